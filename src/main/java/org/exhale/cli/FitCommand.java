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
import org.exhale.fitting.Pretreatment;
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
            + "temperature. Before that, an early separate mass-loss step (moisture, solvent) is cut off, "
            + "a sloping end plateau (drift, buoyancy) is corrected, and optionally a thermal lag. "
            + "The number of components is chosen by an information criterion with an effective sample "
            + "size, and a new component must carry at least 3 %% of the mass and differ from the others. "
            + "Writes kinetics.yaml (a polymer components block for a case file), "
            + "isoconversional.csv, fit.csv and fit.json to the output folder."},
        footer = {"", "Exit codes: 0 success, 2 bad input (the message names file, row and column and what to do),",
            "3 no model fit could be made (isoconversional.csv and fit.json are still written)."})
public final class FitCommand implements Callable<Integer> {

    @Parameters(arity = "1..*", paramLabel = "RUN.csv", description = "TGA runs (CSV).")
    List<Path> runFiles;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR", defaultValue = "out/fit", description = "Output folder (default: ${DEFAULT-VALUE}).")
    Path output;

    @picocli.CommandLine.Mixin
    CommonOptions common = new CommonOptions();

    @Option(names = "--components", paramLabel = "1|2|3|auto", defaultValue = "auto",
            description = "Number of parallel components; auto tries 1, 2 and 3 and keeps what the data support (default: ${DEFAULT-VALUE}).")
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

    @Option(names = "--from", paramLabel = "T", description = "Use only samples at or above this sample temperature, e.g. '180 C'.")
    String from;

    @Option(names = "--to", paramLabel = "T", description = "Use only samples at or below this sample temperature, e.g. '450 C'.")
    String to;

    @Option(names = "--keep-early-step", description = "Keep an early separate mass-loss step (moisture, solvent) instead of cutting it off.")
    boolean keepEarlyStep;

    @Option(names = "--no-drift-correction", description = "Only warn about a sloping end plateau instead of subtracting its slope.")
    boolean noDriftCorrection;

    @Option(names = "--lag", paramLabel = "TIME", description = "Correct the recorded temperature for a first-order thermal lag of the sample, e.g. '10 s'.")
    String lag;

    @Option(names = "--temperature-column", paramLabel = "NAME",
            description = "Which column holds the sample temperature when a file has several (its header text or its number from 1).")
    String temperatureColumn;

    @Option(names = "--segment", paramLabel = "N",
            description = "Use only this segment (block or segment-column value) of files with several; default: every heating segment as a run.")
    String segment;

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

        double fromK = from == null ? Double.NaN : option("--from", from, UnitKind.TEMPERATURE, false);
        double toK = to == null ? Double.NaN : option("--to", to, UnitKind.TEMPERATURE, false);
        double lagS = lag == null ? 0 : option("--lag", lag, UnitKind.TIME, false);
        Pretreatment pre;
        try {
            pre = new Pretreatment(fromK, toK, keepEarlyStep, lagS, !noDriftCorrection);
        } catch (IllegalArgumentException e) {
            throw new InputException(ErrorKind.BAD_ARGUMENT, "command line", lag != null ? "--lag" : "--from/--to", 0,
                    e.getMessage());
        }

