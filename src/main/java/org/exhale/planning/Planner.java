package org.exhale.planning;

import java.util.ArrayList;
import java.util.List;

import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.simulation.CornerResult;
import org.exhale.simulation.GasRegime;
import org.exhale.simulation.InstantLimits;
import org.exhale.simulation.Margin;
import org.exhale.simulation.SimulationSettings;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.hipparchus.optim.InitialGuess;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.SimpleBounds;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.nonlinear.scalar.ObjectiveFunction;
import org.hipparchus.optim.nonlinear.scalar.noderiv.BOBYQAOptimizer;

/**
 * Finds the shortest recipe that takes the polymer to the residue target at the end of a hold
 * while every limit holds at every corner, within what the tool can do (MODEL.md §9).
 *
 * <ol>
 *   <li><b>Ceiling seed</b>: ramp at the fastest rate to the cap (ceiling less spread and overshoot
 *       guard band) and hold. When it keeps every limit it is the optimum (only the ceiling and the
 *       ramp bind); a bisection then finds the lowest final setpoint when the target comes before
 *       the cap.</li>
 *   <li><b>Rider plan</b> (otherwise): the closed-loop ride with unlimited steps in the proof's gas
 *       regime ({@link Rider}), knots placed on it by dynamic programming, the recipe built from the
 *       real simulated state segment by segment on the tool's grid, then proved by simulating it again
 *       at every corner; a failed proof raises the rider's margin, bisected between failure and
 *       success. The ride's own time is reported as {@code rideS} (where the ride crossed a limit, that of a
 *       second ride looking four times as far ahead, if it kept every limit; {@code rideAdmissible} says which).</li>
 *   <li><b>Fallback</b> (only when the rider finds no admissible path): the older seeds (a rider seed
 *       on the instantaneous limits, a slow staircase), BOBYQA refinement, rounding and proof with
 *       back-off; or a diagnosis of the limit that makes the case infeasible.</li>
 * </ol>
 * Deterministic: no randomness anywhere, so the same case gives the same recipe.
 */
public final class Planner {
    /** Margin the search aims for, so that rounding and the regime change of the proof keep every limit. */
    static final double SEARCH_MARGIN = 1.01;
    private static final double LONG_HOLD_S = 24 * 3600;

    private final BakeCase bake;
    private final Tool tool;
    private final double capK;
    private final double startK;
    private final SimulationSettings search;
    private int evaluations;
    private final List<String> notes = new ArrayList<>();
    /** The last failed proof, for the diagnosis. */
    private BakeResult lastProof;

    private Planner(BakeCase bake, Tool tool) {
        this.bake = bake;
        this.tool = tool;
        this.startK = bake.recipeStartK();
        this.capK = floorSetpoint(tool.highestSetpointK(bake.limits().ceilingK(), bake.wafer().spreadK()), tool.setpointStepK());
        this.search = new SimulationSettings(0, 1e-7, 1e-5, GasRegime.QUASI_STEADY, false);
    }

    public static PlanResult plan(BakeCase bake, Tool tool) {
        return start(bake, tool).finish();
    }

    /**
     * Plans, and returns once the recipe is found and verified; where the gas is stored, the stored-gas bound may still
     * be computing on its own thread ({@link Pending#finish()} waits for it). A caller can meanwhile prepare what does
     * not depend on the bound.
     */
    public static Pending start(BakeCase bake, Tool tool) {
        Planner p = new Planner(bake, tool);
        PlanResult r = p.run();
        return new Pending(r, p.storedBound, System.nanoTime());
    }

    /** A verified plan whose lower bound may still be computing. */
    public static final class Pending {
        private final PlanResult searched;
        private final java.util.concurrent.CompletableFuture<LowerBound.Result> bound;
        private final long searchedAt;
        private volatile long boundAt;

        private Pending(PlanResult searched, java.util.concurrent.CompletableFuture<LowerBound.Result> bound, long searchedAt) {
            this.searched = searched;
            this.searchedAt = searchedAt;
            this.bound = bound == null ? null : bound.thenApply(b -> {
                boundAt = System.nanoTime();
                return b;
            });
        }

        /** When planning ended ({@link System#nanoTime()}): the later of the search and the bound; after {@link #finish()}. */
        public long finishedAt() {
            return Math.max(searchedAt, boundAt);
        }

        /** The recipe, its verification and everything but the stored-gas bound (the fast bounds only). */
        public PlanResult searched() {
            return searched;
        }

        /** The plan with every bound (waits for the stored-gas bound where one is computed). */
        public PlanResult finish() {
            if (bound == null) {
                return searched;
            }
            try {
                return searched.withLowerBound(bound.join());
            } catch (java.util.concurrent.CompletionException e) {
                throw e.getCause() instanceof RuntimeException re ? re : e;
            }
        }
    }

    /**
     * The stored-gas bound, computed on its own thread beside the search when the gas is stored (it takes about as long
     * as the search; the search itself uses only the fast bounds, so the plan does not depend on it).
     */
    private java.util.concurrent.CompletableFuture<LowerBound.Result> storedBound;

    /** A recipe shape: knots (duration of the step into it [s], setpoint at its end [K]), then a hold of given length. */
    record Shape(double[] durations, double[] temps, double holdS) {
    }

