package org.exhale.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.exhale.PhysicalConstants;
import org.exhale.kinetics.Component;
import org.exhale.kinetics.Polymer;
import org.exhale.kinetics.Product;
import org.exhale.kinetics.ReactionModel;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.junit.jupiter.api.Test;

/** The well-mixed purged chamber of MODEL.md §8 against its closed forms. */
class ChamberBalanceTest {

    @Test
    void standardFlowConversion() {
        // 1 sccm = p V/(R T) at 0 °C, 1 atm, 1 cm³/min: 7.436e-7 mol/s (ideal-gas law, common practice)
        assertEquals(7.436e-7, PhysicalConstants.MOL_PER_S_PER_SCCM, 5e-11);
    }

    /**
     * A release that is constant to 4e-6 (a first-order component far below its decomposition
     * temperature, held isothermally: Q ∝ 1 − α with α < 4e-6) into a purged chamber follows
     * y(t) = Q/(F + Q) (1 − exp(−t/τ)), τ = (p V/(R T))/(F + Q) — the first-order step response of a
     * well-mixed vessel (common practice, no source).
     */
    @Test
    void constantReleaseFollowsTheFirstOrderStepResponse() {
        double t = TestCases.c(200);
        double kRate = 1e-9;   // per second: α stays below 4e-6 over the hold
        Polymer polymer = new Polymer(1150, 0.02, List.of(new Component("slow", 1, new ReactionModel.NthOrder(1),
                kRate * Math.exp(150e3 / (PhysicalConstants.GAS_CONSTANT * t)), 150e3, 0,
                new Product(0.1, 0.5e-9, 1e-5))), Polymer.DEFAULT_SEED);
        Chamber chamber = new Chamber(25, 0.3, 0.6, 0.5, 0.06, TestCases.c(250), 101_325,
                10 * 1000 * PhysicalConstants.MOL_PER_S_PER_SCCM, Double.NaN, "");
        BakeCase bake = TestCases.porousLine().withPolymer(polymer).withChamber(chamber)
                .withRecipe(new Recipe(t, List.of(new Step.Hold(4000))));
        BakeResult r = BakeSimulator.simulate(bake, SimulationSettings.defaults().withSampleInterval(50).withTolerance(1e-10));
        CornerResult c = r.corners().get(0);
        double n0 = 1150 * 200e-9 / 0.1;
        double q = chamber.ventAreaM2() * n0 * kRate;          // mol/s
        double f = chamber.purgeMolPerS();
        double tau = chamber.gasMoles() / (f + q);
        int ppm = c.column("chamber_ppm");
        int load = c.column("chamber_load_sccm");
        for (double[] row : c.history()) {
            double expected = 1e6 * q / (f + q) * (1 - Math.exp(-row[0] / tau));
            // tolerance: release constant to 4e-6 relative, integrator tolerances well below
            assertEquals(expected, row[ppm], 1e-5 * 1e6 * q / (f + q), "t = " + row[0]);
            assertEquals(q / PhysicalConstants.MOL_PER_S_PER_SCCM, row[load], 1e-5 * q / PhysicalConstants.MOL_PER_S_PER_SCCM);
        }
        // steady state Q/(F + Q), approached to 1e-9 after twenty time constants
        double[] last = c.history().get(c.history().size() - 1);
        assertTrue(last[0] > 20 * tau);
        assertEquals(1e6 * q / (f + q), last[ppm], 1e-5 * 1e6 * q / (f + q));
    }

    @Test
    void evolvedEqualsExhaustedPlusHeldInBothRegimes() {
        Chamber chamber = new Chamber(25, 0.3, 0.6, 0.5, 0.06, TestCases.c(250), 101_325,
                10 * 1000 * PhysicalConstants.MOL_PER_S_PER_SCCM, 1e-3, "1000 ppm");
        for (BakeCase bake : new BakeCase[]{TestCases.porousLine().withChamber(chamber),
                                            TestCases.denseDisc().withChamber(chamber)}) {
            BakeResult r = BakeSimulator.simulate(bake);
            for (CornerResult c : r.corners()) {
                double[] last = c.history().get(c.history().size() - 1);
                double evolved = last[c.column("evolved_mol")];
                double balance = Math.abs(evolved - last[c.column("chamber_mol")] - last[c.column("exhausted_mol")]) / evolved;
                assertTrue(balance < 1e-8, bake.name() + " " + c.regime() + ": chamber balance " + balance);
            }
            assertTrue(r.margin("chamber") != null, "the chamber limit is reported as a margin");
        }
    }
}
