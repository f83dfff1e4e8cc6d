package org.exhale.simulation;

/**
 * How the wafer follows the setpoint.
 *
 * @param lagS    first-order lag time constant τ_w [s] (0: the wafer is at the setpoint)
 * @param spreadK across-wafer spread ±ΔT [K]; above 0 a hot and a cold corner are simulated
 */
public record Wafer(double lagS, double spreadK) {
    public Wafer {
        if (!(lagS >= 0 && lagS <= 1e5)) {
            throw new IllegalArgumentException("wafer lag must be in [0, 1e5] s, got " + lagS);
        }
        if (!(spreadK >= 0 && spreadK < 200)) {
            throw new IllegalArgumentException("wafer spread must be in [0, 200) K, got " + spreadK);
        }
    }

    public static Wafer ideal() {
        return new Wafer(0, 0);
    }
}
