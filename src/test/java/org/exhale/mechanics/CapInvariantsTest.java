package org.exhale.mechanics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

/** Invariants, allowed values and input checks (common practice, no source, unless noted). */
class CapInvariantsTest {

    private static final long SEED = 20240611L;

    @Test
    void noLoadNoMismatchNoIntrinsicStressGivesNoStress() {
        FilmProperties f = FilmProperties.elastic(70e9, 0.2, 1e-6, 600, 0);
        for (SpanGeometry span : new SpanGeometry[] {SpanGeometry.line(10e-6), SpanGeometry.disc(10e-6),
                SpanGeometry.rectangle(10e-6, 20e-6)}) {
            CapResponse r = new CapStructure(f, 0.2e-6, span, CapStructure.SILICON_CTE_PER_K,
                    MechanicalLimits.withSafetyFactor(2)).evaluate(600, 0);
            assertEquals(0, r.thermalStressPa(), 0);
            assertEquals(0, r.edgeStressPa(), 0);
            assertEquals(0, r.deflectionM(), 0);
            assertEquals(0, r.channelCrackingJPerM2(), 0);
            assertEquals(0, r.delaminationJPerM2(), 0);
            assertEquals(0, r.bucklingCompressionPa(), 0);
        }
    }

    @Test
    void edgeStressGrowsWithPressureRandomised() {
        Random random = new Random(SEED);
        SpanGeometry.Shape[] shapes = SpanGeometry.Shape.values();
        for (int trial = 0; trial < 300; trial++) {
            double w = 1e-6 * Math.pow(10, 2 * random.nextDouble());          // 1–100 µm
            double h = w * (0.002 + 0.1 * random.nextDouble());
            SpanGeometry.Shape shape = shapes[random.nextInt(shapes.length)];
            SpanGeometry span = switch (shape) {
                case LINE -> SpanGeometry.line(w);
                case DISC -> SpanGeometry.disc(w);
                case RECTANGLE -> SpanGeometry.rectangle(w, w * (1 + 4 * random.nextDouble()));
            };
            FilmProperties f = FilmProperties.elastic(1e9 + 200e9 * random.nextDouble(), 0.4 * random.nextDouble(),
                    1e-5 * random.nextDouble(), 400 + 400 * random.nextDouble(), 4e8 * (random.nextDouble() - 0.5));
            CapStructure c = new CapStructure(f, h, span, CapStructure.SILICON_CTE_PER_K,
                    MechanicalLimits.withSafetyFactor(1));
            double t = 300 + 500 * random.nextDouble();
            double p1 = Math.pow(10, 7 * random.nextDouble());
            double p2 = p1 * (1 + random.nextDouble());
            double sign = random.nextBoolean() ? 1 : -1;
            double s1 = c.evaluate(t, sign * p1).maxStressPa();
            double s2 = c.evaluate(t, sign * p2).maxStressPa();
            String where = "seed " + SEED + ", trial " + trial + ": " + span + ", p " + sign * p1 + " -> " + sign * p2;
            assertTrue(s2 >= s1 * (1 - 1e-9), where + ": edge stress fell from " + s1 + " to " + s2);
            assertTrue(s1 >= c.thermalStressPa(t) - 1e-6 * Math.abs(c.thermalStressPa(t)), where + ": pressure lowered the edge stress");
            assertEquals(c.evaluate(t, sign * p1).maxStressPa(), c.edgeStressPa(t, sign * p1), 0, where);
            double d = c.evaluate(t, sign * p1).deflectionM();
            assertEquals(d, c.deflectionM(t, sign * p1), 1e-12 * Math.abs(d), where + ": the two deflection paths agree");
        }
    }

    @Test
    void allowedValuesAreInputsOverSafetyFactor() {
        FilmProperties f = FilmProperties.elastic(70e9, 0.2, 1e-6, 600, 0).withFracture(300e6, 4.0, 2.5);
        CapStructure c = new CapStructure(f, 0.2e-6, SpanGeometry.line(10e-6), CapStructure.SILICON_CTE_PER_K,
                new MechanicalLimits(1.5, 0.3e-6));
        assertEquals(300e6 / 1.5, c.allowedStressPa(), 1e-6);
        assertEquals(4.0 / 1.5, c.allowedCrackingJPerM2(), 1e-15);
        assertEquals(2.5 / 1.5, c.allowedDelaminationJPerM2(), 1e-15);
        assertEquals(0.3e-6, c.maxDeflectionM(), 0);
        CapStructure unchecked = new CapStructure(FilmProperties.elastic(70e9, 0.2, 1e-6, 600, 0), 0.2e-6,
                SpanGeometry.line(10e-6), CapStructure.SILICON_CTE_PER_K, MechanicalLimits.withSafetyFactor(3));
        assertEquals(Double.POSITIVE_INFINITY, unchecked.allowedStressPa());
        assertEquals(Double.POSITIVE_INFINITY, unchecked.allowedCrackingJPerM2());
        assertEquals(Double.POSITIVE_INFINITY, unchecked.allowedDelaminationJPerM2());
        assertEquals(Double.POSITIVE_INFINITY, unchecked.maxDeflectionM());
    }

