package org.exhale.planning;

import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;

/**
 * The lower bounds on the bake time of MODEL.md §9, each labelled with whether it is rigorous for
 * the case's gas regime. Four are computed, and a fifth where the gas is stored (proofs in docs/model.md,
 * "Lower bounds"):
 * <ul>
 *   <li><b>ceiling</b>: the cold corner under the lagged temperature cap, ignoring every other limit;
 *       rigorous in any regime ({@link VentBound});</li>
 *   <li><b>vent capacity</b>: the gas made cannot exceed what the cavity can store plus what the cap
 *       can vent at the admissible pressure; rigorous in any regime ({@link VentBound});</li>
 *   <li><b>joint</b>: a minimum-time programme over all components' conversions with every monotone
 *       instantaneous limit at both corners, the gas taken quasi-steady; rigorous where the gas is
 *       quasi-steady, otherwise reported as an estimate ({@link JointBound});</li>
 *   <li><b>envelope</b>: every component's conversion at both corners followed forward in time under an
 *       upper envelope of the wafer temperature (the tool's fastest ramp, the lagged cap, the highest
 *       admissible temperature at the conversions' upper bounds); rigorous where the gas is
 *       quasi-steady, otherwise an estimate ({@link EnvelopeBound}). The tight one for a single
 *       component: it keeps the cold corner's lag behind the hot one and the ramp rate.</li>
 *   <li><b>joint_stored</b> (stored gas only): the joint programme with the pressure limits entering through one
 *       corner's stored gas, followed in bins, and what its cap can vent; rigorous in any regime
 *       ({@link JointBound} with {@link StoredGas}). The planner computes it on its own thread
 *       ({@link #withStoredGas}).</li>
 * </ul>
 * The reported bound is the largest rigorous one. Every discretisation error of the five lowers
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

    /**
     * Grid resolution of the joint bound: relative change of f between clock levels (several components; one
     * component has no cells to cross, so a finer clock costs milliseconds) and across a cell, and the widest cell in
     * reduced time (a cell lets the other component be re-placed anywhere in it at every level, so it must be narrow
     * against that component's motion per level; measured on qs-two-pressure: 0.015 87.8 min, 0.01 88.4, 0.0075 88.9,
     * the joint bound of the dense demo taking 0.45 / 0.67 / 0.98 s).
     */
    static final double CLOCK_DELTA = 0.1;
    static final double CLOCK_DELTA_ONE = 0.005;
    static final double CELL_DELTA = 0.03;
    static final double CELL_WIDTH = 0.01;
    /**
     * The stored-gas joint bound: bins of the followed corner's stored gas, its clock step, and the cells of the coarse
     * quasi-steady guide (measured on the dense demo with affine labels per bin: 6 / 8 / 12 / 16 / 32 bins
     * 208.1 / 209.0 / 209.7 / 209.8 / 209.9 min in 0.6 / 0.8 / 1.3 / 2.0 / 6.5 s; with one value per bin, which lets each
     * move gain up to a bin of free storage, 16 / 32 / 64 bins gave 206.8 / 208.3 / 209.1). Clock levels of 10 / 15 /
     * 20 % in f, with the lockstep after a change of corner: dense demo 210.8 / 211.5 / 211.4 min, two-component-stored
     * 262.0 / 262.4 / 261.7, at about the same cost (fewer levels, each with more moves). 12 bins since the cells
     * became narrow early in the bake and wide late (below), which paid for them.
     */
    static final int STORED_BINS = 12;
    static final double STORED_CLOCK_DELTA = 0.15;
    /**
     * The stored-gas programme's cells of another component: at most 0.004 × its reduced time wide, between 0.002 and
     * 0.05 — narrow early in the bake, where that component moves little per clock level and re-placing it anywhere in
     * its cell costs most, and wide late, where it moves fast — unless that gives more than {@link #STORED_CELL_BUDGET}
     * cells; then 0.005 × F between 0.0025 and 0.05 (a case with a broad Šesták–Berggren component, as `exhale new disc
     * --dense` writes, has 4609 cells by the first rule, 3697 by the second, which already plans in about 4.5 s). Any
     * grid is rigorous; this spends resolution where it is affordable. Measured before the start's bound (minutes;
     * cells 0.002 wide only for F in [0, 0.3) / [0.3, 1) / [1, 2) / [2, ∞), 0.01 elsewhere, 8 bins: dense demo 211.8 /
     * 212.9 / 212.1 / 211.4 against 211.5). Side by side, warm medians of 5 runs of the programme, dense demo /
     * two-component-stored / the template case: cells 0.01 everywhere, 8 bins 211.5 / 262.4 / 98.03 (0.6 / 1.3 / 3.5 s);
     * 0.005 F within [0.003, 0.01], 8 bins 213.44 / 265.85 / 97.76 (0.66 / 0.97 / 2.99 s); within [0.0025, 0.05], 12
     * bins 213.60 / 266.99 / 99.46 (0.66 / 0.71 / 2.17 s); 0.004 F within [0.002, 0.05], 10 bins 214.12 / 267.60 (0.85 /
     * 0.92 s); cells 0.0015 everywhere with 16 bins 215.6 / 270.2 (26 / 36 s). With the start's bound (warm medians of 3,
     * 12 bins): 0.005 F within [0.0025, 0.05] 217.30 / 270.15 / 99.83 min (0.70 / 0.73 / 2.25 s; 883 / 898 / 3697
     * cells); 0.004 F within [0.002, 0.05] 217.89 / 271.14 / 100.00 (1.09 / 1.16 / 4.88 s; 1100 / 1114 / 4609 cells);
     * 0.0035 F 218.10 / 271.49 / 99.96 (1.30 / 1.38 / 7.04 s); 0.003 F 218.38 (1.90 s); switching to 0.005 F beyond
     * F = 1 / 2 / 3 217.41 / 217.64 / 217.79 (the late cells matter as well). Grids are not nested, so a finer one need
     * not be higher everywhere. The quasi-steady programme keeps CELL_WIDTH: 0.005 F within [0.003, 0.01] gains 0.7 %
     * on qs-two-pressure there at 3× its cost.
     */
    static final double STORED_CELL_WIDTH_PER_F = 0.004;
    static final double STORED_CELL_WIDTH_MIN = 0.002;
    static final double STORED_CELL_WIDTH_PER_F_COARSE = 0.005;
    static final double STORED_CELL_WIDTH_MIN_COARSE = 0.0025;
    static final int STORED_CELL_BUDGET = 2000;
    static final double STORED_CELL_WIDTH_MAX = 0.05;
    /**
     * A second grid with one component (no cells to cross, so fine levels and many bins cost milliseconds), whose bound
     * is kept where larger. Measured on dense-one, clock step / bins: 0.15 / 8 186.2 min, 0.05 / 32 186.7, 0.02 / 64
     * 191.2, 0.01 / 32 191.4, 0.01 / 64 192.0 in 0.05 s, 0.01 / 128 192.2 in 0.3 s, 0.005 / 128 191.8 (finer levels gain
     * only with bins narrow enough that a move's share of the storage is resolved); but with a rate that rises with
     * conversion (dense-one with Šesták–Berggren m = 0.5, n = 1.5) 0.15 / 8 171.8, 0.05 / 32 170.9, 0.02 / 64 168.3,
     * 0.01 / 64 162.4: finer levels lose there, so both grids run.
     */
    static final int STORED_BINS_ONE = 64;
    static final double STORED_CLOCK_DELTA_ONE = 0.01;
    static final double GUIDE_CELL_WIDTH = 0.03;
    /** Parts of each clock level with several components (each with its own floors). */
    static final int CLOCK_PARTS = 2;
    /** Shortest time step of the envelope bound [s] (measured: 4× finer moves the bench bounds by under 0.02 %). */
    static final double ENVELOPE_STEP_S = 0.25;

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
        return compute(bake, tool, quasiSteady, true);
    }

    /**
     * As {@link #compute(BakeCase, Tool, boolean)}; with {@code withEstimates} false the joint and
     * envelope bounds are left out where they would only be estimates (stored gas), which saves the
     * planner most of a second on a dense cap.
     */
    public static Result compute(BakeCase bake, Tool tool, boolean quasiSteady, boolean withEstimates) {
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
        if (!quasiSteady && !withEstimates) {
            return new Result(Math.max(v.ceilingS(), v.ventS()), v.ceilingS(), -1, true, false, java.util.List.copyOf(list),
                    (System.nanoTime() - t0) / 1e9);
        }
        double clockDelta = bake.polymer().size() == 1 ? CLOCK_DELTA_ONE : CLOCK_DELTA;
        int parts = bake.polymer().size() == 1 ? 1 : CLOCK_PARTS;
        JointBound qsJoint = new JointBound(bake, limits, cap, spread, clockDelta, CELL_DELTA, CELL_WIDTH, parts);
        JointBound.Outcome j = qsJoint.compute();
        if (!quasiSteady) {
            Estimate stored = storedGas(bake, limits, cap, spread);
            if (stored != null) {
                list.add(stored);
            }
        }
        list.add(new Estimate("joint", j.boundS(), quasiSteady, quasiSteady
                ? "all components and both corners jointly, every monotone instantaneous limit, quasi-steady gas"
                : "as for quasi-steady gas; the gas here is stored (not quasi-steady), so this is an estimate"));
        EnvelopeBound.Outcome env = new EnvelopeBound(bake, limits, cap, spread, tool.maxRampUpKPerS(), ENVELOPE_STEP_S).compute();
        list.add(new Estimate("envelope", env.boundS(), quasiSteady, quasiSteady
                ? "every component at both corners followed in time under the wafer's ramp-rate envelope, quasi-steady gas"
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
     * The stored-gas joint bound (rigorous in any gas regime; docs/model.md, "Lower bounds", 5) added to a result
     * computed without it: the planner runs this beside its search when the gas is stored.
     */
    public static Result withStoredGas(Result base, BakeCase bake, Tool tool) {
        long t0 = System.nanoTime();
        double spread = bake.wafer().spreadK();
        TemperatureCap cap = new TemperatureCap(bake.recipeStartK(), bake.limits().ceilingK() - spread,
                tool.maxRampUpKPerS(), bake.wafer().lagS());
        Estimate e = storedGas(bake, new InstantLimits(bake), cap, spread);
        if (e == null) {
            return base;
        }
        java.util.List<Estimate> list = new java.util.ArrayList<>(base.estimates());
        list.removeIf(x -> x.name().equals(e.name()));
        list.add(e);
        return new Result(Math.max(base.boundS(), e.seconds()), base.ceilingOnlyBoundS(), base.component(), true, base.quasiSteady(),
                java.util.List.copyOf(list), base.computeS() + (System.nanoTime() - t0) / 1e9);
    }

    /**
     * The joint programme with one corner's stored gas followed in bins: rigorous in any gas regime. Which corner, level
     * by level, is the one whose limits bind a coarse quasi-steady programme (any choice is rigorous; this one is only a
     * guide, so it may be coarse). Null where it does not apply.
     */
    private static Estimate storedGas(BakeCase bake, InstantLimits limits, TemperatureCap cap, double spread) {
        double boundS = storedProgramme(bake, limits, cap, spread, STORED_CLOCK_DELTA, STORED_BINS);
        if (bake.polymer().size() == 1 && boundS > 0) {
            // one component: the fine grid too (milliseconds), and the larger of two rigorous bounds; neither is best on
            // every case (dense-one 186.2 / 192.0 min, the same with a rate rising with conversion 171.8 / 162.4)
            boundS = Math.max(boundS, storedProgramme(bake, limits, cap, spread, STORED_CLOCK_DELTA_ONE, STORED_BINS_ONE));
        }
        if (!(boundS > 0)) {
            return null;   // not applicable here (see JointBound): nothing claimed
        }
        return new Estimate("joint_stored", boundS, true,
                "all components jointly; each corner's stored gas and venting followed (one corner per level); any gas regime");
    }

    /** The stored-gas programme on one grid, guided by a coarse quasi-steady programme on the same clock levels. */
    private static double storedProgramme(BakeCase bake, InstantLimits limits, TemperatureCap cap, double spread,
                                          double clockDelta, int bins) {
        JointBound guide = new JointBound(bake, limits, cap, spread, clockDelta, CELL_DELTA, GUIDE_CELL_WIDTH, 1);
        guide.compute();
        return storedJoint(bake, limits, cap, spread, clockDelta, bins, guide.bindingCorners()).compute().boundS();
    }

    /** The stored-gas programme as shipped, on the given clock levels and bins, following the given corners. */
    static JointBound storedJoint(BakeCase bake, InstantLimits limits, TemperatureCap cap, double spread,
                                  double clockDelta, int bins, int[] tracked) {
        JointBound fine = new JointBound(bake, limits, cap, spread, clockDelta, CELL_DELTA, STORED_CELL_WIDTH_MAX,
                STORED_CELL_WIDTH_PER_F, STORED_CELL_WIDTH_MIN, 1, bins, tracked);
        if (fine.cells() <= STORED_CELL_BUDGET) {
            return fine;
        }
        return new JointBound(bake, limits, cap, spread, clockDelta, CELL_DELTA, STORED_CELL_WIDTH_MAX,
                STORED_CELL_WIDTH_PER_F_COARSE, STORED_CELL_WIDTH_MIN_COARSE, 1, bins, tracked);
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
