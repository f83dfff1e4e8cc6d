package org.exhale.simulation;

/** The extreme value of a quantity over a bake and the time it occurs [s]. */
public record Extremum(double value, double timeS) {
}
