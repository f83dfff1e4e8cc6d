package org.exhale.mechanics;

/** The contributions to the largest face stress σ_max = σ_th + σ_m + σ_b. */
public enum EdgeTerm {
    /** Thermal mismatch plus intrinsic stress σ_th. */
    THERMAL,
    /** Plate bending stress σ_b at the clamped edge (or the centre, where that is larger). */
    BENDING,
    /** Membrane (stretching) stress σ_m from large deflection. */
    MEMBRANE
}
