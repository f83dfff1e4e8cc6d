package org.exhale.recipe;

/** One step of a bake recipe: a ramp to a target at a rate, or a hold for a duration. */
public sealed interface Step permits Step.Ramp, Step.Hold {

    /**
     * Ramp the setpoint linearly to {@code targetK} at {@code rateKPerS} (a magnitude; the
     * direction follows from the target).
     */
    record Ramp(double targetK, double rateKPerS) implements Step {
        public Ramp {
            if (!(targetK > 0 && targetK <= 3000)) {
                throw new IllegalArgumentException("ramp target must be in (−273.15 C, 3000 K], got " + targetK + " K");
            }
            if (!(rateKPerS > 0 && rateKPerS <= 100)) {
                throw new IllegalArgumentException("ramp rate must be in (0, 6000] C/min, got " + rateKPerS * 60 + " C/min");
            }
        }
    }

    /** Hold the setpoint for {@code durationS}. */
    record Hold(double durationS) implements Step {
        public Hold {
            if (!(durationS > 0 && durationS < 1e7)) {
                throw new IllegalArgumentException("hold duration must be in (0, 1e7) s, got " + durationS + " s");
            }
        }
    }
}
