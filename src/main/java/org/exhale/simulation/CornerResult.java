package org.exhale.simulation;

import java.util.List;
import java.util.Map;

/**
 * The result of simulating one wafer corner. Times that never occur are NaN.
 *
 * @param corner             "nominal", "hot" or "cold"
 * @param offsetK            temperature offset of this corner from the setpoint program [K]
 * @param regime             the gas regime used
 * @param quasiSteadyError   estimated relative error of the quasi-steady pressure, max τ_g |d ln n/dt|
 * @param maxima             the largest value and its time of each tracked quantity, by history column
 * @param atMaximum          the whole history row at each of those maxima
 * @param timeTo1pctS        first time the unconverted fraction reaches 1 %
 * @param timeToTargetS      first time it reaches the residue target
 * @param finalUnconverted   unconverted fraction at the end of the recipe (after any cool-down)
 * @param unconvertedAtCheckpoint unconverted fraction where the residue target applies: the end of the
 *                           final hold ({@link org.exhale.recipe.ResidueCheckpoint})
 * @param thermalDoseS       equivalent time at the reference temperature [s]
 * @param massBalanceError   |gasified − vented − stored| / gasified at the end
 * @param columns            history column names (SI units in the suffix)
 * @param history            history rows
 * @param evaluations        right-hand-side evaluations
 */
public record CornerResult(String corner, double offsetK, GasRegime regime, double quasiSteadyError,
                           Map<String, Extremum> maxima, Map<String, double[]> atMaximum, double timeTo1pctS, double timeToTargetS,
                           double finalUnconverted, double unconvertedAtCheckpoint, double thermalDoseS, double massBalanceError,
                           List<String> columns, List<double[]> history, long evaluations) {

    /** A copy carrying the quasi-steady error estimate of the pre-run that chose this regime. */
    public CornerResult withQuasiSteadyError(double error) {
        return new CornerResult(corner, offsetK, regime, error, maxima, atMaximum, timeTo1pctS, timeToTargetS, finalUnconverted,
                unconvertedAtCheckpoint, thermalDoseS, massBalanceError, columns, history, evaluations);
    }

    public Extremum peakPressure() {
        return maxima.get("excess_pressure_Pa");
    }

    public Extremum maxWafer() {
        return maxima.get("wafer_K");
    }

    public Extremum maxSetpoint() {
        return maxima.get("setpoint_K");
    }

    public Extremum max(String column) {
        return maxima.get(column);
    }

    /** Index of a history column, or −1. */
    public int column(String name) {
        return columns.indexOf(name);
    }
}
