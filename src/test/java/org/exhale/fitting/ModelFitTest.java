package org.exhale.fitting;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.exhale.kinetics.ReactionModel;
import org.junit.jupiter.api.Test;

/**
 * Model-fit recovery on runs integrated independently by {@link SyntheticTga} (Dormand–Prince at
 * rtol 1e-12), common practice, no source: a fit must return the parameters the data were made with.
 */
class ModelFitTest {
    static final long SEED = 20240611L;

    static List<ConversionCurve> mixture(double noise, long seed) {
        System.out.println("ModelFitTest noise seed " + seed);
        Random rnd = new Random(seed);
        List<SyntheticTga.Part> parts = List.of(
                new SyntheticTga.Part(0.4, 1e12, 150e3, new ReactionModel.NthOrder(1)),
                new SyntheticTga.Part(0.6, 1.7e13, 175e3, new ReactionModel.NthOrder(1)));
        List<ConversionCurve> curves = new ArrayList<>();
        for (double b : new double[] {2, 5, 10, 20}) {
            TgaRun run = SyntheticTga.run("b" + b, parts, b, 400, 700, 0.1, 1e-4, noise, rnd);
            curves.add(Conversion.of(run, AnalysisOptions.DEFAULT));
        }
        return curves;
    }

    @Test
    void twoComponentMixtureIsRecoveredAndTheCriteriaPickTwo() {
        List<ConversionCurve> curves = mixture(2e-4, SEED);
        IsoconversionalResult friedman = Isoconversional.compute(IsoconversionalMethod.FRIEDMAN, curves, 0.95);
        ModelFitResult one = ModelFit.fit(curves, ModelFitOptions.of(1, ModelKind.NTH_ORDER), friedman);
        ModelFitResult two = ModelFit.fit(curves, ModelFitOptions.of(2, ModelKind.NTH_ORDER), friedman);
        assertTrue(two.bic() < one.bic(), "BIC prefers 2: " + two.bic() + " vs " + one.bic());
        assertTrue(two.aic() < one.aic(), "AIC prefers 2");
        FittedComponent c1 = two.components().get(0), c2 = two.components().get(1);
        assertEquals(150e3, c1.energyJPerMol(), 0.01 * 150e3);
        assertEquals(175e3, c2.energyJPerMol(), 0.01 * 175e3);
        assertEquals(0.4, c1.fraction(), 0.01);
        assertEquals(1.0, c1.shape()[0], 0.03);
        assertEquals(1.0, c2.shape()[0], 0.03);
        assertEquals(Math.log(1e12), c1.lnPreExponential(), 0.3);
        assertEquals(Math.log(1.7e13), c2.lnPreExponential(), 0.3);
        // Noise 2e-4 in α: the rms residual must come out near it.
        assertEquals(2e-4, two.rms(), 0.3e-4);
        // The true value inside the reported interval (independent noise, 95 %).
        assertTrue(Math.abs(c1.energyJPerMol() - 150e3) < 1.5 * c1.energyHalfWidthJPerMol() + 1,
                "E1 " + c1.energyJPerMol() + " ± " + c1.energyHalfWidthJPerMol());
        assertTrue(Math.abs(c2.energyJPerMol() - 175e3) < 1.5 * c2.energyHalfWidthJPerMol() + 1,
                "E2 " + c2.energyJPerMol() + " ± " + c2.energyHalfWidthJPerMol());
    }

    @Test
    void noiseFreeSingleComponentIsRecoveredForEachClosedFormModel() {
        Object[][] cases = {
            {new ReactionModel.NthOrder(1.5), ModelKind.NTH_ORDER, 1.5},
            {new ReactionModel.AvramiErofeev(2), ModelKind.AVRAMI_EROFEEV, 2.0},
            {new ReactionModel.RandomScission(), ModelKind.RANDOM_SCISSION, Double.NaN},
        };
        for (Object[] c : cases) {
            List<ConversionCurve> curves = new ArrayList<>();
            for (double b : new double[] {2, 5, 10, 20}) {
                TgaRun run = SyntheticTga.run("b" + b, List.of(new SyntheticTga.Part(1, 1e12, 150e3, (ReactionModel) c[0])),
                        b, 400, 700, 0.1, 1e-4, 0, null);
                curves.add(Conversion.of(run, AnalysisOptions.DEFAULT));
            }
            IsoconversionalResult friedman = Isoconversional.compute(IsoconversionalMethod.FRIEDMAN, curves, 0.95);
            ModelFitResult fit = ModelFit.fit(curves, ModelFitOptions.of(1, (ModelKind) c[1]), friedman);
            FittedComponent f = fit.components().get(0);
            assertEquals(150e3, f.energyJPerMol(), 0.01 * 150e3, c[1].toString());
            if (!Double.isNaN((double) c[2])) {
                assertEquals((double) c[2], f.shape()[0], 0.02 * (double) c[2], c[1].toString());
            }
        }
    }
}
