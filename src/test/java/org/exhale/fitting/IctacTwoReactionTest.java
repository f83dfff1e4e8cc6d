package org.exhale.fitting;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;

import java.util.ArrayList;
import java.util.List;
import org.exhale.kinetics.ReactionModel;
import org.junit.jupiter.api.Test;

/**
 * The two parallel reactions of the ICTAC 2000 kinetics project (Brown et al., Thermochim. Acta 355
 * (2000) 125). Parameters from a secondary source (the original was not seen): A1 = 1e10 1/min,
 * E1 = 80 kJ/mol; A2 = 1e15 1/min, E2 = 120 kJ/mol; equal weights; first order. The heating rates
 * (1, 2, 4, 8, 16 K/min), the range 260–700 K (from where the first reaction has not started, α < 1e-6) and the 1,000 samples per run are our choice. Runs
 * integrated independently by {@link SyntheticTga} (Dormand–Prince, rtol 1e-12). The brief asks
 * for recovery within 1 %.
 */
class IctacTwoReactionTest {
    @Test
    void ictac2000TwoParallelReactionsAreRecoveredWithinOnePercent() {
        double a1 = 1e10 / 60, a2 = 1e15 / 60; // 1/min → 1/s
        List<SyntheticTga.Part> parts = List.of(new SyntheticTga.Part(0.5, a1, 80e3, new ReactionModel.NthOrder(1)),
                new SyntheticTga.Part(0.5, a2, 120e3, new ReactionModel.NthOrder(1)));
        List<TgaRun> runs = new ArrayList<>();
        for (double b : new double[] {1, 2, 4, 8, 16}) {
            runs.add(SyntheticTga.artefacts("b" + b, parts, b, 260, 700, (440 / (b / 60)) / 1000, 0, 0, 0, null));
        }
        KineticsReport r = KineticsAnalysis.run(runs, AnalysisOptions.DEFAULT, Pretreatment.DEFAULT,
                ModelFitOptions.of(1, ModelKind.NTH_ORDER), true, s -> { });
        assertNotNull(r.chosen(), r.failures().toString());
        assertEquals(2, r.chosen().components().size(), r.verdicts().toString());
        FittedComponent c1 = r.chosen().components().get(0), c2 = r.chosen().components().get(1);
        assertEquals(80e3, c1.energyJPerMol(), 0.01 * 80e3, "E1");
        assertEquals(120e3, c2.energyJPerMol(), 0.01 * 120e3, "E2");
        assertEquals(a1, c1.preExponentialPerS(), 0.01 * a1, "A1");
        assertEquals(a2, c2.preExponentialPerS(), 0.01 * a2, "A2");
        assertEquals(0.5, c1.fraction(), 0.005, "w1");
        assertEquals(1.0, c1.shape()[0], 0.01, "n1");
        assertEquals(1.0, c2.shape()[0], 0.01, "n2");
    }

    @Test
    void sestakBerggrenTableAgreesWithDirectIntegration() {
        // Truth: one Šesták–Berggren component m = 0.5, n = 1.5, E = 150 kJ/mol, A = 1e12 1/s, made by
        // Dormand–Prince on dα/dt (independent of the fitter's logit table). Common practice, no source.
        List<SyntheticTga.Part> parts = List.of(new SyntheticTga.Part(1, 1e12, 150e3, new ReactionModel.SestakBerggren(0.5, 1.5)));
        List<ConversionCurve> curves = new ArrayList<>();
        for (double b : new double[] {2, 5, 10, 20}) {
            curves.add(Conversion.of(SyntheticTga.run("b" + b, parts, b, 380, 700, 0.25, 1e-4, 0, null), AnalysisOptions.DEFAULT));
        }
        IsoconversionalResult seed = Isoconversional.compute(IsoconversionalMethod.FRIEDMAN, curves, 0.95);
        ModelFitResult f = ModelFit.fit(curves, ModelFitOptions.of(1, ModelKind.SESTAK_BERGGREN), seed);
        FittedComponent c = f.components().get(0);
        assertEquals(150e3, c.energyJPerMol(), 0.005 * 150e3);
        assertEquals(0.5, c.shape()[0], 0.01);
        assertEquals(1.5, c.shape()[1], 0.015);
    }
}
