package org.exhale.fitting;

import java.util.List;

/**
 * The model fitted to all runs at once.
 *
 * @param options          settings used
 * @param components       fitted components, by rising reference temperature
 * @param ssr              residual sum of squares of α
 * @param points           number of residuals N
 * @param parameters       number of fitted parameters p
 * @param aic              N ln(SSR/N) + 2p (independent residuals assumed; reported only)
 * @param bic              N ln(SSR/N) + p ln N (independent residuals assumed; reported only)
 * @param iterations       Levenberg–Marquardt iterations
 * @param runs             measured against model per run
 * @param lag1Correlation  lag-1 autocorrelation ρ of the residuals, pooled over the runs
 * @param effectivePoints  N_eff = N (1 − ρ)/(1 + ρ), the number of independent residuals an AR(1)
 *                         series of N correlated ones is worth
 */
public record ModelFitResult(ModelFitOptions options, List<FittedComponent> components, double ssr, int points,
                             int parameters, double aic, double bic, int iterations, List<RunFit> runs,
                             double lag1Correlation, double effectivePoints) {
    public ModelFitResult {
        components = List.copyOf(components);
        runs = List.copyOf(runs);
    }

    /** Root-mean-square residual of α. */
    public double rms() {
        return Math.sqrt(ssr / points);
    }

    /**
     * The information criterion used to compare component counts: N_eff ln(SSR/N) + p ln N_eff,
     * with one N_eff shared by the fits compared (BIC with an effective sample size).
     */
    public double bicEffective(double neff) {
        return neff * Math.log(Math.max(ssr, Double.MIN_NORMAL) / points) + parameters * Math.log(neff);
    }

    /** Smallest component fraction. */
    public double smallestFraction() {
        return components.stream().mapToDouble(FittedComponent::fraction).min().orElse(1);
    }

    /** A copy with other components (e.g. widened intervals). */
    public ModelFitResult withComponents(List<FittedComponent> cs) {
        return new ModelFitResult(options, cs, ssr, points, parameters, aic, bic, iterations, runs, lag1Correlation,
                effectivePoints);
    }
}
