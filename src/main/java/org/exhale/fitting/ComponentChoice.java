package org.exhale.fitting;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.exhale.PhysicalConstants;

/**
 * How many parallel components the data support. Candidates are taken in order of rising count;
 * one more component is accepted only when all of these hold (every rule is ours, stated in
 * docs/model.md):
 * <ol>
 *   <li>every component carries at least {@link #MIN_FRACTION} of the mass;</li>
 *   <li>no two components are alike: their characteristic temperatures (where
 *       k(T) = β E/(R T²) at the median heating rate, Kissinger's peak condition) differ by at least
 *       {@link #MIN_TEMPERATURE_GAP_K} or their E by at least {@link #MIN_ENERGY_GAP} of the mean;</li>
 *   <li>the rms residual of α falls by at least {@link #MIN_RMS_GAIN} relative and
 *       {@link #MIN_RMS_GAIN_ABSOLUTE} absolute (below that a balance cannot tell the difference);</li>
 *   <li>the Bayesian information criterion with an effective sample size,
 *       N_eff ln(SSR/N) + p ln N_eff, falls; N_eff is one value for all candidates, that of the
 *       candidate with the most components (the least structured residuals), from the lag-1
 *       autocorrelation of its residuals (see {@link ModelFit}).</li>
 * </ol>
 * A fixed count is honoured, except that a component under {@link #MIN_WRITTEN_FRACTION} is never
 * written: {@link KineticsAnalysis} then falls back to one component fewer.
 *
 * @param chosen          the fit chosen (null if none converged)
 * @param effectivePoints N_eff used for the criterion
 * @param verdicts        per component count, why it was accepted or turned down
 */
public record ComponentChoice(ModelFitResult chosen, double effectivePoints, Map<Integer, String> verdicts) {
    /** Smallest mass share of a component that a new component must carry. */
    public static final double MIN_FRACTION = 0.03;
    /** No component with less than this share is ever written. */
    public static final double MIN_WRITTEN_FRACTION = 0.01;
    /** Characteristic temperatures of two distinct components differ by at least this [K]... */
    public static final double MIN_TEMPERATURE_GAP_K = 10;
    /** ...or their activation energies by at least this share of their mean. */
    public static final double MIN_ENERGY_GAP = 0.15;
    /** Relative fall of the rms residual one more component must bring. */
    public static final double MIN_RMS_GAIN = 0.10;
    /** Absolute fall of the rms residual of α one more component must bring. */
    public static final double MIN_RMS_GAIN_ABSOLUTE = 2e-4;

    public ComponentChoice {
        verdicts = Map.copyOf(verdicts);
    }

    /**
     * @param fits          converged fits, one per component count
     * @param heatingRateKPerS the median heating rate, for the characteristic temperatures
     */
    public static ComponentChoice choose(List<ModelFitResult> fits, double heatingRateKPerS) {
        List<ModelFitResult> sorted = new ArrayList<>(fits);
        sorted.sort((a, b) -> Integer.compare(a.components().size(), b.components().size()));
        Map<Integer, String> verdicts = new LinkedHashMap<>();
        if (sorted.isEmpty()) {
            return new ComponentChoice(null, Double.NaN, verdicts);
        }
        double neff = sorted.get(sorted.size() - 1).effectivePoints();
        ModelFitResult chosen = null;
        for (ModelFitResult f : sorted) {
            int k = f.components().size();
            if (f.smallestFraction() < (chosen == null ? MIN_WRITTEN_FRACTION : MIN_FRACTION)) {
                verdicts.put(k, String.format(Locale.ROOT, "turned down: a component carries only %.1f %% of the mass "
                        + "(a new component needs at least %.0f %%)", 100 * f.smallestFraction(), 100 * MIN_FRACTION));
                continue;
            }
            String alike = alike(f, heatingRateKPerS);
            if (alike != null && k > 1) {
                verdicts.put(k, "turned down: " + alike);
                continue;
            }
            if (chosen == null) {
                chosen = f;
                verdicts.put(k, String.format(Locale.ROOT, "rms %.2e, criterion %.1f", f.rms(), f.bicEffective(neff)));
                continue;
            }
            double gain = chosen.rms() - f.rms();
            if (gain < MIN_RMS_GAIN * chosen.rms() || gain < MIN_RMS_GAIN_ABSOLUTE) {
                verdicts.put(k, String.format(Locale.ROOT, "turned down: rms residual of alpha only %.2e against %.2e "
                        + "with %d (needs %.0f %% and %.0e less)", f.rms(), chosen.rms(), chosen.components().size(),
                        100 * MIN_RMS_GAIN, MIN_RMS_GAIN_ABSOLUTE));
                continue;
            }
            if (!(f.bicEffective(neff) < chosen.bicEffective(neff))) {
                verdicts.put(k, String.format(Locale.ROOT, "turned down: criterion %.1f not below %.1f (N_eff %.0f)",
                        f.bicEffective(neff), chosen.bicEffective(neff), neff));
                continue;
            }
            chosen = f;
            verdicts.put(k, String.format(Locale.ROOT, "rms %.2e, criterion %.1f", f.rms(), f.bicEffective(neff)));
        }
        return new ComponentChoice(chosen, neff, verdicts);
    }

    /** A description of two alike components, or null. */
    static String alike(ModelFitResult f, double beta) {
        List<FittedComponent> cs = f.components();
        for (int i = 0; i < cs.size(); i++) {
            for (int j = i + 1; j < cs.size(); j++) {
                FittedComponent a = cs.get(i), b = cs.get(j);
                double ta = characteristicTemperatureK(a, beta), tb = characteristicTemperatureK(b, beta);
                double de = Math.abs(a.energyJPerMol() - b.energyJPerMol()) / (0.5 * (a.energyJPerMol() + b.energyJPerMol()));
                if (Math.abs(ta - tb) < MIN_TEMPERATURE_GAP_K && de < MIN_ENERGY_GAP) {
                    return String.format(Locale.ROOT, "%s and %s are alike (peaks at %.0f and %.0f K, E %.0f and %.0f kJ/mol)",
                            a.name(), b.name(), ta, tb, a.energyJPerMol() / 1e3, b.energyJPerMol() / 1e3);
                }
            }
        }
        return null;
    }

    /** T with A exp(−E/RT) = β E/(R T²), by fixed-point iteration on ln (converges: the T² term is weak). */
    public static double characteristicTemperatureK(FittedComponent c, double beta) {
        double r = PhysicalConstants.GAS_CONSTANT;
        double e = c.energyJPerMol();
        double t = c.referenceTemperatureK();
        for (int i = 0; i < 50; i++) {
            double next = e / (r * (c.lnPreExponential() - Math.log(beta * e / (r * t * t))));
            if (!(next > 0) || !Double.isFinite(next)) {
                return c.referenceTemperatureK();
            }
            if (Math.abs(next - t) < 1e-6) {
                return next;
            }
            t = next;
        }
        return t;
    }
}
