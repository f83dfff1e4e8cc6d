package org.exhale.fitting;

import java.util.List;
import org.exhale.PhysicalConstants;

/**
 * Kissinger's method on the peak of the smoothed dα/dt of each run: a straight line of
 * ln(β/Tp²) on 1/Tp has slope −E/R and intercept ln(AR/E). Exact for a first-order reaction at
 * constant heating rate (Kissinger, Anal. Chem. 29 (1957) 1702). The interval on ln A carries the
 * covariance of slope and intercept (delta method, common practice).
 */
public final class Kissinger {
    private Kissinger() {
    }

    public static KissingerResult compute(List<ConversionCurve> runs, double confidence) {
        int m = runs.size();
        if (m < 2) {
            throw new IllegalArgumentException("Kissinger's method needs at least two runs, got " + m);
        }
        double[] x = new double[m];
        double[] y = new double[m];
        double[] tp = new double[m];
        double[] beta = new double[m];
        for (int i = 0; i < m; i++) {
            tp[i] = runs.get(i).peakTemperatureK();
            beta[i] = runs.get(i).heatingRateKPerS();
            x[i] = 1 / tp[i];
            y[i] = Math.log(beta[i] / (tp[i] * tp[i]));
        }
        LinearRegression lr = LinearRegression.fit(x, y);
        double r = PhysicalConstants.GAS_CONSTANT;
        double e = -lr.slope() * r;
        double t = lr.tQuantile(confidence);
        double lnA = lr.intercept() + Math.log(-lr.slope());
        // ln A = b + ln(−s): ∂/∂b = 1, ∂/∂s = 1/s.
        double s = lr.slope();
        double varLnA = lr.interceptStdError() * lr.interceptStdError()
                + lr.slopeStdError() * lr.slopeStdError() / (s * s) + 2 * lr.covariance() / s;
        return new KissingerResult(e, t * lr.slopeStdError() * r, lnA, t * Math.sqrt(Math.max(0, varLnA)),
                confidence, tp, beta);
    }
}
