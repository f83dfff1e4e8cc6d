package org.exhale.fitting;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Consumer;
import org.hipparchus.exception.MathRuntimeException;

/**
 * The whole kinetics-from-thermogravimetry analysis: pre-treatment, conversion, the five
 * isoconversional methods, Kissinger, the model fit with 1 to 3 components, the choice of the
 * component count ({@link ComponentChoice}), a comparison of the model families at that count, a
 * jackknife over the runs for the intervals, and the advice. Pure computation; a method or a
 * candidate that fails is named in {@link KineticsReport#failures()} and never discards the others.
 */
public final class KineticsAnalysis {
    /** A family that fits with an rms this many times smaller than the chosen one is pointed out. */
    public static final double FAMILY_RMS_RATIO = 1.5;
    /**
     * Samples per run of the auxiliary fits (family comparison, jackknife): they compare rms values
     * and spreads, for which 250 samples across a run are plenty, at a fraction of the cost.
     */
    public static final int AUXILIARY_POINTS = 250;
    /** Iteration limit of a candidate with one more component in automatic mode. */
    public static final int EXTRA_COMPONENT_ITERATIONS = 100;

    private KineticsAnalysis() {
    }

    /**
     * @param runs        measured runs
     * @param analysis    pre-processing settings
     * @param fit         model-fit settings; its component count is used unless {@code auto}
     * @param auto        try 1, 2 and 3 components and choose by {@link ComponentChoice}
     */
    public static KineticsReport run(List<TgaRun> runs, AnalysisOptions analysis, ModelFitOptions fit, boolean auto) {
        return run(runs, analysis, Pretreatment.DEFAULT, fit, auto, m -> { });
    }

