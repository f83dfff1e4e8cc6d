package org.exhale.transport;

/**
 * The gas around the wafer.
 *
 * @param pressurePa                 chamber pressure p_amb [Pa]; 0 for vacuum (no molecular diffusion)
 * @param viscosityPaS               dynamic viscosity μ of the gas in the cap pores [Pa s]
 * @param diffusivityRefTemperatureK temperature at which the products' molecular diffusivities are given [K]
 * @param diffusivityRefPressurePa   pressure at which they are given [Pa]
 */
public record Ambient(double pressurePa, double viscosityPaS, double diffusivityRefTemperatureK,
                      double diffusivityRefPressurePa) {
    /** Typical small-organic-in-nitrogen molecular diffusivity, 1e-5 m²/s at 25 °C, 1 atm (common practice, no source). */
    public static final double DEFAULT_DIFFUSIVITY_M2_PER_S = 1.0e-5;
    /** Nitrogen near 400 °C, about 3.0e-5 Pa s (common practice, no source). */
    public static final double DEFAULT_VISCOSITY_PA_S = 3.0e-5;

    public Ambient {
        if (!(pressurePa >= 0 && pressurePa <= 1e8)) {
            throw new IllegalArgumentException("ambient pressure must be in [0, 100] MPa, got " + pressurePa + " Pa");
        }
        if (!(viscosityPaS > 0 && viscosityPaS <= 1)) {
            throw new IllegalArgumentException("ambient viscosity must be in (0, 1] Pa s, got " + viscosityPaS);
        }
        if (!(diffusivityRefTemperatureK > 0 && diffusivityRefTemperatureK < 5000)) {
            throw new IllegalArgumentException("diffusivity reference temperature must be positive, got "
                    + diffusivityRefTemperatureK + " K");
        }
        if (!(diffusivityRefPressurePa > 0 && diffusivityRefPressurePa <= 1e8)) {
            throw new IllegalArgumentException("diffusivity reference pressure must be positive, got "
                    + diffusivityRefPressurePa + " Pa");
        }
    }

    public boolean isVacuum() {
        return pressurePa == 0;
    }

    public Ambient withPressure(double p) {
        return new Ambient(p, viscosityPaS, diffusivityRefTemperatureK, diffusivityRefPressurePa);
    }
}
