package org.exhale.planning;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.kinetics.ReactionModel;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.simulation.GasRegime;
import org.exhale.simulation.InstantLimits;
import org.exhale.simulation.Limits;
import org.exhale.simulation.SimulationSettings;
import org.exhale.simulation.TestCases;
import org.exhale.simulation.Wafer;
import org.exhale.transport.CapFilm;
import org.junit.jupiter.api.Test;

class LowerBoundTest {
    private static final double C0 = 273.15;
    private static final double R = org.exhale.PhysicalConstants.GAS_CONSTANT;
    private static final Tool TOOL = new Tool(10 / 60.0, 5 / 60.0, 1, 1, 30, 12, Double.NaN);

    /** One first-order component under a porous cap, no spread or lag, no mechanics, only the ceiling binds. */
    private static BakeCase ceilingOnly(double ceilingC) {
        return TestCases.porousLine()
                .withPolymer(TestCases.singleComponent(new ReactionModel.NthOrder(1), 1e10, 150e3))
                .withFilm(null).withWafer(Wafer.ideal())
                .withLimits(new Limits(C0 + ceilingC, 0.005, Double.POSITIVE_INFINITY, null, 1, Double.POSITIVE_INFINITY));
    }

    @Test
    void ceilingOnlyBoundEqualsTheClosedFormOptimum() {
        // Derived, no published source (docs/model.md, "Lower bounds"): with only the ceiling and the ramp binding the
        // optimum is the fastest ramp to the ceiling and a hold, and for a first-order component
        // −ln u(t*) = ∫_0^{t_r} k(T(t)) dt + k(T_c)(t* − t_r). The ramp integral is taken here by Simpson's rule
        // over temperature (an independent quadrature, 20 000 intervals).
        double ceilingC = 330;
        BakeCase b = ceilingOnly(ceilingC);
        double a = 1e10;
        double e = 150e3;
        double t0 = b.recipeStartK();
        double tc = C0 + ceilingC;
        double beta = 10 / 60.0;
        int n = 20_000;
        double h = (tc - t0) / n;
        double sum = 0;
        for (int i = 0; i <= n; i++) {
            double w = i == 0 || i == n ? 1 : (i % 2 == 1 ? 4 : 2);
            sum += w * a * Math.exp(-e / (R * (t0 + i * h)));
        }
        double rampIntegral = sum * h / 3 / beta;
        double tr = (tc - t0) / beta;
        double tStar = tr + (-Math.log(0.005) - rampIntegral) / (a * Math.exp(-e / (R * tc)));
        LowerBound.Result r = LowerBound.compute(b, TOOL, true);
        double ceiling = r.estimate("ceiling").seconds();
        // the ceiling bound steps 1 s with upper Riemann sums: at most a few seconds early, never late
        assertTrue(ceiling <= tStar && ceiling >= tStar - 3, "ceiling bound " + ceiling + " s vs closed form " + tStar + " s");
        assertEquals(tStar, r.boundS(), 3, "the reported bound");
        // the joint bound sees the same problem on its grid (the cap is tabulated per second; 0.5 % empirical)
        double joint = r.estimate("joint").seconds();
        assertTrue(joint <= tStar && joint >= 0.995 * tStar, "joint bound " + joint + " s vs closed form " + tStar + " s");
        // and the simulator's fastest ramp and hold reaches the target at the closed-form time (0.1 %, its tolerance)
        Recipe fastest = new Recipe(t0, List.of(new Step.Ramp(tc, beta), new Step.Hold(48 * 3600)));
        double sim = BakeSimulator.simulate(b.withRecipe(fastest)).timeToTargetS();
        assertEquals(tStar, sim, 1e-3 * tStar, "simulated optimum");
    }

