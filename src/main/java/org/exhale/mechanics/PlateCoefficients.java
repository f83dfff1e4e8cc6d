package org.exhale.mechanics;

/**
 * Small-deflection coefficients of a clamped plate under uniform pressure q:
 * centre deflection {@code δ = c_δ q w⁴ / D} and largest edge bending stress
 * {@code σ_b = c_σ q w² / h²}, with w the full span (line width, disc diameter, rectangle short
 * side), h the thickness and {@code D = E h³ / (12 (1−ν²))}.
 *
 * <ul>
 *   <li>Long line (clamped–clamped strip in cylindrical bending): c_δ = 1/384, c_σ = 1/2
 *       (edge moment q w²/12, σ = 6M/h²).</li>
 *   <li>Disc of diameter w = 2a: δ = q a⁴/(64 D) and σ = 3 q a²/(4 h²) (Chen (ed.), Civil
 *       Engineering Handbook, 2nd ed., eq. 47.72–47.74), i.e. c_δ = 1/1024, c_σ = 3/16.</li>
 *   <li>Rectangle w × L: Roark's Formulas for Stress and Strain, 7th ed., Table 11.4 case 8a
 *       (ν = 0.3), {@code σ_max = β1 q b²/t²}, {@code y_max = α q b⁴/(E t³)} with b = w the short side.
 *       Since {@code q b⁴/D = 12(1−ν²) q b⁴/(E t³)}, {@code c_δ = α / (12(1−ν²)) = α / 10.92} at
 *       ν = 0.3, and {@code c_σ = β1}. The square value c_δ = 0.00126 agrees with Timoshenko &amp;
 *       Woinowsky-Krieger, Theory of Plates and Shells, Table 35.</li>
 * </ul>
 *
 * <p><b>Poisson's ratio.</b> The table is for ν = 0.3, but both coefficients as defined here do
 * not depend on ν in Kirchhoff plate theory: the deflection solves {@code D ∇⁴w = q} with clamped
 * conditions (no ν), and at a clamped edge the normal moment is {@code −D ∂²w/∂n²} (the ν term
 * multiplies the tangential curvature, zero along a clamped edge). So c_δ (per D) and c_σ are used
 * for any ν; only the conversion of Roark's α to c_δ uses the table's ν = 0.3.
 *
 * <p><b>Interpolation.</b> In the variable s = w/L ∈ [0, 1] (s = 0 the infinite strip) through
 * the table columns a/b = 1.0 … 2.0 and the ∞ column, by a monotone piecewise-cubic Hermite
 * interpolant (Fritsch &amp; Carlson, SIAM J. Numer. Anal. 17 (1980) 238, with the weighted
 * harmonic-mean slopes of Fritsch &amp; Butland for uneven spacing). It passes through every table
 * value and never overshoots between them. At s = 0 the exact strip values 1/384 and 1/2 are used;
 * the table's α = 0.0284 is their rounding (10.92/384 = 0.02844), so a very long rectangle meets
 * the LINE result continuously.
 *
 * @param deflectionCoefficient  c_δ in δ = c_δ q w⁴/D
 * @param edgeStressCoefficient  c_σ in σ_b = c_σ q w²/h²
 */
public record PlateCoefficients(double deflectionCoefficient, double edgeStressCoefficient) {

    /** Long clamped strip. */
    public static final PlateCoefficients LINE = new PlateCoefficients(1.0 / 384, 0.5);
    /** Clamped disc of diameter w. */
    public static final PlateCoefficients DISC = new PlateCoefficients(1.0 / 1024, 3.0 / 16);

    /** Poisson's ratio of the Roark table. */
    private static final double TABLE_POISSON = 0.3;
    /*
     * Roark 7th ed. Table 11.4 case 8a, columns a/b = ∞, 2.0, 1.8, 1.6, 1.4, 1.2, 1.0, in increasing
     * s = b/a. Private, never written after class initialisation.
     */
    private static final double[] S = {0, 1 / 2.0, 1 / 1.8, 1 / 1.6, 1 / 1.4, 1 / 1.2, 1.0};
    private static final double[] BETA1 = {0.5, 0.4974, 0.4872, 0.4680, 0.4356, 0.3834, 0.3078};
    private static final double[] ROARK_ALPHA = {Double.NaN, 0.0277, 0.0267, 0.0251, 0.0226, 0.0188, 0.0138};
    private static final double[] C_DELTA = new double[S.length];
    private static final double[] C_DELTA_SLOPE;
    private static final double[] BETA1_SLOPE;

