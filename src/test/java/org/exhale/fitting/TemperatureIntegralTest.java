package org.exhale.fitting;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.exhale.PhysicalConstants;
import org.hipparchus.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

class TemperatureIntegralTest {

    /** p(x) = e^(−x) ∫₀^∞ e^(−s)/(x+s)² ds by adaptive Gauss–Legendre on [0, 80] (e^(−80) is negligible). */
    static double pByQuadrature(double x) {
        IterativeLegendreGaussIntegrator q = new IterativeLegendreGaussIntegrator(8, 1e-15, 1e-300);
        double inner = q.integrate(10_000_000, s -> Math.exp(-s) / ((x + s) * (x + s)), 0, 80);
        return Math.exp(-x) * inner;
    }

    @Test
    void senumYangMatchesQuadratureWithTheTabulatedErrors() {
        // Source: Senum & Yang, J. Therm. Anal. 11 (1977) 445, fourth-degree rational form with the
        // coefficient 86; CHECKS.md (st. D) gives relative errors −9.9e-5 % at x = 10 and −1.6e-6 % at x = 20.
        double rel10 = TemperatureIntegral.senumYang(10) / pByQuadrature(10) - 1;
        double rel20 = TemperatureIntegral.senumYang(20) / pByQuadrature(20) - 1;
        assertEquals(-9.9e-7, rel10, 0.1e-7);
        assertEquals(-1.6e-8, rel20, 0.1e-8);
    }

    @Test
    void historyIntegralOfLinearRampMatchesSenumYang() {
        // ∫ e^(−E/RT) dt over T = T0 + βt equals (E/(Rβ)) [p(x1) − p(x0)] — change of variable,
        // common practice, no source; p from Senum–Yang (error < 1e-7 here).
        double beta = 10.0 / 60, e = 150e3, r = PhysicalConstants.GAS_CONSTANT;
        int n = 2001;
        double[] t = new double[n];
        double[] temp = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 3.0;
            temp[i] = 450 + beta * t[i];
        }
        double tRef = 500;
        double got = TemperatureIntegral.alongHistory(t, temp, 100.5, 5000.25, e, tRef) * Math.exp(-e / (r * tRef));
        double x0 = e / (r * (450 + beta * 100.5)), x1 = e / (r * (450 + beta * 5000.25));
        double expected = e / (r * beta) * (TemperatureIntegral.senumYang(x1) - TemperatureIntegral.senumYang(x0));
        assertEquals(expected, got, 1e-6 * expected);
    }
}
