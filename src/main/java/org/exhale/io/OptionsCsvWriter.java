package org.exhale.io;

import java.util.List;

import org.exhale.studies.Compare;
import org.exhale.studies.Variation;

/**
 * Writes the ranked option table of a comparison: one row per option, the varied values in their
 * display units, the planned duration and its bound, the smallest margin and the Pareto flag, and
 * a margin column per limit (allowed/actual; "inf" when the limit is not loaded). Tied options
 * (see {@link Compare}) share their rank.
 */
public final class OptionsCsvWriter {
    private OptionsCsvWriter() {
    }

    public static String header(List<Variation> vary) {
        return header(vary, List.of());
    }

    /** The limits of the options' verified plans, in order (a margin column each). */
    public static List<String> limits(List<Compare.Option> options) {
        java.util.LinkedHashSet<String> out = new java.util.LinkedHashSet<>();
        for (Compare.Option o : options) {
            if (o.feasible() && o.plan() != null && o.plan().verification() != null) {
                for (org.exhale.simulation.Margin m : o.plan().verification().margins()) {
                    if (!m.headroom()) {
                        out.add(m.limit());
                    }
                }
            }
        }
        return List.copyOf(out);
    }

    public static String header(List<Variation> vary, List<String> limits) {
        StringBuilder sb = new StringBuilder("rank,option");
        for (Variation v : vary) {
            sb.append(',').append(v.key().column());
        }
        return sb.append(",feasible,pareto,duration_s,total_with_cooldown_s,lower_bound_s,bound_ratio,bound_rigorous,")
                .append("peak_pressure_Pa,smallest_margin,smallest_margin_limit,ceiling_headroom_K,steps,")
                .append("infeasible_limit,infeasible_reason")
                .append(limits.stream().map(l -> ",margin_" + l).collect(java.util.stream.Collectors.joining())).toString();
    }

    /** Rows in the given (ranked) order; {@code pareto} is parallel to {@code ranked}. */
    public static String write(List<Variation> vary, List<Compare.Option> ranked, boolean[] pareto) {
        List<String> limits = limits(ranked);
        int[] rank = Compare.ranks(ranked);
        StringBuilder sb = new StringBuilder(header(vary, limits)).append('\n');
        for (int r = 0; r < ranked.size(); r++) {
            Compare.Option o = ranked.get(r);
            sb.append(rank[r]).append(',').append(o.index() + 1);
            for (int k = 0; k < vary.size(); k++) {
                sb.append(',').append(Numbers.csv(vary.get(k).key().display(o.values().get(k))));
            }
            sb.append(',').append(o.feasible()).append(',').append(pareto[r]).append(',')
                    .append(Numbers.csv(o.durationS())).append(',').append(Numbers.csv(o.totalS())).append(',')
                    .append(Numbers.csv(o.lowerBoundS())).append(',').append(Numbers.csv(o.boundRatio())).append(',')
                    .append(o.boundRigorous()).append(',').append(Numbers.csv(o.peakPressurePa())).append(',')
                    .append(Numbers.csv(o.smallestMargin())).append(',').append(o.smallestLimit()).append(',')
                    .append(Numbers.csv(o.ceilingHeadroomK())).append(',').append(o.steps()).append(',')
                    .append(o.verdictLimit()).append(',').append(quote(o.verdictReason()));
            for (String l : limits) {
                org.exhale.simulation.Margin m = o.feasible() && o.plan() != null ? o.plan().verification().margin(l) : null;
                sb.append(',').append(m == null ? "" : Double.isInfinite(m.margin()) ? "inf" : Numbers.csv(m.margin()));
            }
            sb.append('\n');
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
