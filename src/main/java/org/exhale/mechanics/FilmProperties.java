package org.exhale.mechanics;

/**
 * Elastic, thermal and fracture properties of the cap film.
 *
 * <p>The three limit properties ({@code strengthPa}, {@code cohesiveEnergyJPerM2},
 * {@code interfaceEnergyJPerM2}) may be {@link Double#POSITIVE_INFINITY}, which means "not given":
 * the matching limit is then never reached (its allowed value is infinite). Use
 * {@link #NOT_GIVEN} for readability.
 *
 * @param youngsModulusPa         Young's modulus E [Pa], finite and positive
 * @param poisson                 Poisson's ratio ν, in (−1, 0.5)
 * @param ctePerK                 linear thermal expansion coefficient α_f of the film [1/K]
 * @param stressFreeTemperatureK  temperature T_0f at which the thermal mismatch stress is zero [K]
 * @param intrinsicStressPa       intrinsic (growth) stress σ_i, biaxial, tension positive [Pa]
 * @param strengthPa              tensile strength σ_f [Pa], positive, or +∞ if not given
 * @param cohesiveEnergyJPerM2    cohesive fracture energy Γ_c of the film [J/m²], positive, or +∞
 * @param interfaceEnergyJPerM2   interface fracture energy Γ_i to the layer below [J/m²], positive, or +∞
 */
public record FilmProperties(double youngsModulusPa, double poisson, double ctePerK,
                             double stressFreeTemperatureK, double intrinsicStressPa, double strengthPa,
                             double cohesiveEnergyJPerM2, double interfaceEnergyJPerM2) {

    /** Marker for a strength or fracture energy that is not given (the limit is not checked). */
    public static final double NOT_GIVEN = Double.POSITIVE_INFINITY;

    public FilmProperties {
        if (!(youngsModulusPa > 0 && youngsModulusPa < 1e13)) {
            throw new IllegalArgumentException("Young's modulus must be in (0, 1e13) Pa, got " + youngsModulusPa);
        }
        if (!(poisson > -1 && poisson < 0.5)) {
            throw new IllegalArgumentException("Poisson's ratio must be in (-1, 0.5), got " + poisson);
        }
        if (!(Math.abs(ctePerK) <= 1e-3)) {
            throw new IllegalArgumentException("film CTE must be finite and at most 1e-3 1/K in magnitude, got "
                    + ctePerK);
        }
        if (!(stressFreeTemperatureK > 0 && stressFreeTemperatureK < 1e4)) {
            throw new IllegalArgumentException("stress-free temperature must be in (0, 1e4) K, got "
                    + stressFreeTemperatureK);
        }
        if (!(Math.abs(intrinsicStressPa) < 1e11)) {
            throw new IllegalArgumentException("intrinsic stress must be finite and below 1e11 Pa in magnitude, got "
                    + intrinsicStressPa);
        }
        if (!(strengthPa > 0)) {
            throw new IllegalArgumentException("strength must be positive (or +Infinity if not given), got "
                    + strengthPa);
        }
        if (!(cohesiveEnergyJPerM2 > 0)) {
            throw new IllegalArgumentException(
                    "cohesive fracture energy must be positive (or +Infinity if not given), got " + cohesiveEnergyJPerM2);
        }
        if (!(interfaceEnergyJPerM2 > 0)) {
            throw new IllegalArgumentException(
                    "interface fracture energy must be positive (or +Infinity if not given), got " + interfaceEnergyJPerM2);
        }
    }

    /** Film with only elastic and thermal properties; strength and fracture energies not given. */
    public static FilmProperties elastic(double youngsModulusPa, double poisson, double ctePerK,
                                         double stressFreeTemperatureK, double intrinsicStressPa) {
        return new FilmProperties(youngsModulusPa, poisson, ctePerK, stressFreeTemperatureK, intrinsicStressPa,
                NOT_GIVEN, NOT_GIVEN, NOT_GIVEN);
    }

    /** Plane-strain modulus Ē = E/(1−ν²) [Pa]. */
    public double planeStrainModulusPa() {
        return youngsModulusPa / (1 - poisson * poisson);
    }

    /** Biaxial modulus M = E/(1−ν) [Pa]. */
    public double biaxialModulusPa() {
        return youngsModulusPa / (1 - poisson);
    }

    public FilmProperties withIntrinsicStress(double newIntrinsicStressPa) {
        return new FilmProperties(youngsModulusPa, poisson, ctePerK, stressFreeTemperatureK, newIntrinsicStressPa,
                strengthPa, cohesiveEnergyJPerM2, interfaceEnergyJPerM2);
    }

    public FilmProperties withFracture(double newStrengthPa, double newCohesiveEnergyJPerM2,
                                       double newInterfaceEnergyJPerM2) {
        return new FilmProperties(youngsModulusPa, poisson, ctePerK, stressFreeTemperatureK, intrinsicStressPa,
                newStrengthPa, newCohesiveEnergyJPerM2, newInterfaceEnergyJPerM2);
    }
}