    @Test
    void everyBoundIsLabelledAndTheReportedOneIsTheLargestRigorous() {
        CaseFile dense = CaseYamlReader.read(Path.of("data/demo/dense-disc.yaml"));
        LowerBound.Result stored = LowerBound.compute(dense.bake(), dense.tool(), false);
        assertFalse(stored.estimate("joint").rigorous(), "the quasi-steady joint bound cannot be rigorous with stored gas");
        assertFalse(stored.estimate("envelope").rigorous());
        assertTrue(stored.estimate("vent_capacity").rigorous());
        assertTrue(stored.estimate("joint_stored").rigorous());
        double fast = Math.max(stored.estimate("ceiling").seconds(), stored.estimate("vent_capacity").seconds());
        assertEquals(Math.max(fast, stored.estimate("joint_stored").seconds()), stored.boundS(), 0);
        LowerBound.Result qs = LowerBound.compute(dense.bake(), dense.tool(), true);
        assertTrue(qs.estimate("joint").rigorous());
        assertEquals(null, qs.estimate("joint_stored"), "quasi-steady gas needs no stored-gas programme");
        assertEquals(Math.max(Math.max(fast, qs.estimate("joint").seconds()), qs.estimate("envelope").seconds()), qs.boundS(), 0);
        // the planner's fast path leaves the stored-gas programme to its own thread
        LowerBound.Result quick = LowerBound.compute(dense.bake(), dense.tool(), false, false);
        assertEquals(fast, quick.boundS(), 0);
        assertEquals(stored.estimate("joint_stored").seconds(),
                LowerBound.withStoredGas(quick, dense.bake(), dense.tool()).boundS(), 0);
    }

    /** The porous line with a pressure limit that binds, quasi-steady (relaxation in microseconds), ±2 K, 10 s lag. */
    static BakeCase porousPressureBinds() {
        return TestCases.porousLine().withFilm(null).withWafer(new Wafer(10, 2))
                .withLimits(new Limits(C0 + 400, 0.005, 0.02, null, 1, Double.POSITIVE_INFINITY));
    }

    /**
     * Two components that really share the pressure budget: a permeation-only cap fast enough to be
     * quasi-steady (relaxation about 2 ms) with a 150 Pa limit; the fastest ramp peaks far above it.
     */
    static BakeCase sharedPressureBudget() {
        return TestCases.denseDisc().withCap(new CapFilm(2e-6, 0, 0, Double.NaN, 2e-11, 20e3)).withFilm(null)
                .withWafer(new Wafer(0, 2))
                .withLimits(new Limits(C0 + 400, 0.005, 150, null, 1, Double.POSITIVE_INFINITY));
    }

    @Test
    void theSharedBudgetCaseBindsOnPressureWithBothComponents() {
        BakeCase b = sharedPressureBudget();
        Recipe fastest = new Recipe(b.recipeStartK(), List.of(new Step.Ramp(C0 + 398, 10 / 60.0), new Step.Hold(3600)));
        BakeResult r = BakeSimulator.simulate(b.withRecipe(fastest));
        assertEquals(GasRegime.QUASI_STEADY, r.regime());
        var p = r.margin("pressure");
        assertTrue(p.margin() < 0.5, "the fastest ramp should overshoot the pressure limit: margin " + p.margin());
        // the pressure binds the bound: it is well above the ceiling-only bound
        LowerBound.Result lb = LowerBound.compute(b, TOOL, true);
        assertTrue(lb.boundS() > 1.15 * lb.ceilingOnlyBoundS(), "bound " + lb.boundS() + " vs ceiling-only " + lb.ceilingOnlyBoundS());
    }

    @Test
    void randomRecipesNearTheBoundaryNeverBeatTheBoundPorous() {
        neverBeaten(porousPressureBinds(), 20261203L, 200);
    }

    @Test
    void randomRecipesNearTheBoundaryNeverBeatTheBoundSharedBudget() {
        neverBeaten(sharedPressureBudget(), 20261204L, 80);
    }

    @Test
    void randomRecipesNearTheBoundaryNeverBeatTheBoundOneComponent() {
        // one component, ±2 K, 10 s lag, pressure binding: the case where the envelope bound is the tight one
        neverBeaten(CaseYamlReader.read(Path.of("data/bench/one-component-porous.yaml")).bake(), 20261207L, 40);
    }

    /** Three components (the joint programme's two-dimensional cells), porous cap, pressure binding. */
    static BakeCase threeComponents() {
        BakeCase b = porousPressureBinds();
        var p = b.polymer();
        var extra = new org.exhale.kinetics.Component("filler", 0.25, new ReactionModel.AvramiErofeev(2), 1e13, 185e3, 0,
                new org.exhale.kinetics.Product(0.044, 0.45e-9, 1.0e-5));
        return b.withPolymer(p.withComponents(List.of(p.component(0).withFraction(0.6), p.component(1).withFraction(0.15), extra)));
    }

    @Test
    void perturbedPlansNeverBeatTheStoredGasBound() {
        // the dense demo under the full gas equations (stored gas). Random recipes sit far above its bound, so the recipes
        // checked start from the verified plan: random short pulses above it (which could use the cavity's storage) and
        // random changes of its ramp rates, each then sped up or slowed down to the boundary of the limits
        perturbedPlansNeverBeat("data/demo/dense-disc.yaml", 20261202L, 1.25);
    }

