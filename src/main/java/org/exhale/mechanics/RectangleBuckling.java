package org.exhale.mechanics;

/**
 * Buckling of the clamped rectangle w × L under equi-biaxial compression: the least compressive force
 * N = λ D/a² (a = w/2) at which the flat plate admits a clamped buckled shape, i.e. σ_cr = λ D/(h a²)
 * = (4λ/π²) · π² D/(w² h).
 *
 * <p>λ(L/w) is tabulated at L/w = 1 … 2 by 0.05, 2 … 4 by 0.1 and 4 … 10 by 0.25, computed by the
 * Rayleigh–Ritz method with Legendre trial functions (RectangleBucklingRitz in the test sources; the
 * basis is converged to 2e-9) and interpolated linearly. λ falls from 1.3259 π² for the square
 * (buckling coefficient 4λ/π² = 5.304 on the width) through π² at L/w ≈ 1.80 towards the long plate's
 * 0.93927 π², in a garland of modes with more half-waves along the length. Conservative by
 * construction: (i) by domain monotonicity of the clamped problem (a rectangle lies inside every longer
 * one and inside the infinite strip, whose buckled shapes include the shorter one's extended by zero),
 * λ never rises with L/w and never falls below the infinite strip's value, which is used beyond
 * L/w = 10 (at most 0.3 % low there); (ii) the linear interpolation overestimates λ between nodes
 * where λ(L/w) is convex, by at most 0.115 % (measured at all midpoints), so the interpolated value is
 * lowered by {@value #MARGIN}.
 *
 * <p>The infinite strip (derived, no published source): a mode f(x) cos ky with f even clamped at
 * x = ±a satisfies (d²/dx² − k²)(d²/dx² − k² + N/D) f = 0, so f = A cosh kx + B cos px with
 * p² = N a²/D − (ka)² (in units of a) and p tan p = −ka tanh ka; the least p² + (ka)² over k is
 * λ∞ = 0.939267 π² at ka = 1.1997.
 */
final class RectangleBuckling {
    /** Nodes in L/w. */
    static final double[] ASPECTS = nodes();
    /** λ/π² at the nodes (Rayleigh–Ritz, 8 × (8 L/w + 6) terms per parity). */
    static final double[] LAMBDA_OVER_PI2 = {
        1.3259065, 1.2658196, 1.2164806, 1.1758023, 1.1421436, 1.1142042, 1.0909470, 1.0715396,
        1.0553104, 1.0417146, 1.0303081, 1.0207276, 1.0126742, 1.0059016, 1.0002055, 0.9954165,
        0.9913932, 0.9880174, 0.9851899, 0.9828274, 0.9808595, 0.9778786, 0.9758711, 0.9745634,
        0.9737541, 0.9732923, 0.9730625, 0.9729727, 0.9724379, 0.9683343, 0.9651288, 0.9626513,
        0.9607630, 0.9593503, 0.9583196, 0.9575928, 0.9571047, 0.9567995, 0.9566291, 0.9565503,
        0.9565239, 0.9535272, 0.9512648, 0.9500635, 0.9495643, 0.9494477, 0.9482424, 0.9470370,
        0.9463372, 0.9460161, 0.9459268, 0.9454258, 0.9447016, 0.9442491, 0.9440226, 0.9439488,
        0.9437531, 0.9432818, 0.9429677, 0.9427977, 0.9427342, 0.9426798, 0.9423555, 0.9421263,
        0.9419933,
    };
    /**
     * λ_s/π² of the modes symmetric about both centre lines (the ones a uniform pressure excites; the
     * same Ritz solution with even terms along the length only): equal to λ up to L/w = 2.7, above it
     * at most lengths beyond, where a mode antisymmetric along the length buckles first.
     */
    static final double[] SYMMETRIC_OVER_PI2 = {
        1.3259065, 1.2658196, 1.2164806, 1.1758023, 1.1421436, 1.1142042, 1.0909470, 1.0715396,
        1.0553104, 1.0417146, 1.0303081, 1.0207276, 1.0126742, 1.0059016, 1.0002055, 0.9954165,
        0.9913932, 0.9880174, 0.9851899, 0.9828274, 0.9808595, 0.9778786, 0.9758711, 0.9745634,
        0.9737541, 0.9732923, 0.9730625, 0.9729727, 0.9729459, 0.9729116, 0.9727982, 0.9725260,
        0.9720012, 0.9711197, 0.9697935, 0.9680076, 0.9658644, 0.9635521, 0.9612599, 0.9591212,
        0.9572080, 0.9535272, 0.9512648, 0.9500635, 0.9495643, 0.9494477, 0.9494165, 0.9491856,
        0.9485492, 0.9475372, 0.9464108, 0.9454258, 0.9447016, 0.9442491, 0.9440226, 0.9439488,
        0.9439390, 0.9438977, 0.9437437, 0.9434507, 0.9430676, 0.9426798, 0.9423555, 0.9421263,
        0.9419933,
    };
    /** λ∞/π² of the infinite clamped strip (characteristic equation above). */
    static final double LONG_PLATE_OVER_PI2 = 0.93926696;
    /** Relative lowering of the interpolated value (covers the interpolation's overestimate). */
    static final double MARGIN = 0.002;

    private RectangleBuckling() {
    }

    /** λ = N_cr a²/D (positive) of the clamped rectangle of aspect ratio L/w ≥ 1, lowered by {@link #MARGIN}. */
    static double lambda(double aspect) {
        return Math.max(interpolate(LAMBDA_OVER_PI2, aspect) * (1 - MARGIN), LONG_PLATE_OVER_PI2) * Math.PI * Math.PI;
    }

    /** λ_s of the doubly symmetric modes, interpolated linearly (no margin: a model scale, not a limit). */
    static double symmetricLambda(double aspect) {
        return interpolate(SYMMETRIC_OVER_PI2, aspect) * Math.PI * Math.PI;
    }

    private static double interpolate(double[] values, double aspect) {
        if (!(aspect >= 1)) {
            throw new IllegalArgumentException("aspect ratio L/w must be >= 1, got " + aspect);
        }
        double[] a = ASPECTS;
        int last = a.length - 1;
        if (aspect >= a[last]) {
            return LONG_PLATE_OVER_PI2;
        }
        int i = aspect < 2 ? (int) ((aspect - 1) / 0.05) : aspect < 4 ? 20 + (int) ((aspect - 2) / 0.1)
                : 40 + (int) ((aspect - 4) / 0.25);
        i = Math.max(0, Math.min(i, last - 1));
        while (i > 0 && a[i] > aspect) {
            i--;
        }
        while (i < last - 1 && a[i + 1] <= aspect) {
            i++;
        }
        double t = (aspect - a[i]) / (a[i + 1] - a[i]);
        return values[i] + t * (values[i + 1] - values[i]);
    }

    private static double[] nodes() {
        double[] a = new double[21 + 20 + 24];
        int k = 0;
        for (int i = 0; i <= 20; i++) {
            a[k++] = 1 + 0.05 * i;
        }
        for (int i = 1; i <= 20; i++) {
            a[k++] = 2 + 0.1 * i;
        }
        for (int i = 1; i <= 24; i++) {
            a[k++] = 4 + 0.25 * i;
        }
        return a;
    }
}
