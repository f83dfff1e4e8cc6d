package org.exhale.planning;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.recipe.Step;
import org.junit.jupiter.api.Test;

/**
 * The planner uses the tool's steps well (common practice, no source: a larger step budget admits every recipe a
 * smaller one does, so a plan allowed more steps is never longer; and one tool step covers a ramp that goes on at the
 * same rate). On the dense demo both failed before: 12 steps planned 239.6 min, 13 steps 240.6, and every plan spent
 * two steps on 150 → 259 → 266 °C at the fastest rate.
 */
class PlannerStepBudgetTest {

    private static CaseFile dense(int maxSteps) throws Exception {
        String text = Files.readString(Path.of("data/demo/dense-disc.yaml"));
        String from = "max_steps: 12";
        assertTrue(text.contains(from), "the demo's step budget is where this test looks for it");
        return CaseYamlReader.parse("dense-" + maxSteps + ".yaml",
                text.replace(from, "max_steps: " + maxSteps).getBytes(StandardCharsets.UTF_8));
    }

    @Test
    void moreStepsNeverPlanLongerAndNoStepContinuesTheLast() throws Exception {
        CaseFile twelve = dense(12);
        CaseFile thirteen = dense(13);
        PlanResult p12 = Planner.plan(twelve.bake(), twelve.tool());
        PlanResult p13 = Planner.plan(thirteen.bake(), thirteen.tool());
        assertTrue(p12.feasible() && p13.feasible());
        assertTrue(p13.durationS() <= p12.durationS() + 1e-6,
                String.format("13 steps %.2f min, 12 steps %.2f min", p13.durationS() / 60, p12.durationS() / 60));
        for (PlanResult p : List.of(p12, p13)) {
            List<Step> steps = p.recipe().steps();
            double sp = twelve.bake().recipeStartK();
            double lastStart = Double.NaN;
            Step last = null;
            for (Step s : steps) {
                if (last instanceof Step.Ramp a && s instanceof Step.Ramp b) {
                    boolean sameWay = (a.targetK() > lastStart) == (b.targetK() > a.targetK());
                    assertFalse(sameWay && Math.abs(a.rateKPerS() - b.rateKPerS()) <= 1e-9 * a.rateKPerS(),
                            "two steps ramp on at the same rate: " + steps);
                }
                lastStart = sp;
                if (s instanceof Step.Ramp r) {
                    sp = r.targetK();
                }
                last = s;
            }
        }
        // the same input gives the same recipe
        assertEquals(p12.recipe(), Planner.plan(twelve.bake(), twelve.tool()).recipe());
    }
}
