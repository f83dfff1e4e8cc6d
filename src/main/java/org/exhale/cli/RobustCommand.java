package org.exhale.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;
import org.exhale.io.Numbers;
import org.exhale.io.OutputFolder;
import org.exhale.io.RecipeCsvWriter;
import org.exhale.io.SamplesCsvWriter;
import org.exhale.io.SummaryJsonWriter;
import org.exhale.recipe.Recipe;
import org.exhale.report.Cautions;
import org.exhale.simulation.BakeCase;
import org.exhale.studies.MonteCarlo;
import org.exhale.studies.ParallelRuns;
import org.exhale.studies.RobustStudy;
import org.exhale.studies.Uncertainty;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

@Command(name = "robust", mixinStandardHelpOptions = true,
        header = "Monte Carlo robustness of a recipe over the case's uncertainty section.",
        description = {"Draws N samples of the uncertain values (normal, truncated to physical ranges, one seeded stream "
                + "per sample so results do not depend on the thread count), simulates the recipe for each on all cores "
                + "and reports the probability of violating each limit with its binomial standard error, the time to "
                + "target (P50, P95) and a ranked sensitivity table (Spearman rank correlation with the smallest margin). "
                + "With --plan: plans nominally, then re-plans with tightened limits until every limit holds in at least "
                + "the chosen quantile of the samples, and says what that costs in bake time.",
                "Writes DIR/samples.csv, DIR/robust.json, DIR/recipe.yaml and DIR/recipe.csv (the evaluated recipe).",
                "Ctrl-C stops early and keeps the samples done so far (\"complete\": false).",
                "Exit 0 every limit holds at the quantile, 3 some limit is violated more often, 4 no robust plan, 2 bad input."})
final class RobustCommand implements Callable<Integer> {
    /** The seed when none is given; printed and stored like any other. */
    static final long DEFAULT_SEED = 1;

    @Parameters(index = "0", paramLabel = "CASE", description = "Case file (YAML) with an uncertainty section.")
    Path casePath;

    @Option(names = "--recipe", paramLabel = "FILE", description = "Recipe to evaluate (a recipe.yaml from plan or compare, or a case file); default: the case's recipe.")
    Path recipePath;

    @Option(names = "--samples", paramLabel = "N", required = true, description = "Number of samples.")
    int samples;

    @Option(names = "--seed", paramLabel = "S", description = "Seed of the generator (default: " + DEFAULT_SEED + ").")
    Long seed;

    @Option(names = "--plan", description = "Plan a recipe that holds every limit at the quantile (needs a tool section).")
    boolean plan;

    @Option(names = "--quantile", paramLabel = "Q", defaultValue = "0.95",
            description = "Each limit must hold in at least this fraction of the samples (default: 0.95).")
    double quantile;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR", description = "Output folder (default: out/<case file name>-robust).")
    Path output;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @Mixin
    CommonOptions common;

    /** What the study has done so far, for the normal end and for Ctrl-C alike. */
    private final class State {
        volatile ParallelRuns<MonteCarlo.Outcome> runs;
        volatile Recipe recipe;
        volatile RobustStudy.RobustPlan robust;
    }

