package org.exhale.simulation;

import java.util.ArrayList;
import java.util.List;

/**
 * Simulates a bake (MODEL.md §2–§7) at every wafer corner and reports the margins to every limit.
 *
 * <p><b>Choice of gas regime.</b> Every corner is first simulated quasi-steadily (dn/dt = 0, the
 * excess pressure the algebraic root of generation = venting). Along that solution the error of
 * neglecting the gas storage is estimated on what the limits see. The full-gas solution lags the
 * quasi-steady one by n_fg ≈ n − τ_g dn/dt (the first-order correction of dn/dt = G − n/τ_g), so
 * the excess pressure, which every pressure-driven limit (pressure, strength, cracking,
 * delamination, deflection) is a function of, is off by about τ_g |dn/dt| R T/V_g. That error,
 * at its largest over the bake, relative to the peak excess pressure is the estimate ε; with a
 * chamber, the stored gas also delays the vent flux by dn/dt, and max |dn/dt| relative to the peak
 * vent flux enters ε too. The initial layer (the cavity starts empty while the quasi-steady
 * solution starts at G/K, for a few τ_g) is left out: there quasi-steady over-states the pressure,
 * on the safe side. The residue and the thermal limits do not see the gas at all (the
 * kinetics do not depend on the pressure). Unlike a relative rate τ_g |d ln n/dt|, ε does not grow
 * where a vanishing amount of gas changes quickly at the end of the bake. If ε ≤
 * {@value #QUASI_STEADY_ERROR} the quasi-steady result stands (every margin to a pressure-driven
 * limit then within about 1e-3 of its own value); otherwise, or where the cap has no vent path at
 * all, the corner is simulated again with the moles under the cap as states, integrated by an
 * L-stable Rosenbrock method.
 * A regime forced in the settings skips the choice.
 */
public final class BakeSimulator {
    /** Largest estimated storage error (relative to the peak excess pressure) for which the quasi-steady solution is kept. */
    public static final double QUASI_STEADY_ERROR = 1e-3;

    private BakeSimulator() {
    }

    public static BakeResult simulate(BakeCase bake) {
        return simulate(bake, SimulationSettings.defaults());
    }

    public static BakeResult simulate(BakeCase bake, SimulationSettings settings) {
        if (bake.recipe() == null) {
            throw new IllegalArgumentException("the case has no recipe to simulate");
        }
        List<CornerResult> corners = new ArrayList<>();
        double spread = bake.wafer().spreadK();
        if (spread > 0) {
            corners.add(simulateCorner(bake, "hot", spread, settings));
            corners.add(simulateCorner(bake, "cold", -spread, settings));
        } else {
            corners.add(simulateCorner(bake, "nominal", 0, settings));
        }
        List<String> warnings = new ArrayList<>();
        return new BakeResult(bake, corners, Margins.evaluate(bake, corners), warnings);
    }

    static CornerResult simulateCorner(BakeCase bake, String name, double offsetK, SimulationSettings settings) {
        GasRegime forced = settings.regime();
        if (forced == GasRegime.QUASI_STEADY) {
            return new CornerRun(bake, name, offsetK, GasRegime.QUASI_STEADY, settings, 1).run();
        }
        // A cap whose slowest relaxation is far below the kinetics is run quasi-steadily in one go; otherwise a
        // light quasi-steady pre-run (no mechanics, chamber or history) decides and scales the gas tolerances.
        boolean likelyQuasiSteady = forced == null && maxRelaxationTimeS(bake, offsetK) < 1e-4;
        CornerResult qs = new CornerRun(likelyQuasiSteady ? bake : lite(bake), name, offsetK, GasRegime.QUASI_STEADY,
                likelyQuasiSteady ? settings : settings.withSampleInterval(0), 1, bake.chamber() != null).run();
        boolean sealed = !Double.isFinite(qs.peakPressure().value());
        if (forced == null && !sealed && qs.quasiSteadyError() <= QUASI_STEADY_ERROR) {
            return likelyQuasiSteady ? qs : new CornerRun(bake, name, offsetK, GasRegime.QUASI_STEADY, settings, 1).run();
        }
        return new CornerRun(bake, name, offsetK, GasRegime.FULL_GAS, settings, sealed ? 1 : gasScale(bake, qs)).run()
                .withQuasiSteadyError(sealed ? Double.POSITIVE_INFINITY : qs.quasiSteadyError());
    }

    private static BakeCase lite(BakeCase bake) {
        return bake.withFilm(null).withChamber(null);
    }

    /**
     * The slowest gas relaxation V_g/(R T K) the case can have: the cavity fully freed, over the
     * temperatures of the recipe, ignoring the viscous flow (which only speeds relaxation) [s].
     */
    static double maxRelaxationTimeS(BakeCase bake, double offsetK) {
        BakeModel m = new BakeModel(lite(bake), offsetK, GasRegime.QUASI_STEADY);
        double vg = m.gasVolume(fullyConverted(bake.polymer().size()));
        double worst = 0;
        double lo = bake.recipe().startK() + offsetK;
        double hi = bake.recipe().maxSetpointK() + offsetK;
        for (int i = 0; i <= 8; i++) {
            double t = lo + (hi - lo) * i / 8;
            for (int j = 0; j < bake.polymer().size(); j++) {
                double k = m.transport().permeance(j, t);
                worst = Math.max(worst, k > 0 ? vg / (org.exhale.PhysicalConstants.GAS_CONSTANT * t * k) : Double.POSITIVE_INFINITY);
            }
        }
        return worst;
    }

    private static double[] fullyConverted(int k) {
        double[] y = new double[k];
        java.util.Arrays.fill(y, 1);
        return y;
    }

    /** Peak normalised moles under the cap in the quasi-steady solution. */
    private static double gasScale(BakeCase bake, CornerResult qs) {
        double peak = qs.max("stored_mol_m2").value();
        double total = BakeModel.gasifiableMoles(bake);
        return peak > 0 && Double.isFinite(peak) ? peak / total : 1;
    }
}
