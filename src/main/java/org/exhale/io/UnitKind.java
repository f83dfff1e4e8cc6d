package org.exhale.io;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A kind of quantity and the units an engineer may type for it, each with its conversion to SI
 * (value_SI = value · scale + offset). The table is explicit on purpose: a unit not listed is an
 * error, never a guess.
 */
public enum UnitKind {
    /** Absolute temperature, SI kelvin. */
    TEMPERATURE("temperature", "K", units(
            "K", 1, 0, "C", 1, 273.15, "°C", 1, 273.15, "degC", 1, 273.15)),
    /** Temperature difference, SI kelvin. */
    TEMPERATURE_DIFFERENCE("temperature difference", "K", units("K", 1, 0, "C", 1, 0, "°C", 1, 0, "degC", 1, 0)),
    /** Heating rate, SI K/s. */
    HEATING_RATE("heating rate", "K/s", units(
            "C/min", 1 / 60.0, 0, "K/min", 1 / 60.0, 0, "°C/min", 1 / 60.0, 0, "C/s", 1, 0, "K/s", 1, 0,
            "°C/s", 1, 0, "C/h", 1 / 3600.0, 0, "K/h", 1 / 3600.0, 0)),
    LENGTH("length", "m", units(
            "m", 1, 0, "cm", 1e-2, 0, "mm", 1e-3, 0, "um", 1e-6, 0, "µm", 1e-6, 0, "μm", 1e-6, 0,
            "nm", 1e-9, 0, "A", 1e-10, 0, "Å", 1e-10, 0, "pm", 1e-12, 0)),
    TIME("time", "s", units("s", 1, 0, "min", 60, 0, "h", 3600, 0, "ms", 1e-3, 0)),
    PRESSURE("pressure", "Pa", units(
            "Pa", 1, 0, "kPa", 1e3, 0, "MPa", 1e6, 0, "GPa", 1e9, 0, "bar", 1e5, 0, "mbar", 100, 0,
            "atm", 101_325, 0, "Torr", 101_325 / 760.0, 0, "mTorr", 101_325 / 760.0e3, 0)),
    /** Stress and moduli share the pressure units. */
    STRESS("stress", "Pa", PRESSURE.table),
    MOLAR_ENERGY("molar energy", "J/mol", units("J/mol", 1, 0, "kJ/mol", 1e3, 0, "kcal/mol", 4184, 0)),
    MOLAR_MASS("molar mass", "kg/mol", units("g/mol", 1e-3, 0, "kg/mol", 1, 0, "Da", 1e-3, 0)),
    DENSITY("density", "kg/m3", units("g/cm3", 1e3, 0, "g/cc", 1e3, 0, "kg/m3", 1, 0, "g/mL", 1e3, 0)),
    /** A plain fraction; "%" divides by 100, "ppm" by 1e6. */
    FRACTION("fraction", "", units("", 1, 0, "%", 1e-2, 0, "ppm", 1e-6, 0)),
    DIFFUSIVITY("diffusivity", "m2/s", units("m2/s", 1, 0, "cm2/s", 1e-4, 0, "mm2/s", 1e-6, 0)),
    FREQUENCY("frequency", "1/s", units("1/s", 1, 0, "1/min", 1 / 60.0, 0, "1/h", 1 / 3600.0, 0, "s-1", 1, 0)),
    VISCOSITY("viscosity", "Pa s", units("Pa s", 1, 0, "Pa.s", 1, 0, "Pa*s", 1, 0, "mPa s", 1e-3, 0, "uPa s", 1e-6, 0,
            "µPa s", 1e-6, 0, "cP", 1e-3, 0)),
    PERMEABILITY("permeability", "mol/(m s Pa)", units("mol/(m s Pa)", 1, 0)),
    THERMAL_EXPANSION("thermal expansion coefficient", "1/K", units("ppm/K", 1e-6, 0, "1/K", 1, 0, "ppm/C", 1e-6, 0)),
    ENERGY_PER_AREA("energy per area", "J/m2", units("J/m2", 1, 0, "mJ/m2", 1e-3, 0, "N/m", 1, 0)),
    VOLUME("volume", "m3", units("m3", 1, 0, "L", 1e-3, 0, "l", 1e-3, 0, "mL", 1e-6, 0, "cm3", 1e-6, 0)),
    /** Gas flow at standard conditions, SI mol/s. */
    STANDARD_FLOW("standard gas flow", "mol/s", units(
            "sccm", org.exhale.PhysicalConstants.MOL_PER_S_PER_SCCM, 0,
            "slm", 1e3 * org.exhale.PhysicalConstants.MOL_PER_S_PER_SCCM, 0, "mol/s", 1, 0)),
    /** A dimensionless number with no unit allowed. */
    NUMBER("number", "", units("", 1, 0));

    /** One unit: SI value = value · scale + offset. */
    public record Unit(String symbol, double scale, double offset) {
        public double toSi(double value) {
            return value * scale + offset;
        }

        public double fromSi(double si) {
            return (si - offset) / scale;
        }
    }

    private final String description;
    private final String siSymbol;
    private final Map<String, Unit> table;

    UnitKind(String description, String siSymbol, Map<String, Unit> table) {
        this.description = description;
        this.siSymbol = siSymbol;
        this.table = table;
    }

    private static Map<String, Unit> units(Object... spec) {
        Map<String, Unit> map = new LinkedHashMap<>();
        for (int i = 0; i < spec.length; i += 3) {
            String s = (String) spec[i];
            map.put(s, new Unit(s, ((Number) spec[i + 1]).doubleValue(), ((Number) spec[i + 2]).doubleValue()));
        }
        return Map.copyOf(map);
    }

    public String description() {
        return description;
    }

    public String siSymbol() {
        return siSymbol;
    }

    /** The unit with this symbol, or null. */
    public Unit unit(String symbol) {
        return table.get(symbol);
    }

    public java.util.Set<String> symbols() {
        return new java.util.TreeSet<>(table.keySet());
    }
}
