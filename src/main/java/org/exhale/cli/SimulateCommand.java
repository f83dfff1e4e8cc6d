package org.exhale.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.io.ErrorKind;
import org.exhale.io.HistoryCsvWriter;
import org.exhale.io.InputException;
import org.exhale.io.OutputFolder;
import org.exhale.io.Quantities;
import org.exhale.io.SummaryJsonWriter;
import org.exhale.io.UnitKind;
import org.exhale.report.Cautions;
import org.exhale.report.TextSummary;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.BakeSimulator;
import org.exhale.simulation.SimulationSettings;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

@Command(name = "simulate", mixinStandardHelpOptions = true,
        header = "Simulate the case's recipe and check every limit.",
        description = {"Integrates decomposition, gas transport through the cap and cap mechanics through the recipe "
                + "at every wafer corner; writes DIR/history.csv and DIR/summary.json and prints a summary.",
                "Exit 0 when every limit holds, 3 when one is violated, 2 on bad input."})
final class SimulateCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "CASE", description = "Case file (YAML).")
    Path casePath;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR", description = "Output folder (default: out/<case file name>).")
    Path output;

    @Option(names = "--sample", paramLabel = "TIME", defaultValue = "30 s",
            description = "History sample interval, e.g. '10 s', '1 min', at least 0.1 s; widened to keep at most "
                    + "20000 rows per corner (default: ${DEFAULT-VALUE}).")
    String sample;

    @Option(names = "--report", description = "Also write DIR/report.html and DIR/charts/ (as 'exhale report DIR').")
    boolean report;

    @Mixin
    CommonOptions common;

    @Override
    public Integer call() {
        double interval = parseTime(sample, "--sample");
        if (interval < SimulationSettings.MIN_SAMPLE_INTERVAL_S) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--sample", 0, "'" + sample
                    + "' is finer than the finest history interval, " + SimulationSettings.MIN_SAMPLE_INTERVAL_S + " s");
        }
        CaseFile cf = CaseYamlReader.read(casePath);
        if (cf.bake().recipe() == null) {
            throw new InputException(ErrorKind.MISSING_KEY, casePath.toString(), "recipe", 0,
                    "the case has no recipe to simulate (use 'exhale plan' to make one)");
        }
        OutputFolder out = new OutputFolder(output != null ? output : defaultOutput(casePath), common.force).owns("history.csv", "summary.json", "report.html", "charts");
        out.checkWritable();
        SimulationSettings settings = SimulationSettings.defaults().withSampleInterval(interval);
        BakeResult r = BakeSimulator.simulate(cf.bake(), settings);
        List<String> warnings = new ArrayList<>(cf.warnings());
        double used = settings.historyIntervalS(cf.bake().recipe().durationS());
        if (used > interval) {
            warnings.add(String.format(java.util.Locale.ROOT, "history sampled every %.4g s instead of %s, to keep at most %d rows "
                    + "per corner; peaks, residue crossings and step ends are resolved all the same", used, sample.strip(),
                    SimulationSettings.MAX_HISTORY_ROWS));
        }
        out.put("history.csv", HistoryCsvWriter.write(r));
        out.put("summary.json", SummaryJsonWriter.toJson(SummaryJsonWriter.summary(r, warnings)));
        out.commit();
        if (!common.quiet) {
            System.out.print(TextSummary.of(r, warnings));
            System.out.println("Wrote " + out.dir().resolve("history.csv") + " and summary.json");
            System.out.println(Cautions.terminal(cf.bake().chamber() != null));
        }
        if (report) {
            ReportCommand.render(out.dir(), common.quiet);
        }
        return r.feasible() ? Main.OK : Main.VIOLATED;
    }

    static Path defaultOutput(Path casePath) {
        String n = casePath.getFileName().toString().replaceFirst("\\.(ya?ml)$", "");
        return Path.of("out", n);
    }

    static double parseTime(String text, String option) {
        try {
            double v = Quantities.parse(text, UnitKind.TIME, false);
            if (!(v > 0)) {
                throw new IllegalArgumentException("must be positive");
            }
            return v;
        } catch (IllegalArgumentException e) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", option, 0, e.getMessage());
        }
    }
}
