package org.exhale.kinetics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Conversion functions f(α) of MODEL.md §3. */
class ReactionModelTest {

    @Test
    void randomScissionPeaksAtHalfWhereAQuarterIsConverted() {
        // Sánchez-Jiménez et al., Polym. Degrad. Stab. 95 (2010) 733: random scission with L = 2,
        // f(α) = 2(α^½ − α), maximum 0.5 at α = 0.25 (CHECKS.md C/M). Exact in binary: 1e-15.
        ReactionModel f = new ReactionModel.RandomScission();
        assertEquals(0.5, f.f(0.25), 1e-15);
        double best = 0;
        double at = -1;
        for (int i = 0; i <= 100_000; i++) {
            double a = i / 100_000.0;
            double v = f.f(a);
            assertTrue(v <= 0.5 + 1e-15, "f(" + a + ") = " + v);
            if (v > best) {
                best = v;
                at = a;
            }
        }
        // grid maximum on a 1e-5 grid: within one grid step of 0.25
        assertEquals(0.25, at, 1e-5);
        assertEquals(0, f.f(0), 0);
        assertEquals(0, f.f(1), 0);
        assertTrue(f.needsSeed());
    }

    @Test
    void nthOrderAndSestakBerggrenFollowTheirFormulas() {
        // MODEL.md §3 definitions (common practice, no source); rounding only: 1e-15.
        assertEquals(0.7, new ReactionModel.NthOrder(1).f(0.3), 1e-15);
        assertEquals(0.49, new ReactionModel.NthOrder(2).f(0.3), 1e-15);
        assertEquals(Math.pow(0.3, 0.5) * Math.pow(0.7, 1.5), new ReactionModel.SestakBerggren(0.5, 1.5).f(0.3), 1e-15);
        assertFalse(new ReactionModel.NthOrder(1.5).needsSeed());
        assertFalse(new ReactionModel.SestakBerggren(0, 1).needsSeed());
        assertTrue(new ReactionModel.SestakBerggren(0.5, 1).needsSeed());
    }

    @Test
    void avramiErofeevFollowsItsFormula() {
        // f = n (1−α)(−ln(1−α))^(1−1/n), MODEL.md §3 (common practice, no source); rounding only.
        ReactionModel f = new ReactionModel.AvramiErofeev(2);
        double a = 0.4;
        assertEquals(2 * 0.6 * Math.sqrt(-Math.log(0.6)), f.f(a), 1e-15);
        assertEquals(0.6, new ReactionModel.AvramiErofeev(1).f(a), 1e-15);
        assertTrue(new ReactionModel.AvramiErofeev(2).needsSeed());
        assertEquals(Double.POSITIVE_INFINITY, new ReactionModel.AvramiErofeev(0.5).f(0));
    }

    @Test
    void everyModelStopsAtFullConversion() {
        // MODEL.md §3: f = 0 for α ≥ 1.
        ReactionModel[] models = {new ReactionModel.NthOrder(0.5), new ReactionModel.SestakBerggren(1, 0.5),
                new ReactionModel.AvramiErofeev(3), new ReactionModel.AvramiErofeev(0.7), new ReactionModel.RandomScission()};
        for (ReactionModel m : models) {
            assertEquals(0, m.f(1), 0, m.toString());
            assertEquals(0, m.f(1.2), 0, m.toString());
            assertTrue(m.f(0.5) > 0, m.toString());
        }
    }

    @Test
    void arrheniusRateConstantAndItsInverse() {
        // k = A exp(−E/(R T)), R = 8.314462618 (CODATA 2018); rounding only: 1e-13 relative.
        Component c = new Component("x", 1, new ReactionModel.NthOrder(1), 1e12, 150e3, 0, new Product(0.05, 0.4e-9, 1e-5));
        double k = 1e12 * Math.exp(-150e3 / (8.314462618 * 550));
        assertEquals(k, c.rateConstant(550), 1e-13 * k);
        assertEquals(550, c.temperatureForRateConstant(k), 1e-9);
    }
}
