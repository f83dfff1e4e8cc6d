package org.exhale.planning;

import org.exhale.kinetics.Component;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;

/**
 * A lower bound that follows every component's conversion at both corners forward in time, with
 * an upper envelope of the wafer temperature, for the quasi-steady gas regime (MODEL.md §9; the
 * proof is in docs/model.md, "Lower bounds", bound 4).
 *
 * <p>The state is, per component and corner, an upper bound on the reduced time
 * F_j = ∫ k_j(T ± ΔT) ds, and an upper bound on the wafer temperature. Three facts bound the wafer
 * of every recipe on a step [t, t + h]: it never rises faster than the tool's fastest ramp (the
 * wafer starts at its setpoint and lags it, so setpoint minus wafer never exceeds rate × lag, and
 * the wafer's rate is that difference over the lag); it never exceeds the lagged temperature cap;
 * and it never exceeds the highest temperature at which the monotone instantaneous limits hold at
 * both corners with the least gas the conversions can give, which — gas falling as conversion
 * grows — is found from the upper bounds of the conversions at the step's end. The conversions'
 * upper bounds then grow by h k_j(T̄ ± ΔT). Unlike the joint bound, the cold corner's conversion
 * is known here (the same temperature history drives both corners), and the wafer's ramp rate
 * binds where the admissible temperature climbs faster than the tool can follow.
 */
final class EnvelopeBound {
    private static final double HORIZON_S = 2 * 86_400;
    /** Relative deflation of every gas floor and inflation of every box rate against rounding. */
    private static final double SAFE = 1e-12;
    /**
     * Relative inflation of every reduced-time increment: covers the rounding of the running sums (at most
     * 1e-16 per addition over fewer than 10⁶ steps).
     */
    private static final double SUM_SAFE = 1e-9;
    /** Times are sums of steps in double precision: the cap is read this much later, the bound reported this much earlier [s]. */
    private static final double TIME_SAFE_S = 1e-6;
    /** The step is at least the time so far over this, so the bound's relative resolution is about its inverse. */
    private static final double STEPS_PER_TIME = 20_000;
    /** The longest step [s]. */
    private static final double MAX_STEP_S = 5;

    /** The bound [s] (+∞ beyond the horizon), the time steps taken and the margin evaluations spent. */
    record Outcome(double boundS, int steps, long evaluations) {
    }

    private final InstantLimits limits;
    private final TemperatureCap cap;
    private final double spread;
    private final double rampUpKPerS;
    private final double stepS;
    private final double startK;
    private final double floorK;
    private final int k;
    private final Component[] comps;
    private final ReducedTime[] rt;
    private final double[] w;
    private final double[] n0;
    private final double target;
    private final double[] gen;
    private long evaluations;

    /**
     * @param rampUpKPerS the tool's fastest setpoint ramp up [K/s]
     * @param stepS       the shortest time step [s]; the step grows to t/20 000 (at most 5 s), and the bound's
     *                    discretisation makes it at most a few steps early, never late
     */
    EnvelopeBound(BakeCase bake, InstantLimits limits, TemperatureCap cap, double spread, double rampUpKPerS, double stepS) {
        this.limits = limits;
        this.cap = cap;
        this.spread = spread;
        this.rampUpKPerS = rampUpKPerS;
        this.stepS = stepS;
        this.startK = bake.recipeStartK();
        this.floorK = bake.recipeStartK() - 100;
        this.k = limits.size();
        this.comps = bake.polymer().components().toArray(new Component[0]);
        this.rt = new ReducedTime[k];
        this.w = new double[k];
        this.n0 = new double[k];
        for (int j = 0; j < k; j++) {
            rt[j] = new ReducedTime(comps[j].model(), bake.polymer().initialConversion(j));
            w[j] = comps[j].fraction();
            n0[j] = limits.gasifiable(j);
        }
        this.target = bake.limits().residue();
        this.gen = new double[k];
    }

