package org.exhale.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.exhale.fitting.AnalysisOptions;
import org.exhale.fitting.ConversionCurve;
import org.exhale.fitting.FittedComponent;
import org.exhale.fitting.IsoconversionalResult;
import org.exhale.fitting.KineticsAnalysis;
import org.exhale.fitting.KineticsReport;
import org.exhale.fitting.ModelFitOptions;
import org.exhale.fitting.ModelFitResult;
import org.exhale.fitting.ModelKind;
import org.exhale.fitting.TgaRun;
import org.exhale.io.ErrorKind;
import org.exhale.io.FitCsvWriter;
import org.exhale.io.FitJsonWriter;
import org.exhale.io.InputException;
import org.exhale.io.IsoconversionalCsvWriter;
import org.exhale.io.KineticsYamlWriter;
import org.exhale.io.Quantities;
import org.exhale.io.TgaCsvReader;
import org.exhale.io.UnitKind;
import org.exhale.kinetics.Component;
import org.exhale.kinetics.Product;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code exhale fit}: decomposition kinetics from thermogravimetric runs at several heating rates. */
@Command(name = "fit", mixinStandardHelpOptions = true,
        header = "Fit decomposition kinetics to thermogravimetric runs at several heating rates.",
        description = {
            "Reads TGA runs (CSV: time, sample temperature, mass; one file per run or a 'run' column), "
            + "converts mass to conversion, measures each run's real heating rate, computes E(alpha) by "
            + "Friedman, KAS, Ozawa-Flynn-Wall, Starink and Vyazovkin with confidence intervals, Kissinger's "
            + "peak E and A, and fits 1 to 3 parallel components to all runs at once along their measured "
            + "temperature. Writes kinetics.yaml (a polymer components block for a case file), "
            + "isoconversional.csv, fit.csv and fit.json to the output folder."},
        footer = {"", "Exit codes: 0 success, 2 bad input (the message names file, row and column)."})
public final class FitCommand implements Callable<Integer> {

    @Parameters(arity = "1..*", paramLabel = "RUN.csv", description = "TGA runs (CSV).")
    List<Path> runFiles;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR", defaultValue = "out/fit", description = "Output folder (default: ${DEFAULT-VALUE}).")
    Path output;

    @picocli.CommandLine.Mixin
    CommonOptions common = new CommonOptions();

    @Option(names = "--components", paramLabel = "1|2|3|auto", defaultValue = "auto",
            description = "Number of parallel components; auto tries 1, 2 and 3 and keeps the lowest BIC (default: ${DEFAULT-VALUE}).")
    String components;

    @Option(names = "--model", paramLabel = "NAME", defaultValue = "nth-order",
            description = "Reaction model of every component: nth-order, sestak-berggren, avrami-erofeev, random-scission (default: ${DEFAULT-VALUE}).")
    String model;

    @Option(names = "--range", paramLabel = "MIN:MAX", defaultValue = "0.05:0.95",
            description = "Conversion range analysed (default: ${DEFAULT-VALUE}).")
    String range;

    @Option(names = "--residue", paramLabel = "FRACTION",
            description = "Final mass as a share of the initial mass, e.g. '2 %%'; default: each run's final plateau.")
    String residue;

    @Option(names = "--molar-mass", paramLabel = "M", defaultValue = "100 g/mol",
            description = "Product molar mass written to kinetics.yaml, not fitted (default: ${DEFAULT-VALUE}).")
    String molarMass;

    @Option(names = "--diameter", paramLabel = "D", defaultValue = "0.6 nm",
            description = "Product kinetic diameter written to kinetics.yaml, not fitted (default: ${DEFAULT-VALUE}).")
    String diameter;

    @Option(names = "--max-points", paramLabel = "N", defaultValue = "600",
            description = "Samples per run used by the model fit (evenly spaced; default: ${DEFAULT-VALUE}).")
    int maxPoints;

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        long started = System.nanoTime();
        org.exhale.io.OutputFolder folder = new org.exhale.io.OutputFolder(output, common.force)
                .owns("report.html", "charts");
        folder.checkWritable();