    @Test
    void perturbedPlansNeverBeatTheStoredGasBoundOneComponent() {
        // as above on the one-component dense bench case, whose bound (fine levels, 64 bins) lies 2.4 % below its plan.
        // The plan itself (checked first) is the recipe nearest the bound; the perturbed ones, the closest at 1.076× the
        // bound, check pulse-shaped recipes that could use the cavity's storage against it, not closeness
        perturbedPlansNeverBeat("data/bench/dense-one.yaml", 20261203L, 1.1);
    }

    /**
     * Perturbed copies of the case's verified plan, each sped up or slowed down to the boundary of its limits, never reach
     * the target before the stored-gas bound; the closest must lie within {@code closeWithin} × the bound (so that the
     * check has recipes near it to test).
     */
    private static void perturbedPlansNeverBeat(String file, long seed, double closeWithin) {
        CaseFile dense = CaseYamlReader.read(Path.of(file));
        BakeCase base = dense.bake();
        PlanResult plan = Planner.plan(base, dense.tool());
        assertTrue(plan.verified());
        LowerBound.Estimate stored = plan.lowerBound().estimate("joint_stored");
        assertTrue(stored != null && stored.rigorous(), "the plan's bound under stored gas comes from the stored-gas programme");
        assertEquals(stored.seconds(), plan.lowerBound().boundS(), 0);
        assertTrue(plan.verification().timeToTargetS() >= plan.lowerBound().boundS());
        Random rnd = new Random(seed);
        int checked = 0;
        double closest = Double.POSITIVE_INFINITY;
        for (int trial = 0; trial < 12; trial++) {
            List<Step> steps = new ArrayList<>();
            double t = base.recipeStartK();
            for (Step st : plan.recipe().steps()) {
                if (st instanceof Step.Ramp r) {
                    double rate = Math.min(TOOL.maxRampUpKPerS(), r.rateKPerS() * (0.8 + 0.4 * rnd.nextDouble()));
                    steps.add(new Step.Ramp(r.targetK(), r.targetK() > t ? rate : r.rateKPerS()));
                    t = r.targetK();
                    if (rnd.nextDouble() < 0.3) {
                        double up = Math.min(base.limits().ceilingK() - base.wafer().spreadK(), t + 1 + 5 * rnd.nextDouble());
                        steps.add(new Step.Ramp(up, TOOL.maxRampUpKPerS()));
                        steps.add(new Step.Hold(30 + 150 * rnd.nextDouble()));
                        steps.add(new Step.Ramp(t, TOOL.maxRampDownKPerS()));
                    }
                } else {
                    steps.add(st);
                }
            }
            steps.add(new Step.Hold(8 * 3600));
            // the fastest speed factor in [0.25, 1.5] at which it keeps every limit (rates × s up to the tool's, holds ÷ s)
            double lo = 0.25;
            double hi = 1.5;
            BakeResult best = null;
            for (int it = 0; it < 7; it++) {
                double sp = it == 0 ? lo : 0.5 * (lo + hi);
                BakeResult r = runScaled(base, steps, sp);
                if (feasible(r)) {
                    lo = sp;
                    best = r;
                } else if (it == 0) {
                    break;
                } else {
                    hi = sp;
                }
            }
            if (best == null) {
                continue;
            }
            checked++;
            closest = Math.min(closest, best.timeToTargetS() / stored.seconds());
            assertTrue(best.timeToTargetS() >= stored.seconds() * (1 - 1e-9), "trial " + trial + " (seed " + seed + "): a "
                    + "verified recipe reaches the target at " + best.timeToTargetS() + " s, before the bound " + stored.seconds()
                    + " s");
        }
        System.out.printf("%s: stored-gas bound %.1f min; plan %.1f min; %d perturbed boundary recipes, closest at %.3fx the "
                + "bound%n", file, stored.seconds() / 60, plan.durationS() / 60, checked, closest);
        assertTrue(checked >= 6, "too few feasible perturbed recipes: " + checked);
        assertTrue(closest <= closeWithin, "no perturbed recipe came within " + closeWithin + "x the bound: " + closest);
    }

