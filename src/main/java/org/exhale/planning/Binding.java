package org.exhale.planning;

import java.util.ArrayList;
import java.util.List;

import org.exhale.mechanics.CapStructure;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Segment;
import org.exhale.recipe.Step;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.CornerResult;

/** Which limit binds each step of a verified recipe, read from its history at every corner. */
final class Binding {
    /** A limit counts as binding in a step when its margin there is within this factor of 1. */
    static final double NEAR = 1.05;

    private Binding() {
    }

    static List<String> perStep(BakeCase bake, Tool tool, Recipe recipe, BakeResult proof) {
        List<Segment> segs = recipe.segments();
        List<String> out = new ArrayList<>();
        CapStructure cap = bake.capStructure();
        int last = Planner.holdEnd(recipe) == segs.get(segs.size() - 1).endTimeS() ? segs.size() - 1 : segs.size() - 2;
        for (int i = 0; i < segs.size(); i++) {
            Segment s = segs.get(i);
            String bestName = null;
            double best = Double.POSITIVE_INFINITY;
            for (CornerResult c : proof.corners()) {
                for (double[] row : c.history()) {
                    if (row[0] < s.startTimeS() || row[0] > s.endTimeS()) {
                        continue;
                    }
                    double chamber = bake.chamber() == null || !bake.chamber().hasLimit() ? Double.POSITIVE_INFINITY
                            : ratio(bake.chamber().limitFraction() * 1e6, row[c.column("chamber_ppm")]);
                    double[] m = {
                            chamber,
                            ratio(bake.limits().maxPressurePa(), row[c.column("excess_pressure_Pa")]),
                            cap == null ? Double.POSITIVE_INFINITY : ratio(cap.allowedStressPa(), row[c.column("cap_stress_Pa")]),
                            cap == null ? Double.POSITIVE_INFINITY : ratio(cap.allowedCrackingJPerM2(), row[c.column("crack_release_J_m2")]),
                            cap == null ? Double.POSITIVE_INFINITY : ratio(cap.allowedDelaminationJPerM2(), row[c.column("delamination_release_J_m2")]),
                            cap == null ? Double.POSITIVE_INFINITY : ratio(cap.bucklingStressPa(), row[c.column("compression_Pa")]),
                            cap == null ? Double.POSITIVE_INFINITY : ratio(cap.maxDeflectionM(), row[c.column("deflection_m")])};
                    String[] names = {"chamber", "pressure", "strength", "cracking", "delamination", "buckling", "deflection"};
                    for (int q = 0; q < m.length; q++) {
                        if (m[q] < best) {
                            best = m[q];
                            bestName = names[q];
                        }
                    }
                }
            }
            Step step = recipe.steps().get(i);
            String label;
            if (best < NEAR) {
                label = bestName;
            } else if (step instanceof Step.Ramp r && r.targetK() > s.startK()
                    && r.rateKPerS() >= tool.maxRampUpKPerS() * 0.999) {
                label = "max_ramp_up";
            } else if (step instanceof Step.Ramp r && r.targetK() < s.startK()) {
                label = i > last ? "cool-down" : "max_ramp_down";
            } else if (step instanceof Step.Hold && i == last) {
                var dose = proof.margin("thermal_dose");
                label = dose != null && dose.margin() < NEAR ? "residue; thermal_dose"
                        : s.endK() >= bake.limits().ceilingK() - bake.wafer().spreadK() - tool.setpointStepK() - 1e-9
                        ? "ceiling; residue" : "residue";
            } else if (s.endK() >= bake.limits().ceilingK() - bake.wafer().spreadK() - tool.setpointStepK() - 1e-9) {
                label = "ceiling";
            } else {
                label = bestName == null || !Double.isFinite(best) ? "none"
                        : "none (nearest: " + bestName + " " + String.format(java.util.Locale.ROOT, "%.3g", best) + ")";
            }
            out.add(label);
        }
        return out;
    }

    private static double ratio(double allowed, double actual) {
        return !Double.isFinite(allowed) || !(actual > 0) ? Double.POSITIVE_INFINITY : allowed / actual;
    }
}
