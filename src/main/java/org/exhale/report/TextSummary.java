package org.exhale.report;

import java.util.List;
import java.util.Locale;

import org.exhale.PhysicalConstants;
import org.exhale.io.Numbers;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.CornerResult;
import org.exhale.simulation.Margin;

/** The short human summary of a simulated bake, for the terminal. */
public final class TextSummary {
    private TextSummary() {
    }

    public static String of(BakeResult r, List<String> warnings) {
        StringBuilder sb = new StringBuilder();
        double c0 = PhysicalConstants.ZERO_CELSIUS_K;
        sb.append("Case: ").append(r.bake().name().isEmpty() ? "(unnamed)" : r.bake().name()).append('\n');
        sb.append(String.format(Locale.ROOT, "Recipe: %d steps, %.1f min; gas regime %s%n",
                r.bake().recipe().steps().size(), r.bake().recipe().durationS() / 60, r.regime().label()));
        CornerResult pc = r.pressureCorner();
        sb.append("Peak excess pressure: ").append(Readable.value(pc.peakPressure().value(), "Pa")).append(" at ")
                .append(Readable.time(pc.peakPressure().timeS())).append(" (").append(pc.corner()).append(" corner)\n");
        sb.append("Time to 1 % unconverted: ").append(minutes(r.timeTo1pctS())).append('\n');
        sb.append("Time to residue target ").append(Readable.percent(r.bake().limits().residue())).append(": ")
                .append(minutes(r.timeToTargetS())).append('\n');
        // the residue target applies at the end of the final hold; the cool-down after it is not counted
        var at = r.residueCheckpoint();
        sb.append("Unconverted polymer at the ").append(at.describe()).append(": ")
                .append(Readable.percent(r.unconvertedAtCheckpoint())).append(" (").append(r.residueCorner().corner())
                .append(" corner)");
        if (at.stepIndex() < r.bake().recipe().steps().size() - 1) {
            sb.append("; after the cool-down ").append(Readable.percent(r.finalUnconverted()));
        }
        sb.append('\n');
        sb.append("Max wafer temperature: ").append(Readable.celsius(r.maxWaferTemperatureK())).append('\n');
        if (r.bake().chamber() != null) {
            sb.append(String.format(Locale.ROOT, "Chamber (%d wafers, well mixed): peak load %s sccm, peak %s ppm of products%n",
                    r.bake().chamber().wafers(), Numbers.sig(r.max("chamber_load_sccm").value(), 4),
                    Numbers.sig(r.max("chamber_ppm").value(), 4)));
        }
        sb.append(limits(r.margins()));
        for (String w : warnings) {
            sb.append("Warning: ").append(w).append('\n');
        }
        return sb.toString();
    }

    /**
     * The limits table with its legend and the tightest limit: shared by simulate and plan. The
     * ceiling is checked on the higher of the wafer and the corner's setpoint (setpoint + spread),
     * so its peak can exceed the wafer's maximum after a short hold.
     */
    public static String limits(List<Margin> margins) {
        return limits(margins, true);
    }

    /** The limits table, with or without the tightest-limit line (a recipe sheet has its own). */
    public static String limits(List<Margin> margins, boolean withTightest) {
        StringBuilder sb = new StringBuilder("Limits (margin = allowed/actual, 1 or more holds; ceiling: headroom in K, "
                + "on the higher of wafer and setpoint + spread):\n");
        for (Margin m : margins) {
            sb.append("  ").append(line(m)).append('\n');
        }
        String t = withTightest ? tightest(margins) : null;
        if (t != null) {
            sb.append(t).append('\n');
        }
        return sb.toString();
    }

    static String minutes(double s) {
        return Double.isNaN(s) ? "not reached" : String.format(Locale.ROOT, "%.1f min", s / 60);
    }

    /**
     * One limit as a line: name, status, margin (allowed/actual; the ceiling's headroom in K), then
     * allowed and actual with units, when and where.
     */
    public static String line(Margin m) {
        String status = m.holds() ? "holds" : "VIOLATED";
        String where = " at " + Readable.time(m.timeS()) + ", " + m.corner() + " corner";
        String rest;
        if (m.headroom()) {
            rest = "peak " + Readable.celsius(m.actual()) + where + " (allowed " + Readable.celsius(m.allowed()) + ")";
        } else if (Double.isInfinite(m.margin())) {
            rest = "allowed " + Readable.value(m.allowed(), m.unit()) + "; stays at zero";
        } else {
            String actual = m.margin() > 1e6 ? "negligible" : Readable.value(m.actual(), m.unit());
            rest = "allowed " + Readable.value(m.allowed(), m.unit()) + ", actual " + actual
                    + where + (m.detail().isEmpty() ? "" : ", " + m.detail());
        }
        return String.format(Locale.ROOT, "%-13s %-8s %-16s %s", m.limit(), status, Readable.margin(m), rest);
    }

    /**
     * The tightest limit: the smallest margin among the limits the recipe can change, with a note
     * when a limit set at the start of the bake (its worst value at t = 0, before any step acts)
     * is smaller. Null when no ratio limit is loaded.
     */
    public static String tightest(List<Margin> margins) {
        Margin t = null;
        Margin start = null;
        for (Margin m : margins) {
            if (m.headroom() || !Double.isFinite(m.margin())) {
                continue;
            }
            if (Readable.setAtStart(m)) {
                start = start == null || m.margin() < start.margin() ? m : start;
            } else {
                t = t == null || m.margin() < t.margin() ? m : t;
            }
        }
        if (t == null && start == null) {
            return null;
        }
        StringBuilder sb = new StringBuilder();
        if (t != null) {
            sb.append("Tightest limit the recipe can change: ").append(t.limit()).append(", margin ").append(Readable.ratio(t.margin()));
        }
        if (start != null && (t == null || start.margin() < t.margin())) {
            sb.append(t == null ? "" : "; ").append(start.limit()).append(" has margin ").append(Readable.ratio(start.margin()))
                    .append(", set at the start of the bake (no recipe changes it)");
        }
        return sb.toString();
    }
}
