package org.exhale.simulation;

import java.util.ArrayList;
import java.util.List;

import org.exhale.mechanics.CapStructure;
import org.exhale.recipe.ResidueCheckpoint;

/** Margins to every limit of a case over all simulated corners. */
final class Margins {
    private Margins() {
    }

    static List<Margin> evaluate(BakeCase bake, List<CornerResult> corners) {
        Limits limits = bake.limits();
        List<Margin> out = new ArrayList<>();

        // thermal ceiling: wafer and (local) setpoint, as headroom in kelvin
        CornerResult hot = corners.get(0);
        Extremum worstT = null;
        for (CornerResult c : corners) {
            for (Extremum e : new Extremum[]{c.maxWafer(), c.maxSetpoint()}) {
                if (worstT == null || e.value() > worstT.value()) {
                    worstT = e;
                    hot = c;
                }
            }
        }
        out.add(new Margin("ceiling", limits.ceilingK(), worstT.value(), limits.ceilingK() - worstT.value(),
                worstT.timeS(), hot.corner(), "K", true, ""));

        // residue where the target applies: the end of the final hold (the cool-down after it not counted)
        CornerResult slow = corners.get(0);
        for (CornerResult c : corners) {
            if (c.unconvertedAtCheckpoint() > slow.unconvertedAtCheckpoint()) {
                slow = c;
            }
        }
        ResidueCheckpoint at = bake.recipe().residueCheckpoint();
        out.add(Margin.ratio("residue", limits.residue(), slow.unconvertedAtCheckpoint(), at.timeS(), slow.corner(), "",
                at.describe()));

        if (Double.isFinite(limits.maxPressurePa())) {
            CornerResult p = corners.get(0);
            for (CornerResult c : corners) {
                if (c.peakPressure().value() > p.peakPressure().value()) {
                    p = c;
                }
            }
            out.add(Margin.ratio("pressure", limits.maxPressurePa(), p.peakPressure().value(),
                    p.peakPressure().timeS(), p.corner(), "Pa", ""));
        }

        if (limits.dose() != null) {
            CornerResult d = corners.get(0);
            for (CornerResult c : corners) {
                if (c.thermalDoseS() > d.thermalDoseS()) {
                    d = c;
                }
            }
            out.add(Margin.ratio("thermal_dose", limits.dose().maxS(), d.thermalDoseS(),
                    bake.recipe().durationS(), d.corner(), "s", ""));
        }
        if (bake.chamber() != null && bake.chamber().hasLimit()) {
            CornerResult w = corners.get(0);
            for (CornerResult c : corners) {
                if (c.max("chamber_ppm").value() > w.max("chamber_ppm").value()) {
                    w = c;
                }
            }
            Extremum e = w.max("chamber_ppm");
            out.add(Margin.ratio("chamber", bake.chamber().limitFraction() * 1e6, e.value(), e.timeS(), w.corner(), "ppm",
                    bake.chamber().limitLabel()));
        }
        CapStructure cap = bake.capStructure();
        if (cap != null) {
            mechanical(out, corners, "strength", cap.allowedStressPa(), "cap_stress_Pa", "Pa");
            mechanical(out, corners, "cracking", cap.allowedCrackingJPerM2(), "crack_release_J_m2", "J/m2");
            mechanical(out, corners, "delamination", cap.allowedDelaminationJPerM2(), "delamination_release_J_m2",
                    "J/m2");
            mechanical(out, corners, "buckling", cap.bucklingStressPa(), "compression_Pa", "Pa");
            mechanical(out, corners, "deflection", cap.maxDeflectionM(), "deflection_m", "m");
        }
        return out;
    }

    private static void mechanical(List<Margin> out, List<CornerResult> corners, String limit, double allowed,
                                   String column, String unit) {
        if (!Double.isFinite(allowed)) {
            return;
        }
        CornerResult worst = corners.get(0);
        for (CornerResult c : corners) {
            if (c.max(column).value() > worst.max(column).value()) {
                worst = c;
            }
        }
        Extremum e = worst.max(column);
        double[] row = worst.atMaximum().get(column);
        String detail = "";
        if (row != null && !limit.equals("buckling")) {
            int f = worst.column("film_stress_Pa");
            double th = Math.abs(row[f]);
            double b = Math.abs(row[f + 1]);
            double m = Math.abs(row[f + 2]);
            detail = th >= b && th >= m ? "thermal" : b >= m ? "bending" : "membrane";
            if (limit.equals("cracking")) {
                int span = worst.column("span_crack_release_J_m2");
                int bonded = worst.column("bonded_crack_release_J_m2");
                detail = (row[span] > row[bonded] ? "free-span crack" : "bonded crack") + " (" + detail + ")";
            }
        } else if (limit.equals("buckling")) {
            detail = "thermal";
        }
        out.add(Margin.ratio(limit, allowed, Math.max(e.value(), 0), e.timeS(), worst.corner(), unit, detail));
    }
}
