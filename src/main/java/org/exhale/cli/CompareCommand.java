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
import org.exhale.io.OptionsCsvWriter;
import org.exhale.io.OutputFolder;
import org.exhale.io.RecipeCsvWriter;
import org.exhale.io.SummaryJsonWriter;
import org.exhale.report.Cautions;
import org.exhale.report.Readable;
import org.exhale.studies.Compare;
import org.exhale.studies.ParallelRuns;
import org.exhale.studies.Variation;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

@Command(name = "compare", mixinStandardHelpOptions = true,
        header = "Plan every combination of cap and process options and rank them.",
        description = {"Varies case values (--vary KEY=VALUES, repeatable; values as a list 1nm,2nm,3nm or an inclusive "
                + "range FROM:TO:STEP with units) and plans the shortest recipe of every combination on all cores. "
                + "Writes DIR/options.csv (ranked by planned duration, infeasible last, with the Pareto front of "
                + "duration against the smallest margin), DIR/compare.json and DIR/recipes/option-N.yaml.",
                "Keys: cap.porosity, cap.pore_radius, cap.thickness, cap.tortuosity, cavity.width, cavity.height, "
                        + "limits.ceiling, limits.max_pressure, limits.safety_factor, wafer.spread, wafer.lag, "
                        + "chamber.purge, polymer.density.",
                "Ctrl-C stops early and keeps the options planned so far (\"complete\": false).",
                "Exit 0 at least one option is feasible, 4 none is, 2 bad input."})