    private static BakeResult runScaled(BakeCase base, List<Step> steps, double speed) {
        List<Step> out = new ArrayList<>();
        double t = base.recipeStartK();
        for (Step st : steps) {
            if (st instanceof Step.Ramp r) {
                double max = r.targetK() > t ? TOOL.maxRampUpKPerS() : TOOL.maxRampDownKPerS();
                out.add(new Step.Ramp(r.targetK(), Math.min(max, r.rateKPerS() * speed)));
                t = r.targetK();
            } else if (st instanceof Step.Hold h) {
                out.add(new Step.Hold(h.durationS() / speed));
            }
        }
        return BakeSimulator.simulate(base.withRecipe(new Recipe(base.recipeStartK(), out)),
                SimulationSettings.defaults().withSampleInterval(0));
    }

    @Test
    void randomRecipesNearTheBoundaryNeverBeatTheBoundThreeComponents() {
        neverBeaten(threeComponents(), 20261206L, 16);
    }

    /**
     * Seeded random recipes (a quarter of them with 15–40 steps) are each sped up as far as they stay
     * feasible (bisection on a speed factor), so that they sit at the boundary of the limits; none
     * may reach the target before the bound (MODEL.md §9; the check itself is common practice, no source).
     */
    private static void neverBeaten(BakeCase base, long seed, int trials) {
        neverBeaten(base, seed, trials, true);
    }

    private static void neverBeaten(BakeCase base, long seed, int trials, boolean quasiSteady) {
        LowerBound.Result bound = LowerBound.compute(base, TOOL, quasiSteady);
        assertTrue(bound.estimate(quasiSteady ? "joint" : "joint_stored").rigorous());
        Random rnd = new Random(seed);
        int checked = 0;
        double closest = Double.POSITIVE_INFINITY;
        double capK = base.limits().ceilingK() - base.wafer().spreadK();
        for (int trial = 0; trial < trials; trial++) {
            int n = rnd.nextInt(4) == 0 ? 15 + rnd.nextInt(26) : 1 + rnd.nextInt(6);
            double[] temps = new double[n];
            double[] rates = new double[n];
            double[] holds = new double[n];
            double t = base.recipeStartK();
            for (int i = 0; i < n; i++) {
                double up = rnd.nextDouble() < 0.85 ? 1 : -1;
                temps[i] = Math.min(capK, Math.max(base.recipeStartK(), t + up * (2 + rnd.nextDouble() * 250.0 / Math.sqrt(n))));
                rates[i] = (0.5 + rnd.nextDouble() * 9.5) / 60;
                holds[i] = rnd.nextBoolean() ? 0 : 30 + rnd.nextDouble() * 1200 / Math.sqrt(n);
                t = temps[i];
            }
            if (rnd.nextBoolean()) {
                temps[n - 1] = capK;
            }
            // the fastest speed factor in (0, 1] at which the recipe keeps every limit (rates × s, holds ÷ s)
            double lo = 0;
            double hi = 1;
            BakeResult best = null;
            BakeResult at1 = run(base, temps, rates, holds, 1);
            if (feasible(at1)) {
                best = at1;
            } else {
                for (int it = 0; it < 6; it++) {
                    double s = it == 0 ? 0.05 : 0.5 * (lo + hi);
                    BakeResult r = run(base, temps, rates, holds, s);
                    if (feasible(r)) {
                        lo = s;
                        best = r;
                    } else {
                        if (it == 0) {
                            break;
                        }
                        hi = s;
                    }
                }
            }
            if (best == null) {
                continue;
            }
            checked++;
            closest = Math.min(closest, best.timeToTargetS() / bound.boundS());
            assertTrue(best.timeToTargetS() >= bound.boundS() * (1 - 1e-9), "seed " + seed + " trial " + trial
                    + ": a verified recipe reaches the target at " + best.timeToTargetS() + " s, before the bound "
                    + bound.boundS() + " s");
        }
        System.out.printf("bound %.1f min (computed in %.2f s); %d boundary recipes checked, closest at %.3fx the bound (seed %d)%n",
                bound.boundS() / 60, bound.computeS(), checked, closest, seed);
        assertTrue(checked >= trials / 2, "seed " + seed + ": too few feasible recipes (" + checked + ") to test the bound");
    }

    private static boolean feasible(BakeResult r) {
        return !Double.isNaN(r.timeToTargetS())
                && r.margins().stream().filter(m -> !m.limit().equals("residue")).allMatch(m -> m.holds());
    }

