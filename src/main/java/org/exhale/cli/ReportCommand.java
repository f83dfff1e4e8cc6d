package org.exhale.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

import org.exhale.report.Report;
import org.exhale.report.RunFolder;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

@Command(name = "report", mixinStandardHelpOptions = true,
        header = "Render charts and a self-contained HTML report of an output folder.",
        description = {"Reads what the folder holds (summary.json and history.csv from simulate or plan, recipe.csv and "
                + "plan.json from plan, fit.json, fit.csv and isoconversional.csv from fit, compare.json and options.csv from "
                + "compare, robust.json and samples.csv from robust) and writes DIR/report.html "
                + "with the headline figures, margins, warnings, cautions and charts inline, and each chart as SVG and "
                + "PNG in DIR/charts/. Charts whose inputs are absent are left out.",
                "The page has no script and refers to no outside file or address: it opens offline."})
final class ReportCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "DIR", description = "Output folder of exhale simulate, plan, fit, compare or robust.")
    Path dir;

    @Option(names = {"-o", "--output"}, paramLabel = "FILE", description = "The page (default: DIR/report.html).")
    Path output;

    @Mixin
    CommonOptions common;

    @Override
    public Integer call() {
        render(dir, output != null ? output : dir.resolve("report.html"), common.quiet, common.force);
        return Main.OK;
    }

    /** Renders the report of an output folder into DIR/report.html and DIR/charts/. */
    static void render(Path dir, boolean quiet) {
        render(dir, dir.resolve("report.html"), quiet, true);
    }

    private static void render(Path dir, Path page, boolean quiet, boolean replacePage) {
        long t0 = System.nanoTime();
        RunFolder folder = RunFolder.read(dir);
        Report r = Report.of(folder, Report.chartsHref(dir, page));
        List<Path> written = r.write(dir, page, replacePage);
        if (!quiet) {
            System.out.printf(java.util.Locale.ROOT, "wrote %s and %d chart files in %s (%.2f s)%n", page,
                    written.size() - 1, dir.resolve(Report.CHARTS), (System.nanoTime() - t0) / 1e9);
        }
    }
}
