package org.exhale.simulation;

/**
 * Process limits. Optional limits are +∞ (pressure, deflection) or null (dose) when not given.
 *
 * @param ceilingK        thermal ceiling for wafer and setpoint [K]
 * @param residue         target unconverted polymer fraction u at the end of the bake
 * @param maxPressurePa   direct limit on the excess pressure under the cap [Pa]
 * @param dose            thermal dose limit, or null
 * @param safetyFactor    divides the film strength and fracture energies
 * @param maxDeflectionM  largest allowed cap deflection [m]
 */
public record Limits(double ceilingK, double residue, double maxPressurePa, ThermalDose dose,
                     double safetyFactor, double maxDeflectionM) {
    public static final double DEFAULT_RESIDUE = 0.005;

    public Limits {
        if (!(ceilingK > 0 && ceilingK < 3000)) {
            throw new IllegalArgumentException("ceiling must be a temperature in (−273, 2727) C");
        }
        if (!(residue > 0 && residue < 1)) {
            throw new IllegalArgumentException("residue target must be in (0, 100) %, got " + residue);
        }
        if (!(maxPressurePa > 0)) {
            throw new IllegalArgumentException("max_pressure must be positive");
        }
        if (!(safetyFactor >= 1 && safetyFactor < 100)) {
            throw new IllegalArgumentException("safety factor must be in [1, 100), got " + safetyFactor);
        }
        if (!(maxDeflectionM > 0)) {
            throw new IllegalArgumentException("max_deflection must be positive");
        }
    }

    public Limits withCeiling(double k) {
        return new Limits(k, residue, maxPressurePa, dose, safetyFactor, maxDeflectionM);
    }

    public Limits withResidue(double r) {
        return new Limits(ceilingK, r, maxPressurePa, dose, safetyFactor, maxDeflectionM);
    }
}
