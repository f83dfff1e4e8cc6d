package org.exhale.fitting;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class LeastSquaresFitTest {
    // NIST StRD nonlinear regression, Misra1a (lower difficulty): y = b1 (1 − exp(−b2 x)), 14 points.
    // Data and certified values as copied in several public test suites (faithful secondary copies
    // of https://www.itl.nist.gov/div898/strd/nls/data/misra1a.shtml): b1 = 2.3894212918E+02
    // (sd 2.7070075241E+00), b2 = 5.5015643181E-04 (sd 7.2668688436E-06), RSS 1.2455138894E-01.
    // (One copy gives sd(b2) = 1.2889360290E-05; the copy of NIST's own file layout gives
    // 7.2668688436E-06, which this fit reproduces to 6 digits; the latter is taken.)
    static final double[] X = {77.6, 114.9, 141.1, 190.8, 239.9, 289.0, 332.8, 378.4, 434.8, 477.3, 536.8, 593.1, 689.1, 760.0};
    static final double[] Y = {10.07, 14.73, 17.94, 23.93, 29.61, 35.18, 40.02, 44.82, 50.76, 55.05, 61.01, 66.40, 75.47, 81.78};

    @Test
    void misra1aFromTheFirstNistStartMatchesCertifiedValues() {
        LeastSquaresFit fit = LeastSquaresFit.fit(b -> {
            double[] v = new double[X.length];
            for (int i = 0; i < X.length; i++) {
                v[i] = b[0] * (1 - Math.exp(-b[1] * X[i]));
            }
            return v;
        }, Y, new double[] {500, 1e-4}, new double[] {1, 1e-6}, 1000);
        assertEquals(2.3894212918E+02, fit.parameters()[0], 1e-6 * 2.3894212918E+02);
        assertEquals(5.5015643181E-04, fit.parameters()[1], 1e-6 * 5.5015643181E-04);
        assertEquals(1.2455138894E-01, fit.ssr(), 1e-7 * 1.2455138894E-01);
        // Certified standard deviations: tests the σ²(JᵀJ)⁻¹ covariance; 1e-4 relative allows for the difference Jacobian.
        assertEquals(2.7070075241E+00, fit.stdError(0), 1e-4 * 2.7070075241E+00);
        assertEquals(7.2668688436E-06, fit.stdError(1), 1e-4 * 7.2668688436E-06);
    }
}
