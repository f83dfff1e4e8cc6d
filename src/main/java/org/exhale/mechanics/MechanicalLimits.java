package org.exhale.mechanics;

/**
 * Design limits applied to the cap.
 *
 * @param safetyFactor    factor SF ≥ 1 dividing the strength and the fracture energies
 * @param maxDeflectionM  largest allowed centre deflection magnitude [m], positive, or +∞ (not checked)
 */
public record MechanicalLimits(double safetyFactor, double maxDeflectionM) {
    public MechanicalLimits {
        if (!(safetyFactor >= 1 && safetyFactor < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("safety factor must be finite and >= 1, got " + safetyFactor);
        }
        if (!(maxDeflectionM > 0)) {
            throw new IllegalArgumentException(
                    "maximum deflection must be positive (or +Infinity if not checked), got " + maxDeflectionM);
        }
    }

    /** Only a safety factor; deflection not checked. */
    public static MechanicalLimits withSafetyFactor(double safetyFactor) {
        return new MechanicalLimits(safetyFactor, Double.POSITIVE_INFINITY);
    }
}