    @Override
    public Integer call() {
        CaseFile cf = CaseYamlReader.read(casePath);
        Uncertainty u = cf.uncertainty();
        List<String> names = cf.bake().polymer().components().stream().map(c -> c.name()).toList();
        if (u == null || !u.any(names)) {
            throw new InputException(ErrorKind.MISSING_KEY, casePath.toString(), "uncertainty", 0,
                    "a robustness study needs an 'uncertainty' section with at least one standard deviation above 0, "
                            + "e.g. uncertainty: {Ea_sd: 2 kJ/mol, spread_sd: 1 K}");
        }
        if (samples < 2 || samples > 1_000_000) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--samples", 0, "must be in [2, 1000000], got " + samples);
        }
        if (!(quantile >= 0.5 && quantile < 1)) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--quantile", 0, "must be in [0.5, 1), got " + quantile);
        }
        int nThreads = threads == null ? ParallelRuns.defaultThreads() : threads;
        if (nThreads < 1 || nThreads > 1024) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--threads", 0, "must be in [1, 1024], got " + nThreads);
        }
        long s = seed == null ? DEFAULT_SEED : seed;
        BakeCase nominal = cf.bake();
        if (recipePath != null) {
            if (plan) {
                throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--recipe", 0, "give either --recipe or --plan");
            }
            Recipe r = CaseYamlReader.readRecipe(recipePath);
            nominal = nominal.withRecipe(r);
        }
        if (plan) {
            CompareCommand.requireTool(cf, casePath);
        } else if (nominal.recipe() == null) {
            throw new InputException(ErrorKind.MISSING_KEY, casePath.toString(), "recipe", 0,
                    "no recipe to evaluate: give one in the case, with --recipe, or plan one with --plan");
        }
        Path dir = output != null ? output : Path.of("out", SimulateCommand.defaultOutput(casePath).getFileName() + "-robust");
        new OutputFolder(dir, common.force).checkWritable();
        List<MonteCarlo.Parameter> ps = MonteCarlo.parameters(nominal, u);
        BakeCase base = nominal;
        if (!common.quiet) {
            System.err.println("Seed " + s + ", " + samples + " samples of " + ps.size() + " uncertain values on "
                    + Math.min(nThreads, samples) + " threads");
        }
        long t0 = System.nanoTime();
        State st = new State();
        String result;
        int code;
        try (SaveOnInterrupt save = new SaveOnInterrupt(() -> {
            ParallelRuns<MonteCarlo.Outcome> r = st.runs;
            if (r != null) {
                r.cancel();
                r.awaitWorkers(5000);
            }
        }, () -> {
            writePartial(dir, cf, base, ps, s, nThreads, st, t0);
        })) {
            if (plan) {
                List<String> limits = RobustStudy.limitNames(base.withRecipe(base.recipe()));
                RobustStudy.RobustPlan rp = RobustStudy.plan(base, cf.tool(), ps, limits, quantile, (withRecipe, round) -> {
                    st.recipe = withRecipe.recipe();
                    try (Progress bar = Progress.start("robust round " + (round + 1), samples, common.quiet)) {
                        return RobustStudy.evaluate(withRecipe, ps, limits, s, samples, nThreads, bar, r -> st.runs = r);
                    }
                }, p -> st.robust = p);
                st.robust = rp;
                if (rp.rounds().stream().anyMatch(r -> r.outcomes().stream().anyMatch(o -> o == null)) || !save.claim()) {
                    return Main.INTERNAL;
                }
                result = write(dir, cf, base, ps, limits, s, nThreads, rp.last().outcomes(), rp.last().plan().recipe(), rp,
                        true, (System.nanoTime() - t0) / 1e9);
                code = rp.met() ? Main.OK : (rp.last().plan().feasible() ? Main.VIOLATED : Main.INFEASIBLE);
            } else {
                List<String> limits = RobustStudy.limitNames(base);
                st.recipe = base.recipe();
                List<MonteCarlo.Outcome> out;
                try (Progress bar = Progress.start("robust", samples, common.quiet)) {
                    out = RobustStudy.evaluate(base, ps, limits, s, samples, nThreads, bar, r -> st.runs = r);
                }
                if (out.stream().anyMatch(o -> o == null) || !save.claim()) {
                    return Main.INTERNAL;
                }
                result = write(dir, cf, base, ps, limits, s, nThreads, out, base.recipe(), null, true,
                        (System.nanoTime() - t0) / 1e9);
                code = RobustStudy.summarize(ps, limits, out, quantile).meetsQuantile() ? Main.OK : Main.VIOLATED;
            }
        }
        if (!common.quiet) {
            System.out.print(result);
            cf.warnings().forEach(w -> System.out.println("Warning: " + w));
            System.out.println("Wrote " + dir + " (samples.csv, robust.json, recipe.yaml, recipe.csv)"
                    + String.format(java.util.Locale.ROOT, " after %.1f s", (System.nanoTime() - t0) / 1e9));
            System.out.println(Cautions.terminal(cf.bake().chamber() != null));
        }
        return code;
    }

    private void writePartial(Path dir, CaseFile cf, BakeCase base, List<MonteCarlo.Parameter> ps, long s, int nThreads,
                              State st, long t0) {
        ParallelRuns<MonteCarlo.Outcome> r = st.runs;
        Recipe recipe = st.recipe;
        if (r == null || recipe == null) {
            System.err.println("Interrupted before any sample was done; nothing written");
            return;
        }
        List<String> limits = RobustStudy.limitNames(base.withRecipe(recipe));
        write(dir, cf, base, ps, limits, s, nThreads, r.snapshot(), recipe, st.robust, false, (System.nanoTime() - t0) / 1e9);
        System.err.println("Interrupted: kept " + r.done() + " of " + samples + " samples in " + dir + " (\"complete\": false)");
    }

    private String write(Path dir, CaseFile cf, BakeCase base, List<MonteCarlo.Parameter> ps, List<String> limits, long s,
                         int nThreads, List<MonteCarlo.Outcome> out, Recipe recipe, RobustStudy.RobustPlan rp,
                         boolean complete, double seconds) {
        RobustStudy.Summary sum = RobustStudy.summarize(ps, limits, out, quantile);
        OutputFolder folder = new OutputFolder(dir, common.force).owns("recipe.csv", "recipe.yaml", "report.html", "charts");
        folder.put("samples.csv", SamplesCsvWriter.write(ps, limits, out));
        folder.put("recipe.yaml", RecipeCsvWriter.yaml(recipe));
        folder.put("recipe.csv", RecipeCsvWriter.csv(recipe));
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("complete", complete);
        m.put("case", cf.path());
        m.put("case_name", cf.bake().name());
        m.put("seed", s);
        m.put("samples", samples);
        m.put("samples_done", sum.n());
        m.put("threads", nThreads);
        // the wall time goes to the terminal only: identical input gives identical bytes (docs/errors.md)
        m.put("quantile", quantile);
        m.put("recipe", recipePath != null ? recipePath.toString() : plan ? "robust plan (recipe.yaml)" : "the case's recipe");
        List<Object> params = new ArrayList<>();
        for (MonteCarlo.Parameter p : ps) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("name", p.name());
            e.put("nominal", SummaryJsonWriter.num(p.display(p.nominal())));
            e.put("sd", SummaryJsonWriter.num(p.display(p.sd())));
            e.put("truncated_to", List.of(Numbers.sig(p.display(p.lo()), 6), Numbers.sig(p.display(p.hi()), 6)));
            if (p.correlation() != 0) {
                e.put("Ea_lnA_correlation", p.correlation());
            }
            params.add(e);
        }
        m.put("parameters", params);
        m.put("violation", risks(sum));
        Map<String, Object> any = new LinkedHashMap<>();
        any.put("probability", SummaryJsonWriter.num(sum.anyProbability()));
        any.put("standard_error", SummaryJsonWriter.num(org.exhale.studies.SampleStatistics.binomialStandardError(sum.anyViolations(), sum.n())));
        m.put("any_limit", any);
        Map<String, Object> t = new LinkedHashMap<>();
        t.put("p50_s", SummaryJsonWriter.num(sum.p50S()));
        t.put("p95_s", SummaryJsonWriter.num(sum.p95S()));
        if (Math.abs(quantile - 0.95) > 1e-9 && Math.abs(quantile - 0.5) > 1e-9) {
            // the chosen quantile, when it is not one of the two above ("p90_s", "p97.5_s")
            t.put("p" + org.exhale.report.ReportText.plain(quantile * 100, 4) + "_s", SummaryJsonWriter.num(sum.pqS()));
        }
        t.put("not_reached", sum.notReached());
        // the residue limit is judged here: a sample violates it exactly when its time to target is later
        t.put("residue_checkpoint", SummaryJsonWriter.checkpoint(recipe.residueCheckpoint()));
        t.put("later_than_checkpoint", sum.lateSamples(recipe.residueCheckpoint().timeS()));
        t.put("note", "quantiles by linear interpolation of order statistics (Hyndman and Fan definition 7); a sample "
                + "that never reaches the residue target counts as infinitely slow (null)");
        m.put("time_to_target", t);
        m.put("sensitivity", sensitivities(sum, limits));
        if (rp != null) {
            m.put("robust_plan", robustJson(rp));
        }
        m.put("notes", List.of(
                "each value is normal around the case's value with the given standard deviation, truncated to its physical "
                        + "range by redrawing; a component's Ea and ln A are drawn as a correlated pair",
                "sample i draws each value from its own random stream, seeded from the seed, i and the value, so "
                        + "results do not depend on the number of threads",
                "a margin is allowed/actual (1 or more holds); the smallest margin of a sample is its smallest ratio "
                        + "margin, the tightest limit; the ceiling is followed on its own as headroom in K",
                "rank correlations below about " + Numbers.sig(2 / Math.sqrt(Math.max(1, sum.n() - 1)), 2)
                        + " in size (2/sqrt(n-1)) are not distinguishable from none"));
        m.put("warnings", cf.warnings());
        m.put("cautions", Cautions.BAKE);
        folder.put("robust.json", SummaryJsonWriter.toJson(m));
        folder.commit();
        return text(sum, limits, s, rp, recipe);
    }

    static List<Object> risks(RobustStudy.Summary sum) {
        List<Object> out = new ArrayList<>();
        for (RobustStudy.LimitRisk r : sum.risks()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("limit", r.limit());
            e.put("probability", SummaryJsonWriter.num(r.probability()));
            e.put("standard_error", SummaryJsonWriter.num(r.standardError()));
            e.put("violations", r.violations());
            if (r.violations() == 0) {
                e.put("upper_95_rule_of_three", SummaryJsonWriter.num(r.upper95IfNone()));
            }
            e.put(r.headroom() ? "headroom_K_median" : "margin_median", SummaryJsonWriter.num(r.marginMedian()));
            e.put(r.headroom() ? "headroom_K_at_1_minus_quantile" : "margin_at_1_minus_quantile", SummaryJsonWriter.num(r.marginAtAlpha()));
            out.add(e);
        }
        return out;
    }

    static List<Object> sensitivities(RobustStudy.Summary sum, List<String> limits) {
        List<Object> out = new ArrayList<>();
        int rank = 0;
        for (RobustStudy.Sensitivity s : sum.sensitivities()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("rank", ++rank);
            e.put("parameter", s.parameter());
            e.put("spearman_smallest_margin", SummaryJsonWriter.num(s.smallestMargin()));
            e.put("spearman_time_to_target", SummaryJsonWriter.num(s.timeToTarget()));
            Map<String, Object> per = new LinkedHashMap<>();
            for (int l = 0; l < limits.size(); l++) {
                per.put(limits.get(l), SummaryJsonWriter.num(s.perLimit()[l]));
            }
            e.put("spearman_per_limit_slack", per);
            out.add(e);
        }
        return out;
    }

    private Map<String, Object> robustJson(RobustStudy.RobustPlan rp) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("met", rp.met());
        m.put("note", rp.note());
        m.put("nominal_duration_s", SummaryJsonWriter.num(rp.nominal().plan().durationS()));
        if (rp.met()) {
            m.put("robust_duration_s", SummaryJsonWriter.num(rp.last().plan().durationS()));
            m.put("cost_s", SummaryJsonWriter.num(rp.costS()));
            m.put("cost_percent", SummaryJsonWriter.num(100 * rp.costS() / rp.nominal().plan().durationS()));
        }
        List<Object> rounds = new ArrayList<>();
        for (RobustStudy.Round r : rp.rounds()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("round", r.round());
            e.put("tightened", r.tightened());
            e.put("feasible", r.plan().feasible());
            e.put("duration_s", SummaryJsonWriter.num(r.plan().durationS()));
            e.put("bound_ratio", SummaryJsonWriter.num(r.plan().boundRatio()));
            var l = r.planningCase().limits();
            Map<String, Object> lim = new LinkedHashMap<>();
            lim.put("ceiling_C", l.ceilingK() - org.exhale.PhysicalConstants.ZERO_CELSIUS_K);
            lim.put("residue", l.residue());
            lim.put("max_pressure_Pa", SummaryJsonWriter.num(l.maxPressurePa()));
            lim.put("safety_factor", l.safetyFactor());
            lim.put("max_deflection_m", SummaryJsonWriter.num(l.maxDeflectionM()));
            if (l.dose() != null) {
                lim.put("thermal_dose_max_s", l.dose().maxS());
            }
            if (r.planningCase().chamber() != null && r.planningCase().chamber().hasLimit()) {
                lim.put("chamber_limit_ppm", r.planningCase().chamber().limitFraction() * 1e6);
            }
            e.put("planning_limits", lim);
            if (r.summary() != null) {
                e.put("violation", risks(r.summary()));
                e.put("samples_done", r.summary().n());
            }
            if (r.plan().feasible()) {
                e.put("recipe", RecipeCsvWriter.yaml(r.plan().recipe()));
            }
            rounds.add(e);
        }
        m.put("rounds", rounds);
        return m;
    }

    private String text(RobustStudy.Summary sum, List<String> limits, long s, RobustStudy.RobustPlan rp, Recipe recipe) {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "Seed %d, %d samples%n", s, sum.n()));
        if (rp != null) {
            sb.append(String.format(Locale.ROOT, "Nominal plan: %.1f min. ", rp.nominal().plan().durationS() / 60));
            if (rp.met()) {
                sb.append(String.format(Locale.ROOT, "Robust plan (every limit holds in >= %s %% of samples): %.1f min, "
                                + "%+.1f min (%+.1f %%) against the nominal plan; %s.%n", Numbers.sig(quantile * 100, 4),
                        rp.last().plan().durationS() / 60, rp.costS() / 60, 100 * rp.costS() / rp.nominal().plan().durationS(),
                        rp.note()));
                if (rp.costS() < 0) {
                    sb.append("  (Shorter than the nominal plan: the planner's nominal recipe was not exactly the shortest; "
                            + "see bound ratios in robust.json.)\n");
                }
            } else {
                sb.append("No robust plan: ").append(rp.note()).append(".\n");
            }
        }
        sb.append(String.format(Locale.ROOT, "%-14s %12s %10s %14s%n", "limit", "P(violate)", "+/- s.e.", "margin P50"));
        for (RobustStudy.LimitRisk r : sum.risks()) {
            sb.append(String.format(Locale.ROOT, "%-14s %12s %10s %14s%s%n", r.limit(), Numbers.fixed(r.probability(), 4),
                    Numbers.fixed(r.standardError(), 4), Numbers.sig(r.marginMedian(), 4) + (r.headroom() ? " K" : ""),
                    r.violations() == 0 ? "  (none seen; < " + Numbers.sig(r.upper95IfNone(), 2) + " at 95 %)" : ""));
        }
        sb.append(String.format(Locale.ROOT, "Any limit violated: %s +/- %s%n", Numbers.fixed(sum.anyProbability(), 4),
                Numbers.fixed(org.exhale.studies.SampleStatistics.binomialStandardError(sum.anyViolations(), sum.n()), 4)));
        sb.append(String.format(Locale.ROOT, "Time to target: P50 %s min, P95 %s min%s%n", min(sum.p50S()), min(sum.p95S()),
                sum.notReached() > 0 ? " (" + sum.notReached() + " samples never reach it)" : ""));
        var at = recipe.residueCheckpoint();
        sb.append(String.format(Locale.ROOT, "  the target applies at the %s, %s min: %d of %d samples reach it later%n",
                at.describe(), Numbers.fixed(at.timeS() / 60, 1), sum.lateSamples(at.timeS()), sum.n()));
        sb.append("Sensitivity (Spearman rank correlation):\n");
        sb.append(String.format(Locale.ROOT, "  %-4s %-32s %16s %16s%n", "rank", "parameter", "smallest margin", "time to target"));
        int rank = 0;
        for (RobustStudy.Sensitivity x : sum.sensitivities()) {
            sb.append(String.format(Locale.ROOT, "  %-4d %-32s %16s %16s%n", ++rank, x.parameter(), Numbers.fixed(x.smallestMargin(), 3),
                    Numbers.fixed(x.timeToTarget(), 3)));
        }
        return sb.toString();
    }

    private static String min(double s) {
        return Double.isFinite(s) ? Numbers.fixed(s / 60, 1) : "not reached";
    }
}
