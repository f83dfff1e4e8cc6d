package org.exhale.planning;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Random;

import org.exhale.io.CaseYamlReader;
import org.exhale.kinetics.Component;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;
import org.exhale.transport.GasTransport;
import org.junit.jupiter.api.Test;

/**
 * The stored-gas programme's per-move bound (docs/model.md, "Lower bounds", 5) against explicit moves: a move that holds
 * the hot corner at one temperature for part of its time and at another for the rest, with every rate and the vent
 * capacity evaluated directly at those temperatures (no minorant, no hull, no Jensen step). Any such move that keeps
 * its stored gas within the room must last at least {@link StoredGas.Phi#leastDuration}, and the best single-temperature
 * move must come close to it (the minorants' error). The check is common practice, no source.
 */
class StoredGasTest {
    private static final double R = org.exhale.PhysicalConstants.GAS_CONSTANT;

    @Test
    void noExplicitMoveIsShorterThanTheBoundAndTheBestOneIsClose() {
        BakeCase bake = CaseYamlReader.read(Path.of("data/demo/dense-disc.yaml")).bake();
        InstantLimits limits = new InstantLimits(bake);
        Component[] comps = bake.polymer().components().toArray(new Component[0]);
        double spread = bake.wafer().spreadK();
        double top = bake.limits().ceilingK() + spread;
        StoredGas sg = new StoredGas(bake, limits, comps, 0, top, 2 * spread);
        assertTrue(sg.hot.convex && sg.cold.convex, "Arrhenius rate constants are convex in the clock's rate constant");
        Random rnd = new Random(20261202L);
        int feasible = 0;
        double worstGap = 0;
        for (int trial = 0; trial < 60; trial++) {
            boolean cold = trial % 2 == 1;
            double offset = cold ? 2 * spread : 0;
            double[] a = {limits.gasifiable(0) * rnd.nextDouble(), limits.gasifiable(1) * rnd.nextDouble()};
            double fLo = 0.005 + 0.2 * rnd.nextDouble();
            double fHi = fLo * (1 + 0.2 * rnd.nextDouble());
            double room = (rnd.nextDouble() * 4 - 3) * sg.maxStoredMolPerM2;
            double uMax = comps[0].rateConstant(top);
            StoredGas.Phi phi = (cold ? sg.cold : sg.hot).phi(a, null);
            double bound = phi.leastDuration(room, fLo, fHi, uMax);
            double bestSingle = Double.POSITIVE_INFINITY;
            for (int k = 0; k < 400; k++) {
                // two temperatures and the share of time at the first; the clock gains F ∈ [fLo, fHi]
                double t1 = 450 + rnd.nextDouble() * (top - 450);
                double t2 = k % 4 == 0 ? t1 : 450 + rnd.nextDouble() * (top - 450);
                double share = rnd.nextDouble();
                double f = fLo + (fHi - fLo) * rnd.nextDouble();
                double u1 = comps[0].rateConstant(t1);
                double u2 = comps[0].rateConstant(t2);
                double d = f / (share * u1 + (1 - share) * u2);
                double stored = d * (share * net(comps, a, limits, bake, t1 - offset) + (1 - share) * net(comps, a, limits, bake, t2 - offset));
                if (stored <= room) {
                    feasible++;
                    assertTrue(d >= bound * (1 - 1e-9), "trial " + trial + ": an explicit move of " + d + " s keeps the room "
                            + room + " but the bound says at least " + bound + " s (seed 20261202)");
                    if (t1 == t2) {
                        bestSingle = Math.min(bestSingle, d);
                    }
                }
            }
            // the best single temperature on a fine scan, against the bound
            for (double t = 450; t <= top; t += 0.05) {
                double u = comps[0].rateConstant(t);
                double d = fLo / u;
                if (d * net(comps, a, limits, bake, t - offset) <= room) {
                    bestSingle = Math.min(bestSingle, d);
                }
            }
            if (Double.isFinite(bestSingle) && bound > 0) {
                worstGap = Math.max(worstGap, bestSingle / bound - 1);
            }
        }
        System.out.printf("explicit moves within the room: %d; best single temperature at most %.4f above the bound%n",
                feasible, worstGap);
        assertTrue(feasible > 500, "too few feasible explicit moves: " + feasible);
        // the minorants (tangents every 4 K, supporting lines of the vent hull, 0.5 K vent grid) cost under 1 %
        assertTrue(worstGap < 0.01, "the bound lies " + worstGap + " below the best single-temperature move");
    }

    /**
     * Gas made minus the most the cap can vent at corner temperature T [mol m⁻² s⁻¹], evaluated directly: the gas
     * weights times each component's rate constant, less the flux at the highest admissible pressure.
     */
    private static double net(Component[] comps, double[] a, InstantLimits limits, BakeCase bake, double t) {
        double g = 0;
        for (int j = 0; j < comps.length; j++) {
            g += a[j] * comps[j].rateConstant(t);
        }
        GasTransport tr = limits.transport();
        double p = VentBound.admissiblePressure(limits, t, bake.limits().maxPressurePa());
        double h = bake.cap().thicknessM();
        double k = 0;
        for (int j = 0; j < comps.length; j++) {
            k = Math.max(k, tr.effectiveDiffusivity(j, t) / (R * t * h) + tr.solidPermeability(j, t) / h);
        }
        double vent = p > 0 ? k * p + tr.viscousConductance(t, p) * p : 0;
        return g - vent;
    }
}
