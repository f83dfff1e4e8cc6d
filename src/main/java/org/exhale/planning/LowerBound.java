package org.exhale.planning;

import org.exhale.kinetics.Component;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;

/**
 * The lower bound on the bake time of MODEL.md §9. At time t and conversion α no recipe converts
 * component j at a corner faster than r*(α, t) = max{k_j(T) f_j(α) : T ≤ T_cap(t) + offset, every
 * monotone instantaneous limit holds}, so by the comparison lemma α_j(t) ≤ b(t) with
 * db/dt = r*(b, t); the bake cannot end before every corner's Σ w_j (1 − b_j(t)) reaches the target.
 * Strengthenings of the contract, each keeping the bound valid (docs/model.md): all bounds are
 * integrated together; the other components generate at least their floor of gas instead of none;
 * and both wafer corners are bounded together, a temperature being admissible at one corner only if
 * the limits also hold at the other corner's temperature (a fixed offset away) with that corner's
 * floor of gas. Only limits that tighten as gas is added are used; limits that depend on history
 * (thermal dose, chamber) are left out. The pressure-driven limits are evaluated quasi-steadily: the
 * bound is rigorous only where the gas is quasi-steady; otherwise the ceiling-only bound is
 * rigorous and is reported beside it. The highest admissible temperature is found by scanning down
 * in 2 K steps and bisecting, so a feasible band narrower than 2 K above the one found could be missed.
 */
public final class LowerBound {
    /** The bound with every instantaneous limit, the ceiling-only bound, and the component that finishes last. */
    public record Result(double boundS, double ceilingOnlyBoundS, int component) {
    }

    private LowerBound() {
    }

    public static Result compute(BakeCase bake, Tool tool) {
        double spread = bake.wafer().spreadK();
        TemperatureCap cap = new TemperatureCap(bake.recipeStartK(), bake.limits().ceilingK() - spread,
                tool.maxRampUpKPerS(), bake.wafer().lagS());
        InstantLimits limits = new InstantLimits(bake);
        double[] offsets = spread > 0 ? new double[]{-spread, spread} : new double[]{0};
        double[] r = integrate(bake, limits, cap, offsets, true);
        double[] c = integrate(bake, limits, cap, offsets, false);
        return new Result(r[0], c[0], (int) r[1]);
    }

    /**
     * Integrates the bounds b_cj of every component j at every corner c together and returns the
     * first time at which the residue Σ w_j (1 − b_cj) of every corner reaches the target, and the
     * component that finishes last. Each b_cj bounds α_j at corner c of every recipe at every
     * instant. A temperature T at corner c is admissible only if the monotone limits hold at every
     * corner d at its own temperature T + (offset_d − offset_c) — the corners differ by a fixed
     * offset — with corner d's gas at least its floor ({@link #floorGeneration}).
     */
    static double[] integrate(BakeCase bake, InstantLimits limits, TemperatureCap cap, double[] offsets, boolean withLimits) {
        int k = limits.size();
        int corners = offsets.length;
        int n = k * corners;
        double[] a0 = new double[k];
        double[] w = new double[k];
        double[] b = new double[n];
        for (int j = 0; j < k; j++) {
            a0[j] = bake.polymer().initialConversion(j);
            w[j] = bake.polymer().component(j).fraction();
            for (int c = 0; c < corners; c++) {
                b[c * k + j] = a0[j];
            }
        }
        double[] r1 = new double[n];
        double[] r2 = new double[n];
        double[] r3 = new double[n];
        double[] r4 = new double[n];
        double[] tmp = new double[n];
        double[] guess = new double[n];
        java.util.Arrays.fill(guess, Double.NaN);
        double target = bake.limits().residue();
        double startK = bake.recipeStartK();
        double t = 0;
        double horizon = 2 * 86_400;   // beyond the planner's 24 h horizon the bound is reported as infinite
        double u = residue(w, b, k);
        while (u > target) {
            rates(limits, a0, b, t, cap, offsets, startK, withLimits, r1, guess);
            double fastest = 0;
            for (double r : r1) {
                fastest = Math.max(fastest, r);
            }
            // steps of at most 5e-4 in conversion (RK4 then errs by far less than the planner's tolerances); at most
            // 10 s while the cap still moves, 60 s once it is steady, and long steps only while nothing converts
            double maxDt = t < cap.settledS() ? 10 : 60;
            if (u < 3 * target) {
                maxDt = Math.min(maxDt, 1);
            }
            double dt = fastest > 1e-12 ? Math.min(Math.max(5e-4 / fastest, 0.05), maxDt) : (t < cap.settledS() ? 10 : 1e4);
            step(b, r1, 0.5 * dt, tmp);
            rates(limits, a0, tmp, t + 0.5 * dt, cap, offsets, startK, withLimits, r2, guess);
            step(b, r2, 0.5 * dt, tmp);
            rates(limits, a0, tmp, t + 0.5 * dt, cap, offsets, startK, withLimits, r3, guess);
            step(b, r3, dt, tmp);
            rates(limits, a0, tmp, t + dt, cap, offsets, startK, withLimits, r4, guess);
            double[] next = new double[n];
            for (int i = 0; i < n; i++) {
                next[i] = Math.min(1, b[i] + dt * (r1[i] + 2 * r2[i] + 2 * r3[i] + r4[i]) / 6);
            }
            double uNext = residue(w, next, k);
            if (uNext <= target) {
                double last = 0;
                int which = 0;
                for (int i = 0; i < n; i++) {
                    int j = i % k;
                    if (w[j] * (1 - b[i]) > last) {
                        last = w[j] * (1 - b[i]);
                        which = j;
                    }
                }
                // the residue is convex in time, so a chord would put the crossing late; the start of the step is
                // a safe (early) bound, and steps are short near the end (see below)
                return new double[]{t, which};
            }
            b = next;
            u = uNext;
            t += dt;
            if (t > horizon) {
                return new double[]{Double.POSITIVE_INFINITY, -1};
            }
        }
        return new double[]{t, -1};
    }

