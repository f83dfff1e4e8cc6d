package org.exhale.simulation;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Random;
import java.util.stream.IntStream;
import java.util.stream.Stream;

import org.exhale.io.HistoryCsvWriter;
import org.exhale.io.SummaryJsonWriter;
import org.exhale.kinetics.Component;
import org.exhale.kinetics.Polymer;
import org.exhale.kinetics.Product;
import org.exhale.kinetics.ReactionModel;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.exhale.transport.Ambient;
import org.exhale.transport.CapFilm;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Property test over the extremes engineers can type: activation energies 50–400 kJ/mol, pore
 * radii 0.3–500 nm, porosity 0–0.9, cap thickness 10 nm–10 µm, ramps 0.1–100 K/min, nitrogen at
 * 1 atm and vacuum. Every case either completes with finite results and a closed mass balance, or
 * stops with a clear IllegalArgumentException; no NaN or infinity reaches an output file.
 * (Common practice, no source.)
 */
class ExtremePhysicsPropertyTest {
    private static final long SEED = 7_340_911L;

    static Stream<Integer> cases() {
        return IntStream.range(0, 60).boxed();
    }

    @ParameterizedTest(name = "case {0}")
    @MethodSource("cases")
    void completesFiniteOrStopsClearly(int index) {
        Random rnd = new Random(SEED + index);
        double ea = 50e3 + rnd.nextDouble() * 350e3;
        // the temperature at which k = 1e-3 /s sits between 200 and 450 C, so that something happens
        double tHalf = 473.15 + rnd.nextDouble() * 250;
        double a = 1e-3 * Math.exp(ea / (8.314462618 * tHalf));
        double porosity = rnd.nextDouble() < 0.15 ? 0 : rnd.nextDouble() * 0.9;
        double radius = Math.exp(Math.log(0.3e-9) + rnd.nextDouble() * Math.log(500e-9 / 0.3e-9));
        double thickness = Math.exp(Math.log(10e-9) + rnd.nextDouble() * Math.log(10e-6 / 10e-9));
        double rate = Math.exp(Math.log(0.1) + rnd.nextDouble() * Math.log(100.0 / 0.1)) / 60;
        boolean vacuum = rnd.nextBoolean();
        double pi0 = porosity == 0 ? Math.pow(10, -17 + 4 * rnd.nextDouble()) : 0;
        String what = String.format(java.util.Locale.ROOT,
                "seed %d case %d: Ea %.0f kJ/mol, eps %.3f, r %.3g nm, h %.3g nm, ramp %.3g K/min, %s, Pi0 %.2g",
                SEED, index, ea / 1e3, porosity, radius * 1e9, thickness * 1e9, rate * 60, vacuum ? "vacuum" : "1 atm", pi0);
        ReactionModel model = switch (index % 4) {
            case 0 -> new ReactionModel.NthOrder(0.5 + rnd.nextDouble() * 1.5);
            case 1 -> new ReactionModel.RandomScission();
            case 2 -> new ReactionModel.AvramiErofeev(0.5 + rnd.nextDouble() * 2.5);
            default -> new ReactionModel.SestakBerggren(rnd.nextDouble(), 0.5 + rnd.nextDouble());
        };
        BakeResult r;
        try {
            Polymer polymer = new Polymer(1100, 0.02, List.of(new Component("p", 1, model, a, ea, 0,
                    new Product(0.08, 0.5e-9, 1e-5))), Polymer.DEFAULT_SEED);
            BakeCase bake = TestCases.porousLine().withPolymer(polymer)
                    .withCap(new CapFilm(thickness, porosity, porosity > 0 ? radius : 0, Double.NaN, pi0, 10e3))
                    .withAmbient(new Ambient(vacuum ? 0 : 101_325, 3e-5, 298.15, 101_325))
                    .withRecipe(new Recipe(423.15, List.of(new Step.Ramp(673.15, rate), new Step.Hold(3600))));
            r = BakeSimulator.simulate(bake, SimulationSettings.defaults().withSampleInterval(120));
        } catch (IllegalArgumentException e) {
            assertTrue(e.getMessage() != null && !e.getMessage().isBlank() && !e.getMessage().contains("\n"),
                    what + ": unclear message " + e.getMessage());
            return;
        }
        for (CornerResult c : r.corners()) {
            assertTrue(Double.isFinite(c.finalUnconverted()) && c.finalUnconverted() >= 0 && c.finalUnconverted() <= 1, what);
            // gasified against a quadrature of the vent flux (Simpson over the Rosenbrock method's quadratic
            // dense output in the full-gas regime): measured up to 1.2e-6 over this sweep, so 1e-5
            assertTrue(c.massBalanceError() < 1e-5, what + ": mass balance " + c.massBalanceError());
            double peak = c.peakPressure().value();
            assertTrue(peak >= 0 && !Double.isNaN(peak), what + ": peak " + peak);
        }
        String csv = HistoryCsvWriter.write(r);
        String json = SummaryJsonWriter.toJson(SummaryJsonWriter.summary(r, List.of()));
        for (String bad : new String[]{"NaN", "Infinity"}) {
            assertTrue(!csv.contains(bad) && !json.contains(bad), what + ": " + bad + " in an output file");
        }
    }
}