    static {
        C_DELTA[0] = 1.0 / 384;
        for (int i = 1; i < S.length; i++) {
            C_DELTA[i] = ROARK_ALPHA[i] / (12 * (1 - TABLE_POISSON * TABLE_POISSON));
        }
        C_DELTA_SLOPE = monotoneSlopes(S, C_DELTA);
        BETA1_SLOPE = monotoneSlopes(S, BETA1);
    }

    public PlateCoefficients {
        if (!(deflectionCoefficient > 0 && deflectionCoefficient < 1)) {
            throw new IllegalArgumentException("deflection coefficient must be in (0, 1), got " + deflectionCoefficient);
        }
        if (!(edgeStressCoefficient > 0 && edgeStressCoefficient < 10)) {
            throw new IllegalArgumentException("edge stress coefficient must be in (0, 10), got " + edgeStressCoefficient);
        }
    }

    /** Coefficients for a span of the given shape and size. */
    public static PlateCoefficients forSpan(SpanGeometry span) {
        return switch (span.shape()) {
            case LINE -> LINE;
            case DISC -> DISC;
            case RECTANGLE -> clampedRectangle(span.aspectRatio());
        };
    }

    /**
     * Interpolated coefficients of a clamped rectangle of aspect ratio L/w ≥ 1 (+∞ allowed: the strip).
     */
    public static PlateCoefficients clampedRectangle(double aspectRatio) {
        if (!(aspectRatio >= 1)) {
            throw new IllegalArgumentException("rectangle aspect ratio L/w must be >= 1, got " + aspectRatio);
        }
        double s = 1 / aspectRatio;
        return new PlateCoefficients(hermite(S, C_DELTA, C_DELTA_SLOPE, s), hermite(S, BETA1, BETA1_SLOPE, s));
    }

    /** Slopes of the monotone (shape-preserving) piecewise-cubic Hermite interpolant. */
    private static double[] monotoneSlopes(double[] x, double[] y) {
        int n = x.length;
        double[] h = new double[n - 1];
        double[] d = new double[n - 1];
        for (int k = 0; k < n - 1; k++) {
            h[k] = x[k + 1] - x[k];
            d[k] = (y[k + 1] - y[k]) / h[k];
        }
        double[] m = new double[n];
        for (int k = 1; k < n - 1; k++) {
            if (d[k - 1] * d[k] > 0) {
                double w1 = 2 * h[k] + h[k - 1];
                double w2 = h[k] + 2 * h[k - 1];
                m[k] = (w1 + w2) / (w1 / d[k - 1] + w2 / d[k]);
            }
        }
        m[0] = endSlope(h[0], h[1], d[0], d[1]);
        m[n - 1] = endSlope(h[n - 2], h[n - 3], d[n - 2], d[n - 3]);
        return m;
    }

    /** One-sided three-point end slope, limited to keep the end interval monotone. */
    private static double endSlope(double h0, double h1, double d0, double d1) {
        double m = ((2 * h0 + h1) * d0 - h0 * d1) / (h0 + h1);
        if (Math.signum(m) != Math.signum(d0)) {
            return 0;
        }
        if (Math.signum(d0) != Math.signum(d1) && Math.abs(m) > 3 * Math.abs(d0)) {
            return 3 * d0;
        }
        return m;
    }

    private static double hermite(double[] x, double[] y, double[] m, double t) {
        int k = 0;
        while (k < x.length - 2 && t > x[k + 1]) {
            k++;
        }
        double h = x[k + 1] - x[k];
        double u = (t - x[k]) / h;
        double u2 = u * u;
        double u3 = u2 * u;
        return (2 * u3 - 3 * u2 + 1) * y[k] + (u3 - 2 * u2 + u) * h * m[k]
                + (-2 * u3 + 3 * u2) * y[k + 1] + (u3 - u2) * h * m[k + 1];
    }
}
