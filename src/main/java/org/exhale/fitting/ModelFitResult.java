package org.exhale.fitting;

import java.util.List;

/**
 * The model fitted to all runs at once.
 *
 * @param options      settings used
 * @param components   fitted components, by rising reference temperature
 * @param ssr          residual sum of squares of α
 * @param points       number of residuals N
 * @param parameters   number of fitted parameters p
 * @param aic          N ln(SSR/N) + 2p
 * @param bic          N ln(SSR/N) + p ln N
 * @param iterations   Levenberg–Marquardt iterations
 * @param runs         measured against model per run
 */
public record ModelFitResult(ModelFitOptions options, List<FittedComponent> components, double ssr, int points,
                             int parameters, double aic, double bic, int iterations, List<RunFit> runs) {
    public ModelFitResult {
        components = List.copyOf(components);
        runs = List.copyOf(runs);
    }

    /** Root-mean-square residual of α. */
    public double rms() {
        return Math.sqrt(ssr / points);
    }
}