    private PlanResult run() {
        LowerBound.Result bound = LowerBound.compute(bake, tool, quasiSteady(), false);
        if (!quasiSteady()) {
            LowerBound.Result fast = bound;
            storedBound = java.util.concurrent.CompletableFuture.supplyAsync(() -> LowerBound.withStoredGas(fast, bake, tool),
                    task -> {
                        Thread t = new Thread(task, "exhale-stored-gas-bound");
                        t.setDaemon(true);
                        t.start();
                    });
        }
        boolean rigorous = bound.rigorous();
        if (capK <= startK) {
            return infeasible(bound, rigorous, "ceiling", "the ceiling less the spread is not above the start temperature",
                    "raise the ceiling or lower the start temperature");
        }
        // 1. ceiling seed
        double rampS = (capK - startK) / tool.maxRampUpKPerS();
        Shape ceiling = new Shape(new double[]{rampS}, new double[]{capK}, LONG_HOLD_S);
        Eval ceilingEval = evaluate(ceiling);
        Shape best = ceiling;
        Eval bestEval = ceilingEval;
        if (ceilingEval.feasible() && ceilingEval.timeToTargetS < rampS + tool.minStepS()) {
            // the target is reached before the cap: a lower final setpoint with the shortest hold is shorter
            Shape lower = lowestSufficient(ceilingEval);
            if (lower != null) {
                Eval le = evaluate(lower);
                if (le.feasible() && le.durationS < bestEval.durationS) {
                    best = lower;
                    bestEval = le;
                    notes.add("target reached before the cap: fastest ramp to " + fmtC(lower.temps[0]) + " then the shortest hold, "
                            + minutes(le.durationS));
                }
            }
        }
        notes.add("ceiling seed (fastest ramp to " + fmtC(capK) + ", hold): "
                + (ceilingEval.feasible() ? "meets every limit, " + minutes(ceilingEval.durationS) : "violates " + ceilingEval.worst));
        if (Double.isNaN(ceilingEval.timeToTargetS)) {
            // the fastest ramp to the cap converts fastest of all recipes: nothing reaches the target in the horizon
            return diagnose(bound, rigorous, ceilingEval);
        }
        if (!ceilingEval.feasible()) {
            PlanResult ridden = riderPlan(bound, rigorous);
            if (ridden != null) {
                return ridden;
            }
            Shape rider = riderSeed();
            if (rider != null) {
                Eval riderEval = evaluate(rider);
                notes.add("rider seed (" + rider.temps.length + " ramps along the highest admissible temperature): "
                        + (riderEval.feasible() ? "meets every limit, " + minutes(riderEval.durationS) : "violates " + riderEval.worst));
                if (riderEval.objective < bestEval.objective) {
                    best = rider;
                    bestEval = riderEval;
                }
                // slow the whole profile down until it keeps every limit, so the refinement starts feasible
                for (double f : new double[]{1.15, 1.3, 1.6, 2, 3, 5}) {
                    if (bestEval.feasible()) {
                        break;
                    }
                    Shape stretched = slowed(rider, f);
                    Eval se = evaluate(stretched);
                    if (!se.feasible()) {
                        notes.add("rider seed stretched " + f + "x still violates " + se.worst
                                + String.format(java.util.Locale.ROOT, " (margin %.3g)", se.minMargin));
                    }
                    if (se.feasible()) {
                        best = stretched;
                        bestEval = se;
                        notes.add("rider seed stretched " + f + "x in time to keep every limit: " + minutes(se.durationS));
                    }
                }
            }
            Shape refined = refine(best);
            Eval refinedEval = evaluate(refined);
            if (refinedEval.objective < bestEval.objective) {
                best = refined;
                bestEval = refinedEval;
                notes.add("refined by BOBYQA: " + (refinedEval.feasible() ? minutes(refinedEval.durationS) : "still violates " + refinedEval.worst));
            }
        }
        if (!bestEval.feasible()) {
            Shape slow = slowest();
            Eval slowEval = evaluate(slow);
            if (slowEval.feasible()) {
                best = slow;
                bestEval = slowEval;
                notes.add("fell back to a slow staircase seed: " + minutes(slowEval.durationS));
            } else {
                return diagnose(bound, rigorous, bestEval);
            }
        }
        if (best != ceiling && best.durations.length > 1) {
            // use up the margin the search left: the whole profile after the first ramp, uniformly faster
            double lo = 0.5;
            double hi = 1;
            Shape fastest = best;
            Eval fastestEval = bestEval;
            for (int it = 0; it < 7; it++) {
                double f = 0.5 * (lo + hi);
                Shape s = slowed(best, f);
                Eval e = evaluate(s);
                if (e.feasible() && e.durationS < fastestEval.durationS) {
                    fastest = s;
                    fastestEval = e;
                    hi = f;
                } else {
                    lo = f;
                }
            }
            if (fastest != best) {
                notes.add("ramps after the first sped up uniformly to " + minutes(fastestEval.durationS));
                best = fastest;
                bestEval = fastestEval;
            }
        }
        // 4. round and prove
        for (int backoff = 0; backoff <= 20; backoff++) {
            if (backoff > 0 && best.durations.length == 1 && lastProof != null
                    && lastProof.violated().stream().noneMatch(m -> m.limit().equals("residue"))) {
                break;   // slowing "every step after the first" cannot change a single ramp
            }
            Shape shifted = slowed(best, 1 + 0.04 * backoff);
            Eval e = evaluate(shifted);
            if (Double.isNaN(e.timeToTargetS)) {
                continue;
            }
            Recipe recipe = rounded(shifted, e.timeToTargetS);
            // rounding the setpoints down delays the target: find when the rounded recipe reaches it
            Recipe longHold = extendFinalHold(recipe, LONG_HOLD_S);
            double txRounded = BakeSimulator.simulate(bake.withRecipe(longHold), search).timeToTargetS();
            evaluations++;
            if (!Double.isNaN(txRounded) && txRounded > e.timeToTargetS) {
                recipe = rounded(shifted, txRounded);
            }
            if (recipe.steps().size() > tool.maxSteps()) {
                return infeasible(bound, rigorous, "max_steps", "the recipe needs " + recipe.steps().size()
                        + " steps (ramps, the final hold" + (tool.hasUnload() ? " and the cool-down" : "") + ") but the tool takes "
                        + tool.maxSteps(), "allow more steps" + (tool.hasUnload() ? " or drop the unload cool-down" : ""));
            }
            for (int ext = 0; ext <= 10; ext++) {
                BakeResult proof = BakeSimulator.simulate(bake.withRecipe(recipe), SimulationSettings.defaults().withSampleInterval(10));
                evaluations++;
                double holdEnd = holdEnd(recipe);
                // the residue target must be met at the end of the final hold, not during the cool-down
                boolean residueLate = Double.isNaN(proof.timeToTargetS()) || proof.timeToTargetS() > holdEnd + 1e-6;
                List<Margin> others = proof.violated().stream().filter(m -> !m.limit().equals("residue")).toList();
                if (others.isEmpty() && !residueLate) {
                    if (backoff > 0) {
                        notes.add("ramps after the first slowed by " + Math.round(4 * backoff) + " % to keep every limit after "
                                + "rounding and in the proof's gas regime");
                    }
                    if (ext > 0) {
                        notes.add("final hold lengthened " + ext + " time(s) so the target is met at its end");
                    }
                    return new PlanResult(recipe, proof, holdEnd, recipe.durationS(), bound, rigorous, true,
                            Binding.perStep(bake, tool, recipe, proof), evaluations, notes, null, rideS, rideAdmissible);
                }
                lastProof = proof;
                if (!others.isEmpty()) {
                    notes.add("the rounded recipe failed its proof: " + others.stream()
                            .map(m -> m.limit() + String.format(java.util.Locale.ROOT, " %.3g", m.margin())).toList());
                    break;
                }
                recipe = extendFinalHold(recipe, Math.max(Math.max(tool.timeStepS(), 1), 0.002 * holdEnd));
            }
        }
        return diagnose(bound, rigorous, bestEval);
    }

