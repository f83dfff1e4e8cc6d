package org.exhale.recipe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.junit.jupiter.api.Test;

/** Where the residue target applies (MODEL.md §9: at the end of a hold, plus an optional cool-down). */
class ResidueCheckpointTest {
    private static double c(double celsius) {
        return celsius + 273.15;
    }

    @Test
    void finalHoldBeforeTheCoolDown() {
        Recipe r = new Recipe(c(150), List.of(new Step.Ramp(c(350), 10 / 60.0), new Step.Hold(600),
                new Step.Ramp(c(150), 5 / 60.0), new Step.Ramp(c(100), 1 / 60.0)));
        ResidueCheckpoint at = r.residueCheckpoint();
        assertTrue(at.finalHold());
        assertEquals(1, at.stepIndex());
        assertEquals(1200 + 600, at.timeS(), 1e-9);
        assertEquals("end of the final hold (step 2)", at.describe());
    }

    @Test
    void recipeEndingInAHold() {
        Recipe r = new Recipe(c(150), List.of(new Step.Ramp(c(350), 10 / 60.0), new Step.Hold(600)));
        assertEquals(r.durationS(), r.residueCheckpoint().timeS(), 1e-9);
        assertTrue(r.residueCheckpoint().finalHold());
    }

    @Test
    void withoutAFinalHoldTheLastStepBeforeTheCoolDownCounts() {
        Recipe r = new Recipe(c(150), List.of(new Step.Hold(60), new Step.Ramp(c(350), 10 / 60.0),
                new Step.Ramp(c(150), 5 / 60.0)));
        ResidueCheckpoint at = r.residueCheckpoint();
        assertFalse(at.finalHold());
        assertEquals(1, at.stepIndex());
        assertEquals(60 + 1200, at.timeS(), 1e-9);
        assertEquals("end of step 2 (no final hold)", at.describe());
        // only cooling: the end of the recipe
        Recipe down = new Recipe(c(350), List.of(new Step.Ramp(c(150), 5 / 60.0)));
        assertEquals(down.durationS(), down.residueCheckpoint().timeS(), 1e-9);
        assertFalse(down.residueCheckpoint().finalHold());
    }
}
