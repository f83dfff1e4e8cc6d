package org.exhale.transport;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.exhale.kinetics.Product;
import org.junit.jupiter.api.Test;

/**
 * Property test of the quasi-steady excess pressure of MODEL.md §5 over a seeded random sweep:
 * without viscous flow p_j = G_j/K_j; with it Δp is the root of Σ G_j/(K_j + c(Δp)) = Δp. The
 * residual is evaluated here with c(Δp) written out independently from MODEL.md §5.
 */
class QuasiSteadyPressurePropertyTest {
    private static final double R = 8.314462618;
    private static final long SEED = 20_240_611L;
    private static final int CASES = 4000;

    private static double logUniform(Random rnd, double lo, double hi) {
        return lo * Math.pow(hi / lo, rnd.nextDouble());
    }

    /** c(Δp) = (B0/μ)(p̄/RT)(Δp/h)/(p_amb + Δp), p̄ = p_amb + Δp/2, B0 = ε r²/(8τ) (MODEL.md §5). */
    private static double conductance(CapFilm cap, Ambient amb, double temp, double dp) {
        double b0 = cap.porosityOverTortuosity() * cap.poreRadiusM() * cap.poreRadiusM() / 8;
        double pbar = amb.pressurePa() + dp / 2;
        double jv = b0 / amb.viscosityPaS() * pbar / (R * temp) * dp / cap.thicknessM();
        return jv / (amb.pressurePa() + dp);
    }

    private static List<Product> products(int n) {
        List<Product> list = new ArrayList<>();
        for (int j = 0; j < n; j++) {
            list.add(new Product(0.05 + 0.01 * j, 0.4e-9, 1e-5));
        }
        return list;
    }

    @Test
    void viscousConductanceMatchesTheDarcyCapillaryBundle() {
        // Capillary-bundle permeability B0 = ε r²/(8τ) and viscous flux (B0 p/(μRT)) ∇p, Mason & Malinauskas,
        // Gas Transport in Porous Media: the Dusty-Gas Model (1983) — CHECKS.md D/M. Rounding only: 1e-12.
        Random rnd = new Random(SEED);
        for (int i = 0; i < 500; i++) {
            CapFilm cap = CapFilm.porous(logUniform(rnd, 3e-8, 1e-5), 0.05 + 0.6 * rnd.nextDouble(),
                    logUniform(rnd, 3e-10, 1e-6));
            Ambient amb = new Ambient(rnd.nextBoolean() ? 0 : logUniform(rnd, 1, 1e6), logUniform(rnd, 1e-5, 1e-4),
                    298.15, 101_325);
            GasTransport t = new GasTransport(cap, amb, products(1));
            double temp = 400 + 300 * rnd.nextDouble();
            double dp = logUniform(rnd, 1e-6, 1e7);
            double expected = conductance(cap, amb, temp, dp);
            assertEquals(expected, t.viscousConductance(temp, dp), 1e-12 * expected, "seed " + SEED + ", case " + i);
        }
    }

    @Test
    void withoutViscousFlowEachPartialPressureIsGenerationOverPermeance() {
        // MODEL.md §5, quasi-steady without the viscous term: p_j = G_j/K_j, Δp = Σ p_j.
        // A dense cap (ε = 0) has no viscous path. Rounding only: 1e-14 relative.
        Random rnd = new Random(SEED + 1);
        CapFilm dense = new CapFilm(2e-6, 0, 0, Double.NaN, 1e-15, 0);
        for (int i = 0; i < CASES; i++) {
            int n = 1 + rnd.nextInt(3);
            Ambient amb = new Ambient(rnd.nextBoolean() ? 0 : logUniform(rnd, 1, 1e6), 3e-5, 298.15, 101_325);
            GasTransport t = new GasTransport(dense, amb, products(n));
            double[] g = new double[n];
            double[] k = new double[n];
            double sum = 0;
            for (int j = 0; j < n; j++) {
                g[j] = logUniform(rnd, 1e-12, 1e-2);
                k[j] = logUniform(rnd, 1e-14, 1e-3);
                sum += g[j] / k[j];
            }
            double dp = t.quasiSteadyExcessPressure(500, g, k);
            assertEquals(sum, dp, 1e-14 * sum, "seed " + (SEED + 1) + ", case " + i);
        }
    }

