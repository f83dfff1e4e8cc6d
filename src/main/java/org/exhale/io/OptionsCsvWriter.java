package org.exhale.io;

import java.util.List;

import org.exhale.studies.Compare;
import org.exhale.studies.Variation;

/**
 * Writes the ranked option table of a comparison: one row per option, the varied values in their
 * display units, the planned duration and its bound, the smallest margin and the Pareto flag.
 */
public final class OptionsCsvWriter {
    private OptionsCsvWriter() {
    }

    public static String header(List<Variation> vary) {
        StringBuilder sb = new StringBuilder("rank,option");
        for (Variation v : vary) {
            sb.append(',').append(v.key().column());
        }
        return sb.append(",feasible,pareto,duration_s,total_with_cooldown_s,lower_bound_s,bound_ratio,bound_rigorous,")
                .append("peak_pressure_Pa,smallest_margin,smallest_margin_limit,ceiling_headroom_K,steps,")
                .append("infeasible_limit,infeasible_reason").toString();
    }

    /** Rows in the given (ranked) order; {@code pareto} is parallel to {@code ranked}. */
    public static String write(List<Variation> vary, List<Compare.Option> ranked, boolean[] pareto) {
        StringBuilder sb = new StringBuilder(header(vary)).append('\n');
        for (int r = 0; r < ranked.size(); r++) {
            Compare.Option o = ranked.get(r);
            sb.append(r + 1).append(',').append(o.index() + 1);
            for (int k = 0; k < vary.size(); k++) {
                sb.append(',').append(Numbers.csv(vary.get(k).key().display(o.values().get(k))));
            }
            sb.append(',').append(o.feasible()).append(',').append(pareto[r]).append(',')
                    .append(Numbers.csv(o.durationS())).append(',').append(Numbers.csv(o.totalS())).append(',')
                    .append(Numbers.csv(o.lowerBoundS())).append(',').append(Numbers.csv(o.boundRatio())).append(',')
                    .append(o.boundRigorous()).append(',').append(Numbers.csv(o.peakPressurePa())).append(',')
                    .append(Numbers.csv(o.smallestMargin())).append(',').append(o.smallestLimit()).append(',')
                    .append(Numbers.csv(o.ceilingHeadroomK())).append(',').append(o.steps()).append(',')
                    .append(o.verdictLimit()).append(',').append(quote(o.verdictReason())).append('\n');
        }
        return sb.toString();
    }

    static String quote(String s) {
        if (s == null || s.isEmpty()) {
            return "";
        }
        return "\"" + s.replace("\"", "\"\"").replace('\n', ' ') + "\"";
    }
}
