package org.exhale.studies;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;

import org.exhale.io.CaseYamlReader;
import org.exhale.kinetics.Component;
import org.exhale.mechanics.FilmProperties;
import org.exhale.simulation.BakeCase;
import org.exhale.studies.CaseDiagnostics.CaseDiagnosis;
import org.exhale.studies.CaseDiagnostics.TransportAt;
import org.exhale.transport.GasTransport;
import org.junit.jupiter.api.Test;

/**
 * The figures of {@code exhale check} against the values of shared/CHECKS.md, each with its source.
 * The case below is made to hit those values: a nitrogen-like product (28.0134 g/mol) in 1 nm pores,
 * a ceiling of 300 K, a molecular diffusivity of 2e-5 m²/s at 300 K and the chamber pressure, and a
 * 10 µm line under a 0.5 µm cap of E = 5 GPa, ν = 0.25.
 */
class CaseDiagnosticsTest {
    static final String CASE = """
            name: reference figures
            polymer:
              density: 1.15 g/cm3
              components:
                - {name: n2-like, model: nth-order, A: 1.0e13 1/s, Ea: 150 kJ/mol,
                   product: {molar_mass: 28.0134 g/mol, diameter: 0.364 nm}}
            cavity: {shape: line, width: 10 um, height: 300 nm}
            cap: {thickness: 0.5 um, porosity: 0.3, pore_radius: 1 nm, youngs_modulus: 5 GPa, poisson: 0.25,
                  cte: 2.6 ppm/K, stress_free_temperature: 25 C}
            ambient: {pressure: 101.325 kPa, diffusivity: {D: 2.0e-5 m2/s, temperature: 300 K, pressure: 101.325 kPa}}
            limits: {ceiling: 300 K}
            recipe: {start: 20 C, steps: [hold: 1 min]}
            """;

    static BakeCase bake() {
        return CaseYamlReader.parse("reference.yaml", CASE.getBytes(StandardCharsets.UTF_8)).bake();
    }

    static TransportAt at(CaseDiagnosis d, String label) {
        return d.products().get(0).at().stream().filter(t -> t.label().equals(label)).findFirst().orElseThrow();
    }

    @Test
    void meanFreePathOfAirMatchesJennings1988() {
        // Jennings, J. Aerosol Sci. 19 (1988) 159: air at 1 atm, 20-25 C, about 66.5 nm (CHECKS.md, ±3 %).
        // Formula: IUPAC Gold Book, "mean free path". Diameter 0.37 nm: from memory, unconfirmed (see NITROGEN_DIAMETER_M).
        double at25 = CaseDiagnostics.meanFreePathM(298.15, 101_325, CaseDiagnostics.NITROGEN_DIAMETER_M);
        double at20 = CaseDiagnostics.meanFreePathM(293.15, 101_325, CaseDiagnostics.NITROGEN_DIAMETER_M);
        assertEquals(66.5e-9, at25, 0.03 * 66.5e-9);
        assertEquals(66.5e-9, at20, 0.03 * 66.5e-9);
        // and the check command reports that figure for a case in nitrogen at 1 atm
        assertEquals(at25, CaseDiagnostics.diagnose(bake()).meanFreePathRoomM(), 1e-12 * at25);
    }

    @Test
    void meanFreePathScalesAsTemperatureOverPressure() {
        // λ = kT/(√2 π d² p), IUPAC Gold Book: doubling T doubles λ, doubling p halves it; vacuum is unbounded.
        double l = CaseDiagnostics.meanFreePathM(300, 1e5, 0.37e-9);
        assertEquals(2 * l, CaseDiagnostics.meanFreePathM(600, 1e5, 0.37e-9), 1e-12 * l);
        assertEquals(l / 2, CaseDiagnostics.meanFreePathM(300, 2e5, 0.37e-9), 1e-12 * l);
        assertEquals(Double.POSITIVE_INFINITY, CaseDiagnostics.meanFreePathM(300, 0, 0.37e-9));
    }

