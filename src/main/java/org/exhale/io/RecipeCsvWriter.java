package org.exhale.io;

import java.util.List;
import java.util.Locale;

import org.exhale.PhysicalConstants;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Segment;
import org.exhale.recipe.Step;

/**
 * Writes a recipe as the ramp table a bake tool takes:
 * {@code step,action,start_C,end_C,rate_C_per_min,duration_s,elapsed_s}; and as a recipe block
 * that can be pasted into a case file.
 */
public final class RecipeCsvWriter {
    public static final String HEADER = "step,action,start_C,end_C,rate_C_per_min,duration_s,elapsed_s";

    private RecipeCsvWriter() {
    }

    public static String csv(Recipe recipe) {
        StringBuilder sb = new StringBuilder(HEADER).append('\n');
        List<Segment> segs = recipe.segments();
        double c0 = PhysicalConstants.ZERO_CELSIUS_K;
        for (int i = 0; i < segs.size(); i++) {
            Segment s = segs.get(i);
            boolean ramp = recipe.steps().get(i) instanceof Step.Ramp;
            sb.append(i + 1).append(',').append(ramp ? "ramp" : "hold").append(',')
                    .append(Numbers.csv(round(s.startK() - c0))).append(',').append(Numbers.csv(round(s.endK() - c0))).append(',')
                    .append(ramp ? Numbers.csv(Math.abs(s.slopeKPerS()) * 60) : "0").append(',')
                    .append(Numbers.csv(s.durationS())).append(',').append(Numbers.csv(s.endTimeS())).append('\n');
        }
        return sb.toString();
    }

    private static double round(double c) {
        return Math.round(c * 1e6) / 1e6;
    }

    /** The recipe as a YAML block for a case file. */
    public static String yaml(Recipe recipe) {
        double c0 = PhysicalConstants.ZERO_CELSIUS_K;
        StringBuilder sb = new StringBuilder("recipe:\n");
        sb.append("  start: ").append(Numbers.csv(round(recipe.startK() - c0))).append(" C\n  steps:\n");
        for (Step s : recipe.steps()) {
            if (s instanceof Step.Ramp r) {
                sb.append(String.format(Locale.ROOT, "    - ramp: {to: %s C, rate: %s C/min}%n",
                        Numbers.csv(round(r.targetK() - c0)), Numbers.csv(r.rateKPerS() * 60)));
            } else if (s instanceof Step.Hold h) {
                sb.append("    - hold: ").append(Numbers.csv(h.durationS())).append(" s\n");
            }
        }
        return sb.toString();
    }
}