        double[] alphaRange = parseRange(range);
        double residueFraction = residue == null ? Double.NaN : option("--residue", residue, UnitKind.FRACTION, true);
        double molarMassKg = option("--molar-mass", molarMass, UnitKind.MOLAR_MASS, false);
        double diameterM = option("--diameter", diameter, UnitKind.LENGTH, false);
        try {
            new Product(molarMassKg, diameterM, 1e-5);
        } catch (IllegalArgumentException e) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--molar-mass/--diameter", 0, e.getMessage());
        }
        ModelKind kind;
        try {
            kind = ModelKind.byId(model);
        } catch (IllegalArgumentException e) {
            throw new InputException(ErrorKind.UNKNOWN_NAME, "command line", "--model", 0, e.getMessage());
        }
        boolean auto = components.equalsIgnoreCase("auto");
        int k = 1;
        if (!auto) {
            if (!components.matches("[123]")) {
                throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--components", 0,
                        "'" + components + "' is not allowed; expected 1, 2, 3 or auto");
            }
            k = Integer.parseInt(components);
        }
        if (maxPoints < 50 || maxPoints > 100_000) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--max-points", 0,
                    maxPoints + " is not allowed; expected 50 to 100000");
        }
        AnalysisOptions analysis;
        try {
            analysis = AnalysisOptions.DEFAULT.withRange(alphaRange[0], alphaRange[1]).withResidue(residueFraction);
        } catch (IllegalArgumentException e) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", residue == null ? "--range" : "--range/--residue", 0, e.getMessage());
        }

        TgaCsvReader reader = new TgaCsvReader();
        List<TgaRun> runs = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        for (Path f : runFiles) {
            TgaCsvReader.Result r = reader.read(f);
            runs.addAll(r.runs());
            notes.addAll(r.notes());
        }
        for (String n : notes) {
            err.println(n);
        }
        ModelFitOptions fitOptions = new ModelFitOptions(k, kind, maxPoints, 1e-4, analysis.confidence(), 300);
        KineticsReport report;
        try {
            report = KineticsAnalysis.run(runs, analysis, fitOptions, auto);
        } catch (IllegalArgumentException e) {
            throw new InputException(ErrorKind.INCONSISTENT, runFiles.size() == 1 ? runFiles.get(0).toString() : "runs",
                    "", 0, e.getMessage());
        }
        ModelFitResult chosen = report.chosen();
        if (chosen == null) {
            throw new InputException(ErrorKind.INCONSISTENT, "runs", "model fit", 0,
                    "no model fit converged: " + report.failures());
        }
        for (FittedComponent c : chosen.components()) {
            // The case-file records validate themselves; a fit outside their ranges is not written.
            try {
                new Component(c.name(), c.fraction(), c.model(), c.preExponentialPerS(), c.energyJPerMol(), 0,
                        new Product(molarMassKg, diameterM, 1e-5));
            } catch (IllegalArgumentException e) {
                throw new InputException(ErrorKind.OUT_OF_RANGE, "runs", "model fit " + c.name(), 0,
                        "fitted component is outside the case-file ranges: " + e.getMessage());
            }
        }

        double charFraction;
        String charOrigin;
        if (!Double.isNaN(residueFraction)) {
            charFraction = residueFraction;
            charOrigin = "the stated residue (--residue), same for every component";
        } else {
            double s = 0;
            for (ConversionCurve c : report.curves()) {
                s += c.finalMass() / c.initialMass();
            }
            charFraction = Math.max(0, Math.min(0.99, s / report.curves().size()));
            if (charFraction < 5e-4) {
                charFraction = 0;
            }
            charOrigin = "mean final-plateau mass over the runs, same for every component";
        }

        List<String> header = new ArrayList<>();
        header.add("Kinetics fitted by 'exhale fit' from " + runs.size() + " run(s) at " + rates(report) + " K/min.");
        header.add(chosen.components().size() + " component(s), " + kind.id() + (auto ? ", chosen by the lowest BIC of 1-3" : "")
                + String.format(Locale.ROOT, "; rms residual of alpha %.2e.", chosen.rms()));
        header.add("Intervals and the isoconversional check are in fit.json and isoconversional.csv.");

        Map<String, Object> settings = new LinkedHashMap<>();
        settings.put("files", runFiles.stream().map(Path::toString).toList());
        settings.put("alpha_range", List.of(analysis.alphaMin(), analysis.alphaMax()));
        settings.put("alpha_step", analysis.alphaStep());
        settings.put("residue", Double.isNaN(residueFraction) ? "final plateau" : residueFraction);
        settings.put("model", kind.id());
        settings.put("components", components);
        settings.put("max_points_per_run", maxPoints);
        settings.put("seed_conversion", fitOptions.seedConversion());
        settings.put("confidence", analysis.confidence());

        // all four files at once, never half-written, an existing non-empty folder only with --force
        folder.put("kinetics.yaml", KineticsYamlWriter.format(chosen, charFraction, charOrigin,
                molarMassKg * 1e3, diameterM * 1e9, header));
        folder.put("isoconversional.csv", IsoconversionalCsvWriter.format(report.isoconversional()));
        folder.put("fit.csv", FitCsvWriter.format(chosen));
        folder.put("fit.json", FitJsonWriter.format(report, settings, notes));
        folder.commit();

        summary(out, report);
        for (String w : report.warnings()) {
            err.println("warning: " + w);
        }
        err.printf(Locale.ROOT, "wrote kinetics.yaml, isoconversional.csv, fit.csv, fit.json to %s (%.2f s)%n",
                output, (System.nanoTime() - started) / 1e9);
        return 0;
    }

    private static void summary(PrintWriter out, KineticsReport report) {
        out.println("Runs:");
        for (ConversionCurve c : report.curves()) {
            out.printf(Locale.ROOT, "  %-24s %8.3f K/min   peak %.2f K   final/initial mass %.4f%n", c.label(),
                    c.heatingRateKPerMin(), c.peakTemperatureK(), c.finalMass() / c.initialMass());
        }
        if (!report.isoconversional().isEmpty()) {
            out.println("Activation energy E(alpha) [kJ/mol], 95 % half-width:");
            out.print("  alpha ");
            for (IsoconversionalResult r : report.isoconversional()) {
                out.printf(Locale.ROOT, " %18s", r.method().id());
            }
            out.println();
            for (double a : new double[] {0.1, 0.3, 0.5, 0.7, 0.9}) {
                out.printf(Locale.ROOT, "  %5.2f ", a);
                for (IsoconversionalResult r : report.isoconversional()) {
                    out.printf(Locale.ROOT, " %8.1f ± %-7.1f", r.energyAt(a) / 1e3, r.halfWidthAt(a) / 1e3);
                }
                out.println();
            }
        }
        if (report.kissinger() != null) {
            out.printf(Locale.ROOT, "Kissinger: Ea %.1f ± %.1f kJ/mol, A %.3e 1/s%n", report.kissinger().energyJPerMol() / 1e3,
                    report.kissinger().energyHalfWidthJPerMol() / 1e3, report.kissinger().preExponentialPerS());
        }
        out.println("Model fits (criterion: lowest BIC):");
        for (ModelFitResult f : report.fits()) {
            out.printf(Locale.ROOT, "  %d component(s): rms %.2e  AIC %.1f  BIC %.1f%s%n", f.components().size(), f.rms(),
                    f.aic(), f.bic(), f == report.chosen() ? "   <- chosen" : "");
        }
        for (FittedComponent c : report.chosen().components()) {
            out.printf(Locale.ROOT, "  %s: fraction %.3f ± %.3f  Ea %.2f ± %.2f kJ/mol  A %.3e 1/s (ln A ± %.2f)  %s %s%n",
                    c.name(), c.fraction(), c.fractionHalfWidth(), c.energyJPerMol() / 1e3, c.energyHalfWidthJPerMol() / 1e3,
                    c.preExponentialPerS(), c.lnPreExponentialHalfWidth(), c.model().id(), shape(c));
        }
    }

    private static String shape(FittedComponent c) {
        double[] s = c.shape();
        return switch (s.length) {
            case 1 -> String.format(Locale.ROOT, "n %.3f", s[0]);
            case 2 -> String.format(Locale.ROOT, "m %.3f n %.3f", s[0], s[1]);
            default -> "";
        };
    }

    private static String rates(KineticsReport report) {
        List<String> r = new ArrayList<>();
        for (ConversionCurve c : report.curves()) {
            r.add(String.format(Locale.ROOT, "%.3g", c.heatingRateKPerMin()));
        }
        return String.join(", ", r);
    }

    private static double[] parseRange(String text) {
        String[] p = text.split(":");
        if (p.length != 2) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--range", 0,
                    "'" + text + "' is not a range; expected MIN:MAX such as 0.05:0.95");
        }
        try {
            return new double[] {Quantities.parseNumber(p[0].trim()), Quantities.parseNumber(p[1].trim())};
        } catch (IllegalArgumentException e) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", "--range", 0,
                    "'" + text + "': " + e.getMessage() + "; expected MIN:MAX such as 0.05:0.95");
        }
    }

    private static double option(String name, String text, UnitKind kind, boolean allowBare) {
        try {
            return Quantities.parse(text, kind, allowBare);
        } catch (IllegalArgumentException e) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", name, 0, e.getMessage());
        }
    }
}
