package org.exhale.recipe;

/** A piece of the setpoint program on which the setpoint is linear in time. */
public record Segment(int stepIndex, double startTimeS, double endTimeS, double startK, double endK) {
    public double durationS() {
        return endTimeS - startTimeS;
    }

    /** Setpoint slope [K/s]. */
    public double slopeKPerS() {
        double d = durationS();
        return d == 0 ? 0 : (endK - startK) / d;
    }

    public double setpointAt(double timeS) {
        double d = durationS();
        if (d == 0) {
            return endK;
        }
        double s = (timeS - startTimeS) / d;
        s = Math.min(1, Math.max(0, s));
        return startK + s * (endK - startK);
    }

    public boolean isHold() {
        return startK == endK;
    }
}
