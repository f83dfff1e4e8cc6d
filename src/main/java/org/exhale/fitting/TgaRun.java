package org.exhale.fitting;

import java.util.Arrays;

/**
 * One thermogravimetric run as measured: time, sample temperature and mass, in SI.
 *
 * @param label          name for outputs (file name, and the run value where one file holds several)
 * @param timeS          time [s], strictly increasing
 * @param temperatureK   sample temperature [K]
 * @param mass           mass, in kg ({@link MassBasis#KILOGRAM}) or as a fraction of the initial
 *                       mass ({@link MassBasis#FRACTION}); conversion only uses ratios
 * @param basis          what the mass column holds
 */
public record TgaRun(String label, double[] timeS, double[] temperatureK, double[] mass, MassBasis basis) {

    /** Fewest points a run may have for the derivative and the plateaus to mean anything. */
    public static final int MIN_POINTS = 20;

    /** What the mass column of a run holds. */
    public enum MassBasis { KILOGRAM, FRACTION }

    public TgaRun {
        if (label == null || label.isBlank()) {
            throw new IllegalArgumentException("run label must not be empty");
        }
        if (timeS == null || temperatureK == null || mass == null || basis == null) {
            throw new IllegalArgumentException("run " + label + ": time, temperature, mass and basis are required");
        }
        if (timeS.length != temperatureK.length || timeS.length != mass.length) {
            throw new IllegalArgumentException("run " + label + ": columns differ in length (" + timeS.length
                    + ", " + temperatureK.length + ", " + mass.length + ")");
        }
        if (timeS.length < MIN_POINTS) {
            throw new IllegalArgumentException("run " + label + ": " + timeS.length + " points, at least "
                    + MIN_POINTS + " needed");
        }
        timeS = timeS.clone();
        temperatureK = temperatureK.clone();
        mass = mass.clone();
        for (int i = 0; i < timeS.length; i++) {
            if (!Double.isFinite(timeS[i]) || !Double.isFinite(temperatureK[i]) || !Double.isFinite(mass[i])) {
                throw new IllegalArgumentException("run " + label + ": point " + i + " is not finite");
            }
            if (!(temperatureK[i] > 0)) {
                throw new IllegalArgumentException("run " + label + ": point " + i + " has temperature "
                        + temperatureK[i] + " K, expected > 0 K");
            }
            if (i > 0 && !(timeS[i] > timeS[i - 1])) {
                throw new IllegalArgumentException("run " + label + ": time does not increase at point " + i);
            }
        }
    }

    public int size() {
        return timeS.length;
    }

    @Override
    public double[] timeS() {
        return timeS.clone();
    }

    @Override
    public double[] temperatureK() {
        return temperatureK.clone();
    }

    @Override
    public double[] mass() {
        return mass.clone();
    }

    double time(int i) {
        return timeS[i];
    }

    double temperature(int i) {
        return temperatureK[i];
    }

    double massAt(int i) {
        return mass[i];
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof TgaRun r && label.equals(r.label) && basis == r.basis
                && Arrays.equals(timeS, r.timeS) && Arrays.equals(temperatureK, r.temperatureK)
                && Arrays.equals(mass, r.mass);
    }

    @Override
    public int hashCode() {
        return label.hashCode() * 31 + Arrays.hashCode(timeS);
    }

    @Override
    public String toString() {
        return "TgaRun[" + label + ", " + timeS.length + " points]";
    }
}
