package org.exhale.kinetics;

/**
 * The gaseous product a component releases.
 *
 * @param molarMassKgPerMol              mean molar mass M [kg/mol]
 * @param kineticDiameterM               kinetic diameter σ [m], used for size exclusion in the pores
 * @param molecularDiffusivityRefM2PerS  molecular diffusivity in the ambient gas at the ambient's
 *                                       reference temperature and pressure [m²/s]
 */
public record Product(double molarMassKgPerMol, double kineticDiameterM, double molecularDiffusivityRefM2PerS) {
    public Product {
        if (!(molarMassKgPerMol > 1e-3 && molarMassKgPerMol < 100)) {
            throw new IllegalArgumentException("product molar mass must be in (1, 1e5) g/mol, got "
                    + molarMassKgPerMol * 1e3 + " g/mol");
        }
        if (!(kineticDiameterM > 0 && kineticDiameterM < 1e-7)) {
            throw new IllegalArgumentException("product kinetic diameter must be in (0, 100) nm, got "
                    + kineticDiameterM * 1e9 + " nm");
        }
        if (!(molecularDiffusivityRefM2PerS > 0 && molecularDiffusivityRefM2PerS <= 1)) {
            throw new IllegalArgumentException("product molecular diffusivity must be in (0, 1] m2/s, got "
                    + molecularDiffusivityRefM2PerS);
        }
    }
}
