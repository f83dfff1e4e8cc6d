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
        sb.append(String.format(Locale.ROOT, "Peak excess pressure: %s Pa at %.1f min (%s corner)%n",
                Numbers.sig(pc.peakPressure().value(), 4), pc.peakPressure().timeS() / 60, pc.corner()));
        sb.append("Time to 1 % unconverted: ").append(minutes(r.timeTo1pctS())).append('\n');
        sb.append("Time to residue target ").append(Numbers.sig(r.bake().limits().residue() * 100, 3)).append(" %: ")
                .append(minutes(r.timeToTargetS())).append('\n');
        // the residue target applies at the end of the final hold; the cool-down after it is not counted
        var at = r.residueCheckpoint();
        sb.append("Unconverted polymer at the ").append(at.describe()).append(": ")
                .append(Numbers.sig(r.unconvertedAtCheckpoint() * 100, 3)).append(" % (").append(r.residueCorner().corner())
                .append(" corner)");
        if (at.stepIndex() < r.bake().recipe().steps().size() - 1) {
            sb.append("; after the cool-down ").append(Numbers.sig(r.finalUnconverted() * 100, 3)).append(" %");
        }
        sb.append('\n');
        sb.append(String.format(Locale.ROOT, "Max wafer temperature: %.2f C%n", r.maxWaferTemperatureK() - c0));
        if (r.bake().chamber() != null) {
            sb.append(String.format(Locale.ROOT, "Chamber (%d wafers, well mixed): peak load %s sccm, peak %s ppm of products%n",
                    r.bake().chamber().wafers(), Numbers.sig(r.max("chamber_load_sccm").value(), 4),
                    Numbers.sig(r.max("chamber_ppm").value(), 4)));
        }
        sb.append("Limits:\n");
        for (Margin m : r.margins()) {
            sb.append("  ").append(line(m)).append('\n');
        }
        for (String w : warnings) {
            sb.append("Warning: ").append(w).append('\n');
        }
        if (r.bake().chamber() != null) {
            for (String c : Cautions.CHAMBER) {
                sb.append("Caution: ").append(c).append('\n');
            }
        }
        return sb.toString();
    }

    static String minutes(double s) {
        return Double.isNaN(s) ? "not reached" : String.format(Locale.ROOT, "%.1f min", s / 60);
    }

    public static String line(Margin m) {
        String status = m.holds() ? "holds" : "VIOLATED";
        if (m.headroom()) {
            return String.format(Locale.ROOT, "%-13s %-8s headroom %.2f K (max %.2f C at %.1f min, %s)", m.limit(), status,
                    m.margin(), m.actual() - PhysicalConstants.ZERO_CELSIUS_K, m.timeS() / 60, m.corner());
        }
        String margin = Double.isInfinite(m.margin()) ? "never loaded" : "margin " + Numbers.sig(m.margin(), 3);
        String dom = m.detail().isEmpty() ? "" : ", " + m.detail();
        return String.format(Locale.ROOT, "%-13s %-8s %s (allowed %s, worst %s %s at %.1f min, %s%s)", m.limit(), status,
                margin, Numbers.sig(m.allowed(), 4), Numbers.sig(m.actual(), 4), m.unit(), m.timeS() / 60, m.corner(), dom);
    }
}