    @Test
    void withViscousFlowTheRootBalancesGenerationAndVenting() {
        // MODEL.md §5: Δp is the unique root of Σ_j G_j/(K_j + c(Δp)) = Δp; the residual must vanish to
        // 1e-10 relative (the solver stops at 1e-13 relative, the residual is a sum of a few positive terms).
        Random rnd = new Random(SEED + 2);
        int vacuumCases = 0;
        double worst = 0;
        for (int i = 0; i < CASES; i++) {
            int n = 1 + rnd.nextInt(3);
            CapFilm cap = CapFilm.porous(logUniform(rnd, 3e-8, 1e-5), 0.05 + 0.6 * rnd.nextDouble(),
                    logUniform(rnd, 3e-10, 1e-6));
            boolean vacuum = rnd.nextInt(3) == 0;
            vacuumCases += vacuum ? 1 : 0;
            Ambient amb = new Ambient(vacuum ? 0 : logUniform(rnd, 1, 1e6), logUniform(rnd, 1e-5, 1e-4), 298.15, 101_325);
            GasTransport t = new GasTransport(cap, amb, products(n));
            double temp = 400 + 300 * rnd.nextDouble();
            double[] g = new double[n];
            double[] k = new double[n];
            double upper = 0;
            for (int j = 0; j < n; j++) {
                g[j] = logUniform(rnd, 1e-12, 1e-2);
                k[j] = logUniform(rnd, 1e-14, 1e-3);
                upper += g[j] / k[j];
            }
            String where = "seed " + (SEED + 2) + ", case " + i;
            double dp = t.quasiSteadyExcessPressure(temp, g, k);
            assertTrue(dp > 0 && dp <= upper * (1 + 1e-14), where + ": Δp = " + dp + ", diffusive bound " + upper);
            double c = conductance(cap, amb, temp, dp);
            double vent = 0;
            for (int j = 0; j < n; j++) {
                vent += g[j] / (k[j] + c);
            }
            double rel = Math.abs(vent - dp) / dp;
            worst = Math.max(worst, rel);
            assertTrue(rel <= 1e-10, where + ": residual " + rel + " at Δp = " + dp);
            // more generation raises the pressure (F is decreasing in Δp, increasing in G), unless the raised
            // product carries less than 1e-12 of Δp, where the rise is below the solver's 1e-13 stopping rule
            double[] g2 = g.clone();
            g2[0] *= 1.5;
            double dp2 = t.quasiSteadyExcessPressure(temp, g2, k);
            assertTrue(dp2 > dp || g[0] / (k[0] + c) < 1e-12 * dp, where + ": not monotone in G, " + dp + " -> " + dp2
                    + ", share of the raised product " + g[0] / (k[0] + c) / dp);
        }
        assertTrue(vacuumCases > CASES / 5, "vacuum cases " + vacuumCases);
        System.out.printf("quasi-steady root: worst relative residual %.3g over %d cases (seed %d)%n", worst, CASES, SEED + 2);
    }

    @Test
    void aSizeExcludedProductVentsByViscousFlowAlone() {
        // K_j = 0 (the molecule does not fit the pores, MODEL.md §5) leaves only the viscous path: Δp finite,
        // G = c(Δp) Δp for a single product. Residual 1e-10 relative as above.
        Random rnd = new Random(SEED + 3);
        for (int i = 0; i < 500; i++) {
            CapFilm cap = CapFilm.porous(logUniform(rnd, 3e-8, 1e-5), 0.3, logUniform(rnd, 3e-10, 1e-6));
            Ambient amb = new Ambient(rnd.nextBoolean() ? 0 : logUniform(rnd, 1, 1e6), 3e-5, 298.15, 101_325);
            GasTransport t = new GasTransport(cap, amb, products(1));
            double g = logUniform(rnd, 1e-12, 1e-2);
            double dp = t.quasiSteadyExcessPressure(600, new double[]{g}, new double[]{0});
            String where = "seed " + (SEED + 3) + ", case " + i;
            assertTrue(Double.isFinite(dp) && dp > 0, where + ": Δp = " + dp);
            double c = conductance(cap, amb, 600, dp);
            assertEquals(g, c * dp, 1e-10 * g, where);
        }
    }

    @Test
    void noGenerationNoExcessPressure() {
        // Trivial root of MODEL.md §5 at G = 0 (common practice, no source).
        GasTransport t = new GasTransport(CapFilm.porous(1e-7, 0.3, 1e-9), new Ambient(0, 3e-5, 298.15, 101_325), products(2));
        assertEquals(0, t.quasiSteadyExcessPressure(600, new double[]{0, 0}, new double[]{1e-6, 1e-6}), 0);
    }
}
