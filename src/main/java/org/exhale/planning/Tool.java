package org.exhale.planning;

/**
 * What the bake tool can do.
 *
 * @param maxRampUpKPerS     fastest heating ramp [K/s]
 * @param maxRampDownKPerS   fastest cooling ramp [K/s]
 * @param setpointStepK      setpoint resolution [K]
 * @param timeStepS          time resolution of step durations [s]
 * @param minStepS           shortest step the tool accepts [s]
 * @param maxSteps           most steps in one recipe
 * @param unloadK            temperature to cool to before unloading [K], NaN for no cool-down
 * @param overshootK         guard band for the controller's overshoot above the setpoint [K], 0 for none
 */
public record Tool(double maxRampUpKPerS, double maxRampDownKPerS, double setpointStepK, double timeStepS,
                   double minStepS, int maxSteps, double unloadK, double overshootK) {
    public Tool {
        if (!(overshootK >= 0 && overshootK <= 50)) {
            throw new IllegalArgumentException("overshoot must be in [0, 50] K");
        }
        if (!(maxRampUpKPerS > 0 && maxRampUpKPerS <= 100)) {
            throw new IllegalArgumentException("max_ramp_up must be in (0, 6000] C/min");
        }
        if (!(maxRampDownKPerS > 0 && maxRampDownKPerS <= 100)) {
            throw new IllegalArgumentException("max_ramp_down must be in (0, 6000] C/min");
        }
        if (!(setpointStepK >= 0 && setpointStepK <= 50)) {
            throw new IllegalArgumentException("setpoint_step must be in [0, 50] K");
        }
        if (!(timeStepS >= 0 && timeStepS <= 600)) {
            throw new IllegalArgumentException("time_step must be in [0, 600] s");
        }
        if (!(minStepS >= 0 && minStepS <= 36_000)) {
            throw new IllegalArgumentException("min_step must be in [0, 10] h");
        }
        if (maxSteps < 2 || maxSteps > 100) {
            throw new IllegalArgumentException("max_steps must be in [2, 100]");
        }
    }

    /** A tool without an overshoot guard band. */
    public Tool(double maxRampUpKPerS, double maxRampDownKPerS, double setpointStepK, double timeStepS,
                double minStepS, int maxSteps, double unloadK) {
        this(maxRampUpKPerS, maxRampDownKPerS, setpointStepK, timeStepS, minStepS, maxSteps, unloadK, 0);
    }

    /**
     * The highest setpoint a plan may use [K]: the ceiling less the across-wafer spread and the
     * overshoot guard band, so that setpoint + overshoot + spread stays at or below the ceiling.
     */
    public double highestSetpointK(double ceilingK, double spreadK) {
        return ceilingK - spreadK - overshootK;
    }

    /** A tool with the given rate limits and the usual resolutions (1 K, 1 s, 30 s, 12 steps, no cool-down). */
    public static Tool typical(double maxRampUpKPerS, double maxRampDownKPerS) {
        return new Tool(maxRampUpKPerS, maxRampDownKPerS, 1, 1, 30, 12, Double.NaN);
    }

    public boolean hasUnload() {
        return !Double.isNaN(unloadK);
    }
}