    /** The rider in use, whose trial segments count among the simulations. */
    private Rider rider;
    /** The closed-loop ride's own time to target (NaN until ridden). */
    private double rideS = Double.NaN;
    /** The ride whose time is reported as rideS. */
    private Rider.Ride reportedRide;
    /** The look-ahead of a second ride where the first crossed a limit (units of lag plus gas relaxation time). */
    private static final double RETRY_LOOK_AHEAD = 12;
    /** Whether the ride kept every limit all the way (else it is a reference only, not an achievable time). */
    private boolean rideAdmissible;

    /**
     * The closed-loop ride in the proof's gas regime on a control interval from the fast bounds (sets {@link #rider},
     * {@link #rideS}, {@link #rideAdmissible}); null, with a note, when it never reaches the target.
     */
    private Rider.Ride ride(LowerBound.Result bound) {
        BakeResult pr = probe();
        GasRegime regime = pr.corners().stream().anyMatch(c -> c.regime() == GasRegime.FULL_GAS)
                ? GasRegime.FULL_GAS : GasRegime.QUASI_STEADY;
        double gasScale = 1;
        if (regime == GasRegime.FULL_GAS) {
            InstantLimits il = new InstantLimits(bake);
            double total = 0;
            for (int j = 0; j < il.size(); j++) {
                total += il.gasifiable(j);
            }
            double peak = pr.corners().stream().mapToDouble(c -> c.max("stored_mol_m2").value()).max().orElse(0);
            gasScale = peak > 0 && Double.isFinite(peak) ? peak / total : 1;
        }
        Rider rider = new Rider(bake, tool, capK, regime, gasScale);
        this.rider = rider;
        // the control interval scales with the bake's time scale, taken from the fast bounds only (ceiling, vent capacity)
        // so that better bounds do not move the plan
        double boundS = 0;
        for (LowerBound.Estimate e : bound.estimates()) {
            if (e.name().equals("ceiling") || e.name().equals("vent_capacity")) {
                boundS = Math.max(boundS, e.seconds());
            }
        }
        double control = Double.isFinite(boundS) && boundS > 0 ? Math.min(Math.max(boundS / 150, 2), 300) : 30;
        Rider.Ride ride = rider.ride(control, LONG_HOLD_S);
        if (Double.isNaN(ride.timeToTargetS())) {
            notes.add("closed-loop ride: no admissible path to the target within " + minutes(LONG_HOLD_S));
            return null;
        }
        rideS = ride.timeToTargetS();
        rideAdmissible = ride.admissibleThroughout();
        reportedRide = ride;
        notes.add("closed-loop ride (" + (regime == GasRegime.FULL_GAS ? "full gas equations" : "quasi-steady gas")
                + ", every corner, " + String.format(java.util.Locale.ROOT, "%.0f s", control) + " control interval): "
                + minutes(rideS) + (ride.admissibleThroughout() ? "" : ", though not admissible throughout"));
        if (!rideAdmissible) {
            // where the admissible temperature falls faster than the look-ahead sees (a rate that rises with conversion),
            // a ride that looks further keeps every limit; its time is the reference reported (the recipe is still built
            // along the first ride, which gave the shorter plans where measured: docs/model.md, "Planning")
            double look = rider.lookAhead();
            Rider.Ride further;
            try {
                rider.setLookAhead(RETRY_LOOK_AHEAD);
                further = rider.ride(control, LONG_HOLD_S);
            } finally {
                rider.setLookAhead(look);
            }
            if (further.admissibleThroughout() && !Double.isNaN(further.timeToTargetS())) {
                reportedRide = further;
                rideS = further.timeToTargetS();
                rideAdmissible = true;
                notes.add("closed-loop ride with a look-ahead " + (int) (RETRY_LOOK_AHEAD / look)
                        + " times as long keeps every limit: " + minutes(rideS) + " (reported as the ride; the steps"
                        + " follow the first)");
            }
        }
        return ride;
    }

    /**
     * For tests that check the rides from outside: the ride the planner builds along, and the one it reports (the same,
     * or the ride with the longer look-ahead where the first crossed a limit and that one did not).
     */
    static Rider.Ride[] ridesFor(BakeCase bake, Tool tool) {
        Planner p = new Planner(bake, tool);
        Rider.Ride built = p.ride(LowerBound.compute(bake, tool, p.quasiSteady(), false));
        return new Rider.Ride[]{built, p.reportedRide};
    }

    /**
     * The rider's plan: ride the case closed-loop in the proof's gas regime, place the tool's steps
     * along the ride, prove the rounded recipe; if the proof fails, ask the rider for a larger margin
     * (bisection between the failed and a passing margin). Null when no verified recipe came out.
     */
    /**
     * Knots placed for up to this many ramps beyond the budget (merged ramps leave steps free). Measured, best predicted
     * recipe with 0 / 1 / 2 extra knots (minutes): two-component-stored 312.95 / 312.08 / 320.43, dense demo 239.63 /
     * 240.55 / 241.80, the other bench cases no better than with none: one is worth its builds, two are not.
     */
    static final int EXTRA_KNOTS = 1;
    /**
     * Knots placed for up to this many ramps below the budget as well, so that a larger budget tries what a smaller one
     * did: allowed 12 / 13 / 14 / 16 steps the dense demo planned 239.6 / 240.6 / 239.0 / 239.0 min with none, 239.6 /
     * 239.6 / 239.0 / 239.0 with two; one-component-porous 40.7 → 40.6, qs-two-pressure 93.5 → 93.2, no case longer.
     */
    static final int FEWER_KNOTS = 2;

