package org.exhale.planning;

import org.exhale.kinetics.Component;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;

/**
 * The lower bounds on the bake time of MODEL.md §9, each labelled with whether it is rigorous for
 * the case's gas regime. Three are computed (proofs in docs/model.md, "Lower bounds"):
 * <ul>
 *   <li><b>ceiling</b>: the cold corner under the lagged temperature cap, ignoring every other limit;
 *       rigorous in any regime ({@link VentBound});</li>
 *   <li><b>vent capacity</b>: the gas made cannot exceed what the cavity can store plus what the cap
 *       can vent at the admissible pressure; rigorous in any regime ({@link VentBound});</li>
 *   <li><b>joint</b>: a minimum-time programme over all components' conversions with every monotone
 *       instantaneous limit at both corners, the gas taken quasi-steady; rigorous where the gas is
 *       quasi-steady, otherwise reported as an estimate ({@link JointBound}).</li>
 * </ul>
 * The reported bound is the largest rigorous one. Every discretisation error of the three lowers
 * them. The one premise not proved by the code is that at fixed conversions the admissible
 * temperatures form an interval below the highest one found (the bisection of
 * {@link #highestFeasible}); docs/model.md says when that holds.
 */
public final class LowerBound {
    /** One bound: its name, value [s] (+∞ beyond the 2-day horizon), whether it is rigorous here, and what it rests on. */
    public record Estimate(String name, double seconds, boolean rigorous, String basis) {
    }

    /**
     * The bounds of a case.
     *
     * @param boundS            the largest rigorous bound [s]
     * @param ceilingOnlyBoundS the ceiling-only bound [s] (rigorous in any regime)
     * @param component         the component used as the joint bound's clock (−1 if none)
     * @param rigorous          whether {@code boundS} is rigorous (always: it is the largest rigorous bound)
     * @param quasiSteady       whether the gas was taken to be quasi-steady (the joint bound is rigorous then)
     * @param estimates         every bound computed, with its label
     * @param computeS          wall time spent on the bounds [s]
     */
    public record Result(double boundS, double ceilingOnlyBoundS, int component, boolean rigorous, boolean quasiSteady,
                         java.util.List<Estimate> estimates, double computeS) {
        /** The named bound, or null. */
        public Estimate estimate(String name) {
            return estimates.stream().filter(e -> e.name().equals(name)).findFirst().orElse(null);
        }
    }

    /** Grid resolution of the joint bound: relative change of f between clock levels and across a cell. */
    static final double CLOCK_DELTA = 0.05;
    static final double CELL_DELTA = 0.03;

    private LowerBound() {
    }

    /** The bounds, with the gas regime found by one simulation of the fastest ramp to the cap (as the planner does). */
    public static Result compute(BakeCase bake, Tool tool) {
        double capK = bake.limits().ceilingK() - bake.wafer().spreadK();
        org.exhale.recipe.Recipe probe = new org.exhale.recipe.Recipe(bake.recipeStartK(), java.util.List.of(
                new org.exhale.recipe.Step.Ramp(Math.max(capK, bake.recipeStartK() + 1), tool.maxRampUpKPerS()),
                new org.exhale.recipe.Step.Hold(600)));
        var r = org.exhale.simulation.BakeSimulator.simulate(bake.withRecipe(probe),
                org.exhale.simulation.SimulationSettings.defaults().withSampleInterval(0));
        return compute(bake, tool, r.regime() == org.exhale.simulation.GasRegime.QUASI_STEADY);
    }

