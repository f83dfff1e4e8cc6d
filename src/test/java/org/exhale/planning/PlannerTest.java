package org.exhale.planning;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Segment;
import org.exhale.recipe.Step;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.simulation.Limits;
import org.exhale.simulation.SimulationSettings;
import org.exhale.simulation.TestCases;
import org.exhale.simulation.Wafer;
import org.junit.jupiter.api.Test;

class PlannerTest {
    private static final double C0 = 273.15;

    private static CaseFile demo(String name) {
        return CaseYamlReader.read(Path.of("data/demo/" + name));
    }

    /** The porous demo with only the ceiling binding: no spread, no lag, a ceiling low enough that the target needs a hold. */
    private static BakeCase ceilingOnly() {
        BakeCase b = demo("porous-line.yaml").bake();
        return b.withWafer(Wafer.ideal()).withChamber(null).withFilm(null)
                .withLimits(new Limits(C0 + 330, 0.005, Double.POSITIVE_INFINITY, null, 1, Double.POSITIVE_INFINITY));
    }

    @Test
    void ceilingOnlyCaseMatchesTheKnownOptimum() {
        // With only the ceiling and the ramp rate binding, the optimum is the fastest ramp to the ceiling and a
        // hold until the target (common practice, no source; it follows from the rate growing with temperature).
        BakeCase b = ceilingOnly();
        Tool tool = new Tool(10 / 60.0, 5 / 60.0, 1, 1, 30, 12, Double.NaN);
        PlanResult p = Planner.plan(b, tool);
        assertTrue(p.verified());
        Recipe optimum = new Recipe(b.recipeStartK(), List.of(new Step.Ramp(C0 + 330, 10 / 60.0), new Step.Hold(48 * 3600)));
        double tStar = BakeSimulator.simulate(b.withRecipe(optimum)).timeToTargetS();
        assertTrue(Math.abs(p.durationS() / tStar - 1) < 0.01, "planned " + p.durationS() + " s vs optimum " + tStar + " s");
        assertTrue(p.boundRatio() >= 1 && p.boundRatio() < 1.01, "bound ratio " + p.boundRatio());
    }

    @Test
    void roundedRecipeReverifiesAndFitsTheTool() {
        for (String name : new String[]{"porous-line.yaml", "dense-disc.yaml"}) {
            CaseFile cf = demo(name);
            PlanResult p = Planner.plan(cf.bake(), cf.tool());
            assertTrue(p.feasible() && p.verified(), name);
            Recipe r = p.recipe();
            BakeResult again = BakeSimulator.simulate(cf.bake().withRecipe(r));
            assertTrue(again.feasible(), name + ": re-simulated plan violates " + again.violated());
            assertTrue(r.steps().size() <= cf.tool().maxSteps(), name + ": too many steps");
            for (Segment s : r.segments()) {
                double endC = s.endK() - C0;
                assertEquals(Math.rint(endC), endC, 1e-6, name + ": setpoint off the 1 C grid: " + endC);
                assertEquals(Math.rint(s.durationS()), s.durationS(), 1e-6, name + ": duration off the 1 s grid");
                assertTrue(s.durationS() >= cf.tool().minStepS() - 1e-9, name + ": step shorter than min_step");
                double rate = Math.abs(s.slopeKPerS());
                double max = s.endK() > s.startK() ? cf.tool().maxRampUpKPerS() : cf.tool().maxRampDownKPerS();
                assertTrue(rate <= max * (1 + 1e-9), name + ": ramp faster than the tool");
            }
            assertTrue(p.durationS() >= p.lowerBound().boundS(), name + ": plan beats its own lower bound");
            assertTrue(p.verification().timeToTargetS() <= p.durationS() + 1e-6,
                    name + ": the target is reached only after the final hold (during the cool-down)");
        }
    }

    @Test
    void theSamePlanTwice() {
        CaseFile cf = demo("dense-disc.yaml");
        PlanResult a = Planner.plan(cf.bake(), cf.tool());
        PlanResult b = Planner.plan(cf.bake(), cf.tool());
        assertEquals(a.recipe(), b.recipe());
    }

