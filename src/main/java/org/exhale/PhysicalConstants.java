package org.exhale;

/** Physical constants used throughout, SI units. */
public final class PhysicalConstants {
    /** Molar gas constant, CODATA 2018 (exact since the 2019 SI redefinition): 8.314462618 J mol⁻¹ K⁻¹. */
    public static final double GAS_CONSTANT = 8.314462618;
    /** Boltzmann constant, CODATA 2018 (exact): 1.380649e-23 J K⁻¹. */
    public static final double BOLTZMANN = 1.380649e-23;
    /** Zero of the Celsius scale: 273.15 K. */
    public static final double ZERO_CELSIUS_K = 273.15;
    /** Standard atmosphere: 101325 Pa. */
    public static final double STANDARD_ATMOSPHERE_PA = 101_325.0;
    /**
     * Moles per second in one sccm (gas at 0 °C and 1 atm): p/(R T) · 1e-6 m³ / 60 s
     * = 7.436e-7 mol/s (ideal-gas law, common practice).
     */
    public static final double MOL_PER_S_PER_SCCM =
            STANDARD_ATMOSPHERE_PA * 1e-6 / 60.0 / (GAS_CONSTANT * ZERO_CELSIUS_K);

    private PhysicalConstants() {
    }
}