    @Test
    void dominantTermIsTheLargestContribution() {
        FilmProperties f = FilmProperties.elastic(70e9, 0.2, CapStructure.SILICON_CTE_PER_K, 600, 100e6);
        // thick cap, small pressure: intrinsic stress dominates
        CapStructure thick = new CapStructure(f, 1e-6, SpanGeometry.line(10e-6), CapStructure.SILICON_CTE_PER_K,
                MechanicalLimits.withSafetyFactor(1));
        assertEquals(EdgeTerm.THERMAL, thick.evaluate(500, 1e3).dominantTerm());
        // thick cap, large pressure: bending dominates (σ_b ≈ (1/2) Δp (w/h)² = 500 MPa)
        CapResponse bent = thick.evaluate(500, 10e6);
        assertEquals(EdgeTerm.BENDING, bent.dominantTerm());
        assertTrue(bent.bendingStressPa() > bent.membraneStressPa() && bent.bendingStressPa() > 100e6);
        // thin cap, large pressure, no pre-stress: the membrane carries the load, yet the clamped-edge boundary
        // layer keeps an edge bending stress of √18 ≈ 4.24 times the membrane stress (derived, no published source:
        // M_e ≈ q a/k, membrane equilibrium q a = N φ_e, and σ = Ē φ_e²/6 for the parabolic membrane)
        CapStructure thin = new CapStructure(f.withIntrinsicStress(0), 20e-9, SpanGeometry.line(20e-6),
                CapStructure.SILICON_CTE_PER_K, MechanicalLimits.withSafetyFactor(1));
        CapResponse membrane = thin.evaluate(500, 1e6);
        assertEquals(EdgeTerm.BENDING, membrane.dominantTerm());
        assertEquals(Math.sqrt(18), membrane.bendingStressPa() / membrane.membraneStressPa(), 0.05 * Math.sqrt(18));
    }

    @Test
    void recordsRejectBadInputsWithAMessage() {
        assertMessage(() -> FilmProperties.elastic(-1, 0.2, 1e-6, 600, 0), "Young's modulus");
        assertMessage(() -> FilmProperties.elastic(70e9, 0.5, 1e-6, 600, 0), "Poisson");
        assertMessage(() -> FilmProperties.elastic(70e9, 0.2, Double.NaN, 600, 0), "CTE");
        assertMessage(() -> FilmProperties.elastic(70e9, 0.2, 1e-6, 600, 0).withFracture(-1, 1, 1), "strength");
        assertMessage(() -> FilmProperties.elastic(70e9, 0.2, 1e-6, 600, 0).withFracture(1e8, 0, 1), "cohesive");
        assertMessage(() -> new SpanGeometry(SpanGeometry.Shape.LINE, 10e-6, 20e-6), "LINE");
        assertMessage(() -> SpanGeometry.rectangle(10e-6, 5e-6), "RECTANGLE");
        assertMessage(() -> new SpanGeometry(SpanGeometry.Shape.DISC, 10e-6, 20e-6), "DISC");
        assertMessage(() -> SpanGeometry.line(0), "width");
        assertMessage(() -> new MechanicalLimits(0.5, 1e-6), "safety factor");
        assertMessage(() -> new MechanicalLimits(2, 0), "deflection");
        assertMessage(() -> PlateCoefficients.clampedRectangle(0.9), "aspect");
        FilmProperties f = FilmProperties.elastic(70e9, 0.2, 1e-6, 600, 0);
        assertMessage(() -> new CapStructure(f, 2e-3, SpanGeometry.line(10e-6), 2.6e-6,
                MechanicalLimits.withSafetyFactor(1)), "thickness");
        CapStructure c = new CapStructure(f, 0.1e-6, SpanGeometry.line(10e-6), 2.6e-6,
                MechanicalLimits.withSafetyFactor(1));
        assertMessage(() -> c.evaluate(-5, 0), "temperature");
        assertMessage(() -> c.evaluate(300, Double.NaN), "pressure");
    }

    private static void assertMessage(org.junit.jupiter.api.function.Executable call, String fragment) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, call);
        assertTrue(e.getMessage().contains(fragment), "message '" + e.getMessage() + "' lacks '" + fragment + "'");
    }
}
