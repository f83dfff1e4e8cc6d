package org.exhale.planning;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;
import org.junit.jupiter.api.Test;

/**
 * The stored-gas programme skips a move whose arrivals, by the first count alone, lower no node (the second count
 * only lengthens moves). Skipping must change nothing: the programme with every move kept gives the same bound to the
 * last bit. A check of the pruning against the unpruned programme (common practice, no source), on a case with two
 * components, where the second count applies.
 */
class JointBoundPruningTest {

    @Test
    void skippingMovesThatLowerNoNodeChangesNothing() {
        prunedEqualsKept("data/bench/two-component-stored.yaml", LowerBound.STORED_CLOCK_DELTA, LowerBound.STORED_BINS);
    }

    @Test
    void skippingMovesChangesNothingOnTheOneComponentGrid() {
        // one component, on the fine grid kept for it (1 % levels, 64 bins): many more levels and bins per move
        prunedEqualsKept("data/bench/dense-one.yaml", LowerBound.STORED_CLOCK_DELTA_ONE, LowerBound.STORED_BINS_ONE);
    }

    private static void prunedEqualsKept(String file, double clockDelta, int bins) {
        CaseFile cf = CaseYamlReader.read(Path.of(file));
        BakeCase bake = cf.bake();
        double spread = bake.wafer().spreadK();
        TemperatureCap cap = new TemperatureCap(bake.recipeStartK(), bake.limits().ceilingK() - spread,
                cf.tool().maxRampUpKPerS(), bake.wafer().lagS());
        InstantLimits limits = new InstantLimits(bake);
        JointBound guide = new JointBound(bake, limits, cap, spread, clockDelta, LowerBound.CELL_DELTA,
                LowerBound.GUIDE_CELL_WIDTH, 1);
        guide.compute();
        int[] corners = guide.bindingCorners();
        JointBound pruned = LowerBound.storedJoint(bake, limits, cap, spread, clockDelta, bins, corners);
        JointBound kept = LowerBound.storedJoint(bake, limits, cap, spread, clockDelta, bins, corners);
        kept.pruneMoves = false;
        double a = pruned.compute().boundS();
        double b = kept.compute().boundS();
        assertTrue(a > 0 && Double.isFinite(a), "the stored-gas bound applies here: " + a);
        assertEquals(b, a, 0.0, "pruned " + a / 60 + " min, every move kept " + b / 60 + " min");
        System.out.printf("%s: stored-gas bound with moves pruned %.4f min, every move kept %.4f min%n", file, a / 60, b / 60);
    }
}