        TgaCsvReader reader = new TgaCsvReader().withTemperatureColumn(temperatureColumn).withSegment(segment);
        List<TgaRun> runs = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        Map<String, Map<String, String>> metadata = new LinkedHashMap<>();
        java.util.Map<Path, Path> seenFiles = new java.util.HashMap<>();
        Map<String, Path> fileOfRun = new java.util.HashMap<>();
        Map<Path, Integer> runsInFile = new java.util.HashMap<>();
        for (Path f : runFiles) {
            Path key = f.toAbsolutePath().normalize();
            try {
                key = f.toRealPath();
            } catch (java.io.IOException e) {
                // the reader says why the file cannot be read
            }
            if (seenFiles.putIfAbsent(key, f) != null) {
                throw new InputException(ErrorKind.BAD_ARGUMENT, f.toString(), "", 0,
                        "the same run file is given twice (as " + seenFiles.get(key) + " too); each run counts once");
            }
            TgaCsvReader.Result r = reader.read(f);
            for (TgaRun run : r.runs()) {
                if (java.util.Arrays.stream(run.mass()).allMatch(m -> m <= 0)) {
                    throw new InputException(ErrorKind.OUT_OF_RANGE, f.toString(), "run " + run.label(), 0,
                            "every mass is zero or negative; expected the sample's mass (tare the balance before the run)");
                }
                for (TgaRun other : runs) {
                    if (java.util.Arrays.equals(other.timeS(), run.timeS()) && java.util.Arrays.equals(other.temperatureK(), run.temperatureK())
                            && java.util.Arrays.equals(other.mass(), run.mass())) {
                        throw new InputException(ErrorKind.INCONSISTENT, f.toString(), "run " + run.label(), 0,
                                "holds the same data as run " + other.label() + "; each run counts once");
                    }
                }
                runs.add(run);
                fileOfRun.putIfAbsent(run.label(), f);
            }
            runsInFile.put(f, r.runs().size());
            notes.addAll(r.notes());
            metadata.putAll(r.metadata());
        }
        boolean quiet = common.quiet;
        ModelFitOptions fitOptions = new ModelFitOptions(k, kind, maxPoints, 1e-4, analysis.confidence(), 300);
        KineticsReport report;
        try {
            report = KineticsAnalysis.run(runs, analysis, pre, fitOptions, auto, stage -> {
                if (!quiet) {
                    err.printf(Locale.ROOT, "[%5.1f s] %s%n", (System.nanoTime() - started) / 1e9, stage);
                    err.flush();
                }
            });
        } catch (IllegalArgumentException e) {
            throw dataError(e.getMessage(), fileOfRun, runsInFile);
        }
        if (!quiet) {
            // after the analysis, so that a data error stays one line
            for (String n : notes) {
                err.println(n);
            }
        }
        ModelFitResult chosen = report.chosen();
        List<String> extraWarnings = new ArrayList<>();
        if (chosen != null) {
            for (FittedComponent c : chosen.components()) {
                // The case-file records validate themselves; a fit outside their ranges is not written.
                try {
                    new Component(c.name(), c.fraction(), c.model(), c.preExponentialPerS(), c.energyJPerMol(), 0,
                            new Product(molarMassKg, diameterM, 1e-5));
                } catch (IllegalArgumentException e) {
                    extraWarnings.add("kinetics.yaml not written: component " + c.name()
                            + " is outside the case-file ranges (" + e.getMessage() + ")");
                    chosen = null;
                    break;
                }
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

        Map<String, Object> settings = new LinkedHashMap<>();
        settings.put("files", runFiles.stream().map(Path::toString).toList());
        settings.put("alpha_range", List.of(analysis.alphaMin(), analysis.alphaMax()));
        settings.put("alpha_step", analysis.alphaStep());
        settings.put("residue", Double.isNaN(residueFraction) ? "final plateau" : residueFraction);
        settings.put("model", kind.id());
        settings.put("components", components);
        settings.put("component_criterion", "BIC with effective sample size N_eff (lag-1 residual autocorrelation) "
                + "plus: fraction >= 3 %, components distinct, rms gain >= 10 % and 2e-4");
        settings.put("max_points_per_run", maxPoints);
        settings.put("seed_conversion", fitOptions.seedConversion());
        settings.put("confidence", analysis.confidence());
        settings.put("from_K", Double.isNaN(fromK) ? null : fromK);
        settings.put("to_K", Double.isNaN(toK) ? null : toK);
        settings.put("keep_early_step", keepEarlyStep);
        settings.put("drift_correction", !noDriftCorrection);
        settings.put("lag_s", lagS);
        List<String> allWarnings = new ArrayList<>(report.warnings());
        allWarnings.addAll(sameRateWarnings(report.curves(), fileOfRun));
        allWarnings.addAll(extraWarnings);
        if (chosen == null) {
            folder.put("isoconversional.csv", IsoconversionalCsvWriter.format(report.isoconversional()));
            folder.put("fit.json", FitJsonWriter.format(report, settings, notes, allWarnings, metadata));
            folder.commit();
            if (!quiet) {
                summary(out, report);
            }
            for (String w : allWarnings) {
                err.println("warning: " + w);
            }
            err.printf(Locale.ROOT, "wrote isoconversional.csv, fit.json to %s; no kinetics.yaml (no usable model fit)%n",
                    output);
            return Main.VIOLATED;
        }
        List<String> header = new ArrayList<>();
        header.add("Kinetics fitted by 'exhale fit' from " + runs.size() + " run(s) at " + rates(report) + " K/min.");
        header.add(chosen.components().size() + " component(s), " + kind.id() + (auto ? ", chosen among 1-3 by BIC with an effective sample size" : "")
                + String.format(Locale.ROOT, "; rms residual of alpha %.2e.", chosen.rms()));
        header.add("Intervals and the isoconversional check are in fit.json and isoconversional.csv.");

        // all four files at once, never half-written, an existing non-empty folder only with --force
        folder.put("kinetics.yaml", KineticsYamlWriter.format(chosen, charFraction, charOrigin,
                molarMassKg * 1e3, diameterM * 1e9, header));
        folder.put("isoconversional.csv", IsoconversionalCsvWriter.format(report.isoconversional()));
        folder.put("fit.csv", FitCsvWriter.format(chosen));
        folder.put("fit.json", FitJsonWriter.format(report, settings, notes, allWarnings, metadata));
        folder.commit();

        if (quiet) {
            return 0;
        }
        summary(out, report);
        for (String w : allWarnings) {
            err.println("warning: " + w);
        }
        err.printf(Locale.ROOT, "wrote kinetics.yaml, isoconversional.csv, fit.csv, fit.json to %s (%.2f s)%n",
                output, (System.nanoTime() - started) / 1e9);
        return 0;
    }

    private static void summary(PrintWriter out, KineticsReport report) {
        out.println("Runs:");
        for (ConversionCurve c : report.curves()) {
            out.printf(Locale.ROOT, "  %-24s %8.3f K/min   peak %s   final/initial mass %s%n", c.label(),
                    c.heatingRateKPerMin(), org.exhale.report.Readable.celsius(c.peakTemperatureK()),
                    org.exhale.report.Readable.fixed(c.finalMass() / c.initialMass(), 4));
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
                    out.printf(Locale.ROOT, " %8.1f ± %-7s", r.energyAt(a) / 1e3, orNa(r.halfWidthAt(a) / 1e3, "%.1f"));
                }
                out.println();
            }
        }
        if (report.kissinger() != null) {
            out.printf(Locale.ROOT, "Kissinger: Ea %.1f ± %s kJ/mol, A %.3e 1/s%s%n", report.kissinger().energyJPerMol() / 1e3,
                    orNa(report.kissinger().energyHalfWidthJPerMol() / 1e3, "%.1f"), report.kissinger().preExponentialPerS(),
                    report.kissinger().flagged() ? String.format(Locale.ROOT, "   FLAGGED: E(alpha) varies by %.0f %%, not one step",
                            100 * report.kissinger().energySpread()) : "");
        }
        out.printf(Locale.ROOT, "Model fits (criterion: BIC with effective sample size N_eff %.0f, see docs/model.md):%n",
                report.effectivePoints());
        int chosenK = report.chosen() == null ? 0 : report.chosen().components().size();
        for (ModelFitResult f : report.fits()) {
            int k = f.components().size();
            out.printf(Locale.ROOT, "  %d component(s): rms %.2e  %s%s%n", k, f.rms(),
                    report.verdicts().getOrDefault(k, ""), k == chosenK ? "   <- chosen" : "");
        }
        for (Map.Entry<String, String> f : report.failures().entrySet()) {
            out.printf(Locale.ROOT, "  %s: failed, %s%n", f.getKey(), f.getValue());
        }
        if (report.families().size() > 1) {
            out.print("Model families with " + chosenK + " component(s), rms:");
            for (var ff : report.families()) {
                out.printf(Locale.ROOT, "  %s %s", ff.family().id(), ff.failure() == null ? String.format(Locale.ROOT, "%.2e", ff.rms()) : "failed");
            }
            out.println();
        }
        if (report.chosen() == null) {
            return;
        }
        for (FittedComponent c : report.chosen().components()) {
            out.printf(Locale.ROOT, "  %s: fraction %.3f %s  Ea %.2f %s kJ/mol  A %.3e 1/s (ln A ± %.2f)  %s %s%n",
                    c.name(), c.fraction(), pm(c.fractionHalfWidth(), 1, "%.3f"), c.energyJPerMol() / 1e3,
                    pm(c.energyHalfWidthJPerMol(), 1e3, "%.2f"), c.preExponentialPerS(), c.lnPreExponentialHalfWidth(),
                    c.model().id(), shape(c));
        }
        out.println("  intervals: " + report.intervalMethod());
    }

    /** Measured heating rates closer than this share count as the same rate. */
    static final double SAME_RATE_SHARE = 0.02;

    /**
     * One line per pair of runs from different files measured at the same heating rate (their data
     * differ: identical data are refused when the files are read). They count as separate runs, which
     * is right for repeats, but often means a file was exported twice or carries the wrong rate.
     */
    private static List<String> sameRateWarnings(List<ConversionCurve> curves, Map<String, Path> fileOfRun) {
        List<String> w = new ArrayList<>();
        for (int i = 0; i < curves.size(); i++) {
            for (int j = i + 1; j < curves.size(); j++) {
                ConversionCurve a = curves.get(i), b = curves.get(j);
                Path fa = fileOfRun.get(a.label()), fb = fileOfRun.get(b.label());
                double ra = a.heatingRateKPerMin(), rb = b.heatingRateKPerMin();
                if (fa != null && fb != null && !fa.equals(fb)
                        && Math.abs(ra - rb) <= SAME_RATE_SHARE * Math.max(ra, rb)) {
                    w.add(String.format(Locale.ROOT, "%s and %s are both heated at %.3g K/min but hold different "
                            + "data: they count as two runs at one rate; if one is not a deliberate repeat, check "
                            + "that it is the right file", fa, fb, (ra + rb) / 2));
                }
            }
        }
        return w;
    }

    /**
     * A data error from the analysis, on one line naming the file the run came from: the analysis
     * says "run LABEL: what", and the label leads back to the file (and names the run only where
     * the file holds several).
     */
    private InputException dataError(String message, Map<String, Path> fileOfRun, Map<Path, Integer> runsInFile) {
        String msg = String.valueOf(message);
        if (msg.startsWith("run ")) {
            for (Map.Entry<String, Path> e : fileOfRun.entrySet()) {
                String prefix = "run " + e.getKey() + ": ";
                if (msg.startsWith(prefix)) {
                    boolean several = runsInFile.getOrDefault(e.getValue(), 1) > 1;
                    return new InputException(ErrorKind.INCONSISTENT, e.getValue().toString(),
                            several ? "run " + e.getKey() : "", 0, msg.substring(prefix.length()));
                }
            }
        }
        return new InputException(ErrorKind.INCONSISTENT, runFiles.size() == 1 ? runFiles.get(0).toString()
                : "the runs (" + runFiles.size() + " files)", "", 0, msg);
    }

    /** A half-width, or "n/a" where too few runs leave no degrees of freedom to compute it (never "NaN"). */
    private static String orNa(double hw, String fmt) {
        return Double.isFinite(hw) ? String.format(Locale.ROOT, fmt, hw) : "n/a";
    }

    private static String pm(double hw, double scale, String fmt) {
        return Double.isFinite(hw) ? "± " + String.format(Locale.ROOT, fmt, hw / scale) : "(at a bound)";
    }

    private static String shape(FittedComponent c) {
        double[] s = c.shape();
        double[] hw = c.shapeHalfWidth();
        String[] names = s.length == 2 ? new String[] {"m", "n"} : new String[] {"n"};
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < s.length; i++) {
            sb.append(i > 0 ? " " : "").append(names[i]).append(' ').append(String.format(Locale.ROOT, "%.3f", s[i]))
                    .append(c.atBound().contains(names[i]) ? " (at bound)" : String.format(Locale.ROOT, " ± %.3f", hw[i]));
        }
        return sb.toString();
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
