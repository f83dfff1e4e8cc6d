package org.exhale.io;

import java.util.List;

import org.exhale.studies.MonteCarlo;

/**
 * Writes the samples of a robustness study: one row per sample, the sampled parameters in their
 * display units, whether every limit holds, the time to target and every margin (ratio margins;
 * the ceiling as headroom in kelvin), and the tightest limit: the smallest ratio margin
 * allowed/actual (the ceiling, in kelvin, is not compared with ratios).
 */
public final class SamplesCsvWriter {
    private SamplesCsvWriter() {
    }

    public static String write(List<MonteCarlo.Parameter> ps, List<String> limits, List<MonteCarlo.Outcome> outcomes) {
        StringBuilder sb = new StringBuilder("sample");
        for (MonteCarlo.Parameter p : ps) {
            sb.append(',').append(p.name());
        }
        sb.append(",feasible,time_to_target_s");
        for (String l : limits) {
            sb.append(',').append(l.equals("ceiling") ? "ceiling_headroom_K" : l + "_margin");
        }
        sb.append(",tightest_limit,smallest_margin\n");
        for (MonteCarlo.Outcome o : outcomes) {
            if (o == null) {
                continue;
            }
            sb.append(o.index());
            for (int p = 0; p < ps.size(); p++) {
                sb.append(',').append(Numbers.csv(ps.get(p).display(o.values()[p])));
            }
            sb.append(',').append(o.feasible()).append(',').append(Numbers.csv(o.timeToTargetS()));
            for (double m : o.margins()) {
                // a limit never loaded in this sample (buckling of a cap never compressed) has no finite margin: empty cell
                sb.append(',').append(Numbers.csv(m));
            }
            int t = o.tightest();
            sb.append(',').append(t < 0 ? "" : limits.get(t)).append(',').append(Double.isInfinite(o.smallestMargin()) ? "inf" : Numbers.csv(o.smallestMargin())).append('\n');
        }
        return sb.toString();
    }
}
