package org.exhale.kinetics;

import java.util.List;

/**
 * The sacrificial polymer: its density, the free volume left in the filled cavity, and its
 * decomposition components.
 *
 * @param densityKgPerM3       ρ [kg/m³]
 * @param freeVolumeFraction   φ0, initial free (gas) volume as a fraction of the cavity height
 * @param components           parallel components; fractions sum to 1
 * @param seedConversion       α(0) for components whose f(0) is zero or infinite; releases no gas
 */
public record Polymer(double densityKgPerM3, double freeVolumeFraction, List<Component> components,
                      double seedConversion) {

    public static final double DEFAULT_SEED = 1e-4;
    public static final double DEFAULT_FREE_VOLUME = 0.02;

    public Polymer {
        if (!(densityKgPerM3 >= 10 && densityKgPerM3 <= 30_000)) {
            throw new IllegalArgumentException("polymer density must be in [0.01, 30] g/cm3, got "
                    + densityKgPerM3 / 1e3 + " g/cm3");
        }
        if (!(freeVolumeFraction >= 0 && freeVolumeFraction <= 1)) {
            throw new IllegalArgumentException("free volume fraction must be in [0, 1], got " + freeVolumeFraction);
        }
        if (components == null || components.isEmpty()) {
            throw new IllegalArgumentException("polymer needs at least one component");
        }
        components = List.copyOf(components);
        double sum = 0;
        for (Component c : components) {
            sum += c.fraction();
        }
        if (Math.abs(sum - 1) > 1e-6) {
            throw new IllegalArgumentException("component fractions must sum to 1, got " + sum);
        }
        if (!(seedConversion > 0 && seedConversion <= 1e-2)) {
            throw new IllegalArgumentException("seed conversion must be in (0, 0.01], got " + seedConversion);
        }
    }

    public int size() {
        return components.size();
    }

    public Component component(int j) {
        return components.get(j);
    }

    /** Initial conversion of component j: the seed where its model needs one, else 0. */
    public double initialConversion(int j) {
        return components.get(j).model().needsSeed() ? seedConversion : 0;
    }

    public Polymer withComponents(List<Component> newComponents) {
        return new Polymer(densityKgPerM3, freeVolumeFraction, newComponents, seedConversion);
    }
}