    private static BakeResult run(BakeCase base, double[] temps, double[] rates, double[] holds, double speed) {
        List<Step> steps = new ArrayList<>();
        double t = base.recipeStartK();
        for (int i = 0; i < temps.length; i++) {
            if (Math.abs(temps[i] - t) > 1e-6) {
                double max = temps[i] > t ? TOOL.maxRampUpKPerS() : TOOL.maxRampDownKPerS();
                steps.add(new Step.Ramp(temps[i], Math.min(max, rates[i] * speed)));
                t = temps[i];
            }
            if (holds[i] > 0) {
                steps.add(new Step.Hold(holds[i] / speed));
            }
        }
        steps.add(new Step.Hold(8 * 3600));
        return BakeSimulator.simulate(base.withRecipe(new Recipe(base.recipeStartK(), steps)),
                SimulationSettings.defaults().withSampleInterval(0));
    }

    @Test
    void manyStepRidesComeCloseToTheBoundButNeverBeatIt() {
        // an independent construction of a near-optimal recipe: the highest setpoint that keeps every instantaneous limit
        // at both corners (quasi-steady), at most the fastest ramp, followed by a simple Euler ride of the conversions;
        // 40 ramps through points of that ride, slowed until the simulator verifies it (common practice, no source)
        for (BakeCase b : new BakeCase[]{porousPressureBinds(), sharedPressureBudget(),
                CaseYamlReader.read(Path.of("data/bench/qs-two-pressure.yaml")).bake()}) {
            LowerBound.Result bound = LowerBound.compute(b, TOOL, true);
            BakeResult ride = ride(b, 40);
            assertTrue(ride != null, b.name() + ": no verified ride");
            double ratio = ride.timeToTargetS() / bound.boundS();
            System.out.printf("%s: ride of 40 ramps %.1f min, bound %.1f min, ratio %.3f%n", b.name(),
                    ride.timeToTargetS() / 60, bound.boundS() / 60, ratio);
            assertTrue(ratio >= 1 - 1e-9, b.name() + ": the ride beats the bound, ratio " + ratio);
            // tightness: the bound is within 20 % of this quickly built ride (empirical: the ride is itself not optimal;
            // measured 1.073 on the porous case, 1.092 on the dense disc, 1.074 on qs-two-pressure)
            assertTrue(ratio < 1.2, b.name() + ": bound loose, ratio " + ratio);
        }
    }

    /** The many-step ride described above, or null. */
    private static BakeResult ride(BakeCase b, int ramps) {
        org.exhale.simulation.InstantLimits lim = new org.exhale.simulation.InstantLimits(b);
        int k = lim.size();
        double s = b.wafer().spreadK();
        double capK = b.limits().ceilingK() - s;
        double[] hot = new double[k];
        double[] cold = new double[k];
        for (int j = 0; j < k; j++) {
            hot[j] = b.polymer().initialConversion(j);
            cold[j] = hot[j];
        }
        double dt = 2;
        double temp = b.recipeStartK();
        List<double[]> path = new ArrayList<>();
        path.add(new double[]{0, temp});
        double t = 0;
        double u = 1;
        while (u > 0.005 && t < 86_400) {
            double top = Math.min(capK, temp + TOOL.maxRampUpKPerS() * dt);
            double lo = b.recipeStartK() - 50;
            double best = lo;
            if (lim.margin(top + s, hot) >= 1 && lim.margin(top - s, cold) >= 1) {
                best = top;
            } else {
                double hi = top;
                for (int it = 0; it < 30; it++) {
                    double mid = 0.5 * (lo + hi);
                    if (lim.margin(mid + s, hot) >= 1 && lim.margin(mid - s, cold) >= 1) {
                        lo = mid;
                    } else {
                        hi = mid;
                    }
                }
                best = lo;
            }
            temp = Math.max(best, temp - TOOL.maxRampDownKPerS() * dt);
            u = 0;
            for (int j = 0; j < k; j++) {
                hot[j] = Math.min(1, hot[j] + dt * lim.rate(j, temp + s, hot[j]));
                cold[j] = Math.min(1, cold[j] + dt * lim.rate(j, temp - s, cold[j]));
                u += b.polymer().component(j).fraction() * (1 - cold[j]);
            }
            t += dt;
            path.add(new double[]{t, temp});
        }
        double[] temps = new double[ramps];
        double[] rates = new double[ramps];
        double[] holds = new double[ramps];
        double prevT = 0;
        double prev = b.recipeStartK();
        for (int i = 0; i < ramps; i++) {
            double[] p = path.get((int) ((long) (path.size() - 1) * (i + 1) / ramps));
            temps[i] = Math.max(p[1], prev - 1e-3);
            double span = Math.max(p[0] - prevT, 1);
            rates[i] = Math.max(Math.abs(temps[i] - prev) / span, 1e-4);
            holds[i] = Math.abs(temps[i] - prev) < 1e-3 ? span : 0;
            prevT = p[0];
            prev = temps[i];
        }
        for (double speed = 1; speed > 0.3; speed *= 0.97) {
            BakeResult r = run(b, temps, rates, holds, speed);
            if (feasible(r)) {
                return r;
            }
        }
        return null;
    }