    @Test
    void knudsenDiffusivityOfNitrogenMatchesKineticTheory() {
        // CHECKS.md: D_K = (d/3) v̄, N2, 300 K, r = 1 nm: 3.1745e-7 m²/s (kinetic theory; e.g. Cussler, Diffusion).
        CaseDiagnosis d = CaseDiagnostics.diagnose(bake());
        TransportAt top = at(d, "ceiling");
        assertEquals(300.0, top.temperatureK(), 1e-9);
        assertEquals(3.1745e-7, top.knudsenM2PerS(), 5e-5 * 3.1745e-7);
        // Mean speed √(8RT/πM), N2 300 K: 476.2 m/s ±0.1 % (Halliday, Resnick & Walker, Table 19-1, via v_rms).
        assertEquals(476.2, GasTransport.meanMolecularSpeed(300, 0.0280134), 0.001 * 476.2);
    }

    @Test
    void bosanquetPoreDiffusivityMatchesPollardAndPresent() {
        // Pollard & Present, Phys. Rev. 73 (1948) 762: 1/D = 1/D_K + 1/D_m; D_K 3.1745e-7, D_m 2e-5 → 3.1249e-7 m²/s.
        TransportAt top = at(CaseDiagnostics.diagnose(bake()), "ceiling");
        assertEquals(2.0e-5, top.molecularM2PerS(), 1e-12);
        assertEquals(3.1249e-7, top.poreM2PerS(), 5e-5 * 3.1249e-7);
    }

    @Test
    void effectiveDiffusivityAndPermeanceFollowTheModel() {
        // MODEL.md §5 with Bruggeman τ = ε^-½ (Bruggeman 1935, from memory, unconfirmed: D_eff/D = ε^1.5, 0.164317 at ε = 0.3)
        // and the steric factor (1 − σ/(2 r_p))², σ = 0.364 nm, r_p = 1 nm → 0.669124.
        CaseDiagnosis d = CaseDiagnostics.diagnose(bake());
        TransportAt top = at(d, "ceiling");
        assertEquals(0.669124, d.products().get(0).stericFactor(), 1e-6);
        assertEquals(0.164317 * 0.669124 * top.poreM2PerS(), top.effectiveM2PerS(), 1e-5 * top.effectiveM2PerS());
        double k = top.effectiveM2PerS() / (8.314462618 * 300 * 0.5e-6);
        assertEquals(k, top.permeance(), 1e-9 * k);
        // τ_g = V_g/(R T K), V_g of the freed cavity = d + φ0 d + ε h/2 (MODEL.md §4).
        double vg = 300e-9 * 1.02 + 0.3 * 0.5e-6 / 2;
        assertEquals(vg, d.freedGasVolumeM3PerM2(), 1e-15);
        assertEquals(vg / (8.314462618 * 300 * k), top.relaxationTimeS(), 1e-9 * top.relaxationTimeS());
    }

    @Test
    void knudsenNumberIsMeanFreePathOverPoreDiameter() {
        // Kn = λ / (2 r_p): common practice, no source. About 33 for nitrogen at 1 atm, 25 C in 1 nm pores.
        CaseDiagnosis d = CaseDiagnostics.diagnose(bake());
        assertEquals(d.meanFreePathRoomM() / 2e-9, d.knudsenRoom(), 1e-12 * d.knudsenRoom());
        assertEquals(33.4, d.knudsenRoom(), 0.5);
    }

    @Test
    void bucklingOfTheClampedStripMatchesHutchinsonAndSuo() {
        // Hutchinson & Suo, Adv. Appl. Mech. 29 (1992) 63 (citation from memory, unconfirmed; value derived in CHECKS.md):
        // σ_c = (π²/12) Ē (h/b)², E 5 GPa, ν 0.25, h 0.5 µm, b = 5 µm half-width → 43.86 MPa.
        CaseDiagnosis d = CaseDiagnostics.diagnose(bake());
        assertEquals(43.86e6, d.mechanics().bucklingStressPa(), 0.005e6);
        assertEquals(5e9 / (1 - 0.0625), d.mechanics().planeStrainModulusPa(), 1);
    }