    /**
     * The lower bound is never beaten: random feasible recipes (seeded) in the quasi-steady regime,
     * with the pressure limit binding, all take at least the bound to reach the target (MODEL.md §9,
     * comparison lemma; the check itself is common practice, no source).
     */
    @Test
    void randomFeasibleRecipesNeverBeatTheBound() {
        // a porous cap whose pressure limit binds, and a permeation-only cap fast enough to be quasi-steady
        // (relaxation about 2 ms), whose two overlapping components share the pressure budget: the fastest ramp
        // peaks near 440 Pa, so a 150 Pa limit binds (LowerBoundTest.theSharedBudgetCaseBindsOnPressureWithBothComponents)
        neverBeaten(TestCases.porousLine().withFilm(null).withWafer(new Wafer(10, 2))
                .withLimits(new Limits(C0 + 400, 0.005, 0.02, null, 1, Double.POSITIVE_INFINITY)), 20261201L);
        BakeCase dense = TestCases.denseDisc();
        neverBeaten(dense.withCap(new org.exhale.transport.CapFilm(2e-6, 0, 0, Double.NaN, 2e-11, 20e3)).withFilm(null)
                .withWafer(new Wafer(0, 2))
                .withLimits(new Limits(C0 + 400, 0.005, 150, null, 1, Double.POSITIVE_INFINITY)), 20261202L);
    }

    private static void neverBeaten(BakeCase base, long seed) {
        Tool tool = new Tool(10 / 60.0, 5 / 60.0, 1, 1, 30, 12, Double.NaN);
        LowerBound.Result bound = LowerBound.compute(base, tool);
        Random rnd = new Random(seed);
        int feasible = 0;
        for (int trial = 0; trial < 120; trial++) {
            List<Step> steps = new ArrayList<>();
            double t = base.recipeStartK();
            int n = 1 + rnd.nextInt(3);
            for (int i = 0; i < n; i++) {
                double target = Math.min(C0 + 397, t + 5 + rnd.nextDouble() * 150);
                if (target <= t + 0.5) {
                    break;
                }
                steps.add(new Step.Ramp(target, (0.2 + rnd.nextDouble() * 9.8) / 60));
                t = target;
                if (rnd.nextBoolean()) {
                    steps.add(new Step.Hold(60 + rnd.nextDouble() * 1800));
                }
            }
            steps.add(new Step.Hold(6 * 3600));
            BakeResult r = BakeSimulator.simulate(base.withRecipe(new Recipe(base.recipeStartK(), steps)),
                    SimulationSettings.defaults().withSampleInterval(0));
            boolean ok = r.margins().stream().filter(m -> !m.limit().equals("residue")).allMatch(m -> m.holds());
            if (ok && !Double.isNaN(r.timeToTargetS())) {
                feasible++;
                assertTrue(r.timeToTargetS() >= bound.boundS() * (1 - 1e-6),
                        "seed " + seed + " trial " + trial + ": recipe reaches the target at " + r.timeToTargetS()
                                + " s, before the bound " + bound.boundS() + " s");
            }
        }
        assertTrue(feasible >= 5, "seed " + seed + ": too few feasible random recipes (" + feasible + ") to test the bound");
        PlanResult p = Planner.plan(base, tool);
        assertTrue(p.feasible());
        assertTrue(p.durationS() >= bound.boundS(), "planner beats the bound");
    }

    @Test
    void plannedRecipeBeatsEverySingleRampAndHold() {
        CaseFile cf = demo("dense-disc.yaml");
        PlanResult p = Planner.plan(cf.bake(), cf.tool());
        double best = Double.POSITIVE_INFINITY;
        for (double holdC = 300; holdC <= 398; holdC += 14) {
            for (double rate : new double[]{0.2, 0.35, 0.6, 1, 2, 5, 10}) {
                Recipe r = new Recipe(cf.bake().recipeStartK(), List.of(new Step.Ramp(C0 + holdC, rate / 60),
                        new Step.Hold(12 * 3600)));
                // ranked with the quasi-steady equations, as the planner's search is; the gas relaxes in about
                // 20 s here, so the ranking does not depend on the regime
                BakeResult res = BakeSimulator.simulate(cf.bake().withRecipe(r),
                        SimulationSettings.defaults().withSampleInterval(0).withRegime(org.exhale.simulation.GasRegime.QUASI_STEADY));
                boolean ok = res.margins().stream().filter(m -> !m.limit().equals("residue")).allMatch(m -> m.holds());
                if (ok && !Double.isNaN(res.timeToTargetS())) {
                    best = Math.min(best, res.timeToTargetS());
                }
            }
        }
        System.out.printf("dense demo: plan %.1f min, best single ramp + hold %.1f min (%.2fx)%n", p.durationS() / 60,
                best / 60, best / p.durationS());
        assertTrue(p.durationS() < best, "plan " + p.durationS() + " s is not shorter than the best single ramp " + best + " s");
    }

