package org.exhale.planning;

import org.exhale.kinetics.Component;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;

/**
 * The lower bound on the bake time of MODEL.md §9. At time t and conversion α no recipe converts
 * component j faster than r*(α, t) = max{k_j(T) f_j(α) : T ≤ T_cap(t), every instantaneous limit
 * holds}, so by the comparison lemma α_j(t) ≤ b(t) with db/dt = r*(b, t); the time b needs to
 * reach α_j* = 1 − u_target/w_j bounds every recipe. The bound is the largest over components,
 * each computed with the other components' gas left out (less gas only loosens the limits).
 * The cold corner is used (its conversion must reach the target; the hot corner's limits are left
 * out, which keeps the bound valid). Limits that depend on history (thermal dose) are left out.
 * The pressure-driven limits are evaluated quasi-steadily: the bound is rigorous only where the
 * gas is quasi-steady; otherwise the ceiling-only bound is rigorous and is reported beside it.
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
        int k = bake.polymer().size();
        InstantLimits limits = new InstantLimits(bake);
        double[] r = integrate(bake, limits, cap, -spread, true);
        double[] c = integrate(bake, limits, cap, -spread, false);
        return new Result(r[0], c[0], (int) r[1]);
    }

    /**
     * Integrates every component's bound b_j together and returns the first time at which
     * Σ w_j (1 − b_j) ≤ u_target, and the component whose bound finishes last. Each b_j bounds α_j
     * of every recipe at every instant, so u(t) ≥ Σ w_j (1 − b_j(t)) for every recipe: this is at
     * least the largest single-component bound of MODEL.md §9 and still valid.
     */
    static double[] integrate(BakeCase bake, InstantLimits limits, TemperatureCap cap, double offsetK, boolean withLimits) {
        int k = limits.size();
        double[] a0 = new double[k];
        for (int j = 0; j < k; j++) {
            a0[j] = bake.polymer().initialConversion(j);
        }
        double[] w = new double[k];
        double[] b = new double[k];
        double[] r1 = new double[k];
        double[] r2 = new double[k];
        double[] r3 = new double[k];
        double[] r4 = new double[k];
        double[] tmp = new double[k];
        double[] alpha = new double[k];
        for (int j = 0; j < k; j++) {
            w[j] = bake.polymer().component(j).fraction();
            b[j] = bake.polymer().initialConversion(j);
        }
        double target = bake.limits().residue();
        double startK = bake.recipeStartK();
        double t = 0;
        double horizon = 2 * 86_400;   // beyond the planner's 24 h horizon the bound is reported as infinite
        double u = residue(w, b);
        while (u > target) {
            rates(limits, a0, b, t, cap, offsetK, startK, withLimits, r1);
            double fastest = 0;
            for (int j = 0; j < k; j++) {
                fastest = Math.max(fastest, r1[j]);
            }
            // steps of at most 5e-4 in conversion (RK4 then errs by far less than the planner's tolerances); at most
            // 10 s while the cap still moves, 60 s once it is steady, and long steps only while nothing converts
            double maxDt = t < cap.settledS() ? 10 : 60;
            double dt = fastest > 1e-12 ? Math.min(Math.max(5e-4 / fastest, 0.05), maxDt) : (t < cap.settledS() ? 10 : 1e4);
            step(b, r1, 0.5 * dt, tmp);
            rates(limits, a0, tmp, t + 0.5 * dt, cap, offsetK, startK, withLimits, r2);
            step(b, r2, 0.5 * dt, tmp);
            rates(limits, a0, tmp, t + 0.5 * dt, cap, offsetK, startK, withLimits, r3);
            step(b, r3, dt, tmp);
            rates(limits, a0, tmp, t + dt, cap, offsetK, startK, withLimits, r4);
            double[] next = new double[k];
            for (int j = 0; j < k; j++) {
                next[j] = Math.min(1, b[j] + dt * (r1[j] + 2 * r2[j] + 2 * r3[j] + r4[j]) / 6);
            }
            double uNext = residue(w, next);
            if (uNext <= target) {
                double last = 0;
                int which = 0;
                for (int j = 0; j < k; j++) {
                    double need = 1 - target / w[j];
                    if (b[j] < need && w[j] * (1 - b[j]) > last) {
                        last = w[j] * (1 - b[j]);
                        which = j;
                    }
                }
                return new double[]{t + dt * (u - target) / (u - uNext), which};
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

    private static double residue(double[] w, double[] b) {
        double u = 0;
        for (int j = 0; j < w.length; j++) {
            u += w[j] * (1 - Math.min(b[j], 1));
        }
        return u;
    }

    private static void step(double[] b, double[] r, double h, double[] out) {
        for (int j = 0; j < b.length; j++) {
            out[j] = Math.min(1, b[j] + h * r[j]);
        }
    }

    private static void rates(InstantLimits limits, double[] a0, double[] b, double t, TemperatureCap cap,
                              double offsetK, double startK, boolean withLimits, double[] out) {
        double top = cap.wafer(t) + offsetK;
        double[] gen = new double[b.length];
        for (int j = 0; j < b.length; j++) {
            if (b[j] >= 1) {
                out[j] = 0;
                continue;
            }
            int jj = j;
            double temp = withLimits
                    ? highestFeasible(temperature -> limits.monotoneMargin(temperature, floorGeneration(limits, a0, b, jj,
                            temperature, gen)), top, startK + offsetK - 100)
                    : top;
            out[j] = Double.isNaN(temp) ? 0 : limits.rate(j, temp, b[j]);
        }
    }

    /**
     * Gas generation for the bound of component j at temperature T: component j at its bound b_j,
     * every other component at the least it can generate there — every recipe has
     * α_i(0) ≤ α_i(t) ≤ b_i(t), and every f of the four models is unimodal, so
     * f_i(α_i) ≥ min(f_i(α_i(0)), f_i(b_i)). Less gas only loosens the monotone limits, so the
     * highest admissible temperature found with it bounds that of every recipe.
     */
    static double[] floorGeneration(InstantLimits limits, double[] a0, double[] b, int j, double temperatureK,
                                    double[] gen) {
        for (int i = 0; i < b.length; i++) {
            double f = i == j ? limits.rate(i, temperatureK, b[i])
                    : Math.min(limits.rate(i, temperatureK, a0[i]), limits.rate(i, temperatureK, Math.min(b[i], 1)));
            gen[i] = limits.gasifiable(i) * f;
        }
        return gen;
    }

    /** The highest T ≤ top at which margin(T) ≥ 1; NaN if none above floor. */
    static double highestFeasible(java.util.function.DoubleUnaryOperator margin, double top, double floor) {
        if (margin.applyAsDouble(top) >= 1) {
            return top;
        }
        double hi = top;
        double lo = top - 2;
        while (lo > floor && margin.applyAsDouble(lo) < 1) {
            hi = lo;
            lo -= 2;
        }
        if (lo <= floor) {
            return Double.NaN;
        }
        for (int it = 0; it < 40 && hi - lo > 1e-6; it++) {
            double mid = 0.5 * (lo + hi);
            if (margin.applyAsDouble(mid) >= 1) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