    @Test
    void oneComponentBoundLiesJustBelowAVerifiedGreedySchedule() {
        // Derived, no published source: for one component under quasi-steady gas with ±2 K across the wafer, the
        // tightened bound (docs/model.md, "Lower bounds", 4) lies within a stated tolerance below a near-optimal
        // schedule built here by a different method — a greedy setpoint per 3 s control interval, the corners'
        // conversions integrated by RK4 under the exact lagged wafer — and then verified by the simulator at
        // every corner. The schedule is itself a verified recipe, so the bound must not exceed it either.
        for (String file : new String[]{"data/bench/qs-one-pressure.yaml", "data/bench/one-component-porous.yaml"}) {
            CaseFile cf = CaseYamlReader.read(Path.of(file));
            BakeCase b = cf.bake();
            LowerBound.Result bound = LowerBound.compute(b, cf.tool(), true);
            assertTrue(bound.estimate("envelope").rigorous());
            BakeResult greedy = greedySchedule(b, cf.tool(), 3);
            assertTrue(greedy != null, file + ": no verified greedy schedule");
            double ratio = greedy.timeToTargetS() / bound.boundS();
            System.out.printf("%s: greedy schedule %.2f min, bound %.2f min (%s), ratio %.4f%n", file,
                    greedy.timeToTargetS() / 60, bound.boundS() / 60, best(bound), ratio);
            assertTrue(ratio >= 1 - 1e-9, file + ": a verified schedule beats the bound, ratio " + ratio);
            // tolerance 1.5 % (empirical): the greedy schedule is not quite optimal (it judges each interval and its safe
            // continuation at the interval's starting conversions, with a 0.2 % margin); measured 1.0074 and 1.0093
            // (against the joint bound alone, before the envelope bound: 1.047 and 1.055)
            assertTrue(ratio < 1.015, file + ": bound loose, ratio " + ratio);
        }
    }

    @Test
    void twoComponentBoundIsNeverBeatenAndLiesWithinToleranceOfAVerifiedGreedySchedule() {
        // Derived, no published source: two components (first order and random scission) sharing a quasi-steady pressure
        // budget, ±2 K. Seeded random recipes pushed to the boundary of the limits never beat the bound; and the bound lies
        // within a stated tolerance below a near-optimal schedule built here by a different method (the greedy per-3 s
        // setpoint of the one-component check, every component at both corners by RK4 under the exact lag), verified by
        // the simulator — which, being a verified recipe, must not beat the bound either.
        CaseFile cf = CaseYamlReader.read(Path.of("data/bench/qs-two-pressure.yaml"));
        BakeCase b = cf.bake();
        neverBeaten(b, 20261208L, 24);
        LowerBound.Result bound = LowerBound.compute(b, cf.tool(), true);
        BakeResult greedy = greedySchedule(b, cf.tool(), 3);
        assertTrue(greedy != null, "no verified greedy schedule");
        double ratio = greedy.timeToTargetS() / bound.boundS();
        System.out.printf("qs-two-pressure: greedy schedule %.2f min, bound %.2f min (%s), ratio %.4f%n",
                greedy.timeToTargetS() / 60, bound.boundS() / 60, best(bound), ratio);
        assertTrue(ratio >= 1 - 1e-9, "a verified schedule beats the bound, ratio " + ratio);
        // tolerance 10 % (empirical; docs/model.md, "Lower bounds", says where the rest is lost: the joint programme's
        // cells, the cold corner known only through per-level temperature bounds, the ramp rate); measured 1.051 (before this
        // bound was tightened: 1.199)
        assertTrue(ratio < 1.10, "bound loose, ratio " + ratio);
    }

    private static String best(LowerBound.Result r) {
        return r.estimates().stream().filter(e -> e.rigorous() && e.seconds() == r.boundS()).findFirst().orElseThrow().name();
    }