    @Test
    void infeasibleCasesAreDiagnosed() {
        CaseFile cf = demo("dense-disc.yaml");
        // a pressure limit no recipe can keep
        BakeCase tight = cf.bake().withLimits(cf.bake().limits().withCeiling(C0 + 400))
                .withLimits(new Limits(C0 + 400, 0.005, 1.0, null, 2, 1e-5));
        PlanResult p = Planner.plan(tight, cf.tool());
        assertNull(p.recipe());
        assertNotNull(p.infeasibility());
        assertEquals("pressure", p.infeasibility().limit());
        // a ceiling too low to clear the polymer in a day
        BakeCase cold = cf.bake().withLimits(cf.bake().limits().withCeiling(C0 + 200));
        PlanResult q = Planner.plan(cold, cf.tool());
        assertNull(q.recipe());
        assertEquals("residue", q.infeasibility().limit());
        assertTrue(q.infeasibility().bestResidue() > 0.005);
        assertTrue(q.infeasibility().suggestion().contains("ceiling"), q.infeasibility().suggestion());
    }

    @Test
    void planHoldsABindingChamberLimit() {
        // the porous demo's load into its purged chamber peaks near 440 ppm under its fastest plan
        // (see 'exhale simulate'); a 300 ppm limit must slow the plan down, and the plan must keep it
        CaseFile cf = demo("porous-line.yaml");
        org.exhale.simulation.Chamber c = cf.bake().chamber();
        BakeCase tight = cf.bake().withChamber(new org.exhale.simulation.Chamber(c.wafers(), c.waferDiameterM(),
                c.patternFraction(), c.cavityFraction(), c.volumeM3(), c.temperatureK(), c.pressurePa(), c.purgeMolPerS(),
                300e-6, "300 ppm"));
        PlanResult free = Planner.plan(cf.bake(), cf.tool());
        PlanResult p = Planner.plan(tight, cf.tool());
        assertTrue(p.verified(), "not verified: " + p.infeasibility());
        var m = p.verification().margin("chamber");
        assertTrue(m.holds() && m.margin() < 1.2, "chamber margin " + m.margin() + " should hold and bind");
        assertTrue(p.durationS() > free.durationS(), "the chamber limit did not slow the plan");
        assertTrue(p.binding().contains("chamber"), "no step bound by the chamber: " + p.binding());
    }

    private static CaseFile template(String from, String to) throws java.io.IOException {
        String text = java.nio.file.Files.readString(Path.of("src/main/resources/templates/line.yaml"));
        String edited = text.replace(from, to);
        assertTrue(!edited.equals(text), "edit did not apply: " + from);
        return CaseYamlReader.parse("line-edited.yaml", edited.getBytes(java.nio.charset.StandardCharsets.UTF_8));
    }

    @Test
    void aBindingThermalDoseIsPlannedWithItsCoolDownCounted() throws Exception {
        // the cool-down's share of the dose counts: a 10 min budget forces a lower hold and the shortest hold
        CaseFile cf = template("    max: 2 h", "    max: 10 min");
        PlanResult p = Planner.plan(cf.bake(), cf.tool());
        assertTrue(p.verified(), "dose case not planned: " + p.infeasibility() + " " + p.notes());
        var dose = p.verification().margin("thermal_dose");
        assertTrue(dose.holds() && dose.margin() < 1.1, "dose margin " + dose.margin());
        assertTrue(String.join(" ", p.binding()).contains("thermal_dose"), "binding " + p.binding());
    }

    @Test
    void toolLimitsAreKeptOrReported() throws Exception {
        CaseFile zero = template("  min_step: 30 s", "  min_step: 0 s");
        PlanResult p = Planner.plan(zero.bake(), zero.tool());
        assertTrue(p.verified(), "min_step 0: " + p.infeasibility());
        for (Step s : p.recipe().steps()) {
            assertTrue(!(s instanceof Step.Hold h) || h.durationS() >= 1, "empty hold " + s);
        }
        CaseFile two = template("  max_steps: 12", "  max_steps: 2");
        PlanResult q = Planner.plan(two.bake(), two.tool());
        assertNull(q.recipe(), "a recipe with more steps than the tool takes");
        assertEquals("max_steps", q.infeasibility().limit());
    }
}
