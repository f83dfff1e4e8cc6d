package org.exhale.simulation;

/**
 * Thermal budget of the devices below, as equivalent time at a reference temperature:
 * t_eq = ∫ exp(−(E_b/R)(1/T − 1/T_ref)) dt ≤ max.
 */
public record ThermalDose(double activationEnergyJPerMol, double referenceK, double maxS) {
    public ThermalDose {
        if (!(activationEnergyJPerMol > 0 && activationEnergyJPerMol <= 1e6)) {
            throw new IllegalArgumentException("thermal dose activation energy must be in (0, 1000] kJ/mol");
        }
        if (!(referenceK > 0 && referenceK <= 3000)) {
            throw new IllegalArgumentException("thermal dose reference temperature must be in (0, 3000] K, got " + referenceK + " K");
        }
        if (!(maxS > 0)) {
            throw new IllegalArgumentException("thermal dose maximum must be positive");
        }
    }
}
