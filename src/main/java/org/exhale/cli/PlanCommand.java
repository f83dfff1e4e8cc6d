package org.exhale.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.exhale.PhysicalConstants;
import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.io.HistoryCsvWriter;
import org.exhale.io.Numbers;
import org.exhale.io.OutputFolder;
import org.exhale.io.RecipeCsvWriter;
import org.exhale.io.SummaryJsonWriter;
import org.exhale.planning.LowerBound;
import org.exhale.planning.PlanResult;
import org.exhale.planning.Planner;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.exhale.report.Cautions;
import org.exhale.report.RecipeSheet;
import org.exhale.report.TextSummary;
import org.exhale.simulation.Margin;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

@Command(name = "plan", mixinStandardHelpOptions = true,
        header = "Plan the shortest recipe that meets every limit.",
        description = {"Searches for the shortest ramp-and-hold recipe from the case's start temperature to the residue "
                + "target at the end of a hold (then the cool-down to the tool's unload temperature), within the "
                + "tool's rates, resolutions and step count, keeping every limit at every wafer corner. The rounded "
                + "recipe is simulated again to prove it. Writes DIR/recipe.csv, DIR/plan.json, DIR/recipe.yaml, "
                + "DIR/history.csv and DIR/summary.json.",
                "Exit 0 planned and verified, 4 no feasible recipe, 2 bad input."})
