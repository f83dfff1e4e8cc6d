package org.exhale.simulation;

/**
 * Numerical settings of a simulation.
 *
 * @param sampleIntervalS    spacing of history rows [s] (segment ends are always recorded); 0 for no history
 * @param relativeTolerance  relative tolerance of the eighth-order explicit integrator (conversions,
 *                           quasi-steady regime)
 * @param stiffRelativeTolerance relative tolerance of the second-order Rosenbrock integrator (full-gas
 *                           regime); looser than the explicit one because its error falls only as h³
 * @param regime             null to choose automatically (see {@link BakeSimulator}), else forced
 * @param explicitFullGas    integrate the full-gas equations with the explicit Dormand–Prince 8(5,3)
 *                           method instead of the Rosenbrock method (for reference solutions of
 *                           non-stiff cases only)
 */
public record SimulationSettings(double sampleIntervalS, double relativeTolerance, double stiffRelativeTolerance,
                                 GasRegime regime, boolean explicitFullGas) {
    public SimulationSettings {
        if (!(sampleIntervalS >= 0)) {
            throw new IllegalArgumentException("sample interval must be non-negative");
        }
        if (!(relativeTolerance >= 1e-14 && relativeTolerance <= 1e-2)) {
            throw new IllegalArgumentException("relative tolerance must be in [1e-14, 1e-2]");
        }
        if (!(stiffRelativeTolerance >= 1e-12 && stiffRelativeTolerance <= 1e-2)) {
            throw new IllegalArgumentException("Rosenbrock relative tolerance must be in [1e-12, 1e-2]");
        }
    }

    public static SimulationSettings defaults() {
        return new SimulationSettings(30, 1e-8, 1e-6, null, false);
    }

    public SimulationSettings withSampleInterval(double s) {
        return new SimulationSettings(s, relativeTolerance, stiffRelativeTolerance, regime, explicitFullGas);
    }

    /** Sets both tolerances: the explicit one to rtol, the Rosenbrock one to rtol as well but not below 1e-12. */
    public SimulationSettings withTolerance(double rtol) {
        return new SimulationSettings(sampleIntervalS, rtol, Math.max(rtol, 1e-12), regime, explicitFullGas);
    }

    public SimulationSettings withStiffTolerance(double rtol) {
        return new SimulationSettings(sampleIntervalS, relativeTolerance, rtol, regime, explicitFullGas);
    }

    public SimulationSettings withRegime(GasRegime r) {
        return new SimulationSettings(sampleIntervalS, relativeTolerance, stiffRelativeTolerance, r, explicitFullGas);
    }

    public SimulationSettings withExplicitFullGas(boolean b) {
        return new SimulationSettings(sampleIntervalS, relativeTolerance, stiffRelativeTolerance, regime, b);
    }
}
