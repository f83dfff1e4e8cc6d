package org.exhale.studies;

import java.util.Arrays;
import java.util.List;

import org.exhale.PhysicalConstants;
import org.exhale.io.UnitKind;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.Cavity;
import org.exhale.simulation.Chamber;
import org.exhale.simulation.Limits;
import org.exhale.simulation.Wafer;
import org.exhale.transport.CapFilm;

/**
 * A case value that a comparison may vary, named by its key path in the case file. Each key knows
 * its unit kind, how to put a value (SI) into a case, and how to show a value in the unit an
 * engineer reads.
 */
public enum StudyKey {
    CAP_POROSITY("cap.porosity", UnitKind.FRACTION, "", 1),
    CAP_PORE_RADIUS("cap.pore_radius", UnitKind.LENGTH, "nm", 1e-9),
    CAP_THICKNESS("cap.thickness", UnitKind.LENGTH, "nm", 1e-9),
    CAP_TORTUOSITY("cap.tortuosity", UnitKind.NUMBER, "", 1),
    CAVITY_WIDTH("cavity.width", UnitKind.LENGTH, "nm", 1e-9),
    CAVITY_HEIGHT("cavity.height", UnitKind.LENGTH, "nm", 1e-9),
    LIMITS_CEILING("limits.ceiling", UnitKind.TEMPERATURE, "C", 1),
    LIMITS_MAX_PRESSURE("limits.max_pressure", UnitKind.PRESSURE, "kPa", 1e3),
    LIMITS_SAFETY_FACTOR("limits.safety_factor", UnitKind.NUMBER, "", 1),
    WAFER_SPREAD("wafer.spread", UnitKind.TEMPERATURE_DIFFERENCE, "K", 1),
    WAFER_LAG("wafer.lag", UnitKind.TIME, "s", 1),
    CHAMBER_PURGE("chamber.purge", UnitKind.STANDARD_FLOW, "slm", 1e3 * PhysicalConstants.MOL_PER_S_PER_SCCM),
    POLYMER_DENSITY("polymer.density", UnitKind.DENSITY, "g/cm3", 1e3);

    private final String key;
    private final UnitKind kind;
    private final String displayUnit;
    private final double displayScale;

    StudyKey(String key, UnitKind kind, String displayUnit, double displayScale) {
        this.key = key;
        this.kind = kind;
        this.displayUnit = displayUnit;
        this.displayScale = displayScale;
    }

    public String key() {
        return key;
    }

    public UnitKind kind() {
        return kind;
    }

    /** The unit values are shown in (and written to CSV columns in). */
    public String displayUnit() {
        return displayUnit;
    }

    /** A SI value in the display unit. */
    public double display(double si) {
        if (kind == UnitKind.TEMPERATURE) {
            return si - PhysicalConstants.ZERO_CELSIUS_K;
        }
        return si / displayScale;
    }

    /** The CSV column name, e.g. {@code cap.pore_radius_nm}. */
    public String column() {
        return displayUnit.isEmpty() ? key : key + "_" + displayUnit.replace("/", "_per_");
    }

    public static List<String> names() {
        return Arrays.stream(values()).map(StudyKey::key).toList();
    }

    /** The key of this name, or null. */
    public static StudyKey of(String name) {
        for (StudyKey k : values()) {
            if (k.key.equals(name)) {
                return k;
            }
        }
        return null;
    }

    /**
     * The case with this value put in.
     *
     * @throws IllegalArgumentException when the value does not fit the case (a record's own check)
     */
    public BakeCase apply(BakeCase b, double v) {
        CapFilm cap = b.cap();
        Limits l = b.limits();
        Cavity c = b.cavity();
        BakeCase out = switch (this) {
            case CAP_POROSITY -> b.withCap(cap.withPorosity(v));
            case CAP_PORE_RADIUS -> b.withCap(cap.withPoreRadius(v));
            case CAP_THICKNESS -> b.withCap(cap.withThickness(v));
            case CAP_TORTUOSITY -> b.withCap(new CapFilm(cap.thicknessM(), cap.porosity(), cap.poreRadiusM(), v,
                    cap.permeabilityPi0(), cap.permeationActivationJPerMol()));
            case CAVITY_WIDTH -> withCavity(b, new Cavity(c.shape(), v, Math.max(c.lengthM(), v), c.heightM()));
            case CAVITY_HEIGHT -> withCavity(b, new Cavity(c.shape(), c.widthM(), c.lengthM(), v));
            case LIMITS_CEILING -> b.withLimits(l.withCeiling(v));
            case LIMITS_MAX_PRESSURE -> b.withLimits(new Limits(l.ceilingK(), l.residue(), v, l.dose(), l.safetyFactor(),
                    l.maxDeflectionM()));
            case LIMITS_SAFETY_FACTOR -> b.withLimits(new Limits(l.ceilingK(), l.residue(), l.maxPressurePa(), l.dose(), v,
                    l.maxDeflectionM()));
            case WAFER_SPREAD -> b.withWafer(new Wafer(b.wafer().lagS(), v));
            case WAFER_LAG -> b.withWafer(new Wafer(v, b.wafer().spreadK()));
            case CHAMBER_PURGE -> {
                Chamber ch = b.chamber();
                if (ch == null) {
                    throw new IllegalArgumentException("the case has no chamber section, so there is no purge to vary");
                }
                yield b.withChamber(new Chamber(ch.wafers(), ch.waferDiameterM(), ch.patternFraction(), ch.cavityFraction(),
                        ch.volumeM3(), ch.temperatureK(), ch.pressurePa(), v, ch.limitFraction(), ch.limitLabel()));
            }
            case POLYMER_DENSITY -> b.withPolymer(new org.exhale.kinetics.Polymer(v, b.polymer().freeVolumeFraction(),
                    b.polymer().components(), b.polymer().seedConversion()));
        };
        // The cap structure checks itself (a cap too thick for its span); make it so that a bad
        // combination fails here, not inside a simulation.
        out.capStructure();
        return out;
    }

    private static BakeCase withCavity(BakeCase b, Cavity c) {
        return new BakeCase(b.name(), b.polymer(), c, b.cap(), b.film(), b.substrateCtePerK(), b.ambient(), b.wafer(),
                b.limits(), b.recipe(), b.chamber());
    }
}
