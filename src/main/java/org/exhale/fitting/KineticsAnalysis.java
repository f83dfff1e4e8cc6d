package org.exhale.fitting;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The whole kinetics-from-thermogravimetry analysis: pre-processing, the five isoconversional
 * methods, Kissinger, the model fit with 1, 2 or 3 components (or all three and the lowest BIC),
 * and the advice. Pure computation.
 */
public final class KineticsAnalysis {
    private KineticsAnalysis() {
    }

    /**
     * @param runs        measured runs
     * @param analysis    pre-processing settings
     * @param fit         model-fit settings; its component count is used unless {@code auto}
     * @param auto        try 1, 2 and 3 components and keep the lowest BIC
     */
    public static KineticsReport run(List<TgaRun> runs, AnalysisOptions analysis, ModelFitOptions fit, boolean auto) {
        List<ConversionCurve> curves = new ArrayList<>();
        for (TgaRun r : runs) {
            curves.add(Conversion.of(r, analysis));
        }
        List<IsoconversionalResult> iso = new ArrayList<>();
        KissingerResult kissinger = null;
        IsoconversionalResult friedman = null;
        if (curves.size() >= 2) {
            for (IsoconversionalMethod m : IsoconversionalMethod.values()) {
                IsoconversionalResult r = Isoconversional.compute(m, curves, analysis.confidence());
                iso.add(r);
                if (m == IsoconversionalMethod.FRIEDMAN) {
                    friedman = r;
                }
            }
            kissinger = Kissinger.compute(curves, analysis.confidence());
        }
        if (friedman == null) {
            // One run: no isoconversional E; start the fit from a typical value.
            double[] g = analysis.grid();
            double[] e = new double[g.length];
            java.util.Arrays.fill(e, 150e3);
            friedman = new IsoconversionalResult(IsoconversionalMethod.FRIEDMAN, g, e, new double[g.length],
                    analysis.confidence());
        }
        List<ModelFitResult> fits = new ArrayList<>();
        Map<Integer, String> failures = new LinkedHashMap<>();
        int[] counts = auto ? new int[] {1, 2, 3} : new int[] {fit.components()};
        for (int k : counts) {
            try {
                fits.add(ModelFit.fit(curves, fit.withComponents(k), friedman));
            } catch (RuntimeException e) {
                failures.put(k, e.getClass().getSimpleName() + ": " + e.getMessage());
            }
        }
        ModelFitResult chosen = null;
        for (ModelFitResult f : fits) {
            if (chosen == null || f.bic() < chosen.bic()) {
                chosen = f;
            }
        }
        List<String> warnings = new ArrayList<>(Advice.warnings(curves, iso.isEmpty() ? null : iso.get(0)));
        for (Map.Entry<Integer, String> f : failures.entrySet()) {
            warnings.add("the " + f.getKey() + "-component fit failed (" + f.getValue() + ")");
        }
        if (curves.size() < 2) {
            warnings.add("one run only: no isoconversional or Kissinger analysis; the model fit is poorly determined");
        }
        return new KineticsReport(curves, iso, kissinger, fits, chosen, failures, warnings);
    }
}