    /**
     * A greedy schedule (every component): per control interval the highest setpoint (at most one fastest
     * ramp above the last, at most the ceiling less the spread) at which every instantaneous limit
     * holds with a margin at both corners at the interval's starting conversions, for the setpoint
     * itself and the wafer on its way there; the conversions then follow by RK4 (0.5 s) under the
     * exact first-order lag. The ramps so found make a recipe, verified by the simulator; the margin
     * grows until it passes. Null if none does.
     */
    private static BakeResult greedySchedule(BakeCase b, Tool tool, double controlS) {
        InstantLimits lim = new InstantLimits(b);
        int k = lim.size();
        double s = b.wafer().spreadK();
        double tau = b.wafer().lagS();
        double capK = b.limits().ceilingK() - s;
        for (double m = 1.002; m < 1.2; m = 1 + 2 * (m - 1)) {
            double sp = b.recipeStartK();
            double wafer = sp;
            double[] hot = new double[k];
            double[] cold = new double[k];
            for (int j = 0; j < k; j++) {
                hot[j] = b.polymer().initialConversion(j);
                cold[j] = hot[j];
            }
            List<Step> steps = new ArrayList<>();
            double t = 0;
            while (unconverted(b, cold) > b.limits().residue() && t < 86_400) {
                double hi = Math.min(capK, sp + tool.maxRampUpKPerS() * controlS);
                double lo = Math.max(b.recipeStartK() - 50, sp - tool.maxRampDownKPerS() * controlS);
                double next = lo;
                if (admissible(lim, sp, hi, wafer, s, hot, cold, m, controlS, tau, tool.maxRampDownKPerS())) {
                    next = hi;
                } else {
                    double a = lo;
                    double c = hi;
                    for (int it = 0; it < 40; it++) {
                        double mid = 0.5 * (a + c);
                        if (admissible(lim, sp, mid, wafer, s, hot, cold, m, controlS, tau, tool.maxRampDownKPerS())) {
                            a = mid;
                        } else {
                            c = mid;
                        }
                    }
                    next = a;
                }
                double rate = (next - sp) / controlS;
                // RK4 of dα/dt = k(T ± ΔT) f(α) under the lagged wafer, T = S(t) − bτ + (T0 − S0 + bτ) e^{−t/τ}
                int sub = (int) Math.round(controlS / 0.5);
                double h = controlS / sub;
                for (int i = 0; i < sub; i++) {
                    double t0 = i * h;
                    double w0 = lagged(sp, rate, wafer, tau, t0);
                    double wm = lagged(sp, rate, wafer, tau, t0 + h / 2);
                    double w1 = lagged(sp, rate, wafer, tau, t0 + h);
                    for (int j = 0; j < k; j++) {
                        var comp = b.polymer().component(j);
                        hot[j] = rk4(comp, hot[j], w0 + s, wm + s, w1 + s, h);
                        cold[j] = rk4(comp, cold[j], w0 - s, wm - s, w1 - s, h);
                    }
                }
                wafer = lagged(sp, rate, wafer, tau, controlS);
                if (Math.abs(next - sp) > 1e-9) {
                    double max = next > sp ? tool.maxRampUpKPerS() : tool.maxRampDownKPerS();
                    steps.add(new Step.Ramp(next, Math.min(Math.abs(rate), max)));
                } else {
                    steps.add(new Step.Hold(controlS));
                }
                sp = next;
                t += controlS;
            }
            steps.add(new Step.Hold(3600));
            BakeResult r = BakeSimulator.simulate(b.withRecipe(new Recipe(b.recipeStartK(), steps)),
                    SimulationSettings.defaults().withSampleInterval(0));
            if (feasible(r)) {
                return r;
            }
        }
        return null;
    }

    private static double unconverted(BakeCase b, double[] alpha) {
        double u = 0;
        for (int j = 0; j < alpha.length; j++) {
            u += b.polymer().component(j).fraction() * (1 - alpha[j]);
        }
        return u;
    }

    /**
     * Whether the limits hold with margin m at both corners, at the given conversions, at the hottest the wafer gets
     * while the setpoint ramps to {@code next} over the control interval and then falls at the fastest ramp down (the
     * safe continuation; sampled every 0.25 s over the interval and six lag times after).
     */
    private static boolean admissible(InstantLimits lim, double sp, double next, double wafer, double s, double[] hot,
                                      double[] cold, double m, double controlS, double tau, double down) {
        double rate = (next - sp) / controlS;
        double top = wafer;
        for (double t = 0.25; t <= controlS + 1e-9; t += 0.25) {
            top = Math.max(top, lagged(sp, rate, wafer, tau, t));
        }
        double w1 = lagged(sp, rate, wafer, tau, controlS);
        for (double t = 0.25; t <= 6 * tau; t += 0.25) {
            top = Math.max(top, lagged(next, -down, w1, tau, t));
        }
        return lim.margin(top + s, hot) >= m && lim.margin(top - s, cold) >= m;
    }

