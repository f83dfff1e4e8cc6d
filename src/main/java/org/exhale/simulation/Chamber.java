package org.exhale.simulation;

import org.exhale.PhysicalConstants;

/**
 * The furnace load and the well-mixed chamber its products go into (MODEL.md §8).
 *
 * @param wafers           wafers per load N
 * @param waferDiameterM   wafer diameter D_w [m]
 * @param patternFraction  fraction of the wafer area that is patterned
 * @param cavityFraction   fraction of the patterned area that is cavity (vent) area
 * @param volumeM3         chamber volume V_ch [m³]
 * @param temperatureK     chamber gas temperature T_ch [K]
 * @param pressurePa       chamber pressure p_ch [Pa]
 * @param purgeMolPerS     purge flow F [mol/s]
 * @param limitFraction    largest allowed product mole fraction in the exhaust (NaN: none)
 * @param limitLabel       how the limit was stated (e.g. "1000 ppm", "25 % of LEL 2 %")
 */
public record Chamber(int wafers, double waferDiameterM, double patternFraction, double cavityFraction,
                      double volumeM3, double temperatureK, double pressurePa, double purgeMolPerS,
                      double limitFraction, String limitLabel) {
    public Chamber {
        if (wafers < 1 || wafers > 10_000) {
            throw new IllegalArgumentException("wafers must be in [1, 10000]");
        }
        if (!(waferDiameterM > 0 && waferDiameterM <= 1)) {
            throw new IllegalArgumentException("wafer diameter must be in (0, 1] m");
        }
        if (!(patternFraction > 0 && patternFraction <= 1) || !(cavityFraction > 0 && cavityFraction <= 1)) {
            throw new IllegalArgumentException("pattern and cavity fractions must be in (0, 1]");
        }
        if (!(volumeM3 > 0 && volumeM3 < 1e3)) {
            throw new IllegalArgumentException("chamber volume must be in (0, 1000) m3");
        }
        if (!(temperatureK > 0 && temperatureK < 3000) || !(pressurePa > 0 && pressurePa < 1e7)) {
            throw new IllegalArgumentException("chamber temperature and pressure must be positive");
        }
        if (!(purgeMolPerS > 0 && purgeMolPerS < 1e3)) {
            throw new IllegalArgumentException("purge flow must be positive (a purged chamber)");
        }
        if (!Double.isNaN(limitFraction) && !(limitFraction > 0 && limitFraction < 1)) {
            throw new IllegalArgumentException("chamber limit must be a mole fraction in (0, 1)");
        }
    }

    /** Cavity (vent) area of the whole load, N (π D²/4) f_pattern f_cavity [m²]. */
    public double ventAreaM2() {
        return wafers * Math.PI * waferDiameterM * waferDiameterM / 4 * patternFraction * cavityFraction;
    }

    /** Moles of gas in the chamber, p V/(R T) [mol]. */
    public double gasMoles() {
        return pressurePa * volumeM3 / (PhysicalConstants.GAS_CONSTANT * temperatureK);
    }

    /** Residence time of the purge, (p V/(R T))/F [s]. */
    public double residenceTimeS() {
        return gasMoles() / purgeMolPerS;
    }

    public boolean hasLimit() {
        return !Double.isNaN(limitFraction);
    }
}