    /**
     * @param progress receives one line per stage (for a progress display); never null
     */
    public static KineticsReport run(List<TgaRun> runs, AnalysisOptions analysis, Pretreatment pre,
                                     ModelFitOptions fit, boolean auto, Consumer<String> progress) {
        List<String> warnings = new ArrayList<>();
        List<ConversionCurve> curves = new ArrayList<>();
        for (TgaRun r : runs) {
            Pretreatment.Prepared p = pre.apply(r);
            warnings.addAll(p.warnings());
            curves.add(Conversion.of(p.run(), analysis));
        }
        Map<String, String> failures = new LinkedHashMap<>();
        List<IsoconversionalResult> iso = new ArrayList<>();
        KissingerResult kissinger = null;
        IsoconversionalResult friedman = null;
        IsoconversionalResult vyazovkin = null;
        if (curves.size() >= 2) {
            for (IsoconversionalMethod m : IsoconversionalMethod.values()) {
                progress.accept("isoconversional: " + m.id());
                try {
                    IsoconversionalResult r = Isoconversional.compute(m, curves, analysis.confidence());
                    iso.add(r);
                    if (m == IsoconversionalMethod.FRIEDMAN) {
                        friedman = r;
                    } else if (m == IsoconversionalMethod.VYAZOVKIN) {
                        vyazovkin = r;
                    }
                } catch (RuntimeException e) {
                    failures.put(m.id(), plain(e));
                }
            }
            iso = Isoconversional.withApproximationBias(iso, curves);
            try {
                kissinger = Kissinger.compute(curves, analysis.confidence(), vyazovkin != null ? vyazovkin : friedman);
            } catch (RuntimeException e) {
                failures.put("kissinger", plain(e));
            }
        }
        IsoconversionalResult seed = friedman != null ? friedman : vyazovkin;
        if (seed == null) {
            // One run: no isoconversional E; start the fit from a typical value.
            double[] g = analysis.grid();
            double[] e = new double[g.length];
            java.util.Arrays.fill(e, 150e3);
            seed = new IsoconversionalResult(IsoconversionalMethod.FRIEDMAN, g, e, new double[g.length],
                    analysis.confidence());
        }
        double beta = medianRate(curves);
        List<ModelFitResult> fits = new ArrayList<>();
        int[] counts = auto ? new int[] {1, 2, 3} : new int[] {fit.components()};
        for (int k : counts) {
            // An extra component the data support settles in tens of iterations (6 to 20 measured on
            // the synthetic mixtures); one that does not wanders for hundreds while a fraction dies away.
            ModelFitOptions o = auto && k > 1 ? fit.withComponents(k).withMaxIterations(
                    Math.min(fit.maxIterations(), EXTRA_COMPONENT_ITERATIONS)) : fit.withComponents(k);
            ModelFitResult f = attempt(curves, o, seed, failures, progress);
            if (f != null) {
                fits.add(f);
            }
            if (auto && k > 1) {
                // One more component is tried only when this one was accepted.
                ModelFitResult sofar = ComponentChoice.choose(fits, beta).chosen();
                if (sofar == null || sofar.components().size() < k) {
                    break;
                }
            }
        }
        ComponentChoice choice = ComponentChoice.choose(fits, beta);
        ModelFitResult chosen = choice.chosen();
        Map<Integer, String> verdicts = new LinkedHashMap<>(choice.verdicts());
        if (auto && chosen != null) {
            // An extra component whose fit does not settle is simply not supported by the data.
            for (int k = chosen.components().size() + 1; k <= 3; k++) {
                String name = k + " components (" + fit.model().id() + ")";
                String why = failures.remove(name);
                if (why != null) {
                    verdicts.put(k, "turned down: " + why);
                }
            }
        }
        if (!auto) {
            // A fixed count is honoured, but no component under 1 % is written.
            int k = fit.components();
            ModelFitResult f = fits.isEmpty() ? null : fits.get(0);
            while (f != null && f.smallestFraction() < ComponentChoice.MIN_WRITTEN_FRACTION && k > 1) {
                warnings.add(String.format(Locale.ROOT, "the %d-component fit gives a component only %.2f %% of the mass; "
                        + "fitted again with %d", k, 100 * f.smallestFraction(), k - 1));
                k--;
                f = attempt(curves, fit.withComponents(k), seed, failures, progress);
                if (f != null) {
                    fits.add(f);
                }
            }
            chosen = f;
            String alike = f == null ? null : ComponentChoice.alike(f, beta);
            if (alike != null) {
                warnings.add("with " + f.components().size() + " components as asked, " + alike
                        + "; the data support fewer (try --components auto)");
            }
        }
        List<KineticsReport.FamilyFit> families = new ArrayList<>();
        String intervalMethod = "none";
        if (chosen != null) {
            int k = chosen.components().size();
            families.add(new KineticsReport.FamilyFit(fit.model(), chosen.rms(), null, boundShapes(chosen)));
            for (ModelKind other : ModelKind.values()) {
                if (other == fit.model()) {
                    continue;
                }
                ModelFitOptions o = new ModelFitOptions(k, other, Math.min(fit.maxPointsPerRun(), AUXILIARY_POINTS),
                        fit.seedConversion(), fit.confidence(), fit.maxIterations());
                progress.accept("model family check: " + k + " component(s), " + other.id());
                try {
                    ModelFitResult r = ModelFit.fit(curves, o, seed);
                    families.add(new KineticsReport.FamilyFit(other, r.rms(), null, boundShapes(r)));
                } catch (RuntimeException e) {
                    families.add(new KineticsReport.FamilyFit(other, Double.NaN, plain(e), List.of()));
                }
            }
            for (KineticsReport.FamilyFit ff : families) {
                if (ff.family() != fit.model() && ff.rms() * FAMILY_RMS_RATIO < chosen.rms()) {
                    warnings.add(String.format(Locale.ROOT, "the %s family fits much better (rms %.2e against %.2e for %s "
                            + "with %d component(s)); try --model %s", ff.family().id(), ff.rms(), chosen.rms(),
                            fit.model().id(), k, ff.family().id()));
                }
            }
            List<String> bound = boundShapes(chosen);
            for (FittedComponent c : chosen.components()) {
                for (String b : c.atBound()) {
                    warnings.add(String.format(Locale.ROOT, "%s: %s ended at the bound of its allowed range (%s); it has "
                            + "no interval%s", c.name(), b, value(c, b), b.equals("n") && fit.model() != ModelKind.AVRAMI_EROFEEV
                            && c.shape()[c.shape().length - 1] < 0.1 ? "; a reaction order near zero is a sign of the wrong "
                            + "model family or of an artefact in the data" : ""));
                }
            }
            intervalMethod = String.format(Locale.ROOT, "least squares with effective sample size (N %d, N_eff %.0f, "
                    + "residual lag-1 correlation %.3f)", chosen.points(), chosen.effectivePoints(), chosen.lag1Correlation());
            if (curves.size() >= 3) {
                progress.accept("jackknife over the runs (" + curves.size() + " refits)");
                ModelFitResult widened = jackknife(curves, chosen, seed, beta);
                if (widened != null) {
                    chosen = widened;
                    intervalMethod += "; widened where a jackknife over the runs (leave one run out) gives more";
                } else {
                    warnings.add("the jackknife over the runs failed for a left-out run; intervals are from the least "
                            + "squares only");
                }
            }
            if (bound.isEmpty() && chosen.lag1Correlation() > 0.9 && chosen.rms() > ComponentChoice.MIN_RMS_GAIN_ABSOLUTE) {
                warnings.add(String.format(Locale.ROOT, "the model-fit residuals are strongly correlated (lag-1 %.2f): "
                        + "the model misses a systematic feature of the data; intervals are widened accordingly",
                        chosen.lag1Correlation()));
            }
        } else {
            warnings.add("no model fit could be made; the isoconversional results are still written");
        }
        warnings.addAll(0, Advice.warnings(curves, vyazovkin != null ? vyazovkin : friedman, kissinger));
        for (Map.Entry<String, String> f : failures.entrySet()) {
            warnings.add(f.getKey() + " failed: " + f.getValue());
        }
        if (curves.size() < 2) {
            warnings.add("one run only: no isoconversional or Kissinger analysis; the model fit is poorly determined");
        }
        return new KineticsReport(curves, iso, kissinger, fits, chosen, failures, warnings, verdicts,
                choice.effectivePoints(), families, intervalMethod);
    }