    private static double lagged(double s0, double rate, double wafer0, double tau, double t) {
        if (tau == 0) {
            return s0 + rate * t;
        }
        return s0 + rate * t - rate * tau + (wafer0 - s0 + rate * tau) * Math.exp(-t / tau);
    }

    private static double rk4(org.exhale.kinetics.Component c, double a, double t0, double tm, double t1, double h) {
        double k1 = c.rate(t0, a);
        double k2 = c.rate(tm, a + h / 2 * k1);
        double k3 = c.rate(tm, a + h / 2 * k2);
        double k4 = c.rate(t1, a + h * k3);
        return Math.min(1, a + h / 6 * (k1 + 2 * k2 + 2 * k3 + k4));
    }

    @Test
    void storedGasBoundIsNeverBeatenByVerifiedRecipes() {
        // the dense demo stores its gas (full gas equations); its rigorous bound must hold for recipes verified there
        CaseFile dense = CaseYamlReader.read(Path.of("data/demo/dense-disc.yaml"));
        BakeCase base = dense.bake();
        LowerBound.Result bound = LowerBound.compute(base, TOOL, false);
        Random rnd = new Random(20261205L);
        int checked = 0;
        for (int trial = 0; trial < 12; trial++) {
            double hold = C0 + 290 + rnd.nextDouble() * 70;
            double rate = (0.05 + rnd.nextDouble() * 0.3) / 60;
            BakeResult r = BakeSimulator.simulate(base.withRecipe(new Recipe(base.recipeStartK(), List.of(
                    new Step.Ramp(hold, rate), new Step.Hold(12 * 3600)))), SimulationSettings.defaults().withSampleInterval(0));
            if (feasible(r)) {
                checked++;
                assertEquals(GasRegime.FULL_GAS, r.regime());
                assertTrue(r.timeToTargetS() >= bound.boundS(), "trial " + trial + ": " + r.timeToTargetS() + " s beats the bound "
                        + bound.boundS() + " s");
            }
        }
        assertTrue(checked >= 3, "too few feasible recipes: " + checked);
    }

    @Test
    void reducedTimeInvertsAndBracketsEveryModel() {
        // F(α) = ∫dα/f against an independent midpoint quadrature (common practice, no source), lower ≤ F ≤ upper
        ReactionModel[] models = {new ReactionModel.NthOrder(1), new ReactionModel.NthOrder(1.7), new ReactionModel.RandomScission(),
                new ReactionModel.AvramiErofeev(2), new ReactionModel.AvramiErofeev(0.7), new ReactionModel.SestakBerggren(0.5, 1.5)};
        for (ReactionModel m : models) {
            double a0 = m.needsSeed() ? 1e-4 : 0;
            ReducedTime rt = new ReducedTime(m, a0);
            for (double a : new double[]{0.01, 0.3, 0.9, 0.999}) {
                int n = 400_000;
                double s = 0;
                double h = (a - a0) / n;
                for (int i = 0; i < n; i++) {
                    s += h / m.f(a0 + (i + 0.5) * h);
                }
                assertEquals(s, rt.lower(a), 2e-3 * s, m.id() + " at " + a);
                assertTrue(rt.lower(a) <= rt.upper(a), m.id());
                double back = rt.conversionAtMost(rt.lower(a));
                assertTrue(back >= a - 1e-12 && back <= a + 1e-3, m.id() + ": " + back + " vs " + a);
                // conversionAtLeast never exceeds the conversion at a reduced time (here 1 % below the quadrature's F(a),
                // which is within 0.2 % of the true one, so the true conversion there is below a), and is not far below
                double least = rt.conversionAtLeast(0.99 * s);
                assertTrue(least <= a, m.id() + ": at least " + least + " vs " + a);
                double atUpper = rt.conversionAtLeast(rt.upper(a));
                assertTrue(Math.abs(atUpper - a) <= 1e-3, m.id() + ": " + atUpper + " vs " + a);
            }
        }
    }
}
