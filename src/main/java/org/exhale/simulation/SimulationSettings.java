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

    /**
     * Most history rows kept per corner: with some 45 columns a row takes about 0.4 KiB in memory and
     * 0.7 KB in history.csv, so a corner's history stays under about 8 MiB in memory and 15 MB on disk
     * whatever the recipe's length or the requested interval (docs/errors.md, resource bounds).
     */
    public static final int MAX_HISTORY_ROWS = 20_000;

    /** Finest history interval the command line accepts [s]. */
    public static final double MIN_SAMPLE_INTERVAL_S = 0.1;

    /**
     * The history interval used for a recipe of the given length: the requested one, widened where
     * it would give more than {@link #MAX_HISTORY_ROWS} rows (0 stays 0: no history). Peaks, residue
     * crossings and segment ends are found from the integrator's dense output, not from these rows,
     * so they are resolved at any interval.
     */
    public double historyIntervalS(double durationS) {
        if (sampleIntervalS == 0) {
            return 0;
        }
        return Math.max(sampleIntervalS, durationS / MAX_HISTORY_ROWS);
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
