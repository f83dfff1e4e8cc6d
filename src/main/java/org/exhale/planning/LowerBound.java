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
    /** The bound with every instantaneous limit, the ceiling-only bound, and which component sets the first. */
    public record Result(double boundS, double ceilingOnlyBoundS, int component) {
    }

    private LowerBound() {
    }

    public static Result compute(BakeCase bake, Tool tool) {
        double spread = bake.wafer().spreadK();
        TemperatureCap cap = new TemperatureCap(bake.recipeStartK(), bake.limits().ceilingK() - spread,
                tool.maxRampUpKPerS(), bake.wafer().lagS());
        int k = bake.polymer().size();
        double best = 0;
        double bestCeiling = 0;
        int which = -1;
        for (int j = 0; j < k; j++) {
            Component c = bake.polymer().component(j);
            double target = 1 - bake.limits().residue() / c.fraction();
            double a0 = bake.polymer().initialConversion(j);
            if (target <= a0) {
                continue;
            }
            boolean[] only = new boolean[k];
            only[j] = true;
            InstantLimits limits = new InstantLimits(bake, only);
            double t = integrate(limits, j, a0, target, cap, -spread, bake.recipeStartK(), true);
            double tc = integrate(limits, j, a0, target, cap, -spread, bake.recipeStartK(), false);
            if (t > best) {
                best = t;
                which = j;
            }
            bestCeiling = Math.max(bestCeiling, tc);
        }
        return new Result(best, bestCeiling, which);
    }

    /** Time for b to go from a0 to target under db/dt = r*(b, t); +∞ if the rate vanishes. */
    static double integrate(InstantLimits limits, int j, double a0, double target, TemperatureCap cap,
                            double offsetK, double startK, boolean withLimits) {
        double[] alpha = new double[limits.size()];
        double t = 0;
        double b = a0;
        double horizon = 30 * 86_400;
        while (b < target) {
            double r1 = rate(limits, j, alpha, b, t, cap, offsetK, startK, withLimits);
            double dt = r1 > 0 ? Math.min(Math.max(2e-3 / r1, 0.05), 10) : 10;
            double r2 = rate(limits, j, alpha, b + 0.5 * dt * r1, t + 0.5 * dt, cap, offsetK, startK, withLimits);
            double r3 = rate(limits, j, alpha, b + 0.5 * dt * r2, t + 0.5 * dt, cap, offsetK, startK, withLimits);
            double r4 = rate(limits, j, alpha, b + dt * r3, t + dt, cap, offsetK, startK, withLimits);
            double db = dt * (r1 + 2 * r2 + 2 * r3 + r4) / 6;
            if (b + db >= target) {
                return t + dt * (target - b) / db;
            }
            b += db;
            t += dt;
            if (t > horizon) {
                return Double.POSITIVE_INFINITY;
            }
        }
        return t;
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
