package org.exhale.planning;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.simulation.CornerResult;
import org.exhale.simulation.InstantLimits;
import org.exhale.simulation.SimulationSettings;
import org.junit.jupiter.api.Test;

/**
 * The stored-gas programme's first clock level on the dense demo (docs/model.md, "Lower bounds", 5, "Nothing vented
 * before it is made"; the bound is derived there, no published source): its earliest label there lies below the
 * earliest arrival of explicit recipes simulated by the full model (the independent solution: a family of
 * ramp-and-hold recipes scanned in the test, each run through the simulator with every limit checked), and above the
 * label of the same programme without the bound for moves out of the start, whose φ credits venting during the forced
 * cool start of the bake when the cavity holds nothing.
 */
class FirstLevelBoundTest {

    @Test
    void firstLevelLabelLiesBelowExplicitRecipesAndAboveThePlainOne() {
        CaseFile cf = CaseYamlReader.read(Path.of("data/demo/dense-disc.yaml"));
        BakeCase b = cf.bake();
        Tool tool = cf.tool();
        double dT = b.wafer().spreadK();
        TemperatureCap cap = new TemperatureCap(b.recipeStartK(), b.limits().ceilingK() - dT, tool.maxRampUpKPerS(),
                b.wafer().lagS());
        InstantLimits lim = new InstantLimits(b);
        JointBound guide = new JointBound(b, lim, cap, dT, LowerBound.STORED_CLOCK_DELTA, LowerBound.CELL_DELTA,
                LowerBound.GUIDE_CELL_WIDTH, 1);
        guide.compute();
        JointBound split = LowerBound.storedJoint(b, lim, cap, dT, LowerBound.STORED_CLOCK_DELTA, LowerBound.STORED_BINS,
                guide.bindingCorners());
        int q = split.compute().clock();
        JointBound plain = LowerBound.storedJoint(b, lim, cap, dT, LowerBound.STORED_CLOCK_DELTA, LowerBound.STORED_BINS,
                guide.bindingCorners());
        plain.splitStart = false;
        plain.compute();
        assertTrue(split.levelLeast().length > 1 && plain.levelLeast().length > 1, "the programme applies to the demo");
        double level = split.level(1);
        double theta = split.levelLeast()[1];
        double thetaPlain = plain.levelLeast()[1];

        // explicit recipes: the fastest ramp to T1, a hold at T1 until the hot corner's clock reaches the level, then the
        // fastest ramp down; kept where every limit but the residue holds over the whole run
        String column = "alpha_" + b.polymer().component(q).name();
        double earliest = Double.POSITIVE_INFINITY;
        double earliestT1 = Double.NaN;
        int feasible = 0;
        // every 1 K over 255–290 °C, then every 0.25 K within 1 K of the best
        List<Double> holds = new ArrayList<>();
        for (double t1 = b.recipeStartK() + 105; t1 <= b.recipeStartK() + 140; t1 += 1) {
            holds.add(t1);
        }
        for (int pass = 0; pass < 2; pass++) {
            for (double t1 : holds) {
                double reach = reach(b, tool, t1, 600 * 60, level, column);
                if (Double.isFinite(reach) && keepsLimits(b, tool, t1, reach)) {
                    feasible++;
                    if (reach < earliest) {
                        earliest = reach;
                        earliestT1 = t1;
                    }
                }
            }
            holds.clear();
            if (Double.isFinite(earliestT1)) {
                for (double d = -0.75; d <= 0.75; d += 0.25) {
                    if (d != 0) {
                        holds.add(earliestT1 + d);
                    }
                }
            }
        }
        String report = String.format("level %.4f: label %.2f min (without the start's bound %.2f), earliest explicit %.2f min"
                + " (hold at %.2f C; %d feasible recipes)", level, theta / 60, thetaPlain / 60, earliest / 60,
                earliestT1 - 273.15, feasible);
        assertTrue(feasible >= 3, report);
        assertTrue(theta <= earliest, report);
        // the bound for moves out of the start is what lifts the label (the plain one credits venting the empty cavity)
        assertTrue(theta > thetaPlain + 120, report);
        // and it leaves little: within 4 % below the explicit family's best
        assertTrue(theta >= 0.96 * earliest, report);
    }

    /** Whether the fastest ramp to t1, a hold until {@code reach} and the fastest ramp down keep every limit but the residue. */
    private static boolean keepsLimits(BakeCase b, Tool tool, double t1, double reach) {
        double hold = reach - (t1 - b.recipeStartK()) / tool.maxRampUpKPerS();
        List<Step> steps = new ArrayList<>();
        steps.add(new Step.Ramp(t1, tool.maxRampUpKPerS()));
        if (hold > 0) {
            steps.add(new Step.Hold(Math.ceil(hold)));
        }
        steps.add(new Step.Ramp(b.recipeStartK(), tool.maxRampDownKPerS()));
        steps.add(new Step.Hold(600));
        BakeResult r = BakeSimulator.simulate(b.withRecipe(new Recipe(b.recipeStartK(), steps)),
                SimulationSettings.defaults().withSampleInterval(0));
        return r.margins().stream().filter(m -> !m.limit().equals("residue")).allMatch(m -> m.holds());
    }

    /** When the hot corner's clock conversion first reaches {@code level} under ramp-then-hold at t1 (+∞ if never). */
    private static double reach(BakeCase b, Tool tool, double t1, double holdS, double level, String column) {
        List<Step> steps = List.of(new Step.Ramp(t1, tool.maxRampUpKPerS()), new Step.Hold(holdS));
        BakeResult r = BakeSimulator.simulate(b.withRecipe(new Recipe(b.recipeStartK(), steps)),
                SimulationSettings.defaults().withSampleInterval(1));
        CornerResult hot = r.corners().stream().max((x, y) -> Double.compare(x.offsetK(), y.offsetK())).orElseThrow();
        int a = hot.columns().indexOf(column);
        int t = hot.columns().indexOf("time_s");
        assertTrue(a >= 0 && t >= 0, "history columns " + hot.columns() + " hold " + column + " and time_s");
        double[] prev = null;
        for (double[] row : hot.history()) {
            if (row[a] >= level) {
                if (prev == null) {
                    return row[t];
                }
                return prev[t] + (row[t] - prev[t]) * (level - prev[a]) / (row[a] - prev[a]);
            }
            prev = row;
        }
        return Double.POSITIVE_INFINITY;
    }
}