    private static String value(FittedComponent c, String name) {
        String[] names = switch (c.model().id()) {
            case "sestak-berggren" -> new String[] {"m", "n"};
            case "nth-order", "avrami-erofeev" -> new String[] {"n"};
            default -> new String[0];
        };
        for (int i = 0; i < names.length; i++) {
            if (names[i].equals(name)) {
                return name + " = " + String.format(Locale.ROOT, "%.3g", c.shape()[i]);
            }
        }
        return switch (name) {
            case "Ea" -> String.format(Locale.ROOT, "Ea = %.0f kJ/mol", c.energyJPerMol() / 1e3);
            case "fraction" -> String.format(Locale.ROOT, "fraction = %.2g", c.fraction());
            default -> name;
        };
    }

    private static List<String> boundShapes(ModelFitResult f) {
        List<String> out = new ArrayList<>();
        for (FittedComponent c : f.components()) {
            for (String b : c.atBound()) {
                out.add(c.name() + "." + b);
            }
        }
        return out;
    }

    private static ModelFitResult attempt(List<ConversionCurve> curves, ModelFitOptions o, IsoconversionalResult seed,
                                          Map<String, String> failures, Consumer<String> progress) {
        String name = o.components() + " component" + (o.components() > 1 ? "s" : "") + " (" + o.model().id() + ")";
        progress.accept("model fit: " + name);
        try {
            return ModelFit.fit(curves, o, seed);
        } catch (RuntimeException e) {
            failures.put(name, plain(e));
            return null;
        }
    }