    private PlanResult riderPlan(LowerBound.Result bound, boolean rigorous) {
        Rider.Ride ride = ride(bound);
        if (ride == null) {
            return null;
        }
        Rider rider = this.rider;
        int ramps = Math.max(1, tool.maxSteps() - 1 - (tool.hasUnload() ? 1 : 0));
        // knots along the ride by either measure of a ramp's loss, the recipe built by the rules of BUILDS (see
        // Rider.Rule): the shortest predicted recipe wins (ties to the first, so the choice is deterministic)
        Rider.Built best = null;
        double[] bestKnots = null;
        Rider.Rule bestRule = null;
        // (a ramp that goes on at the same rate as the one before, such as the fastest ramp split by a knot, is one step
        // of the tool: knots for one or two ramps more than the budget are tried too, and the build stops at the budget)
        java.util.Map<String, double[]> knotsBy = new java.util.HashMap<>();
        java.util.Set<String> tried = new java.util.HashSet<>();
        for (int extra = -FEWER_KNOTS; extra <= EXTRA_KNOTS; extra++) {
            if (ramps + extra < 1) {
                continue;
            }
            for (Build build : BUILDS) {
                int placed = ramps + extra;
                double[] knots = knotsBy.computeIfAbsent(build.knots() + "/" + placed, c -> knotTimes(ride, placed, build.knots()));
                if (!tried.add(java.util.Arrays.toString(knots) + build.rule())) {
                    continue;   // another placement gave the same knots
                }
                Rider.Built b = rider.build(ride, knots, ramps, build.rule());
                if (b != null && b.admissibleThroughout() && (best == null || b.holdEndS() < best.holdEndS())) {
                    best = b;
                    bestKnots = knots;
                    bestRule = build.rule();
                }
            }
        }
        if (best == null) {
            notes.add("no recipe along the ride kept every limit within " + ramps + " ramps");
            return null;
        }
        notes.add(best.recipe().steps().size() + " steps placed along the ride: " + minutes(best.holdEndS()) + " predicted");
        // prove; on failure, bisect the rider's margin between the last failure and a pass
        double failed = 1;
        double m = rider.margin();
        PlanResult passed = null;
        double passedMargin = Double.NaN;
        for (int it = 0; it < 8; it++) {
            PlanResult r = prove(best, bound, rigorous);
            if (r != null) {
                passed = r;
                passedMargin = m;
                if (it == 0 || passedMargin - failed < 0.002) {
                    break;
                }
            } else {
                failed = m;
            }
            m = passed == null ? 1 + 2.5 * (m - 1) : 0.5 * (failed + passedMargin);
            if (m > 1.5) {
                break;
            }
            rider.setMargin(m);
            Rider.Built b = rider.build(ride, bestKnots, ramps, bestRule);
            if (b == null || !b.admissibleThroughout()) {
                if (passed == null) {
                    continue;
                }
                break;
            }
            best = b;
        }
        if (passed != null && passedMargin > 1.0011) {
            notes.add(String.format(java.util.Locale.ROOT, "the rider kept a margin of %.4f so the rounded recipe passes its proof",
                    passedMargin));
        }
        return passed;
    }

    /** Simulates a built recipe at every corner (automatic gas regime) and returns the plan if it keeps every limit. */
    private PlanResult prove(Rider.Built built, LowerBound.Result bound, boolean rigorous) {
        Recipe recipe = built.recipe();
        if (recipe.steps().size() > tool.maxSteps()) {
            return null;
        }
        for (int ext = 0; ext <= 4; ext++) {
            BakeResult proof = BakeSimulator.simulate(bake.withRecipe(recipe), SimulationSettings.defaults().withSampleInterval(10));
            evaluations++;
            double holdEnd = holdEnd(recipe);
            boolean residueLate = Double.isNaN(proof.timeToTargetS()) || proof.timeToTargetS() > holdEnd + 1e-6;
            List<Margin> others = proof.violated().stream().filter(x -> !x.limit().equals("residue")).toList();
            if (!others.isEmpty()) {
                lastProof = proof;
                return null;
            }
            if (!residueLate) {
                if (ext > 0) {
                    notes.add("final hold lengthened " + ext + " time(s) so the target is met at its end");
                }
                return new PlanResult(recipe, proof, holdEnd, recipe.durationS(), bound, rigorous, true,
                        Binding.perStep(bake, tool, recipe, proof), evaluations + rider.trials(), notes, null, rideS, rideAdmissible);
            }
            double lateBy = Double.isNaN(proof.timeToTargetS()) ? 0.01 * holdEnd : proof.timeToTargetS() - holdEnd;
            recipe = extendFinalHold(recipe, Math.max(Math.max(tool.timeStepS(), 1), lateBy));
        }
        return null;
    }

    /** A knot placement and a rule to build the recipe on it. */
    private record Build(KnotCost knots, Rider.Rule rule) {
    }

    /**
     * The builds tried. The first two are the planner's earlier pair (so no case plans longer than it
     * did); the grid-aware placement adds the shortened rule and the progress rule. The other two
     * pairings never gave the shortest recipe on the demo and bench cases and are left out for time.
     */
    private static final List<Build> BUILDS = List.of(
            new Build(KnotCost.DEVIATION, Rider.Rule.RIDE_TIMES_SHORTENED),
            new Build(KnotCost.DEVIATION, Rider.Rule.RIDE_TIMES),
            new Build(KnotCost.GRID_AREA, Rider.Rule.RIDE_TIMES_SHORTENED),
            new Build(KnotCost.GRID_AREA, Rider.Rule.PROGRESS));

    /** How the knot placement measures the time a ramp loses against the ride. */
    enum KnotCost {
        /** The largest gap between the ramp's straight line and the ride, times the ramp's duration. */
        DEVIATION,
        /**
         * The area between the ride and the ramp whose ends are the ride's setpoints rounded down to the
         * tool's grid (the line lowered as far as it rises above the ride), weighted by 1/T²: a setpoint
         * gap δT slows a reaction of activation energy E by the fraction E δT / (R T²).
         */
        GRID_AREA
    }

