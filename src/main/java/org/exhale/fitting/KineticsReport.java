package org.exhale.fitting;

import java.util.List;
import java.util.Map;

/**
 * Everything {@link KineticsAnalysis} found.
 *
 * @param curves        pre-processed runs
 * @param isoconversional E(α) per method
 * @param kissinger     Kissinger's result (null with one run)
 * @param fits          model fits tried, by number of components
 * @param chosen        the fit chosen (lowest BIC among the tried ones)
 * @param failures      fits that did not converge, with the reason
 * @param warnings      advice
 */
public record KineticsReport(List<ConversionCurve> curves, List<IsoconversionalResult> isoconversional,
                             KissingerResult kissinger, List<ModelFitResult> fits, ModelFitResult chosen,
                             Map<Integer, String> failures, List<String> warnings) {
    public KineticsReport {
        curves = List.copyOf(curves);
        isoconversional = List.copyOf(isoconversional);
        fits = List.copyOf(fits);
        failures = Map.copyOf(failures);
        warnings = List.copyOf(warnings);
    }
}
