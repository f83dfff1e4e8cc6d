package org.exhale.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.exhale.kinetics.Polymer;
import org.exhale.kinetics.Product;
import org.exhale.kinetics.ReactionModel;
import org.exhale.transport.Ambient;
import org.exhale.transport.CapFilm;
import org.exhale.transport.GasTransport;
import org.junit.jupiter.api.Test;

/**
 * Scaling laws of the peak excess pressure in the Knudsen quasi-steady regime (vacuum ambient,
 * viscous flow checked negligible): Δp = G/K with K = (ε/τ) S (2r/3) v̄ /(R T h) (MODEL.md §5), so
 * Δp ∝ h, ∝ 1/(r S(r)), and ∝ M^−½ at a fixed mass of polymer (G ∝ 1/M, K ∝ M^−½) or ∝ M^½ at a
 * fixed molar release. The kinetics, and so the peak's time, are independent of the cap in this
 * regime, so the ratios are exact up to the viscous share (asserted below 1e-9): tolerance 1e-6.
 */
class KnudsenScalingTest {
    /** Viscous flow made negligible by a very viscous (fictitious) ambient, 0.9 Pa s. */
    private static final Ambient VACUUM = new Ambient(0, 0.9, 298.15, 101_325);
    private static final double TOL = 1e-6;

    private static BakeCase bake(CapFilm cap, Polymer polymer) {
        return TestCases.kineticsCase(polymer, TestCases.demoRecipe(), null).withCap(cap).withAmbient(VACUUM);
    }

    private static Polymer polymer(double molarMass, double diameter, double density) {
        return TestCases.singleComponent(new ReactionModel.NthOrder(1), 3e10, 150e3,
                new Product(molarMass, diameter, 1e-5), density);
    }

    /** Peak of one run, after checking it ran quasi-steadily with a negligible viscous share. */
    private static Extremum peak(BakeCase bake) {
        BakeResult r = BakeSimulator.simulate(bake);
        CornerResult c = r.corners().get(0);
        assertEquals(GasRegime.QUASI_STEADY, c.regime());
        Extremum p = c.peakPressure();
        double temp = c.atMaximum().get("excess_pressure_Pa")[c.column("wafer_K")];
        GasTransport t = new GasTransport(bake.cap(), bake.ambient(),
                List.of(bake.polymer().component(0).product()));
        double share = t.viscousConductance(temp, p.value()) / t.permeance(0, temp);
        assertTrue(p.value() > 0 && share < 1e-9, "peak " + p.value() + " Pa, viscous/diffusive " + share);
        return p;
    }

    @Test
    void peakPressureIsProportionalToCapThickness() {
        Polymer poly = polymer(0.05, 0.4e-9, 1150);
        CapFilm cap = CapFilm.porous(100e-9, 0.3, 2e-9);
        Extremum p1 = peak(bake(cap, poly));
        Extremum p3 = peak(bake(cap.withThickness(300e-9), poly));
        System.out.printf("thickness ×3: peak ratio %.12f%n", p3.value() / p1.value());
        assertEquals(3, p3.value() / p1.value(), 3 * TOL);
        assertEquals(p1.timeS(), p3.timeS(), 1e-6 * p1.timeS());
    }

    @Test
    void peakPressureIsInverseToPoreRadiusTimesStericFactor() {
        // a product of 0.4 nm: S = (1 − 0.4/(2r))², so the Knudsen-only law Δp ∝ 1/r is corrected by 1/S
        Polymer poly = polymer(0.05, 0.4e-9, 1150);
        CapFilm cap = CapFilm.porous(100e-9, 0.3, 1e-9);
        double r1 = 1e-9;
        double r2 = 2.5e-9;
        Extremum p1 = peak(bake(cap, poly));
        Extremum p2 = peak(bake(cap.withPoreRadius(r2), poly));
        double s1 = Math.pow(1 - 0.4e-9 / (2 * r1), 2);
        double s2 = Math.pow(1 - 0.4e-9 / (2 * r2), 2);
        double expected = (r2 * s2) / (r1 * s1);
        System.out.printf("pore radius ×2.5: peak ratio %.12f, expected %.12f%n", p1.value() / p2.value(), expected);
        assertEquals(expected, p1.value() / p2.value(), expected * TOL);

        // a vanishingly small molecule (S = 1 − 1e-6): plain 1/r
        Polymer small = polymer(0.05, 1e-15, 1150);
        double q = peak(bake(cap, small)).value() / peak(bake(cap.withPoreRadius(r2), small)).value();
        assertEquals(2.5, q, 2.5 * TOL);
    }

    @Test
    void peakPressureScalesWithTheSquareRootOfMolarMass() {
        CapFilm cap = CapFilm.porous(100e-9, 0.3, 2e-9);
        // fixed mass of polymer: G ∝ 1/M, K ∝ M^−½ → Δp ∝ M^−½
        double fixedMass = peak(bake(cap, polymer(0.2, 1e-15, 1150))).value()
                / peak(bake(cap, polymer(0.05, 1e-15, 1150))).value();
        System.out.printf("M ×4 at fixed mass: peak ratio %.12f%n", fixedMass);
        assertEquals(0.5, fixedMass, 0.5 * TOL);
        // fixed molar release (density ∝ M, so m0/M is the same): Δp ∝ M^½
        double fixedMoles = peak(bake(cap, polymer(0.2, 1e-15, 2000))).value()
                / peak(bake(cap, polymer(0.05, 1e-15, 500))).value();
        System.out.printf("M ×4 at fixed moles: peak ratio %.12f%n", fixedMoles);
        assertEquals(2, fixedMoles, 2 * TOL);
    }
}
