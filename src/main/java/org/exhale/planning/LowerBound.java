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
        InstantLimits[] limits = new InstantLimits[k];
        for (int j = 0; j < k; j++) {
            boolean[] only = new boolean[k];
            only[j] = true;
            limits[j] = new InstantLimits(bake, only);
        }
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
    static double[] integrate(BakeCase bake, InstantLimits[] limits, TemperatureCap cap, double offsetK, boolean withLimits) {
        int k = limits.length;
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
            rates(limits, alpha, b, t, cap, offsetK, startK, withLimits, r1);
            double fastest = 0;
            for (int j = 0; j < k; j++) {
                fastest = Math.max(fastest, r1[j]);
            }
            // steps of at most 5e-4 in conversion (RK4 then errs by far less than the planner's tolerances); at most
            // 10 s while the cap still moves, 60 s once it is steady, and long steps only while nothing converts
            double maxDt = t < cap.settledS() ? 10 : 60;
            double dt = fastest > 1e-12 ? Math.min(Math.max(5e-4 / fastest, 0.05), maxDt) : (t < cap.settledS() ? 10 : 1e4);
            step(b, r1, 0.5 * dt, tmp);
            rates(limits, alpha, tmp, t + 0.5 * dt, cap, offsetK, startK, withLimits, r2);
            step(b, r2, 0.5 * dt, tmp);
            rates(limits, alpha, tmp, t + 0.5 * dt, cap, offsetK, startK, withLimits, r3);
            step(b, r3, dt, tmp);
            rates(limits, alpha, tmp, t + dt, cap, offsetK, startK, withLimits, r4);
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

    private static void rates(InstantLimits[] limits, double[] alpha, double[] b, double t, TemperatureCap cap,
                              double offsetK, double startK, boolean withLimits, double[] out) {
        for (int j = 0; j < b.length; j++) {
            out[j] = b[j] >= 1 ? 0 : rate(limits[j], j, alpha, b[j], t, cap, offsetK, startK, withLimits);
        }
    }

    private static double rate(InstantLimits limits, int j, double[] alpha, double b, double t, TemperatureCap cap,
                               double offsetK, double startK, boolean withLimits) {
        double top = cap.wafer(t) + offsetK;
        double temp = withLimits ? highestFeasible(limits, j, alpha, b, top, startK + offsetK - 100) : top;
        return Double.isNaN(temp) ? 0 : limits.rate(j, temp, b);
    }

    /** The highest T ≤ top at which every instantaneous limit holds with component j at conversion b; NaN if none above floor. */
    static double highestFeasible(InstantLimits limits, int j, double[] alpha, double b, double top, double floor) {
        alpha[j] = b;
        if (limits.margin(top, alpha) >= 1) {
            return top;
        }
        double hi = top;
        double lo = top - 2;
        while (lo > floor && limits.margin(lo, alpha) < 1) {
            hi = lo;
            lo -= 2;
        }
        if (lo <= floor) {
            return Double.NaN;
        }
        for (int it = 0; it < 40 && hi - lo > 1e-6; it++) {
            double mid = 0.5 * (lo + hi);
            if (limits.margin(mid, alpha) >= 1) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
