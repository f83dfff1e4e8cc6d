package org.exhale.kinetics;

/**
 * The gaseous product a component releases.
 *
 * @param molarMassKgPerMol              mean molar mass M [kg/mol]
 * @param kineticDiameterM               kinetic diameter σ [m], used for size exclusion in the pores
 * @param molecularDiffusivityRefM2PerS  molecular diffusivity in the ambient gas at the ambient's
 *                                       reference temperature and pressure [m²/s]
 * @param permeabilityPi0                this product's own solution–diffusion permeability through the
 *                                       cap's solid, Π0 in Π = Π0 exp(−E/(R T)) [mol m⁻¹ s⁻¹ Pa⁻¹]; NaN:
 *                                       the cap's permeability applies (MODEL.md §5)
 * @param permeationActivationJPerMol    its activation energy E [J/mol]; NaN with a NaN Π0
 */
public record Product(double molarMassKgPerMol, double kineticDiameterM, double molecularDiffusivityRefM2PerS,
                      double permeabilityPi0, double permeationActivationJPerMol) {
    /** A product that permeates the cap's solid as the cap's permeability says. */
    public Product(double molarMassKgPerMol, double kineticDiameterM, double molecularDiffusivityRefM2PerS) {
        this(molarMassKgPerMol, kineticDiameterM, molecularDiffusivityRefM2PerS, Double.NaN, Double.NaN);
    }

    public Product {
        if (Double.isNaN(permeabilityPi0) != Double.isNaN(permeationActivationJPerMol)) {
            throw new IllegalArgumentException("a product's permeability needs both Pi0 and Ea");
        }
        if (!Double.isNaN(permeabilityPi0) && !(permeabilityPi0 >= 0 && permeabilityPi0 < 1)) {
            throw new IllegalArgumentException("product permeability Pi0 must be in [0, 1) mol/(m s Pa), got " + permeabilityPi0);
        }
        if (!Double.isNaN(permeationActivationJPerMol) && !(permeationActivationJPerMol >= 0 && permeationActivationJPerMol <= 1e6)) {
            throw new IllegalArgumentException("product permeation activation energy must be in [0, 1000] kJ/mol, got "
                    + permeationActivationJPerMol / 1e3 + " kJ/mol");
        }
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

    /** True when this product has its own permeability (else the cap's applies). */
    public boolean hasOwnPermeability() {
        return !Double.isNaN(permeabilityPi0);
    }
}