    @Test
    void thermalMismatchOfOxideOnSiliconMatchesFreundAndSuresh() {
        // Freund & Suresh, Thin Film Materials (2003), formula from memory, unconfirmed; value derived in CHECKS.md:
        // σ = E/(1−ν) (α_s − α_f) ΔT, 70 GPa, 0.17, Δα 2.1 ppm/K, ΔT = −375 K → −66.4 MPa.
        // A stress-free temperature of 400 C puts ΔT = −375 K at 25 C, the "room" figure of check.
        BakeCase b = bake().withFilm(new FilmProperties(70e9, 0.17, 0.5e-6, 673.15, 0, FilmProperties.NOT_GIVEN,
                FilmProperties.NOT_GIVEN, FilmProperties.NOT_GIVEN));
        CaseDiagnosis d = CaseDiagnostics.diagnose(b);
        assertEquals(-66.4e6, d.mechanics().thermalStressRoomPa(), 0.05e6);
        // at the ceiling (300 K, 1.85 K above 25 C) slightly less compressive, linear in T
        double slope = 70e9 / 0.83 * 2.1e-6;
        assertEquals(-66.4e6 + slope * 1.85, d.mechanics().thermalStressCeilingPa(), 0.05e6);
        assertEquals(-66.4e6 + slope * (293.15 - 298.15), d.mechanics().thermalStressStartPa(), 0.05e6);
    }

    @Test
    void loadAndOnsetTemperature() {
        // m0 = ρ d (MODEL.md §1): 1150 kg/m3 × 300 nm = 3.45e-4 kg/m2; common practice, no source.
        CaseDiagnosis d = CaseDiagnostics.diagnose(bake());
        assertEquals(3.45e-4, d.initialLoadKgPerM2(), 1e-12);
        // The onset is where k(T) = A exp(−E/RT) = 1e-3 1/s; for A 1e13, E 150 kJ/mol: E/(R ln 1e16) = 489.9 K.
        Component c = bake().polymer().components().get(0);
        double t = d.onsets().get(0).temperatureK();
        assertEquals(150e3 / (8.314462618 * Math.log(1e16)), t, 1e-9);
        assertEquals(1e-3, c.rateConstant(t), 1e-12);
    }

    @Test
    void denseCapInVacuumHasNoPoresAndOnlyPermeation() {
        String dense = CASE.replace("porosity: 0.3, pore_radius: 1 nm,", "porosity: 0, permeability: {Pi0: 2.0e-15 mol/(m s Pa), Ea: 0 kJ/mol},")
                .replace("pressure: 101.325 kPa, diffusivity", "pressure: 0 kPa, diffusivity");
        CaseDiagnosis d = CaseDiagnostics.diagnose(CaseYamlReader.parse("dense.yaml", dense.getBytes(StandardCharsets.UTF_8)).bake());
        assertTrue(Double.isNaN(d.knudsenRoom()));
        assertEquals(Double.POSITIVE_INFINITY, d.meanFreePathCeilingM());
        TransportAt top = at(d, "ceiling");
        assertEquals(0, top.effectiveM2PerS());
        // K = Π/h with E_Π = 0 (MODEL.md §5).
        assertEquals(2.0e-15 / 0.5e-6, top.permeance(), 1e-20);
        // V_g at the start is φ0 d (no pores); relaxation then takes V_g h/(R T Π) of the freed cavity.
        assertEquals(0.02 * 300e-9, d.initialGasVolumeM3PerM2(), 1e-18);
    }

    @Test
    void noMechanicsWithoutFilmProperties() {
        String bare = CASE.replace(", youngs_modulus: 5 GPa, poisson: 0.25,\n      cte: 2.6 ppm/K, stress_free_temperature: 25 C", "");
        assertTrue(!bare.equals(CASE), "the replacement must apply");
        assertNull(CaseDiagnostics.diagnose(CaseYamlReader.parse("bare.yaml", bare.getBytes(StandardCharsets.UTF_8)).bake()).mechanics());
    }
}
