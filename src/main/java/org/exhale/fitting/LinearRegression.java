package org.exhale.fitting;

import org.hipparchus.distribution.continuous.TDistribution;

/**
 * Ordinary least-squares straight line y = intercept + slope · x with standard errors.
 *
 * @param slope             fitted slope
 * @param intercept         fitted intercept
 * @param slopeStdError     standard error of the slope (NaN with fewer than 3 points)
 * @param interceptStdError standard error of the intercept (NaN with fewer than 3 points)
 * @param n                 number of points
 * @param rSquared          coefficient of determination
 * @param maxAbsResidual    largest |y − fit|
 * @param covariance        covariance of slope and intercept (NaN with fewer than 3 points)
 */
public record LinearRegression(double slope, double intercept, double slopeStdError, double interceptStdError,
                               int n, double rSquared, double maxAbsResidual, double covariance) {

    public static LinearRegression fit(double[] x, double[] y) {
        return fit(x, y, 0, x.length);
    }

    /** Fit over points [from, to). */
    public static LinearRegression fit(double[] x, double[] y, int from, int to) {
        int n = to - from;
        if (n < 2) {
            throw new IllegalArgumentException("a straight line needs at least 2 points, got " + n);
        }
        double mx = 0, my = 0;
        for (int i = from; i < to; i++) {
            mx += x[i];
            my += y[i];
        }
        mx /= n;
        my /= n;
        double sxx = 0, sxy = 0, syy = 0;
        for (int i = from; i < to; i++) {
            double dx = x[i] - mx, dy = y[i] - my;
            sxx += dx * dx;
            sxy += dx * dy;
            syy += dy * dy;
        }
        if (!(sxx > 0)) {
            throw new IllegalArgumentException("all x values are equal; no slope can be fitted");
        }
        double slope = sxy / sxx;
        double intercept = my - slope * mx;
        double ssr = 0, maxRes = 0;
        for (int i = from; i < to; i++) {
            double r = y[i] - intercept - slope * x[i];
            ssr += r * r;
            maxRes = Math.max(maxRes, Math.abs(r));
        }
        double seSlope = Double.NaN, seIntercept = Double.NaN, cov = Double.NaN;
        if (n > 2) {
            double s2 = ssr / (n - 2);
            seSlope = Math.sqrt(s2 / sxx);
            seIntercept = Math.sqrt(s2 * (1.0 / n + mx * mx / sxx));
            cov = -mx * s2 / sxx;
        }
        double r2 = syy > 0 ? 1 - ssr / syy : 1;
        return new LinearRegression(slope, intercept, seSlope, seIntercept, n, r2, maxRes, cov);
    }

    /** Student t quantile for a two-sided interval at {@code confidence} with n − 2 degrees of freedom (NaN if n ≤ 2). */
    public double tQuantile(double confidence) {
        return studentT(confidence, n - 2);
    }

    /** Two-sided Student t quantile; NaN for fewer than one degree of freedom. */
    public static double studentT(double confidence, int degreesOfFreedom) {
        if (degreesOfFreedom < 1) {
            return Double.NaN;
        }
        return new TDistribution(degreesOfFreedom).inverseCumulativeProbability(0.5 + confidence / 2);
    }
}