    Outcome compute() {
        double[] hot = new double[k];
        double[] cold = new double[k];
        double[] boxHot = new double[k];
        double[] boxCold = new double[k];
        double[] floorHot = new double[k];
        double[] floorCold = new double[k];
        double wafer = startK;
        double guess = Double.NaN;
        double t = 0;
        int steps = 0;
        double h = 0;
        while (t <= HORIZON_S) {
            if (residue(hot) <= target && residue(cold) <= target) {
                // the check at the previous step's end failed, so no recipe met the target before t; it may meet it
                // within the step just taken, so the bound is that step's start
                return new Outcome(Math.max(0, t - h - TIME_SAFE_S), steps, evaluations);
            }
            // the step grows with time (a relative resolution of 1/STEPS_PER_TIME) so that a long bake stays cheap
            h = Math.min(Math.max(stepS, t / STEPS_PER_TIME), MAX_STEP_S);
            // the hottest the wafer can be on [t, t + h]: the ramp-rate envelope and the lagged cap (both rise)
            double top = Math.min(wafer + rampUpKPerS * h + 1e-9, cap.wafer(t + h + TIME_SAFE_S));
            // a box that holds every recipe's conversions on the step if the wafer stays below top
            for (int j = 0; j < k; j++) {
                boxHot[j] = hot[j] + h * comps[j].rateConstant(top + spread) * (1 + 2 * SUM_SAFE) + Double.MIN_NORMAL;
                boxCold[j] = cold[j] + h * comps[j].rateConstant(top - spread) * (1 + 2 * SUM_SAFE) + Double.MIN_NORMAL;
                floorHot[j] = leastF(j, boxHot[j]);
                floorCold[j] = leastF(j, boxCold[j]);
            }
            // inside the box each component gives at least the gas of its least f on [α0, ᾱ] (f unimodal: at an end)
            double adm = LowerBound.highestFeasible(temp -> margin(temp, floorHot, floorCold), top, floorK, guess);
            if (Double.isNaN(adm)) {
                // no admissible temperature found below top: no recipe is feasible here, but nothing is claimed from it
                // (where the admissible temperatures extend upwards, as a strength limit that relaxes on heating can make
                // them, the search may find none below top while some lie above it)
                adm = top;
            } else {
                guess = adm;
            }
            double bar = Math.min(top, adm);
            for (int j = 0; j < k; j++) {
                hot[j] += h * comps[j].rateConstant(bar + spread) * (1 + SUM_SAFE);
                cold[j] += h * comps[j].rateConstant(bar - spread) * (1 + SUM_SAFE);
            }
            wafer = bar;
            t += h;
            steps++;
        }
        return new Outcome(Double.POSITIVE_INFINITY, steps, evaluations);
    }

    /** The least f_j over the conversions a corner can have with reduced time at most v, lowered against rounding. */
    private double leastF(int j, double v) {
        double top = rt[j].conversionAtMost(v);
        return rt[j].minF(rt[j].alpha0(), top) * (1 - SAFE);
    }

    /** The residue if every conversion were at its upper bound (a lower bound on the residue at that corner). */
    private double residue(double[] f) {
        double u = 0;
        for (int j = 0; j < k; j++) {
            u += w[j] * (1 - rt[j].conversionAtMost(f[j]));
        }
        return u;
    }

    /** The smaller margin of the two corners at wafer temperature T with the given least gas. */
    private double margin(double waferK, double[] floorHot, double[] floorCold) {
        evaluations++;
        for (int j = 0; j < k; j++) {
            gen[j] = n0[j] * comps[j].rateConstant(waferK + spread) * floorHot[j];
        }
        double m = limits.monotoneMargin(waferK + spread, gen);
        if (spread > 0 && m >= 1) {
            for (int j = 0; j < k; j++) {
                gen[j] = n0[j] * comps[j].rateConstant(waferK - spread) * floorCold[j];
            }
            m = Math.min(m, limits.monotoneMargin(waferK - spread, gen));
        }
        return m;
    }
}
