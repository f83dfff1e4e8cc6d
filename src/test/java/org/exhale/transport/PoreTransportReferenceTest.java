package org.exhale.transport;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.exhale.kinetics.Product;
import org.junit.jupiter.api.Test;

/** Pore-transport coefficients of MODEL.md §5 against kinetic-theory values (CHECKS.md, gas kinetics). */
class PoreTransportReferenceTest {
    /** N2 molar mass 28.0134 g/mol (common practice, no source). */
    private static final double M_N2 = 0.0280134;
    /** CO2 molar mass 44.0095 g/mol (common practice, no source). */
    private static final double M_CO2 = 0.0440095;

    private static GasTransport transport(CapFilm cap, Ambient ambient, Product... products) {
        return new GasTransport(cap, ambient, List.of(products));
    }

    private static Ambient vacuum() {
        return new Ambient(0, 3e-5, 298.15, 101_325);
    }

    /** A molecule too small to feel the pore wall, so only the Knudsen part is under test. */
    private static Product tiny(double molarMass) {
        return new Product(molarMass, 1e-15, 1e-5);
    }

    @Test
    void meanSpeedOfNitrogenMatchesHallidayResnickWalkerTable19_1() {
        // Halliday, Resnick & Walker, Fundamentals of Physics, Table 19-1 (v_rms 517 m/s × √(8/3π)),
        // via CHECKS.md: 476.2 m/s, ±0.1 % (the table has three figures)
        double v = GasTransport.meanMolecularSpeed(300, M_N2);
        assertEquals(476.2, v, 1e-3 * 476.2);
    }

    @Test
    void knudsenDiffusivityMatchesKineticTheoryValues() {
        // D_K = (2r/3) v̄; kinetic theory, e.g. Cussler, "Diffusion" (Knudsen section), values via CHECKS.md (D).
        // The checks carry 5 and 4 significant figures: tolerance half a unit of the last figure.
        GasTransport n2 = transport(CapFilm.porous(100e-9, 0.3, 1e-9), vacuum(), tiny(M_N2));
        assertEquals(3.1745e-7, n2.knudsenDiffusivity(0, 300), 0.00005e-7);
        GasTransport co2 = transport(CapFilm.porous(100e-9, 0.3, 1.5e-9), vacuum(), tiny(M_CO2));
        // The CO2 check value 5.691e-7 is the 400 °C (673.15 K) figure: at exactly 673 K the formula gives
        // 5.6901e-7, which rounds to 5.690e-7, so the check's "673 K" is 400 °C rounded.
        assertEquals(5.691e-7, co2.knudsenDiffusivity(0, 673.15), 0.0005e-7);
        assertEquals(5.690e-7, co2.knudsenDiffusivity(0, 673.0), 0.0005e-7);
    }

    @Test
    void knudsenDiffusivityMatchesTextbookNumericForm() {
        // D_K = 97.0 r √(T/M), r in m, M in g/mol (common textbook form, CHECKS.md, D).
        // 97.0 has three figures: ±0.05 of 97.0, i.e. 5.2e-4 relative.
        double[][] cases = {{1e-9, 300, 28.0134}, {1.5e-9, 673, 44.0095}, {3e-9, 550, 100}, {0.5e-9, 700, 58}};
        for (double[] c : cases) {
            GasTransport t = transport(CapFilm.porous(100e-9, 0.3, c[0]), vacuum(), tiny(c[2] / 1e3));
            double expected = 97.0 * c[0] * Math.sqrt(c[1] / c[2]);
            assertEquals(expected, t.knudsenDiffusivity(0, c[1]), 0.05 / 97.0 * expected,
                    "r = " + c[0] + " m, T = " + c[1] + " K, M = " + c[2] + " g/mol");
        }
    }

    @Test
    void bosanquetCombinationMatchesPollardPresent() {
        // Pollard & Present, Phys. Rev. 73 (1948) 762: 1/D = 1/D_K + 1/D_m; CHECKS.md:
        // D_K 3.1745e-7 with D_m 2e-5 → 3.1249e-7 (five figures: ±0.00005e-7).
        // D_m is given at the ambient's reference state (300 K, 1 atm) and the ambient sits there.
        Ambient atm = new Ambient(101_325, 3e-5, 300, 101_325);
        GasTransport t = transport(CapFilm.porous(100e-9, 0.3, 1e-9), atm, new Product(M_N2, 1e-15, 2e-5));
        assertEquals(2e-5, t.molecularDiffusivity(0, 300), 1e-15);
        assertEquals(3.1249e-7, t.poreDiffusivity(0, 300), 0.00005e-7);
        // and the exact harmonic combination of the code's own two parts (rounding only)
        double dk = t.knudsenDiffusivity(0, 300);
        double dm = t.molecularDiffusivity(0, 300);
        assertEquals(1 / (1 / dk + 1 / dm), t.poreDiffusivity(0, 300), 1e-14 * dk);
    }

    @Test
    void bosanquetLimitCases() {
        // Limits of Pollard & Present's 1/D = 1/D_K + 1/D_m (1948): vacuum → D_K exactly;
        // D_m ≪ D_K → D_m, with relative deviation D_m/D_K (the first term of the expansion).
        GasTransport vac = transport(CapFilm.porous(100e-9, 0.3, 1e-9), vacuum(), tiny(M_N2));
        assertEquals(Double.POSITIVE_INFINITY, vac.molecularDiffusivity(0, 500));
        assertEquals(vac.knudsenDiffusivity(0, 500), vac.poreDiffusivity(0, 500), 0);

        // wide pores (r = 50 µm) at 10 atm: D_K ~ 1.6e-2, D_m = 1e-6 → ratio ~ 6e-5
        Ambient dense = new Ambient(10 * 101_325, 3e-5, 300, 101_325);
        GasTransport wide = transport(CapFilm.porous(500e-6, 0.3, 50e-6), dense, new Product(M_N2, 1e-15, 1e-5));
        double dm = wide.molecularDiffusivity(0, 300);
        double dk = wide.knudsenDiffusivity(0, 300);
        assertEquals(1e-6, dm, 1e-18);
        assertTrue(dm / dk < 1e-4, "D_m/D_K = " + dm / dk);
        assertEquals(dm, wide.poreDiffusivity(0, 300), 1.01 * dm * dm / dk);
    }

