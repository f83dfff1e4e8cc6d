package org.exhale.simulation;

/** Plan-view shape of the cavity (and of the freed cap span above it). */
public enum CavityShape {
    /** A long line of width w. */
    LINE,
    /** A rectangle w × L (L ≥ w). */
    RECTANGLE,
    /** A disc of diameter w. */
    DISC
}
