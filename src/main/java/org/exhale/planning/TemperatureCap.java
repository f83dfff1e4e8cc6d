package org.exhale.planning;

/**
 * The highest temperature any recipe can give the wafer at time t (MODEL.md §9): the setpoint
 * ramped at the tool's fastest rate from the start and then held at the cap, and the wafer's
 * first-order lagged response to it. Any admissible setpoint lies at or below this one, and the
 * lag is a monotone linear filter, so the wafer of any recipe lies at or below the lagged cap.
 */
final class TemperatureCap {
    private final double startK;
    private final double capK;
    private final double rateKPerS;
    private final double lagS;
    private final double rampEndS;
    private final double waferAtRampEnd;

    TemperatureCap(double startK, double capK, double rateKPerS, double lagS) {
        this.startK = startK;
        this.capK = Math.max(capK, startK);
        this.rateKPerS = rateKPerS;
        this.lagS = lagS;
        this.rampEndS = (this.capK - startK) / rateKPerS;
        this.waferAtRampEnd = rampResponse(rampEndS);
    }

    double setpoint(double t) {
        return Math.min(startK + rateKPerS * t, capK);
    }

    private double rampResponse(double t) {
        if (lagS == 0) {
            return startK + rateKPerS * t;
        }
        return startK + rateKPerS * (t - lagS * (1 - Math.exp(-t / lagS)));
    }

    /** The lagged wafer temperature under the cap setpoint. */
    double wafer(double t) {
        if (t <= rampEndS) {
            return rampResponse(t);
        }
        if (lagS == 0) {
            return capK;
        }
        return capK - (capK - waferAtRampEnd) * Math.exp(-(t - rampEndS) / lagS);
    }

    double capK() {
        return capK;
    }

    double rampEndS() {
        return rampEndS;
    }

    /** Time after which the lagged wafer is within 1e-9 of its cap (20 lag times after the ramp ends) [s]. */
    double settledS() {
        return rampEndS + 20 * lagS;
    }
}
