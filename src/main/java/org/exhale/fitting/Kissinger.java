package org.exhale.fitting;

import java.util.List;
import org.exhale.PhysicalConstants;

/**
 * Kissinger's method on the peak of dα/dt of each run (found by a local cubic fit over the top of
 * the peak, see {@link Conversion}): a straight line of
 * ln(β/Tp²) on 1/Tp has slope −E/R and intercept ln(AR/E). Exact for a first-order reaction at
 * constant heating rate (Kissinger, Anal. Chem. 29 (1957) 1702). The interval on ln A carries the
 * covariance of slope and intercept (delta method, common practice).
 */
public final class Kissinger {
    /**
     * E(α) spread above which Kissinger's single E is flagged: the ICTAC Kinetics Committee
     * (Vyazovkin et al., Thermochim. Acta 520 (2011) 1) treats a variation of more than 10–20 % of
     * the mean as significant; the lower end is taken.
     */
    public static final double MAX_SPREAD = 0.10;

    private Kissinger() {
    }

    public static KissingerResult compute(List<ConversionCurve> runs, double confidence) {
        return compute(runs, confidence, null);
    }

    /** With the isoconversional E(α) to judge whether one E describes the process (α 0.1–0.9). */
    public static KissingerResult compute(List<ConversionCurve> runs, double confidence, IsoconversionalResult reference) {
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
        double spread = reference == null ? Double.NaN : reference.relativeSpread(0.1, 0.9);
        double r = PhysicalConstants.GAS_CONSTANT;
        double e = -lr.slope() * r;
        double t = lr.tQuantile(confidence);
        double lnA = lr.intercept() + Math.log(-lr.slope());
        // ln A = b + ln(−s): ∂/∂b = 1, ∂/∂s = 1/s.
        double s = lr.slope();
        double varLnA = lr.interceptStdError() * lr.interceptStdError()
                + lr.slopeStdError() * lr.slopeStdError() / (s * s) + 2 * lr.covariance() / s;
        return new KissingerResult(e, t * lr.slopeStdError() * r, lnA, t * Math.sqrt(Math.max(0, varLnA)),
                confidence, tp, beta, spread, spread > MAX_SPREAD);
    }
}
