package org.exhale.mechanics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Plate-to-membrane behaviour against the bulge-test relations. */
class LargeDeflectionTest {

    private static final double E = 100e9;
    private static final double NU = 0.25;
    private static final double EBAR = E / (1 - NU * NU);
    private static final double T0 = 600;

    private static CapStructure cap(SpanGeometry span, double h, double intrinsicPa, boolean stiffening) {
        return new CapStructure(FilmProperties.elastic(E, NU, CapStructure.SILICON_CTE_PER_K, T0, intrinsicPa), h,
                span, CapStructure.SILICON_CTE_PER_K, MechanicalLimits.withSafetyFactor(1), stiffening);
    }

    private static CapStructure cap(SpanGeometry span, double h) {
        return cap(span, h, 0, true);
    }

    @ParameterizedTest
    @ValueSource(doubles = {1e-1, 1e2, 1e4, 1e5, 1e6, 1e7})
    void lineSolvesVlassakNixRelation(double p) {
        double w = 20e-6;
        double h = 0.1e-6;
        double a = w / 2;
        double d = E * h * h * h / (12 * (1 - NU * NU));
        double delta = cap(SpanGeometry.line(w), h).deflectionM(T0, p);
        // Vlassak & Nix, J. Mater. Res. 7 (1992) 3242, plane strain (σ0 = 0): cubic term 4 E h δ³/(3(1−ν²) a⁴),
        // plus the clamped-strip plate term 384 D δ / w⁴ (common practice, no source)
        double load = 384 * d * delta / Math.pow(w, 4) + 4 * E * h * Math.pow(delta, 3) / (3 * (1 - NU * NU) * Math.pow(a, 4));
        assertEquals(p, load, 1e-10 * p);
    }

    @Test
    void thinLineApproachesVlassakNixCubeRootLaw() {
        double w = 20e-6;
        double h = 20e-9;
        double a = w / 2;
        double p = 1e6;
        CapResponse r = cap(SpanGeometry.line(w), h).evaluate(T0, p);
        // Vlassak & Nix 1992 membrane limit: p = 4 E h δ³/(3(1−ν²) a⁴) → δ = (3(1−ν²) p a⁴/(4 E h))^(1/3).
        // Bending share here ≈ 1.5 (h/δ)² ≈ 3e-4 (derived), so 1e-3 relative.
        double membraneOnly = Math.cbrt(3 * (1 - NU * NU) * p * Math.pow(a, 4) / (4 * E * h));
        assertEquals(membraneOnly, r.deflectionM(), 1e-3 * membraneOnly);
        assertTrue(r.bendingLoadFraction() < 1e-3, "bending share " + r.bendingLoadFraction());
        assertEquals(EdgeTerm.MEMBRANE, r.dominantTerm());
    }

    @Test
    void lineMembraneStressIsPlaneStrainStretchOfParabolicProfile() {
        // Derived (see CapStructure): σ_m = Ē ε with ε the arc-length stretch of z = δ(1 − x²/a²),
        // the profile behind Vlassak & Nix 1992. Arc length integrated numerically here (Simpson);
        // the small-slope result (2/3)(δ/a)² differs from the exact stretch by O((δ/a)²) relative.
        double w = 20e-6;
        double h = 20e-9;
        double a = w / 2;
        CapResponse r = cap(SpanGeometry.line(w), h).evaluate(T0, 1e3);
        double delta = r.deflectionM();
        int n = 2000;
        double sum = 0;
        for (int i = 0; i <= n; i++) {
            double x = -a + 2 * a * i / n;
            double slope = -2 * delta * x / (a * a);
            double f = Math.sqrt(1 + slope * slope);
            sum += (i == 0 || i == n ? 1 : (i % 2 == 1 ? 4 : 2)) * f;
        }
        double arc = sum * (2 * a / n) / 3;
        double stretch = arc / (2 * a) - 1;
        double slopeSq = (delta / a) * (delta / a);
        assertTrue(slopeSq < 1e-3, "test needs a small slope, got (δ/a)² = " + slopeSq);
        assertEquals(EBAR * stretch, r.membraneStressPa(), 2 * slopeSq * r.membraneStressPa());
    }

    @ParameterizedTest
    @ValueSource(doubles = {1e2, 1e5, 1e7})
    void discSolvesSmallNixRelationWithMatchingMembraneStress(double p) {
        double w = 20e-6;
        double h = 0.1e-6;
        double a = w / 2;
        double d = E * h * h * h / (12 * (1 - NU * NU));
        CapResponse r = cap(SpanGeometry.disc(w), h).evaluate(T0, p);
        double delta = r.deflectionM();
        // Small & Nix, J. Mater. Res. 7 (1992) 1553 (σ0 = 0): (8/3)(1−0.24ν) E h δ³/((1−ν) a⁴),
        // plus the clamped-disc plate term 64 D δ / a⁴ (Chen, Civil Engineering Handbook, eq. 47.72)
        double membraneLoad = 8.0 / 3 * (1 - 0.24 * NU) * E * h * Math.pow(delta, 3) / ((1 - NU) * Math.pow(a, 4));
        double load = 64 * d * delta / Math.pow(a, 4) + membraneLoad;
        assertEquals(p, load, 1e-10 * p);
        // spherical-cap equilibrium p_m = 4 σ h δ/a², the form of the Small & Nix σ0 term (derived)
        assertEquals(membraneLoad * a * a / (4 * h * delta), r.membraneStressPa(), 1e-10 * r.membraneStressPa());
    }