    /**
     * The bounds of a case whose gas is ({@code quasiSteady}) or is not quasi-steady.
     */
    public static Result compute(BakeCase bake, Tool tool, boolean quasiSteady) {
        long t0 = System.nanoTime();
        double spread = bake.wafer().spreadK();
        TemperatureCap cap = new TemperatureCap(bake.recipeStartK(), bake.limits().ceilingK() - spread,
                tool.maxRampUpKPerS(), bake.wafer().lagS());
        InstantLimits limits = new InstantLimits(bake);
        java.util.List<Estimate> list = new java.util.ArrayList<>();
        VentBound.Outcome v = VentBound.compute(bake, limits, cap, spread, true);
        list.add(new Estimate("ceiling", v.ceilingS(), true,
                "fastest ramp to the ceiling and hold, cold corner; every other limit left out"));
        if (v.ventS() > 0) {
            list.add(new Estimate("vent_capacity", v.ventS(), true,
                    "gas made <= most the cavity can store + most the cap can vent at the admissible pressure; any gas regime"));
        }
        JointBound.Outcome j = new JointBound(bake, limits, cap, spread, CLOCK_DELTA, CELL_DELTA).compute();
        list.add(new Estimate("joint", j.boundS(), quasiSteady, quasiSteady
                ? "all components and both corners jointly, every monotone instantaneous limit, quasi-steady gas"
                : "as for quasi-steady gas; the gas here is stored (not quasi-steady), so this is an estimate"));
        double best = 0;
        for (Estimate e : list) {
            if (e.rigorous()) {
                best = Math.max(best, e.seconds());
            }
        }
        return new Result(best, v.ceilingS(), j.clock(), true, quasiSteady, java.util.List.copyOf(list),
                (System.nanoTime() - t0) / 1e9);
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
     * The highest T ≤ top at which margin(T) ≥ 1, rounded up: the answer is the infeasible end of a
     * bracket at most 0.005 K wide (so the bound stays on the safe side, given that the admissible
     * temperatures below top form an interval). NaN if none above floor. The search starts from
     * {@code guess} (NaN for none: 2 K below top), brackets in steps that double from 0.25 K, and
     * closes the bracket by the Illinois variant of regula falsi on ln margin.
     */
    static double highestFeasible(java.util.function.DoubleUnaryOperator margin, double top, double floor, double guess) {
        double g = Double.isNaN(guess) ? top - 2 : Math.min(guess, top);
        if (g >= top - 1e-9 || !(g > floor)) {
            if (margin.applyAsDouble(top) >= 1) {
                return top;
            }
            g = Math.max(floor + 1e-6, Math.min(top - 2, g));
        }
        double mg = margin.applyAsDouble(g);
        double lo;
        double hi;
        double mlo;
        double mhi;
        double step = 0.25;
        if (mg >= 1) {
            lo = g;
            mlo = mg;
            while (true) {
                double x = Math.min(lo + step, top);
                double mx = margin.applyAsDouble(x);
                if (mx < 1) {
                    hi = x;
                    mhi = mx;
                    break;
                }
                if (x >= top) {
                    return top;
                }
                lo = x;
                mlo = mx;
                step *= 2;
            }
        } else {
            hi = g;
            mhi = mg;
            while (true) {
                double x = hi - step;
                if (x <= floor) {
                    return Double.NaN;
                }
                double mx = margin.applyAsDouble(x);
                if (mx >= 1) {
                    lo = x;
                    mlo = mx;
                    break;
                }
                hi = x;
                mhi = mx;
                step *= 2;
            }
        }
        // Illinois regula falsi on y = ln margin (bisection where y is not finite)
        double ylo = Math.log(mlo);
        double yhi = Math.log(mhi);
        int side = 0;
        while (hi - lo > 0.005) {
            double x;
            if (Double.isFinite(ylo) && Double.isFinite(yhi) && ylo > yhi) {
                x = lo + (hi - lo) * ylo / (ylo - yhi);
                x = Math.min(Math.max(x, lo + 0.02 * (hi - lo)), hi - 0.02 * (hi - lo));
            } else {
                x = 0.5 * (lo + hi);
            }
            double mx = margin.applyAsDouble(x);
            double y = Math.log(mx);
            if (mx >= 1) {
                lo = x;
                ylo = y;
                if (side == 1) {
                    yhi *= 0.5;
                }
                side = 1;
            } else {
                hi = x;
                yhi = y;
                if (side == -1) {
                    ylo *= 0.5;
                }
                side = -1;
            }
        }
        return hi;
    }
}
