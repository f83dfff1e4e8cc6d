package org.exhale.fitting;

import java.util.List;
import java.util.Map;

/**
 * Everything {@link KineticsAnalysis} found.
 *
 * @param curves          pre-processed runs
 * @param isoconversional E(α) per method (a method that failed is missing and named in failures)
 * @param kissinger       Kissinger's result (null with one run or when it failed)
 * @param fits            model fits of the requested family, by number of components
 * @param chosen          the fit chosen (null when no fit could be made; the isoconversional
 *                        results are still there)
 * @param failures        what could not be computed, by name ("2 components (nth-order)",
 *                        "kissinger"), with the reason in plain words
 * @param warnings        advice
 * @param verdicts        per component count, why it was accepted or turned down
 * @param effectivePoints effective sample size used by the component-count criterion
 * @param families        the chosen component count fitted with every model family
 * @param intervalMethod  how the model-fit intervals were made
 */
public record KineticsReport(List<ConversionCurve> curves, List<IsoconversionalResult> isoconversional,
                             KissingerResult kissinger, List<ModelFitResult> fits, ModelFitResult chosen,
                             Map<String, String> failures, List<String> warnings, Map<Integer, String> verdicts,
                             double effectivePoints, List<FamilyFit> families, String intervalMethod) {
    public KineticsReport {
        curves = List.copyOf(curves);
        isoconversional = List.copyOf(isoconversional);
        fits = List.copyOf(fits);
        failures = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(failures));
        warnings = List.copyOf(warnings);
        verdicts = java.util.Collections.unmodifiableMap(new java.util.TreeMap<>(verdicts));
        families = List.copyOf(families);
    }

    /**
     * One model family fitted with the chosen number of components.
     *
     * @param family  the family
     * @param rms     rms residual of α (NaN when the fit failed)
     * @param failure why it failed, or null
     * @param atBound shape parameters that ended at a bound, e.g. "c1.n"
     */
    public record FamilyFit(ModelKind family, double rms, String failure, List<String> atBound) {
        public FamilyFit {
            atBound = List.copyOf(atBound);
        }
    }
}