final class PlanCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "CASE", description = "Case file (YAML) with a tool section.")
    Path casePath;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR", description = "Output folder (default: out/<case file name>-plan).")
    Path output;

    @Option(names = "--report", description = "Also write DIR/report.html and DIR/charts/ (as 'exhale report DIR').")
    boolean report;

    @Mixin
    CommonOptions common;

    /** Set by {@code demo}, which prints the cautions once for all its cases. */
    boolean cautionsElsewhere;

    @Override
    public Integer call() {
        CaseFile cf = CaseYamlReader.read(casePath);
        CompareCommand.requireTool(cf, casePath);
        Path dir = output != null ? output : Path.of("out", SimulateCommand.defaultOutput(casePath).getFileName() + "-plan");
        OutputFolder out = new OutputFolder(dir, common.force).owns("recipe.csv", "recipe.yaml", "recipe.txt", "history.csv", "summary.json", "report.html", "charts");
        out.checkWritable();
        long t0 = System.nanoTime();
        Planner.Pending pending = Planner.start(cf.bake(), cf.tool());
        List<String> warnings = new ArrayList<>(cf.warnings());
        // while a stored-gas bound is still computing: the files that do not depend on it
        PlanResult searched = pending.searched();
        String csv = null;
        String summary = null;
        String yaml = null;
        String history = null;
        if (searched.feasible()) {
            csv = RecipeCsvWriter.csv(searched.recipe());
            summary = SummaryJsonWriter.toJson(SummaryJsonWriter.summary(searched.verification(), warnings));
            yaml = RecipeCsvWriter.yaml(searched.recipe());
            history = HistoryCsvWriter.write(searched.verification());
        }
        PlanResult plan = pending.finish();
        double seconds = (pending.finishedAt() - t0) / 1e9;
        Map<String, Object> pj = planJson(plan, seconds);
        pj.put("overshoot_K", cf.tool().overshootK());
        pj.put("spread_K", cf.bake().wafer().spreadK());
        pj.put("exhale_version", VersionProvider.version());
        String planText = SummaryJsonWriter.toJson(pj);
        out.put("plan.json", planText);
        String sheet = null;
        if (plan.feasible()) {
            sheet = RecipeSheet.of(planText, csv, summary).text(VersionProvider.version());
            out.put("recipe.csv", csv);
            out.put("recipe.txt", sheet);
            out.put("recipe.yaml", yaml);
            out.put("history.csv", history);
            out.put("summary.json", summary);
        }
        out.commit();
        if (!common.quiet) {
            if (sheet != null) {
                // the sheet without its signature line and closing caution (printed once below)
                System.out.print(sheet.replaceFirst("Date: _+ +Approved by: _+\n\n", "\n")
                        .replaceFirst("(?s)\nCaution: .*$", ""));
                System.out.print(TextSummary.limits(plan.verification().margins(), false));
                System.out.printf(Locale.ROOT, "Planning: %d simulations, %.2f s%n", plan.evaluations(), seconds);
            } else {
                System.out.print(text(plan, seconds));
            }
            warnings.forEach(w -> System.out.println("Warning: " + w));
            System.out.println("Wrote " + out.dir() + (plan.feasible()
                    ? " (recipe.txt to print, recipe.csv, recipe.yaml, plan.json, history.csv, summary.json)" : " (plan.json)"));
            if (!cautionsElsewhere) {
                System.out.println(Cautions.terminal(cf.bake().chamber() != null));
            }
        }
        if (report) {
            ReportCommand.render(out.dir(), common.quiet);
        }
        return plan.feasible() ? Main.OK : Main.INFEASIBLE;
    }

    static Map<String, Object> planJson(PlanResult p, double seconds) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("feasible", p.feasible());
        m.put("verified", p.verified());
        m.put("duration_s", SummaryJsonWriter.num(p.durationS()));
        m.put("total_with_cooldown_s", SummaryJsonWriter.num(p.totalS()));
        m.put("lower_bound_s", SummaryJsonWriter.num(p.lowerBound().boundS()));
        m.put("bound_ratio", SummaryJsonWriter.num(p.boundRatio()));
        m.put("ride_s", SummaryJsonWriter.num(p.rideS()));
        m.put("ride_ratio", SummaryJsonWriter.num(p.rideRatio()));
        m.put("ride_admissible", Double.isFinite(p.rideS()) ? p.rideAdmissible() : null);
        m.put("lower_bound_rigorous", p.boundRigorous());
        m.put("lower_bound_kind", boundKind(p.lowerBound()));
        m.put("ceiling_only_lower_bound_s", SummaryJsonWriter.num(p.lowerBound().ceilingOnlyBoundS()));
        List<Object> bounds = new ArrayList<>();
        for (LowerBound.Estimate e : p.lowerBound().estimates()) {
            Map<String, Object> b = new LinkedHashMap<>();
            b.put("name", e.name());
            b.put("seconds", SummaryJsonWriter.num(e.seconds()));
            b.put("rigorous", e.rigorous());
            b.put("basis", e.basis());
            bounds.add(b);
        }
        m.put("lower_bounds", bounds);
        m.put("lower_bound_note", p.boundRigorous()
                ? "lower_bound_s is the largest rigorous bound (" + boundKind(p.lowerBound()) + "): no recipe within the limits "
                  + "can be shorter" + (p.lowerBound().quasiSteady() ? "" : "; the gas is stored here (not quasi-steady): the "
                  + "joint programme follows each corner's stored gas and venting (joint_stored); the quasi-steady joint and "
                  + "envelope bounds would only be estimates, so they are not computed")
                : "the bound is an estimate here, not a guarantee");
        if (p.feasible()) {
            m.put("margins", SummaryJsonWriter.margins(p.verification().margins()));
            List<Object> steps = new ArrayList<>();
            Recipe r = p.recipe();
            for (int i = 0; i < r.steps().size(); i++) {
                Map<String, Object> s = new LinkedHashMap<>();
                s.put("step", i + 1);
                s.put("action", r.steps().get(i) instanceof Step.Ramp ? "ramp" : "hold");
                s.put("binding", p.binding().get(i));
                steps.add(s);
            }
            m.put("binding", steps);
        } else {
            PlanResult.Infeasibility inf = p.infeasibility();
            Map<String, Object> d = new LinkedHashMap<>();
            d.put("limit", inf.limit());
            d.put("reason", inf.reason());
            d.put("best_residue", SummaryJsonWriter.num(inf.bestResidue()));
            d.put("best_residue_within_s", SummaryJsonWriter.num(inf.withinS()));
            d.put("suggestion", inf.suggestion());
            m.put("infeasible", d);
        }
        m.put("simulations", p.evaluations());
        // the planning time is printed on the terminal only: identical input gives identical bytes (docs/errors.md)
        m.put("notes", p.notes());
        m.put("cautions", Cautions.BAKE);
        return m;
    }

    /** The name of the bound that gives lower_bound_s. */
    static String boundKind(LowerBound.Result r) {
        for (LowerBound.Estimate e : r.estimates()) {
            if (e.rigorous() && e.seconds() == r.boundS()) {
                return e.name();
            }
        }
        return "none";
    }

    static String text(PlanResult p, double seconds) {
        StringBuilder sb = new StringBuilder();
        double c0 = PhysicalConstants.ZERO_CELSIUS_K;
        if (!p.feasible()) {
            PlanResult.Infeasibility inf = p.infeasibility();
            sb.append("No feasible recipe: ").append(inf.reason()).append(" (limit: ").append(inf.limit()).append(")\n");
            if (Double.isFinite(inf.bestResidue())) {
                sb.append("Best residue under the ceiling within ").append(Numbers.fixed(inf.withinS() / 3600, 0))
                        .append(" h: ").append(Numbers.sig(inf.bestResidue() * 100, 3)).append(" %\n");
            }
            sb.append("What would help: ").append(inf.suggestion()).append('\n');
            return sb.toString();
        }
        Recipe r = p.recipe();
        sb.append(String.format(Locale.ROOT, "%-4s %-5s %9s %9s %12s %10s %10s  %s%n", "step", "kind", "start C", "end C",
                "rate C/min", "dur s", "elapsed s", "binding"));
        var segs = r.segments();
        for (int i = 0; i < segs.size(); i++) {
            var s = segs.get(i);
            boolean ramp = r.steps().get(i) instanceof Step.Ramp;
            sb.append(String.format(Locale.ROOT, "%-4d %-5s %9.1f %9.1f %12s %10.0f %10.0f  %s%n", i + 1,
                    ramp ? "ramp" : "hold", s.startK() - c0, s.endK() - c0,
                    ramp ? Numbers.fixed(Math.abs(s.slopeKPerS()) * 60, 3) : "-", s.durationS(), s.endTimeS(),
                    p.binding().get(i)));
        }
        sb.append(String.format(Locale.ROOT, "Planned time to target (end of final hold): %.1f min; with cool-down %.1f min%n",
                p.durationS() / 60, p.totalS() / 60));
        sb.append(String.format(Locale.ROOT, "Lower bound: %.1f min (%s, %s); planned/bound = %s%n", p.lowerBound().boundS() / 60,
                boundKind(p.lowerBound()), p.boundRigorous() ? "rigorous" : "an estimate", Numbers.sig(p.boundRatio(), 4)));
        StringBuilder others = new StringBuilder();
        for (LowerBound.Estimate e : p.lowerBound().estimates()) {
            others.append(others.length() == 0 ? "" : ", ").append(e.name()).append(' ')
                    .append(Double.isFinite(e.seconds()) ? Numbers.fixed(e.seconds() / 60, 1) + " min" : "beyond 2 days")
                    .append(e.rigorous() ? "" : " (estimate)");
        }
        sb.append("  bounds: ").append(others).append('\n');
        if (Double.isFinite(p.rideS())) {
            sb.append(String.format(Locale.ROOT, "Closed-loop ride (unlimited steps): %.1f min; planned/ride = %s%s%n",
                    p.rideS() / 60, Numbers.sig(p.rideRatio(), 4), p.rideAdmissible() ? ""
                            : " (the ride crossed a limit on the way: a reference only, not an achievable time)"));
        }
        sb.append("Verified: ").append(p.verified() ? "yes, the rounded recipe meets every limit at every corner" : "NO").append('\n');
        sb.append(TextSummary.limits(p.verification().margins()));
        sb.append(String.format(Locale.ROOT, "Planning: %d simulations, %.2f s%n", p.evaluations(), seconds));
        return sb.toString();
    }
}
