package org.exhale.fitting;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Exact checks on noise-free first-order runs, E = 150 kJ/mol, A = 1e12 1/s,
 * β = 1, 2, 5, 10, 20 K/min, from 380 K (where the conversion already reached is ~1e-6), integrated by {@link SyntheticTga} (independent of the fitter).
 */
class KissingerAndIsoconversionalTest {
    static final double[] BETAS = {1, 2, 5, 10, 20};
    static List<ConversionCurve> curves;

    @BeforeAll
    static void makeRuns() {
        curves = new ArrayList<>();
        for (double b : BETAS) {
            TgaRun run = SyntheticTga.firstOrder(150e3, 1e12, b, 380, 660, 0.05);
            curves.add(Conversion.of(run, AnalysisOptions.DEFAULT.withSmoothing(0.005)));
        }
    }

    @Test
    void peakTemperaturesMatchDerivedValues() {
        // Source: CHECKS.md "synthetic first order" (derived by direct integration), st. D.
        double[] expected = {523.729, 533.877, 547.893, 558.980, 570.510};
        for (int i = 0; i < BETAS.length; i++) {
            // 0.01 K: the peak is a cubic least-squares fit over the top 10 % of the rate peak (robust to
            // noise); on this asymmetric first-order peak its bias is ~4 mK (measured), far below what
            // moves Kissinger's E (see kissingerIsExactForFirstOrder).
            assertEquals(expected[i], curves.get(i).peakTemperatureK(), 0.01, "Tp at " + BETAS[i] + " K/min");
        }
    }

    @Test
    void kissingerIsExactForFirstOrder() {
        // Source: Kissinger, Anal. Chem. 29 (1957) 1702, ln(β/Tp²) = ln(AR/E) − E/(R Tp), exact for
        // first order; CHECKS.md gives 150.000 kJ/mol and 1.000e12 1/s on these runs.
        KissingerResult k = Kissinger.compute(curves, 0.95);
        assertEquals(150.000, k.energyJPerMol() / 1e3, 0.02);
        assertEquals(Math.log(1e12), k.lnPreExponential(), 0.01);
    }

    @Test
    void temperaturesAtHalfConversionMatchDerivedValues() {
        // Source: CHECKS.md "same data, α = 0.5" (derived), st. D.
        double[] expected = {519.283, 529.278, 543.078, 553.992, 565.341};
        for (int i = 0; i < BETAS.length; i++) {
            double[] g = curves.get(i).gridAlpha();
            double[] temps = curves.get(i).gridTemperatureK();
            int idx = nearest(g, 0.5);
            assertEquals(expected[i], temps[idx], 2e-3, "T(α=0.5) at " + BETAS[i] + " K/min");
        }
    }

    @Test
    void linearMethodsAtHalfConversionMatchDerivedValues() {
        // Source: CHECKS.md "same data, α = 0.5" (derived): Friedman 150.00, Starink 150.00 ± 0.01,
        // KAS 149.76, OFW 150.91 kJ/mol. Method definitions: Friedman, J. Polym. Sci. C 6 (1964) 183;
        // KAS as tabulated in Sci. Rep. 2019; Doyle, J. Appl. Polym. Sci. 6 (1962) 639;
        // Starink, Thermochim. Acta 404 (2003) 163.
        // Tolerance 0.02 kJ/mol: the values are given to 0.01 kJ/mol; T(α) is read to ~1e-3 K.
        assertEquals(150.00, e(IsoconversionalMethod.FRIEDMAN), 0.03);
        assertEquals(150.00, e(IsoconversionalMethod.STARINK), 0.02);
        assertEquals(149.76, e(IsoconversionalMethod.KAS), 0.02);
        assertEquals(150.91, e(IsoconversionalMethod.OFW), 0.02);
    }

    @Test
    void vyazovkinRecoversTheTrueEnergyAcrossTheRange() {
        // Vyazovkin's integral over the measured T(t) is exact for any single-step process
        // (Vyazovkin, J. Comput. Chem. 22 (2001) 178); noise-free recovery within 1 % (brief).
        IsoconversionalResult r = Isoconversional.compute(IsoconversionalMethod.VYAZOVKIN, curves, 0.95);
        double[] e = r.energyJPerMol();
        for (int g = 0; g < e.length; g++) {
            assertEquals(150e3, e[g], 1.5e3, "α = " + r.alpha()[g]);
        }
        assertEquals(150e3, r.energyAt(0.5), 50, "tight at α = 0.5");
    }

    @Test
    void friedmanAndStarinkRecoverTheTrueEnergyWithinOnePercentAcrossTheRange() {
        // Friedman is exact for any f(α) (Friedman 1964); Starink's 1.0008 / T^1.92 form is accurate
        // to about 0.1 % for E/RT ≈ 35 (Starink 2003, from memory, unconfirmed); brief asks 1 %.
        for (IsoconversionalMethod m : List.of(IsoconversionalMethod.FRIEDMAN, IsoconversionalMethod.STARINK)) {
            IsoconversionalResult r = Isoconversional.compute(m, curves, 0.95);
            double[] e = r.energyJPerMol();
            for (int g = 0; g < e.length; g++) {
                assertEquals(150e3, e[g], 1.5e3, m + " at α = " + r.alpha()[g]);
            }
        }
    }

    private static double e(IsoconversionalMethod m) {
        return Isoconversional.compute(m, curves, 0.95).energyAt(0.5) / 1e3;
    }

    private static int nearest(double[] g, double v) {
        int b = 0;
        for (int i = 1; i < g.length; i++) {
            if (Math.abs(g[i] - v) < Math.abs(g[b] - v)) {
                b = i;
            }
        }
        return b;
    }
}
