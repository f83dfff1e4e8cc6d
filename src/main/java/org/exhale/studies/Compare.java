package org.exhale.studies;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

import org.exhale.planning.PlanResult;
import org.exhale.planning.Planner;
import org.exhale.planning.Tool;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.Margin;

/**
 * Plans every combination of the varied values (the first key varies slowest) and ranks the
 * options. The ranking rule: feasible options by planned duration, then by the larger smallest
 * margin, both as resolved — durations to the tool's time step, margins to three significant
 * digits, the precision they are shown with — so that differences below the resolution never
 * rank; options equal in both are <em>tied</em>, share a rank and keep their input order. The
 * infeasible options follow in input order. The Pareto front is taken over the feasible options,
 * minimising duration and maximising the smallest margin, on the same resolved values.
 *
 * <p>The smallest margin is the smallest ratio margin (allowed / actual) of the verified plan;
 * the ceiling is a headroom in kelvin and is reported beside it, not mixed in, because a planner
 * that is ceiling-bound always leaves only the wafer spread as headroom.
 */
public final class Compare {
    /** Most combinations one comparison may plan. */
    public static final int MAX_OPTIONS = 10_000;

    private Compare() {
    }

    /**
     * One planned option.
     *
     * @param index           position in the combination order (0-based)
     * @param values          the varied values, SI, in the order of the variations
     * @param feasible        a verified recipe meets every limit
     * @param durationS       planned time to target (end of the final hold) [s]; NaN when infeasible
     * @param totalS          with the cool-down [s]
     * @param lowerBoundS     the planner's lower bound [s]
     * @param boundRatio      duration / lower bound
     * @param boundRigorous   whether the bound is rigorous (quasi-steady gas)
     * @param peakPressurePa  peak excess pressure of the verified recipe [Pa]
     * @param smallestMargin  smallest ratio margin of the verified recipe
     * @param smallestLimit   which limit that is
     * @param ceilingHeadroomK the ceiling headroom [K]
     * @param steps           recipe steps
     * @param verdictLimit    when infeasible: the limit that prevents the target (or "input")
     * @param verdictReason   when infeasible: why
     * @param plan            the plan itself (null for an invalid combination)
     */
    public record Option(int index, List<Double> values, boolean feasible, double durationS, double totalS,
                         double lowerBoundS, double boundRatio, boolean boundRigorous, double peakPressurePa,
                         double smallestMargin, String smallestLimit, double ceilingHeadroomK, int steps,
                         String verdictLimit, String verdictReason, PlanResult plan) {
        public Option {
            values = List.copyOf(values);
        }
    }

    /** The cartesian product of the variations' values, first key slowest. */
    public static List<List<Double>> combinations(List<Variation> vary) {
        long count = 1;
        for (Variation v : vary) {
            count *= v.values().size();
            if (count > MAX_OPTIONS) {
                throw new org.exhale.io.InputException(org.exhale.io.ErrorKind.OUT_OF_RANGE, "command line", "--vary", 0,
                        "the variations make more than " + MAX_OPTIONS + " combinations");
            }
        }
        List<List<Double>> out = new ArrayList<>();
        out.add(List.of());
        for (Variation v : vary) {
            List<List<Double>> next = new ArrayList<>();
            for (List<Double> prefix : out) {
                for (double x : v.values()) {
                    List<Double> c = new ArrayList<>(prefix);
                    c.add(x);
                    next.add(c);
                }
            }
            out = next;
        }
        return out;
    }

    /** The case of one combination. */
    public static BakeCase caseOf(BakeCase nominal, List<Variation> vary, List<Double> values) {
        BakeCase b = nominal;
        for (int k = 0; k < vary.size(); k++) {
            b = vary.get(k).key().apply(b, values.get(k));
        }
        return b;
    }

    /** Plans one combination; an invalid one (values that do not fit together) is an infeasible option. */
    public static Option planOne(BakeCase nominal, Tool tool, List<Variation> vary, int index, List<Double> values) {
        BakeCase b;
        try {
            b = caseOf(nominal, vary, values);
        } catch (IllegalArgumentException e) {
            return new Option(index, values, false, Double.NaN, Double.NaN, Double.NaN, Double.NaN, false, Double.NaN,
                    Double.NaN, "", Double.NaN, 0, "input", e.getMessage(), null);
        }
        PlanResult p = Planner.plan(b, tool);
        return option(index, values, p);
    }