    /** The largest residue over the corners. */
    private static double residue(double[] w, double[] b, int k) {
        double worst = 0;
        for (int c = 0; c < b.length / k; c++) {
            double u = 0;
            for (int j = 0; j < k; j++) {
                u += w[j] * (1 - Math.min(b[c * k + j], 1));
            }
            worst = Math.max(worst, u);
        }
        return worst;
    }

    private static void step(double[] b, double[] r, double h, double[] out) {
        for (int j = 0; j < b.length; j++) {
            out[j] = Math.min(1, b[j] + h * r[j]);
        }
    }

    private static void rates(InstantLimits limits, double[] a0, double[] b, double t, TemperatureCap cap,
                              double[] offsets, double startK, boolean withLimits, double[] out, double[] guess) {
        int k = limits.size();
        double lagged = cap.wafer(t);
        double[] gen = new double[k];
        for (int c = 0; c < offsets.length; c++) {
            double top = lagged + offsets[c];
            for (int j = 0; j < k; j++) {
                int i = c * k + j;
                if (b[i] >= 1) {
                    out[i] = 0;
                    continue;
                }
                int cc = c;
                int jj = j;
                double temp = withLimits ? highestFeasible(temperature -> {
                    double m = Double.POSITIVE_INFINITY;
                    for (int d = 0; d < offsets.length; d++) {
                        double td = temperature + offsets[d] - offsets[cc];
                        m = Math.min(m, limits.monotoneMargin(td,
                                floorGeneration(limits, a0, b, d * k, d == cc ? jj : -1, td, gen)));
                    }
                    return m;
                }, top, startK + offsets[c] - 100, guess[i]) : top;
                guess[i] = temp;
                out[i] = Double.isNaN(temp) ? 0 : limits.rate(j, temp, b[i]);
            }
        }
    }

    /**
     * Gas generation at one corner (its bounds start at {@code b[from]}) for the bound of component
     * j at temperature T (j = −1: no component is being bounded at this corner): component j at
     * its bound b_j, every other component at the least it can generate there — every recipe has
     * α_i(0) ≤ α_i(t) ≤ b_i(t), and every f of the four models is unimodal, so
     * f_i(α_i) ≥ min(f_i(α_i(0)), f_i(b_i)). Less gas only loosens the monotone limits, so the
     * highest admissible temperature found with it bounds that of every recipe.
     */
    static double[] floorGeneration(InstantLimits limits, double[] a0, double[] b, int from, int j, double temperatureK,
                                    double[] gen) {
        for (int i = 0; i < a0.length; i++) {
            double bi = Math.min(b[from + i], 1);
            double f = i == j ? limits.rate(i, temperatureK, bi)
                    : Math.min(limits.rate(i, temperatureK, a0[i]), limits.rate(i, temperatureK, bi));
            gen[i] = limits.gasifiable(i) * f;
        }
        return gen;
    }

    /**
     * The highest T ≤ top at which margin(T) ≥ 1, to within 1e-3 K and rounded up (so the bound
     * stays on the safe side); NaN if none above floor. The search starts from {@code guess} (the
     * answer of the previous call, NaN for none) and steps 2 K at a time before bisecting.
     */
    static double highestFeasible(java.util.function.DoubleUnaryOperator margin, double top, double floor, double guess) {
        if (margin.applyAsDouble(top) >= 1) {
            return top;
        }
        double hi;
        double lo;
        double g = Double.isNaN(guess) ? top - 2 : Math.min(guess, top - 1e-3);
        if (g > floor && margin.applyAsDouble(g) >= 1) {
            lo = g;
            hi = Math.min(g + 2, top);
            while (hi < top && margin.applyAsDouble(hi) >= 1) {
                lo = hi;
                hi = Math.min(hi + 2, top);
            }
        } else {
            hi = g;
            lo = g - 2;
            while (lo > floor && margin.applyAsDouble(lo) < 1) {
                hi = lo;
                lo -= 2;
            }
            if (lo <= floor) {
                return Double.NaN;
            }
        }
        while (hi - lo > 1e-3) {
            double mid = 0.5 * (lo + hi);
            if (margin.applyAsDouble(mid) >= 1) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return hi;
    }
}