final class CompareCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "CASE", description = "Case file (YAML) with a tool section and a recipe start.")
    Path casePath;

    @Option(names = "--vary", paramLabel = "KEY=VALUES", required = true,
            description = "A key and its values, e.g. cap.porosity=0.2:0.5:0.05 or cap.pore_radius=1nm,2nm,3nm.")
    List<String> vary;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR", description = "Output folder (default: out/<case file name>-compare).")
    Path output;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @Mixin
    CommonOptions common;

    @Override
    public Integer call() {
        CaseFile cf = CaseYamlReader.read(casePath);
        requireTool(cf, casePath);
        List<Variation> variations = new ArrayList<>();
        for (String v : vary) {
            Variation var = Variation.parse(v);
            if (variations.stream().anyMatch(x -> x.key() == var.key())) {
                throw new InputException(ErrorKind.DUPLICATE_KEY, "command line", "--vary", 0, var.key().key() + " is varied twice");
            }
            for (double x : var.values()) {
                try {
                    var.key().apply(cf.bake(), x);
                } catch (IllegalArgumentException e) {
                    throw new InputException(ErrorKind.OUT_OF_RANGE, "command line", "--vary " + var.key().key(), 0,
                            "value " + Numbers.sig(var.key().display(x), 6)
                                    + (var.key().displayUnit().isEmpty() ? "" : " " + var.key().displayUnit()) + " does not fit the case: " + e.getMessage());
                }
            }
            variations.add(var);
        }
        int nThreads = threads == null ? ParallelRuns.defaultThreads() : threads;
        if (nThreads < 1 || nThreads > 1024) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--threads", 0, "must be in [1, 1024], got " + nThreads);
        }
        List<List<Double>> combos = Compare.combinations(variations);
        Path dir = output != null ? output : Path.of("out", SimulateCommand.defaultOutput(casePath).getFileName() + "-compare");
        new OutputFolder(dir, common.force).checkWritable();

        if (!common.quiet) {
            System.err.println("Comparing " + combos.size() + " options on " + Math.min(nThreads, combos.size()) + " threads");
        }
        long t0 = System.nanoTime();
        ParallelRuns<Compare.Option> runs = new ParallelRuns<>(combos.size(), nThreads,
                i -> Compare.planOne(cf.bake(), cf.tool(), variations, i, combos.get(i)));
        Summary s;
        try (SaveOnInterrupt save = new SaveOnInterrupt(() -> {
            runs.cancel();
            runs.awaitWorkers(5000);
        }, () -> {
            write(dir, cf, variations, runs.snapshot(), combos.size(), false, (System.nanoTime() - t0) / 1e9, nThreads, common.force);
            System.err.println("Interrupted: kept " + runs.done() + " of " + combos.size() + " options in " + dir
                    + " (\"complete\": false)");
        })) {
            List<Compare.Option> done;
            try (Progress bar = Progress.start("compare", combos.size(), common.quiet)) {
                done = runs.run(bar);
            }
            if (!runs.complete() || !save.claim()) {
                return Main.INTERNAL; // stopped: the hook keeps what is done
            }
            s = write(dir, cf, variations, done, combos.size(), true, (System.nanoTime() - t0) / 1e9, nThreads, common.force);
        }
        if (!common.quiet) {
            System.out.print(s.text);
            cf.warnings().forEach(w -> System.out.println("Warning: " + w));
            System.out.println("Wrote " + dir + " (options.csv, compare.json, recipes/)"
                    + String.format(java.util.Locale.ROOT, " after %.1f s", (System.nanoTime() - t0) / 1e9));
            System.out.println(Cautions.terminal(cf.bake().chamber() != null));
        }
        return s.anyFeasible ? Main.OK : Main.INFEASIBLE;
    }

    static void requireTool(CaseFile cf, Path casePath) {
        if (cf.tool() == null) {
            throw new InputException(ErrorKind.MISSING_KEY, casePath.toString(), "tool", 0,
                    "planning needs a 'tool' section (max_ramp_up, max_ramp_down, setpoint_step, time_step, min_step, "
                            + "max_steps, unload)");
        }
        if (cf.bake().recipe() == null) {
            throw new InputException(ErrorKind.MISSING_KEY, casePath.toString(), "recipe.start", 0,
                    "planning needs the start temperature: give 'recipe: {start: 150 C, steps: [...]}'");
        }
    }

    record Summary(String text, boolean anyFeasible) {
    }

    /** Builds and writes the outputs from the options done so far (null entries are not done). */
    static Summary write(Path dir, CaseFile cf, List<Variation> vary, List<Compare.Option> all, int total,
                         boolean complete, double seconds, int threads, boolean force) {
        List<Compare.Option> done = all.stream().filter(o -> o != null).toList();
        List<Compare.Option> ranked = Compare.rank(done);
        boolean[] pareto = Compare.pareto(ranked);
        OutputFolder out = new OutputFolder(dir, force).owns("recipes", "report.html", "charts");
        out.put("options.csv", OptionsCsvWriter.write(vary, ranked, pareto));
        for (Compare.Option o : done) {
            if (o.feasible()) {
                out.put("recipes/option-" + (o.index() + 1) + ".yaml", RecipeCsvWriter.yaml(o.plan().recipe()));
            }
        }
        String text = text(vary, ranked, pareto, total);
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("complete", complete);
        m.put("case", cf.path());
        m.put("case_name", cf.bake().name());
        m.put("options_total", total);
        m.put("options_done", done.size());
        m.put("threads", threads);
        // the wall time goes to the terminal only: identical input gives identical bytes (docs/errors.md)
        List<Object> keys = new ArrayList<>();
        for (Variation v : vary) {
            Map<String, Object> k = new LinkedHashMap<>();
            k.put("key", v.key().key());
            k.put("unit", v.key().displayUnit());
            k.put("values", v.values().stream().map(x -> SummaryJsonWriter.num(v.key().display(x))).toList());
            keys.add(k);
        }
        m.put("vary", keys);
        m.put("best", text.lines().findFirst().orElse(""));
        m.put("ranking", RANKING);
        int[] rank = Compare.ranks(ranked);
        List<Object> opts = new ArrayList<>();
        for (int r = 0; r < ranked.size(); r++) {
            Compare.Option o = ranked.get(r);
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("rank", rank[r]);
            e.put("option", o.index() + 1);
            Map<String, Object> vals = new LinkedHashMap<>();
            for (int k = 0; k < vary.size(); k++) {
                vals.put(vary.get(k).key().column(), SummaryJsonWriter.num(vary.get(k).key().display(o.values().get(k))));
            }
            e.put("values", vals);
            e.put("feasible", o.feasible());
            e.put("pareto", pareto[r]);
            if (o.feasible()) {
                e.put("duration_s", SummaryJsonWriter.num(o.durationS()));
                e.put("total_with_cooldown_s", SummaryJsonWriter.num(o.totalS()));
                e.put("lower_bound_s", SummaryJsonWriter.num(o.lowerBoundS()));
                e.put("bound_ratio", SummaryJsonWriter.num(o.boundRatio()));
                e.put("bound_rigorous", o.boundRigorous());
                e.put("peak_pressure_Pa", SummaryJsonWriter.num(o.peakPressurePa()));
                e.put("smallest_margin", SummaryJsonWriter.num(o.smallestMargin()));
                e.put("smallest_margin_limit", o.smallestLimit());
                e.put("ceiling_headroom_K", SummaryJsonWriter.num(o.ceilingHeadroomK()));
                e.put("recipe", "recipes/option-" + (o.index() + 1) + ".yaml");
            } else {
                e.put("lower_bound_s", SummaryJsonWriter.num(o.lowerBoundS()));
                e.put("infeasible_limit", o.verdictLimit());
                e.put("infeasible_reason", o.verdictReason());
            }
            opts.add(e);
        }
        m.put("options", opts);
        m.put("smallest_margin_note", "the smallest ratio margin (allowed/actual) of the verified plan; the ceiling "
                + "headroom in kelvin is reported apart");
        m.put("warnings", cf.warnings());
        m.put("cautions", Cautions.BAKE);
        out.put("compare.json", SummaryJsonWriter.toJson(m));
        out.commit();
        return new Summary(text, ranked.stream().anyMatch(Compare.Option::feasible));
    }

    /** The ranking rule, as the outputs state it. */
    static final String RANKING = "feasible options by planned duration, then by the larger smallest margin, as resolved "
            + "(durations to 1 s, margins to 3 significant digits); options equal in both tie and share a rank";

    static String describe(List<Variation> vary, Compare.Option o) {
        List<String> parts = new ArrayList<>();
        for (int k = 0; k < vary.size(); k++) {
            var key = vary.get(k).key();
            parts.add(key.key() + " = " + Numbers.sig(key.display(o.values().get(k)), 4)
                    + (key.displayUnit().isEmpty() ? "" : " " + key.displayUnit()));
        }
        return "#" + (o.index() + 1) + " (" + String.join(", ", parts) + ")";
    }

    static String text(List<Variation> vary, List<Compare.Option> ranked, boolean[] pareto, int total) {
        StringBuilder sb = new StringBuilder();
        long feasible = ranked.stream().filter(Compare.Option::feasible).count();
        if (feasible == 0) {
            sb.append("No option is feasible");
            if (!ranked.isEmpty()) {
                Compare.Option o = ranked.get(0);
                sb.append("; ").append(describe(vary, o)).append(": ").append(o.verdictReason())
                        .append(" (limit: ").append(o.verdictLimit()).append(")");
            }
            sb.append('\n');
        } else {
            Compare.Option best = ranked.get(0);
            List<Compare.Option> tiedFirst = new ArrayList<>();
            for (Compare.Option o : ranked) {
                if (o == best || Compare.tied(best, o)) {
                    tiedFirst.add(o);
                }
            }
            if (tiedFirst.size() > 1) {
                sb.append(String.format(Locale.ROOT, "%d options tie for first: %s; %.1f min to target, smallest margin %s "
                                + "(%s). They differ by less than the resolution (1 s, 3 digits of margin): choose among "
                                + "them on other grounds.%n", tiedFirst.size(),
                        String.join(", ", tiedFirst.stream().map(o -> "#" + (o.index() + 1)).toList()),
                        best.durationS() / 60, Readable.ratio(best.smallestMargin()), best.smallestLimit()));
            } else {
                sb.append(String.format(Locale.ROOT, "Best option: %s, %.1f min to target, %s x its lower bound, "
                                + "smallest margin %s (%s).%n", describe(vary, best), best.durationS() / 60,
                        Numbers.fixed(best.boundRatio(), 3), Readable.ratio(best.smallestMargin()), best.smallestLimit()));
            }
            int front = 0;
            java.util.Set<String> points = new java.util.HashSet<>();
            Compare.Option safest = null;
            for (int r = 0; r < ranked.size(); r++) {
                if (pareto[r]) {
                    front++;
                    points.add(Math.round(ranked.get(r).durationS()) + "/" + Compare.resolved(ranked.get(r).smallestMargin()));
                    if (safest == null || Compare.resolved(ranked.get(r).smallestMargin()) > Compare.resolved(safest.smallestMargin())) {
                        safest = ranked.get(r);
                    }
                }
            }
            sb.append(String.format(Locale.ROOT, "%d of %d options are feasible; the Pareto front of time against smallest "
                    + "margin has %d point%s (%d option%s)", feasible, total, points.size(), points.size() == 1 ? "" : "s",
                    front, front == 1 ? "" : "s"));
            if (safest != null && !Compare.tied(safest, best) && safest != best) {
                sb.append(String.format(Locale.ROOT, "; the safest of these is %s, %.1f min, margin %s (%s)",
                        describe(vary, safest), safest.durationS() / 60, Readable.ratio(safest.smallestMargin()),
                        safest.smallestLimit()));
            }
            sb.append(".\nRanking: ").append(RANKING).append(".\n");
        }
        sb.append(String.format(Locale.ROOT, "%-5s %-7s %-40s %10s %8s %9s  %s%n", "rank", "option", "values", "time min",
                "ratio", "margin", "limit / verdict"));
        int shown = Math.min(ranked.size(), 20);
        int[] rank = Compare.ranks(ranked);
        for (int r = 0; r < shown; r++) {
            Compare.Option o = ranked.get(r);
            String vals = describe(vary, o).replaceFirst("^#\\d+ \\(", "").replaceFirst("\\)$", "");
            if (o.feasible()) {
                sb.append(String.format(Locale.ROOT, "%-5s %-7s %-40s %10.1f %8s %9s  %s%s%n",
                        rank[r] + (r + 1 < ranked.size() && rank[r + 1] == rank[r] || r > 0 && rank[r - 1] == rank[r] ? "=" : ""),
                        "#" + (o.index() + 1),
                        vals, o.durationS() / 60, Numbers.fixed(o.boundRatio(), 3), Readable.ratio(o.smallestMargin()),
                        o.smallestLimit(), pareto[r] ? "  (Pareto)" : ""));
            } else {
                sb.append(String.format(Locale.ROOT, "%-5d %-7s %-40s %10s %8s %9s  infeasible: %s (%s)%n", rank[r],
                        "#" + (o.index() + 1), vals, "-", "-", "-", o.verdictLimit(), o.verdictReason()));
            }
        }
        if (ranked.size() > shown) {
            sb.append("... ").append(ranked.size() - shown).append(" more in options.csv\n");
        }
        return sb.toString();
    }
}
