package org.exhale.fitting;

/**
 * Smoothing of a sampled curve by a local quadratic least-squares fit on the real abscissa
 * (Savitzky–Golay smoothing generalised to uneven spacing): at each point a parabola is fitted to
 * the points within {@code halfWidth} places on either side (the window is shifted, not shrunk, at
 * the ends) and its value and slope are taken. Cost O(n · halfWidth).
 *
 * <p>Source: Savitzky & Golay, Anal. Chem. 36 (1964) 1627 (the local-polynomial idea); the
 * uneven-spacing form is plain weighted-free least squares, common practice.
 */
public final class LocalPolynomial {
    private LocalPolynomial() {
    }

    /** Smoothed values and first derivatives. */
    public record Smoothed(double[] value, double[] slope) {
    }

    public static Smoothed quadratic(double[] x, double[] y, int halfWidth) {
        int n = x.length;
        if (y.length != n) {
            throw new IllegalArgumentException("x and y differ in length");
        }
        int h = Math.max(1, halfWidth);
        int width = 2 * h + 1;
        if (n < width) {
            throw new IllegalArgumentException("need at least " + width + " points for a window of half-width " + h);
        }
        double[] value = new double[n];
        double[] slope = new double[n];
        for (int i = 0; i < n; i++) {
            int lo = Math.max(0, Math.min(i - h, n - width));
            int hi = lo + width;
            double scale = (x[hi - 1] - x[lo]) / 2;
            double s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, b0 = 0, b1 = 0, b2 = 0;
            for (int k = lo; k < hi; k++) {
                double u = (x[k] - x[i]) / scale;
                double u2 = u * u;
                s0 += 1;
                s1 += u;
                s2 += u2;
                s3 += u2 * u;
                s4 += u2 * u2;
                b0 += y[k];
                b1 += y[k] * u;
                b2 += y[k] * u2;
            }
            // Normal equations [s0 s1 s2; s1 s2 s3; s2 s3 s4] c = b, solved by Cramer's rule.
            double det = s0 * (s2 * s4 - s3 * s3) - s1 * (s1 * s4 - s3 * s2) + s2 * (s1 * s3 - s2 * s2);
            double c0 = (b0 * (s2 * s4 - s3 * s3) - s1 * (b1 * s4 - s3 * b2) + s2 * (b1 * s3 - s2 * b2)) / det;
            double c1 = (s0 * (b1 * s4 - b2 * s3) - b0 * (s1 * s4 - s3 * s2) + s2 * (s1 * b2 - b1 * s2)) / det;
            value[i] = c0;
            slope[i] = c1 / scale;
        }
        return new Smoothed(value, slope);
    }
}