    static Option option(int index, List<Double> values, PlanResult p) {
        double lb = p.lowerBound() == null ? Double.NaN : p.lowerBound().boundS();
        if (!p.feasible()) {
            PlanResult.Infeasibility inf = p.infeasibility();
            return new Option(index, values, false, Double.NaN, Double.NaN, lb, Double.NaN, p.boundRigorous(), Double.NaN,
                    Double.NaN, "", Double.NaN, 0, inf == null ? "" : inf.limit(),
                    inf == null ? "no recipe" : inf.reason(), p);
        }
        BakeResult v = p.verification();
        Margin t = v.tightest();
        Margin c = v.margin("ceiling");
        boolean ok = p.verified() && v.feasible();
        return new Option(index, values, ok, p.durationS(), p.totalS(), lb, p.boundRatio(), p.boundRigorous(),
                v.peakExcessPressurePa(), t == null ? Double.POSITIVE_INFINITY : t.margin(), t == null ? "" : t.limit(),
                c == null ? Double.NaN : c.margin(), p.recipe().steps().size(),
                ok ? "" : (v.violated().isEmpty() ? "verification" : v.violated().get(0).limit()),
                ok ? "" : "the rounded recipe did not pass verification", p);
    }

    /**
     * Feasible by duration; ties by the larger smallest margin (to nine significant digits, so
     * that round-off does not rank), then the lower peak pressure, then the index; infeasible
     * last by index.
     */
    public static List<Option> rank(List<Option> options) {
        List<Option> out = new ArrayList<>(options);
        out.sort(Comparator.comparing((Option o) -> !o.feasible())
                .thenComparingDouble(o -> o.feasible() ? durationResolved(o) : 0)
                .thenComparingDouble(o -> o.feasible() ? -resolved(o.smallestMargin()) : 0)
                .thenComparingInt(Option::index));
        return out;
    }

    /** Significant digits a margin is resolved to: the precision it is shown with. */
    public static final int MARGIN_DIGITS = 3;

    /** Time resolution durations are compared at [s] (plans are already rounded to the tool's time step). */
    public static final double DURATION_RESOLUTION_S = 1;

    /** A margin to {@link #MARGIN_DIGITS} significant digits (infinite values kept). */
    public static double resolved(double v) {
        if (!Double.isFinite(v) || v == 0) {
            return v;
        }
        return new java.math.BigDecimal(v).round(new java.math.MathContext(MARGIN_DIGITS)).doubleValue();
    }

    static double durationResolved(Option o) {
        return Math.round(o.durationS() / DURATION_RESOLUTION_S) * DURATION_RESOLUTION_S;
    }

    /** Whether two feasible options are tied: equal duration and smallest margin as resolved. */
    public static boolean tied(Option a, Option b) {
        return a.feasible() && b.feasible() && durationResolved(a) == durationResolved(b)
                && resolved(a.smallestMargin()) == resolved(b.smallestMargin());
    }

    /** The shared rank of each option of a ranked list: tied options have the rank of the first of them. */
    public static int[] ranks(List<Option> ranked) {
        int[] r = new int[ranked.size()];
        for (int i = 0; i < ranked.size(); i++) {
            r[i] = i > 0 && tied(ranked.get(i - 1), ranked.get(i)) ? r[i - 1] : i + 1;
        }
        return r;
    }

    /**
     * Whether each option (same order as given) is on the Pareto front of the feasible ones: no
     * other feasible option is at least as short and at least as safe and strictly better in one.
     */
    public static boolean[] pareto(List<Option> options) {
        boolean[] front = new boolean[options.size()];
        for (int i = 0; i < options.size(); i++) {
            Option a = options.get(i);
            if (!a.feasible()) {
                continue;
            }
            boolean dominated = false;
            for (Option b : options) {
                if (b == a || !b.feasible()) {
                    continue;
                }
                double ma = resolved(a.smallestMargin());
                double mb = resolved(b.smallestMargin());
                double da = durationResolved(a);
                double db = durationResolved(b);
                boolean noWorse = db <= da && mb >= ma;
                boolean better = db < da || mb > ma;
                if (noWorse && better) {
                    dominated = true;
                    break;
                }
            }
            front[i] = !dominated;
        }
        return front;
    }
}