    /**
     * Times along the ride (after its start) at which m ramps approximate it up to its arrival at the
     * cap. A ramp that runs above the ride must end lower, one below it heats too little: either way
     * the bake loses time in proportion to how far the straight line strays from the ride and for how
     * long. The knots minimise the sum of that loss over the ramps, as {@code measure} counts it, by
     * dynamic programming over the ride's points (thinned to at most 160).
     */
    private double[] knotTimes(Rider.Ride ride, int m, KnotCost measure) {
        double[] tAll = ride.timesS();
        double[] spAll = ride.setpointsK();
        int end = tAll.length - 1;
        for (int i = 0; i < tAll.length; i++) {
            if (spAll[i] >= capK - 1e-9) {
                end = i;
                break;
            }
        }
        int stride = Math.max(1, (end + 159) / 160);
        List<Integer> idx = new ArrayList<>();
        for (int i = 0; i < end; i += stride) {
            idx.add(i);
        }
        idx.add(end);
        int n = idx.size();
        double[] t = new double[n];
        double[] sp = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = tAll[idx.get(i)];
            sp[i] = spAll[idx.get(i)];
        }
        if (n <= 1) {
            return new double[]{tAll[end]};
        }
        // cost of one ramp from point a to b (using every original point in between)
        double[][] cost = new double[n][n];
        for (int a = 0; a < n; a++) {
            for (int b = a + 1; b < n; b++) {
                int ia = idx.get(a);
                int ib = idx.get(b);
                cost[a][b] = measure == KnotCost.GRID_AREA ? gridArea(tAll, spAll, ia, ib) : deviation(tAll, spAll, ia, ib);
            }
        }
        int segs = Math.min(m, n - 1);
        double[][] best = new double[segs + 1][n];
        int[][] from = new int[segs + 1][n];
        for (double[] row : best) {
            java.util.Arrays.fill(row, Double.POSITIVE_INFINITY);
        }
        best[0][0] = 0;
        for (int q = 1; q <= segs; q++) {
            for (int b = 1; b < n; b++) {
                for (int a = 0; a < b; a++) {
                    double v = best[q - 1][a] + cost[a][b];
                    if (v < best[q][b]) {
                        best[q][b] = v;
                        from[q][b] = a;
                    }
                }
            }
        }
        int q = 1;
        for (int c = 1; c <= segs; c++) {
            if (best[c][n - 1] < best[q][n - 1] - 1e-12) {
                q = c;
            }
        }
        double[] knots = new double[q];
        int b = n - 1;
        for (int c = q; c >= 1; c--) {
            knots[c - 1] = t[b];
            b = from[c][b];
        }
        return knots;
    }

    /** The largest gap between the ride and the straight line through its points ia and ib, times the duration. */
    private static double deviation(double[] t, double[] sp, int ia, int ib) {
        double dev = 0;
        for (int p = ia + 1; p < ib; p++) {
            double c = sp[ia] + (t[p] - t[ia]) / (t[ib] - t[ia]) * (sp[ib] - sp[ia]);
            dev = Math.max(dev, Math.abs(c - sp[p]));
        }
        return dev * (t[ib] - t[ia]);
    }

    /**
     * ∫ (ride − ramp) / T² dt from point ia to ib (trapezoidal rule), the ramp running between the ride's
     * setpoints rounded down to the tool's grid (the start setpoint as it is at the start) and lowered
     * by as much as it rises above the ride anywhere.
     */
    private double gridArea(double[] t, double[] sp, int ia, int ib) {
        double ya = ia == 0 ? sp[0] : floorSetpoint(sp[ia], tool.setpointStepK());
        double yb = floorSetpoint(sp[ib], tool.setpointStepK());
        double slope = (yb - ya) / (t[ib] - t[ia]);
        double excess = 0;
        for (int p = ia + 1; p < ib; p++) {
            excess = Math.max(excess, ya + slope * (t[p] - t[ia]) - sp[p]);
        }
        double sum = 0;
        double g0 = (sp[ia] - ya + excess) / (sp[ia] * sp[ia]);
        for (int p = ia + 1; p <= ib; p++) {
            double g1 = (sp[p] - (ya + slope * (t[p] - t[ia]) - excess)) / (sp[p] * sp[p]);
            sum += 0.5 * (g0 + g1) * (t[p] - t[p - 1]);
            g0 = g1;
        }
        return sum;
    }

    private boolean quasiSteady() {
        return probe().regime() == GasRegime.QUASI_STEADY;
    }

    /** The probe: the fastest ramp to the cap and a short hold, simulated once for the gas regime (bound and rider). */
    private BakeResult probe;

    private BakeResult probe() {
        if (probe == null) {
            Recipe r = new Recipe(startK, List.of(new Step.Ramp(capK, tool.maxRampUpKPerS()), new Step.Hold(600)));
            probe = BakeSimulator.simulate(bake.withRecipe(r), SimulationSettings.defaults().withSampleInterval(0));
            evaluations++;
        }
        return probe;
    }

    // ------------------------------------------------------------------ evaluation

    /** The result of simulating a shape with a long final hold. */
    record Eval(double timeToTargetS, double durationS, double minMargin, String worst, double objective, double finalU) {
        boolean feasible() {
            return !Double.isNaN(timeToTargetS) && minMargin >= 1;
        }
    }

    private Recipe toRecipe(Shape s, double holdS) {
        return toRecipe(s, holdS, true);
    }

    /** The recipe of a shape with a final hold, and the cool-down when the tool unloads and {@code coolDown}. */
    private Recipe toRecipe(Shape s, double holdS, boolean coolDown) {
        List<Step> steps = new ArrayList<>();
        double t = startK;
        for (int i = 0; i < s.temps.length; i++) {
            double target = s.temps[i];
            double d = Math.max(s.durations[i], tool.minStepS());
            if (Math.abs(target - t) < 1e-6) {
                steps.add(new Step.Hold(d));
            } else {
                double rateMax = target > t ? tool.maxRampUpKPerS() : tool.maxRampDownKPerS();
                double rate = Math.min(Math.abs(target - t) / d, rateMax);
                steps.add(new Step.Ramp(target, rate));
                t = target;
            }
        }
        steps.add(new Step.Hold(Math.max(holdS, Math.max(tool.minStepS(), 1))));
        if (coolDown && tool.hasUnload() && tool.unloadK() < t) {
            // the cool-down belongs to the bake: its thermal dose and stresses count in the search too
            steps.add(new Step.Ramp(tool.unloadK(), tool.maxRampDownKPerS()));
        }
        return new Recipe(startK, steps);
    }

    /** Time to target of the last evaluated shape, to size the final hold of the next one. */
    private double lastTargetS = Double.NaN;

    private Eval evaluate(Shape s) {
        if (s.holdS >= LONG_HOLD_S && !Double.isNaN(lastTargetS)) {
            // a final hold that comfortably covers the last target time keeps the simulations short
            double ramps = 0;
            for (double d : s.durations) {
                ramps += Math.max(d, tool.minStepS());
            }
            double hold = Math.max(3600, 2 * lastTargetS - ramps);
            Eval e = evaluateWithHold(s, hold);
            if (!Double.isNaN(e.timeToTargetS)) {
                return e;
            }
        }
        Eval e = evaluateWithHold(s, s.holdS);
        if (!Double.isNaN(e.timeToTargetS)) {
            lastTargetS = e.timeToTargetS;
        }
        return e;
    }

    private Eval evaluateWithHold(Shape s, double holdS) {
        Recipe r = toRecipe(s, holdS);
        BakeResult res = BakeSimulator.simulate(bake.withRecipe(r), search);
        evaluations++;
        double tx = res.timeToTargetS();
        double holdEnd = holdEnd(r);
        // the tool's shortest step applies to the final hold too, so the hold ends no earlier than that
        double holdStart = holdEnd - lastHoldDuration(r) + Math.max(tool.minStepS(), Math.max(tool.timeStepS(), 1));
        List<Margin> margins = res.margins();
        if (bake.limits().dose() != null && !Double.isNaN(tx)) {
            // the dose depends on how long the hold really lasts and on the cool-down after it: simulate the
            // recipe again with the final hold ending where the target is reached
            double end = Math.max(tx, holdStart);
            Recipe exact = toRecipe(s, end - (holdEnd - lastHoldDuration(r)));
            margins = BakeSimulator.simulate(bake.withRecipe(exact), search).margins();
            evaluations++;
        }
        double min = Double.POSITIVE_INFINITY;
        String worst = "";
        for (Margin m : margins) {
            double v;
            if (m.limit().equals("residue")) {
                continue;
            }
            if (m.headroom()) {
                v = m.margin() >= 0 ? Double.POSITIVE_INFINITY : 1 + m.margin() / 10;
            } else {
                v = m.margin();
            }
            if (v < min) {
                min = v;
                worst = m.limit();
            }
        }
        double duration = Double.isNaN(tx) ? Double.NaN : Math.max(tx, holdStart);
        double objective;
        if (Double.isNaN(tx)) {
            objective = 1e9 * (1 + res.finalUnconverted());
        } else {
            double shortfall = Math.max(0, SEARCH_MARGIN - min);
            objective = duration * (1 + 20 * shortfall) + (shortfall > 0 ? 1e5 * shortfall : 0);
        }
        return new Eval(tx, duration, min, worst, objective, res.finalUnconverted());
    }

    private static double lastHoldDuration(Recipe r) {
        return ((Step.Hold) r.steps().get(lastHoldIndex(r))).durationS();
    }

    // ------------------------------------------------------------------ seeds

    /** Bisection on the final setpoint of a fastest ramp: the lowest one whose target time fits a minimum hold. */
    private Shape lowestSufficient(Eval atCap) {
        double lo = startK;
        double hi = capK;
        Shape best = null;
        for (int it = 0; it < 14 && hi - lo > Math.max(tool.setpointStepK(), 0.05); it++) {
            double mid = 0.5 * (lo + hi);
            double ramp = (mid - startK) / tool.maxRampUpKPerS();
            Shape s = new Shape(new double[]{ramp}, new double[]{mid}, Math.max(tool.minStepS(), 1));
            Eval e = evaluate(s);
            if (e.feasible() && e.timeToTargetS <= ramp + tool.minStepS()) {
                hi = mid;
                best = s;
            } else {
                lo = mid;
            }
        }
        if (best == null) {
            return null;
        }
        double t = floorSetpoint(best.temps[0], tool.setpointStepK());
        if (t < best.temps[0]) {
            t += Math.max(tool.setpointStepK(), 0);
        }
        return new Shape(new double[]{(t - startK) / tool.maxRampUpKPerS()}, new double[]{Math.min(t, capK)}, LONG_HOLD_S);
    }

    /**
     * The rider seed, built closed-loop: from the simulated state at the end of the recipe so far,
     * the hot corner rides the highest admissible temperature; the next ramp follows that ride as
     * far as a straight line stays within {@code toleranceK} of it, ending that much below it; the
     * recipe so far is simulated again and the next ramp planned from there. The tolerance grows
     * until the ramps reach the cap within the step budget.
     */
    private Shape riderSeed() {
        InstantLimits limits = new InstantLimits(bake);
        int ramps = Math.max(1, tool.maxSteps() - 2 - (tool.hasUnload() ? 1 : 0));
        Shape last = null;
        for (double tol = 0.5; tol <= 128; tol *= 2) {
            Shape s = closedLoop(limits, ramps, tol);
            if (s == null) {
                break;
            }
            last = s;
            if (s.temps[s.temps.length - 1] >= capK - 1e-9) {
                return s;
            }
        }
        if (last == null) {
            return null;
        }
        // the budget ran out below the cap: one more ramp to the cap at a tenth of the fastest rate (the
        // closed loop was given one ramp less than the tool allows, so this still fits)
        double[] temps = java.util.Arrays.copyOf(last.temps, last.temps.length + 1);
        double[] durations = java.util.Arrays.copyOf(last.durations, last.durations.length + 1);
        temps[temps.length - 1] = capK;
        durations[durations.length - 1] = (capK - last.temps[last.temps.length - 1]) / (0.1 * tool.maxRampUpKPerS());
        return new Shape(durations, temps, LONG_HOLD_S);
    }

    private Shape closedLoop(InstantLimits limits, int budget, double tol) {
        int k = limits.size();
        double spread = bake.wafer().spreadK();
        List<Double> temps = new ArrayList<>();
        List<Double> durations = new ArrayList<>();
        double[] alpha = new double[k];
        for (int j = 0; j < k; j++) {
            alpha[j] = bake.polymer().initialConversion(j);
        }
        double wafer = startK + spread;
        double setpoint = startK;
        for (int q = 0; q < budget; q++) {
            List<double[]> path = ride(limits, alpha, wafer, setpoint);
            if (path == null) {
                return null;
            }
            int e;
            double target;
            {
                e = 1;
                while (e + 1 < path.size() && chordWithin(path, e + 1, tol)) {
                    e++;
                }
                target = path.get(e)[1];
                if (target < capK - 1e-9) {
                    target = Math.max(target - chordExcess(path, e), setpoint);
                }
            }
            double duration = Math.max(path.get(e)[0] - path.get(0)[0], (target - setpoint) / tool.maxRampUpKPerS());
            temps.add(target);
            durations.add(Math.max(duration, 1));
            if (target >= capK - 1e-9) {
                break;
            }
            // where the real recipe so far leaves the hot corner
            Shape partial = new Shape(unbox(durations), unbox(temps), 1);
            BakeResult r = BakeSimulator.simulate(bake.withRecipe(toRecipe(partial, 1e-3, false)),
                    search.withSampleInterval(1e9));
            evaluations++;
            CornerResult hot = r.hottest();
            double[] end = hot.history().get(hot.history().size() - 1);
            for (int j = 0; j < k; j++) {
                alpha[j] = end[3 + j];
            }
            wafer = end[hot.column("wafer_K")];
            setpoint = target;
        }
        return new Shape(unbox(durations), unbox(temps), LONG_HOLD_S);
    }

    private static double[] unbox(List<Double> list) {
        return list.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /** Whether the straight line from the path's start to point e stays within tol of the path. */
    private static boolean chordWithin(List<double[]> path, int e, double tol) {
        for (int p = 1; p < e; p++) {
            if (Math.abs(chord(path, 0, e, p) - path.get(p)[1]) > tol) {
                return false;
            }
        }
        return true;
    }

    /** How far the straight line from the path's start to point e rises above the path at most. */
    private static double chordExcess(List<double[]> path, int e) {
        double m = 0;
        for (int p = 1; p < e; p++) {
            m = Math.max(m, chord(path, 0, e, p) - path.get(p)[1]);
        }
        return m;
    }

    /**
     * The hot corner's ride from the given state at the highest admissible temperature, no faster
     * than the tool, until the setpoint reaches the cap: points (time from now [s], setpoint [K]).
     */
    private List<double[]> ride(InstantLimits limits, double[] alpha0, double wafer0, double setpoint0) {
        int k = limits.size();
        double spread = bake.wafer().spreadK();
        double[] alpha = alpha0.clone();
        double tHot = Math.max(wafer0, setpoint0 + spread);
        double t = 0;
        double dt = 5;
        List<double[]> path = new ArrayList<>();
        path.add(new double[]{0, setpoint0});
        while (t < LONG_HOLD_S) {
            double top = Math.min(tHot + tool.maxRampUpKPerS() * dt, capK + spread);
            // a ride that would have to fall below the start setpoint is hopeless: no recipe of this shape
            double feasible = highestFeasible(limits, alpha, top, startK + spread - 1e-9);
            if (Double.isNaN(feasible)) {
                return null;
            }
            double next = Math.max(feasible, tHot - tool.maxRampDownKPerS() * dt);
            for (int j = 0; j < k; j++) {
                alpha[j] = Math.min(1, alpha[j] + dt * limits.rate(j, next, alpha[j]));
            }
            tHot = next;
            t += dt;
            path.add(new double[]{t, tHot - spread});
            if (tHot - spread >= capK - 1e-6) {
                break;
            }
        }
        return path;
    }

    private static double highestFeasible(InstantLimits limits, double[] alpha, double top, double floor) {
        if (limits.margin(top, alpha) >= SEARCH_MARGIN) {
            return top;
        }
        double hi = top;
        double lo = top - 2;
        while (lo > floor && limits.margin(lo, alpha) < SEARCH_MARGIN) {
            hi = lo;
            lo -= 2;
        }
        if (lo <= floor) {
            return Double.NaN;
        }
        for (int it = 0; it < 30 && hi - lo > 1e-3; it++) {
            double mid = 0.5 * (lo + hi);
            if (limits.margin(mid, alpha) >= SEARCH_MARGIN) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    private static double chord(List<double[]> path, int a, int b, int p) {
        double[] pa = path.get(a);
        double[] pb = path.get(b);
        double[] pp = path.get(p);
        return pa[1] + (pp[0] - pa[0]) / (pb[0] - pa[0]) * (pb[1] - pa[1]);
    }

    /** A slow fallback: ramp to well below the cap, then creep up at a tenth of the fastest rate. */
    private Shape slowest() {
        double mid = startK + 0.5 * (capK - startK);
        return new Shape(new double[]{(mid - startK) / tool.maxRampUpKPerS(), (capK - mid) / (0.1 * tool.maxRampUpKPerS())},
                new double[]{mid, capK}, LONG_HOLD_S);
    }

    // ------------------------------------------------------------------ refinement

    private Shape refine(Shape seed) {
        int m = seed.temps.length;
        int n = 2 * m;
        double[] x0 = new double[n];
        double[] lo = new double[n];
        double[] hi = new double[n];
        double span = capK - startK;
        for (int i = 0; i < m; i++) {
            x0[i] = (seed.temps[i] - startK) / span;
            lo[i] = 0;
            hi[i] = 1;
            x0[m + i] = Math.log10(Math.max(Math.max(seed.durations[i], tool.minStepS()), 1));
            lo[m + i] = Math.log10(Math.max(tool.minStepS(), 1));
            hi[m + i] = Math.log10(LONG_HOLD_S);
            x0[m + i] = Math.min(Math.max(x0[m + i], lo[m + i]), hi[m + i]);
        }
        BOBYQAOptimizer opt = new BOBYQAOptimizer(2 * n + 1, 0.05, 1e-4);
        double[][] bestX = {x0.clone()};
        double[] bestF = {Double.POSITIVE_INFINITY};
        try {
            opt.optimize(new MaxEval(Math.max(40, 6 * n)), GoalType.MINIMIZE, new InitialGuess(x0),
                    new SimpleBounds(lo, hi), new ObjectiveFunction(x -> {
                        double f = evaluate(decode(x, m)).objective;
                        if (f < bestF[0]) {
                            bestF[0] = f;
                            bestX[0] = x.clone();
                        }
                        return f;
                    }));
        } catch (org.hipparchus.exception.MathIllegalStateException e) {
            notes.add("refinement stopped at its evaluation limit");
        }
        return decode(bestX[0], m);
    }

    private Shape decode(double[] x, int m) {
        double[] temps = new double[m];
        double[] durations = new double[m];
        for (int i = 0; i < m; i++) {
            // a heating programme: each knot at least as hot as the one before (the cool-down comes last)
            temps[i] = Math.max(startK + x[i] * (capK - startK), i > 0 ? temps[i - 1] : startK);
            durations[i] = Math.pow(10, x[m + i]);
        }
        return new Shape(durations, temps, LONG_HOLD_S);
    }

    /** The same setpoints reached more slowly: every step after the first lasts {@code factor} times longer. */
    private static Shape slowed(Shape s, double factor) {
        if (factor == 1) {
            return s;
        }
        double[] d = s.durations.clone();
        for (int i = 1; i < d.length; i++) {
            d[i] *= factor;
        }
        return new Shape(d, s.temps, s.holdS);
    }

    // ------------------------------------------------------------------ rounding

    private Recipe rounded(Shape s, double timeToTargetS) {
        List<Step> steps = new ArrayList<>();
        double t = startK;
        double elapsed = 0;
        double res = tool.setpointStepK();
        double ts = Math.max(tool.timeStepS(), 1e-3);
        for (int i = 0; i < s.temps.length; i++) {
            double target = Math.min(floorSetpoint(s.temps[i], res), capK);
            double d = Math.max(s.durations[i], tool.minStepS());
            if (Math.abs(target - t) < 1e-9) {
                double dh = ceilTo(d, ts);
                steps.add(new Step.Hold(dh));
                elapsed += dh;
                continue;
            }
            double rateMax = target > t ? tool.maxRampUpKPerS() : tool.maxRampDownKPerS();
            double minDuration = Math.abs(target - t) / rateMax;
            double dr = ceilTo(Math.max(Math.max(d, minDuration), tool.minStepS()), ts);
            steps.add(new Step.Ramp(target, Math.abs(target - t) / dr));
            elapsed += dr;
            t = target;
        }
        double hold = Math.max(ceilTo(Math.max(timeToTargetS - elapsed, tool.minStepS()), ts), Math.max(tool.minStepS(), ts));
        steps.add(new Step.Hold(hold));
        if (tool.hasUnload() && tool.unloadK() < t) {
            double dr = ceilTo(Math.max((t - tool.unloadK()) / tool.maxRampDownKPerS(), tool.minStepS()), ts);
            steps.add(new Step.Ramp(tool.unloadK(), (t - tool.unloadK()) / dr));
        }
        return new Recipe(startK, steps);
    }

    private Recipe extendFinalHold(Recipe r, double extraS) {
        List<Step> steps = new ArrayList<>(r.steps());
        int idx = lastHoldIndex(r);
        Step.Hold h = (Step.Hold) steps.get(idx);
        steps.set(idx, new Step.Hold(ceilTo(h.durationS() + extraS, Math.max(tool.timeStepS(), 1e-3))));
        return new Recipe(r.startK(), steps);
    }

    private static int lastHoldIndex(Recipe r) {
        for (int i = r.steps().size() - 1; i >= 0; i--) {
            if (r.steps().get(i) instanceof Step.Hold) {
                return i;
            }
        }
        throw new IllegalStateException("recipe has no hold");
    }

    /** Elapsed time at the end of the final hold (before the cool-down). */
    static double holdEnd(Recipe r) {
        int idx = lastHoldIndex(r);
        return r.segments().get(idx).endTimeS();
    }

    /** Rounds a setpoint down to the tool's resolution on the Celsius scale the tool displays. */
    static double floorSetpoint(double kelvin, double step) {
        double c0 = org.exhale.PhysicalConstants.ZERO_CELSIUS_K;
        return floorTo(kelvin - c0, step) + c0;
    }

    static double floorTo(double v, double step) {
        return step <= 0 ? v : Math.floor(v / step + 1e-9) * step;
    }

    static double ceilTo(double v, double step) {
        return step <= 0 ? v : Math.ceil(v / step - 1e-9) * step;
    }

    // ------------------------------------------------------------------ infeasible

    private PlanResult infeasible(LowerBound.Result bound, boolean rigorous, String limit, String reason, String suggestion) {
        return new PlanResult(null, null, Double.NaN, Double.NaN, bound, rigorous, false, List.of(), evaluations, notes,
                new PlanResult.Infeasibility(limit, reason, Double.NaN, Double.NaN, suggestion), rideS, rideAdmissible);
    }

    private PlanResult diagnose(LowerBound.Result bound, boolean rigorous, Eval best) {
        // best residue reachable under the ceiling within the long hold
        Shape ceiling = new Shape(new double[]{(capK - startK) / tool.maxRampUpKPerS()}, new double[]{capK}, LONG_HOLD_S);
        Recipe r = toRecipe(ceiling, LONG_HOLD_S);
        BakeResult res = BakeSimulator.simulate(bake.withRecipe(r), search);
        evaluations++;
        double bestU = res.finalUnconverted();
        Margin worst = res.violated().stream().filter(m -> !m.limit().equals("residue")).findFirst().orElse(null);
        if (Double.isNaN(res.timeToTargetS())) {
            // find the ceiling that would reach the target within the long hold
            String suggestion = "raise the ceiling (the residue target is not reached at " + fmtC(capK) + " within "
                    + minutes(LONG_HOLD_S) + ")";
            for (double up = 10; up <= 200; up += 10) {
                BakeCase hotter = bake.withLimits(bake.limits().withCeiling(bake.limits().ceilingK() + up));
                Recipe rr = new Recipe(startK, List.of(new Step.Ramp(capK + up, tool.maxRampUpKPerS()), new Step.Hold(LONG_HOLD_S)));
                BakeResult h = BakeSimulator.simulate(hotter.withRecipe(rr), search);
                evaluations++;
                if (!Double.isNaN(h.timeToTargetS())) {
                    suggestion = "a ceiling of " + fmtC(bake.limits().ceilingK() + up) + " would reach the target in "
                            + minutes(h.timeToTargetS());
                    break;
                }
            }
            return new PlanResult(null, null, Double.NaN, Double.NaN, bound, rigorous, false, List.of(), evaluations, notes,
                    new PlanResult.Infeasibility("residue", "the residue target is not reached under the ceiling",
                            bestU, LONG_HOLD_S, suggestion), rideS, rideAdmissible);
        }
        Margin proofWorst = lastProof == null ? null
                : lastProof.violated().stream().filter(m -> !m.limit().equals("residue")).findFirst().orElse(null);
        String limit = proofWorst != null ? proofWorst.limit()
                : !best.worst.isEmpty() && best.minMargin < 1 ? best.worst : worst == null ? "unknown" : worst.limit();
        String dominant = proofWorst != null ? proofWorst.detail() : "";
        boolean thermal = dominant.equals("thermal") && List.of("strength", "cracking", "delamination").contains(limit);
        String suggestion = thermal
                ? "the cap's thermal-mismatch stress alone is too high at a temperature the bake must pass: a cap with "
                  + "less intrinsic or mismatch stress, a stronger or tougher film, or a lower safety factor"
                : switch (limit) {
            case "pressure", "strength", "cracking", "delamination", "deflection" ->
                    "the trapped pressure is too high even at the slowest recipe tried: a more porous or thinner cap, "
                    + "larger pores, or a higher allowed pressure";
            case "buckling" -> "the cap buckles under its thermal compression: a cap with less compressive stress or a narrower span";
            case "thermal_dose" -> "the thermal budget is too small for the polymer's kinetics: raise the dose limit or use a faster polymer";
            default -> "relax the '" + limit + "' limit";
        };
        double atStart = new InstantLimits(bake).margin(startK, initialAlpha());
        if (atStart < 1 && List.of("strength", "cracking", "delamination", "buckling").contains(limit)) {
            // nothing has decomposed yet: the cap's own stress (intrinsic and thermal mismatch) is the cause
            suggestion = "the cap's own stress (intrinsic plus thermal mismatch) already fails the '" + limit
                    + "' limit before any gas: a cap with less intrinsic or mismatch stress, a stronger or tougher film, "
                    + "a narrower span, or a lower safety factor";
        }
        String reason = atStart < 1 ? "the '" + limit + "' limit fails already at the start temperature"
                : "no recipe tried keeps the '" + limit + "' limit (best margin " + String.format(java.util.Locale.ROOT, "%.3g", best.minMargin) + ")";
        return new PlanResult(null, null, Double.NaN, Double.NaN, bound, rigorous, false, List.of(), evaluations, notes,
                new PlanResult.Infeasibility(limit, reason, bestU, LONG_HOLD_S, suggestion), rideS, rideAdmissible);
    }

    private double[] initialAlpha() {
        double[] a = new double[bake.polymer().size()];
        for (int j = 0; j < a.length; j++) {
            a[j] = bake.polymer().initialConversion(j);
        }
        return a;
    }

    static String fmtC(double k) {
        return String.format(java.util.Locale.ROOT, "%.0f C", k - 273.15);
    }

    static String minutes(double s) {
        return String.format(java.util.Locale.ROOT, "%.1f min", s / 60);
    }
}
