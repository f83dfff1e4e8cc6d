package org.exhale.fitting;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.exhale.kinetics.ReactionModel;
import org.junit.jupiter.api.Test;

/**
 * The component count and E per component on runs with the artefacts of real balances, generated
 * by {@link SyntheticTga#artefacts} (Dormand–Prince at rtol 1e-12, independent of the fitter).
 * Truths (our invention, common practice, no source):
 * <ul>
 *   <li>ONE: a single first-order component, E = 150 kJ/mol, A = 1e12 1/s;</li>
 *   <li>TWO: 40 % first order E = 150 kJ/mol, A = 1e12 1/s and 60 % first order E = 175 kJ/mol,
 *       A = 1.7e13 1/s (the demo polymer);</li>
 *   <li>WET: 3 % water (first order, E = 50 kJ/mol, A = 1.2e5 1/s, gone below ~160 °C) on ONE.</li>
 * </ul>
 * Heating rates 2, 5, 10 and 20 K/min, 1,000 samples per run unless stated. Tolerances are stated
 * at each check; the measured values they were set from are in the comments.
 */
class ArtefactRunsTest {
    static final List<SyntheticTga.Part> ONE = List.of(new SyntheticTga.Part(1, 1e12, 150e3, new ReactionModel.NthOrder(1)));
    static final List<SyntheticTga.Part> TWO = List.of(new SyntheticTga.Part(0.4, 1e12, 150e3, new ReactionModel.NthOrder(1)),
            new SyntheticTga.Part(0.6, 1.7e13, 175e3, new ReactionModel.NthOrder(1)));
    static final List<SyntheticTga.Part> WET = List.of(new SyntheticTga.Part(0.03, 1.2e5, 50e3, new ReactionModel.NthOrder(1)),
            new SyntheticTga.Part(0.97, 1e12, 150e3, new ReactionModel.NthOrder(1)));
    static final double[] RATES = {2, 5, 10, 20};

    static KineticsReport analyse(List<SyntheticTga.Part> parts, double t0, double t1, double dt, double lag,
                                  double drift, double noise, long seed, Pretreatment pre) {
        Random rnd = new Random(seed);
        List<TgaRun> runs = new ArrayList<>();
        for (double b : RATES) {
            double duration = (t1 - t0) / (b / 60);
            runs.add(SyntheticTga.artefacts("b" + b, parts, b, t0, t1, dt > 0 ? dt : duration / 1000, lag, drift,
                    noise, rnd));
        }
        return KineticsAnalysis.run(runs, AnalysisOptions.DEFAULT, pre, ModelFitOptions.of(1, ModelKind.NTH_ORDER), true,
                s -> { });
    }

    static void assertOne(KineticsReport r, double tolerance, String what) {
        assertNotNull(r.chosen(), what + ": " + r.failures());
        assertEquals(1, r.chosen().components().size(), what + ": " + r.verdicts());
        assertEquals(150e3, r.chosen().components().get(0).energyJPerMol(), tolerance * 150e3, what);
        assertTrue(r.chosen().components().get(0).fraction() >= 0.01);
    }

    @Test
    void preciseSingleComponentStaysOne() {
        // Truth ONE, no noise: the old criterion picked 3 with two empty components. Measured E 150.00.
        assertOne(analyse(ONE, 380, 660, 0, 0, 0, 0, 1, Pretreatment.DEFAULT), 0.005, "precise");
    }

    @Test
    void buoyancyDriftIsCorrectedAndStaysOne() {
        // Truth ONE with a drift of +1 % of the mass over 500 K. Measured E 150.00 ± 0.05.
        KineticsReport r = analyse(ONE, 380, 660, 0, 0, 0.01, 0, 2, Pretreatment.DEFAULT);
        assertOne(r, 0.01, "drift");
        assertTrue(r.warnings().stream().anyMatch(w -> w.contains("final plateau slopes")), r.warnings().toString());
    }

    @Test
    void moistureIsCutOffAndStaysOne() {
        // Truth WET from 30 °C: 3 % water, then ONE. Measured E 150.00.
        KineticsReport r = analyse(WET, 303, 660, 0, 0, 0, 0, 3, Pretreatment.DEFAULT);
        assertOne(r, 0.01, "moisture");
        assertTrue(r.warnings().stream().anyMatch(w -> w.contains("early separate mass-loss step of 3.0 %")),
                r.warnings().toString());
    }

    @Test
    void twoComponentsWithNoiseOfOneTenthAndOnePercent() {
        // Truth TWO. Noise 0.1 % of the mass: measured E 149.9 ± 1.2 / 175.1 ± 0.6, fractions 0.399 / 0.601.
        // Noise 1 %: measured E 149.2 ± 11.9 / 176.0 ± 6.1, fractions 0.395 / 0.605.
        double[][] cases = {{1e-3, 0.01, 0.01}, {1e-2, 0.03, 0.04}};
        for (double[] c : cases) {
            KineticsReport r = analyse(TWO, 400, 700, 0, 0, 0, c[0], 4, Pretreatment.DEFAULT);
            String what = "noise " + c[0] + " seed 4: " + r.verdicts();
            assertNotNull(r.chosen(), what);
            assertEquals(2, r.chosen().components().size(), what);
            FittedComponent a = r.chosen().components().get(0), b = r.chosen().components().get(1);
            assertEquals(150e3, a.energyJPerMol(), c[1] * 150e3, what);
            assertEquals(175e3, b.energyJPerMol(), c[1] * 175e3, what);
            assertEquals(0.4, a.fraction(), c[2], what);
        }
    }

    @Test
    void thirtySecondSamplingStaysOneAndIsWarned() {
        // Truth ONE sampled every 30 s (8 samples across the reaction at 20 K/min). Measured E 150.00.
        KineticsReport r = analyse(ONE, 380, 660, 30, 0, 0, 0, 5, Pretreatment.DEFAULT);
        assertOne(r, 0.01, "30 s");
        assertTrue(r.warnings().stream().anyMatch(w -> w.contains("samples across the reaction")), r.warnings().toString());
    }

    @Test
    void tenSecondLagWithAndWithoutCorrection() {
        // Truth ONE, the sample lagging the recorded temperature by τ = 10 s. Without --lag every
        // method reads E low (measured 140.7 ± 10.9 kJ/mol, −6.2 %, the interval still covering 150)
        // but no component is invented and the residuals are flagged; with --lag 10 s the truth
        // comes back (measured 150.00).
        KineticsReport raw = analyse(ONE, 380, 660, 0, 10, 0, 0, 6, Pretreatment.DEFAULT);
        assertOne(raw, 0.08, "lag, uncorrected");
        assertTrue(raw.warnings().stream().anyMatch(w -> w.contains("strongly correlated")), raw.warnings().toString());
        KineticsReport fixed = analyse(ONE, 380, 660, 0, 10, 0, 0, 6,
                new Pretreatment(Double.NaN, Double.NaN, false, 10, true));
        assertOne(fixed, 0.005, "lag, corrected");
    }
}
