package org.exhale.fitting;

import org.exhale.PhysicalConstants;

/**
 * The Arrhenius temperature integral, in closed approximation and along a measured history.
 */
public final class TemperatureIntegral {
    /** Gauss–Legendre 3-point nodes on [0, 1] and weights (common practice). */
    private static final double[] GL_NODE = {0.5 - Math.sqrt(0.15), 0.5, 0.5 + Math.sqrt(0.15)};
    private static final double[] GL_WEIGHT = {5.0 / 18, 8.0 / 18, 5.0 / 18};

    private TemperatureIntegral() {
    }

    /**
     * p(x) = ∫ₓ^∞ e^(−u)/u² du by the fourth-degree rational approximation of Senum & Yang,
     * J. Therm. Anal. 11 (1977) 445: p(x) ≈ (e^(−x)/x)(x³ + 18x² + 86x + 96)/(x⁴ + 20x³ + 120x² + 240x + 120),
     * with x = E/(RT). Then ∫₀^T e^(−E/RT′) dT′ = (E/R) p(E/RT).
     */
    public static double senumYang(double x) {
        if (!(x > 0)) {
            throw new IllegalArgumentException("x = E/RT must be positive, got " + x);
        }
        double num = ((x + 18) * x + 86) * x + 96;
        double den = (((x + 20) * x + 120) * x + 240) * x + 120;
        return Math.exp(-x) / x * num / den;
    }

    /**
     * ∫ exp(−(E/R)(1/T(t) − 1/Tref)) dt from tFrom to tTo along a sampled history, T taken linear
     * between samples, three-point Gauss–Legendre on each piece. The factor exp(E/(R Tref)) keeps
     * the value in range; ratios of such integrals with the same Tref are exact ratios of the
     * unscaled ones. Times outside the samples are refused.
     */
    public static double alongHistory(double[] t, double[] temperatureK, double tFrom, double tTo,
                                      double energyJPerMol, double referenceK) {
        if (!(tTo >= tFrom) || tFrom < t[0] || tTo > t[t.length - 1]) {
            throw new IllegalArgumentException("integration interval [" + tFrom + ", " + tTo
                    + "] s is outside the history [" + t[0] + ", " + t[t.length - 1] + "] s");
        }
        double b = energyJPerMol / PhysicalConstants.GAS_CONSTANT;
        double invRef = 1 / referenceK;
        int i = upperIndex(t, tFrom);
        double sum = 0;
        double a = tFrom;
        double ta = interpolate(t, temperatureK, i, tFrom);
        while (a < tTo) {
            double e = Math.min(t[i], tTo);
            double te = e == t[i] ? temperatureK[i] : interpolate(t, temperatureK, i, e);
            double h = e - a;
            for (int q = 0; q < 3; q++) {
                double temp = ta + GL_NODE[q] * (te - ta);
                sum += GL_WEIGHT[q] * h * Math.exp(-b * (1 / temp - invRef));
            }
            a = e;
            ta = te;
            i++;
            if (i >= t.length) {
                break;
            }
        }
        return sum;
    }

    /** Index i ≥ 1 with t[i−1] ≤ x ≤ t[i]. */
    static int upperIndex(double[] t, double x) {
        int k = java.util.Arrays.binarySearch(t, x);
        if (k >= 0) {
            return Math.max(1, Math.min(k + 1, t.length - 1));
        }
        int ins = -k - 1;
        return Math.max(1, Math.min(ins, t.length - 1));
    }

    private static double interpolate(double[] t, double[] y, int i, double x) {
        double f = (x - t[i - 1]) / (t[i] - t[i - 1]);
        return y[i - 1] + f * (y[i] - y[i - 1]);
    }
}