    @Test
    void tensilePrestressGivesVlassakNixStringTerm() {
        double w = 100e-6;
        double h = 10e-9;
        double a = w / 2;
        double sigma0 = 200e6;
        double p = 1.0;
        double delta = cap(SpanGeometry.line(w), h, sigma0, true).deflectionM(T0, p);
        // Vlassak & Nix 1992 residual-stress term p = 2 σ0 h δ/a² (plate share here ≈ 2e-5, stretching ≈ 1e-9; derived)
        assertEquals(p * a * a / (2 * sigma0 * h), delta, 1e-4 * delta);
        // without stiffening the same cap is a plain plate: far larger deflection
        double plain = cap(SpanGeometry.line(w), h, sigma0, false).deflectionM(T0, p);
        assertTrue(plain > 100 * delta, "plain " + plain + " vs stiffened " + delta);
        // compressive pre-stress is not counted in the stiffness (documented choice): same as zero pre-stress
        assertEquals(cap(SpanGeometry.line(w), h).deflectionM(T0, p),
                cap(SpanGeometry.line(w), h, -sigma0, true).deflectionM(T0, p), 0);
    }

    @Test
    void passageFromPlateToMembraneIsMonotoneAndSmooth() {
        // common practice, no source: δ grows with p, never faster than linearly (plate) nor slower than
        // the cube root (membrane); the bending share of the load falls from 1 toward 0.
        for (SpanGeometry span : new SpanGeometry[] {SpanGeometry.line(20e-6), SpanGeometry.disc(20e-6),
                SpanGeometry.rectangle(20e-6, 30e-6)}) {
            CapStructure c = cap(span, 50e-9);
            double ratio = Math.pow(10, 0.05);
            CapResponse previous = c.evaluate(T0, 1e-3);
            assertEquals(1.0, previous.bendingLoadFraction(), 1e-9);
            for (double p = 1e-3 * ratio; p < 1e9; p *= ratio) {
                CapResponse r = c.evaluate(T0, p);
                double growth = r.deflectionM() / previous.deflectionM();
                assertTrue(growth <= ratio * (1 + 1e-12) && growth >= Math.cbrt(ratio) * (1 - 1e-12),
                        span.shape() + ": deflection growth " + growth + " at " + p + " Pa");
                assertTrue(r.bendingLoadFraction() <= previous.bendingLoadFraction() + 1e-12,
                        span.shape() + ": bending share rose at " + p + " Pa");
                previous = r;
            }
            assertTrue(previous.bendingLoadFraction() < 1e-3, span.shape() + " membrane limit not reached");
        }
    }

    @Test
    void suctionIsSymmetric() {
        // common practice, no source: a symmetric cap under −Δp mirrors its response to +Δp
        for (SpanGeometry span : new SpanGeometry[] {SpanGeometry.line(20e-6), SpanGeometry.disc(20e-6)}) {
            CapStructure c = cap(span, 0.1e-6);
            for (double p : new double[] {10, 1e4, 1e6}) {
                CapResponse up = c.evaluate(T0, p);
                CapResponse down = c.evaluate(T0, -p);
                assertEquals(-up.deflectionM(), down.deflectionM(), 1e-12 * up.deflectionM());
                assertEquals(up.edgeStressPa(), down.edgeStressPa(), 1e-12 * up.edgeStressPa());
                assertEquals(up.bendingStressPa(), down.bendingStressPa(), 1e-12 * up.bendingStressPa());
            }
        }
    }

    @Test
    void rectangleUsesStripStretchingAndIsBoundedByTheStrip() {
        // This package's rectangle relation (see CapStructure): own plate term (Roark Table 11.4 case 8a),
        // the line's stretching term. Checked: never deflects more than the strip; plate-limit ratio is the
        // Roark/strip coefficient ratio; membrane limit is the strip's; a very long rectangle is the strip.
        double w = 20e-6;
        double h = 50e-9;
        CapStructure line = cap(SpanGeometry.line(w), h);
        CapStructure rect = cap(SpanGeometry.rectangle(w, 1.5 * w), h);
        CapStructure longRect = cap(SpanGeometry.rectangle(w, 1e4 * w), h);
        for (double p = 1e-2; p < 1e9; p *= 3) {
            double dl = line.deflectionM(T0, p);
            assertTrue(rect.deflectionM(T0, p) <= dl, "rectangle above strip at " + p);
            assertEquals(dl, longRect.deflectionM(T0, p), 1e-8 * dl);
        }
        double plateRatio = rect.plateCoefficients().deflectionCoefficient() / (1.0 / 384);
        assertEquals(plateRatio, rect.deflectionM(T0, 1e-3) / line.deflectionM(T0, 1e-3), 1e-9);
        assertEquals(1.0, rect.deflectionM(T0, 1e10) / line.deflectionM(T0, 1e10), 1e-3);
    }
}