    @Test
    void molecularDiffusivityFollowsTemperatureAndPressureScaling() {
        // D_m ∝ T^1.75 / p, Fuller, Schettler & Giddings, Ind. Eng. Chem. 58 (1966) — exponent from memory,
        // unconfirmed (CHECKS.md M); the scaling is what MODEL.md §5 prescribes. Rounding only: 1e-12.
        Ambient half = new Ambient(50_662.5, 3e-5, 298.15, 101_325);
        GasTransport t = transport(CapFilm.porous(100e-9, 0.3, 1e-9), half, new Product(0.1, 0.6e-9, 7e-6));
        double expected = 7e-6 * Math.pow(600 / 298.15, 1.75) * 2;
        assertEquals(expected, t.molecularDiffusivity(0, 600), 1e-12 * expected);
    }

    @Test
    void stericFactorIsSquaredFreeFractionAndVanishesWhenTheMoleculeDoesNotFit() {
        // (1 − λ)², λ = σ/(2 r_p), zero for λ ≥ 1 (MODEL.md §5; centre-excluded area of a cylindrical
        // pore, common practice, no source)
        assertEquals(1, GasTransport.stericFactor(0, 1e-9), 0);
        assertEquals(0.25, GasTransport.stericFactor(1e-9, 1e-9), 1e-15);
        assertEquals(Math.pow(1 - 0.6 / 3.0, 2), GasTransport.stericFactor(0.6e-9, 1.5e-9), 1e-15);
        assertEquals(0, GasTransport.stericFactor(2e-9, 1e-9), 0);
        assertEquals(0, GasTransport.stericFactor(3e-9, 1e-9), 0);
        // just below λ = 1 the factor is small and positive
        double s = GasTransport.stericFactor(1.999e-9, 1e-9);
        assertTrue(s > 0 && s < 1e-6, "S = " + s);

        GasTransport t = transport(CapFilm.porous(100e-9, 0.3, 1e-9), vacuum(),
                new Product(0.1, 0.5e-9, 1e-5), new Product(0.1, 2.5e-9, 1e-5));
        assertEquals(0.5625, t.stericFactor(0), 1e-15);
        assertEquals(0, t.stericFactor(1), 0);
        assertEquals(0, t.effectiveDiffusivity(1, 600), 0);
        assertEquals(0, t.permeance(1, 600), 0);
    }

    @Test
    void bruggemanGeometricFactor() {
        // Bruggeman, Ann. Phys. 1935: τ = ε^-½, so ε/τ = ε^1.5; ε = 0.3 → 0.164317.
        // From memory, unconfirmed (CHECKS.md M). Six figures: ±5e-7.
        CapFilm cap = CapFilm.porous(100e-9, 0.3, 1e-9);
        assertEquals(0.164317, cap.porosityOverTortuosity(), 5e-7);
        assertEquals(1 / Math.sqrt(0.3), cap.effectiveTortuosity(), 1e-14);
        // an explicit tortuosity overrides Bruggeman
        CapFilm given = new CapFilm(100e-9, 0.3, 1e-9, 3, 0, 0);
        assertEquals(0.1, given.porosityOverTortuosity(), 1e-15);
    }

    /*
     * The effective diffusivity of MODEL.md §5 from published values only, chained: nitrogen through 1 nm
     * pores at 300 K in an ambient where D_m = 2e-5 m²/s — pore diffusivity 3.1249e-7 m²/s (Bosanquet,
     * Pollard & Present, Phys. Rev. 73 (1948) 762, on the kinetic-theory Knudsen value 3.1745e-7, CHECKS.md
     * C/D); Bruggeman's geometric factor at ε = 0.3, ε^1.5 = 0.164317 (Bruggeman, Ann. Phys. 1935, from
     * memory, unconfirmed, CHECKS.md M); a molecule of 0.4 nm in a 1 nm pore, λ = 0.2, keeps (1 − λ)² = 0.64
     * of the pore (centre-excluded area of a cylindrical pore, common practice, no source). Tolerance 3e-5
     * relative: the five and six figures of the two published values.
     */
    @Test
    void effectiveDiffusivityChainsPublishedValues() {
        Ambient atm = new Ambient(101_325, 3e-5, 300, 101_325);
        GasTransport t = transport(CapFilm.porous(100e-9, 0.3, 1e-9), atm, new Product(M_N2, 0.4e-9, 2e-5));
        double expected = 3.1249e-7 * 0.164317 * 0.64;
        assertEquals(expected, t.effectiveDiffusivity(0, 300), 3e-5 * expected);
        // in vacuum only Knudsen diffusion is left: CO2 through 1.5 nm pores at 400 °C, 5.691e-7 m²/s
        // (kinetic theory, CHECKS.md D), same geometric factor, λ = 0.33/3 (kinetic diameter 0.33 nm)
        GasTransport co2 = transport(CapFilm.porous(100e-9, 0.3, 1.5e-9), vacuum(), new Product(M_CO2, 0.33e-9, 1e-5));
        double expectedCo2 = 5.691e-7 * 0.164317 * Math.pow(1 - 0.11, 2);
        assertEquals(expectedCo2, co2.effectiveDiffusivity(0, 673.15), 1e-4 * expectedCo2);
    }
}
