package org.exhale.transport;

/**
 * The porous cap film as a gas barrier.
 *
 * @param thicknessM                  h [m]
 * @param porosity                    open (connected) porosity ε in [0, 1)
 * @param poreRadiusM                 mean pore radius r_p [m] (ignored when ε = 0)
 * @param tortuosity                  τ ≥ 1, or NaN for Bruggeman's τ = ε^−½
 * @param permeabilityPi0             solution–diffusion permeability pre-factor Π0 [mol m⁻¹ s⁻¹ Pa⁻¹]
 * @param permeationActivationJPerMol activation energy of permeation E_Π [J/mol]
 */
public record CapFilm(double thicknessM, double porosity, double poreRadiusM, double tortuosity,
                      double permeabilityPi0, double permeationActivationJPerMol) {
    public CapFilm {
        if (!(thicknessM > 0 && thicknessM <= 1e-3)) {
            throw new IllegalArgumentException("cap thickness must be in (0, 1] mm, got " + thicknessM + " m");
        }
        if (!(porosity >= 0 && porosity < 1)) {
            throw new IllegalArgumentException("cap porosity must be in [0, 1), got " + porosity);
        }
        if (porosity > 0 && !(poreRadiusM > 0 && poreRadiusM <= 1e-4)) {
            throw new IllegalArgumentException("cap pore radius must be in (0, 100] um, got " + poreRadiusM + " m");
        }
        if (!Double.isNaN(tortuosity) && !(tortuosity >= 1 && tortuosity <= 1e3)) {
            throw new IllegalArgumentException("cap tortuosity must be in [1, 1000], got " + tortuosity);
        }
        if (!(permeabilityPi0 >= 0 && permeabilityPi0 < 1)) {
            throw new IllegalArgumentException("cap permeability Pi0 must be in [0, 1) mol/(m s Pa), got " + permeabilityPi0);
        }
        if (!(permeationActivationJPerMol >= 0 && permeationActivationJPerMol <= 1e6)) {
            throw new IllegalArgumentException("permeation activation energy must be in [0, 1000] kJ/mol");
        }
    }

    /** A porous cap with Bruggeman tortuosity and no solid-state permeation. */
    public static CapFilm porous(double thicknessM, double porosity, double poreRadiusM) {
        return new CapFilm(thicknessM, porosity, poreRadiusM, Double.NaN, 0, 0);
    }

    /** ε/τ, the geometric factor of effective diffusivity (ε^1.5 with Bruggeman's τ). */
    public double porosityOverTortuosity() {
        if (porosity == 0) {
            return 0;
        }
        return Double.isNaN(tortuosity) ? porosity * Math.sqrt(porosity) : porosity / tortuosity;
    }

    /** The tortuosity in use (Bruggeman's ε^−½ when not given; infinite for a dense film). */
    public double effectiveTortuosity() {
        if (!Double.isNaN(tortuosity)) {
            return tortuosity;
        }
        return porosity == 0 ? Double.POSITIVE_INFINITY : 1 / Math.sqrt(porosity);
    }

    /** Capillary-bundle viscous permeability B0 = ε r_p² / (8 τ) [m²]. */
    public double viscousPermeabilityM2() {
        return porosity == 0 ? 0 : porosityOverTortuosity() * poreRadiusM * poreRadiusM / 8;
    }

    public CapFilm withThickness(double h) {
        return new CapFilm(h, porosity, poreRadiusM, tortuosity, permeabilityPi0, permeationActivationJPerMol);
    }

    public CapFilm withPorosity(double e) {
        return new CapFilm(thicknessM, e, poreRadiusM, tortuosity, permeabilityPi0, permeationActivationJPerMol);
    }

    public CapFilm withPoreRadius(double r) {
        return new CapFilm(thicknessM, porosity, r, tortuosity, permeabilityPi0, permeationActivationJPerMol);
    }
}