    /**
     * Leave-one-run-out jackknife of E, ln A and the fractions (Quenouille–Tukey; common practice,
     * no source): half-width = t(m−1) · sqrt((m−1)/m Σ (θ₍ᵢ₎ − θ̄)²). Components are matched by
     * their characteristic temperature. Returns the chosen fit with each half-width widened to the
     * jackknife's where that is larger, or null when a refit fails.
     */
    static ModelFitResult jackknife(List<ConversionCurve> curves, ModelFitResult chosen, IsoconversionalResult seed,
                                    double beta) {
        int m = curves.size();
        int k = chosen.components().size();
        double[][] e = new double[k][m], lnA = new double[k][m], w = new double[k][m];
        for (int i = 0; i < m; i++) {
            List<ConversionCurve> rest = new ArrayList<>(curves);
            rest.remove(i);
            ModelFitResult r;
            try {
                ModelFitOptions o = chosen.options();
                r = ModelFit.fit(rest, new ModelFitOptions(o.components(), o.model(),
                        Math.min(o.maxPointsPerRun(), AUXILIARY_POINTS), o.seedConversion(), o.confidence(),
                        o.maxIterations()), seed);
            } catch (RuntimeException ex) {
                return null;
            }
            List<FittedComponent> cs = new ArrayList<>(r.components());
            cs.sort(Comparator.comparingDouble(c -> ComponentChoice.characteristicTemperatureK(c, beta)));
            for (int j = 0; j < k; j++) {
                e[j][i] = cs.get(j).energyJPerMol();
                lnA[j][i] = cs.get(j).lnPreExponential();
                w[j][i] = cs.get(j).fraction();
            }
        }
        double t = LinearRegression.studentT(chosen.options().confidence(), m - 1);
        List<FittedComponent> own = new ArrayList<>(chosen.components());
        own.sort(Comparator.comparingDouble(c -> ComponentChoice.characteristicTemperatureK(c, beta)));
        List<FittedComponent> out = new ArrayList<>();
        for (int j = 0; j < k; j++) {
            out.add(own.get(j).widened(t * jackSd(e[j]), t * jackSd(lnA[j]), k > 1 ? t * jackSd(w[j]) : 0));
        }
        out.sort(Comparator.comparingDouble(FittedComponent::referenceTemperatureK));
        List<FittedComponent> ordered = new ArrayList<>();
        for (FittedComponent c : chosen.components()) {
            for (FittedComponent x : out) {
                if (x.name().equals(c.name())) {
                    ordered.add(x);
                }
            }
        }
        return chosen.withComponents(ordered);
    }

    private static double jackSd(double[] v) {
        int m = v.length;
        double mean = 0;
        for (double x : v) {
            mean += x / m;
        }
        double s = 0;
        for (double x : v) {
            s += (x - mean) * (x - mean);
        }
        return Math.sqrt((m - 1.0) / m * s);
    }

    private static double medianRate(List<ConversionCurve> curves) {
        double[] r = curves.stream().mapToDouble(ConversionCurve::heatingRateKPerS).sorted().toArray();
        return r[r.length / 2];
    }

    /** A failure in plain words: never the text of a library exception. */
    public static String plain(Throwable e) {
        if (e instanceof LeastSquaresFit.NotConverged) {
            return "the optimiser " + e.getMessage() + "; the data do not pin this model down";
        }
        if (e instanceof MathRuntimeException) {
            String msg = String.valueOf(e.getMessage());
            if (msg.contains("maximal count") || msg.contains("exceeded")) {
                return "the optimiser did not settle within its iteration limit; the data do not pin this model down";
            }
            if (msg.toLowerCase(Locale.ROOT).contains("singular")) {
                return "the parameters cannot be told apart from these data (singular problem)";
            }
            return "the numerical method could not proceed on these data";
        }
        if (e instanceof IllegalArgumentException && e.getMessage() != null) {
            return e.getMessage();
        }
        return "an internal error (" + e.getClass().getSimpleName() + "); please report it with --debug output";
    }
}
