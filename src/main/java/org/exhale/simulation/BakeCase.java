package org.exhale.simulation;

import org.exhale.kinetics.Polymer;
import org.exhale.mechanics.CapStructure;
import org.exhale.mechanics.FilmProperties;
import org.exhale.mechanics.MechanicalLimits;
import org.exhale.recipe.Recipe;
import org.exhale.transport.Ambient;
import org.exhale.transport.CapFilm;

/**
 * Everything one bake needs: structure, materials, ambient, limits and the recipe.
 *
 * @param film             mechanical properties of the cap, or null when the cap mechanics is not checked
 * @param substrateCtePerK thermal expansion coefficient of the substrate [1/K]
 * @param recipe           the bake recipe, or null when the case is only to be planned
 * @param chamber          the furnace load and chamber, or null when the exhaust is not checked
 */
public record BakeCase(String name, Polymer polymer, Cavity cavity, CapFilm cap, FilmProperties film,
                       double substrateCtePerK, Ambient ambient, Wafer wafer, Limits limits, Recipe recipe,
                       Chamber chamber) {

    /** A case without a chamber section. */
    public BakeCase(String name, Polymer polymer, Cavity cavity, CapFilm cap, FilmProperties film,
                    double substrateCtePerK, Ambient ambient, Wafer wafer, Limits limits, Recipe recipe) {
        this(name, polymer, cavity, cap, film, substrateCtePerK, ambient, wafer, limits, recipe, null);
    }
    public BakeCase {
        if (name == null) {
            name = "";
        }
        if (polymer == null || cavity == null || cap == null || ambient == null || wafer == null || limits == null) {
            throw new IllegalArgumentException("a bake case needs polymer, cavity, cap, ambient, wafer and limits");
        }
        if (!(substrateCtePerK >= -1e-4 && substrateCtePerK < 1e-3)) {
            throw new IllegalArgumentException("substrate CTE must be in (-100, 1000) ppm/K");
        }
    }

    public BakeCase withRecipe(Recipe r) {
        return new BakeCase(name, polymer, cavity, cap, film, substrateCtePerK, ambient, wafer, limits, r, chamber);
    }

    public BakeCase withCap(CapFilm c) {
        return new BakeCase(name, polymer, cavity, c, film, substrateCtePerK, ambient, wafer, limits, recipe, chamber);
    }

    public BakeCase withPolymer(Polymer p) {
        return new BakeCase(name, p, cavity, cap, film, substrateCtePerK, ambient, wafer, limits, recipe, chamber);
    }

    public BakeCase withWafer(Wafer w) {
        return new BakeCase(name, polymer, cavity, cap, film, substrateCtePerK, ambient, w, limits, recipe, chamber);
    }

    public BakeCase withLimits(Limits l) {
        return new BakeCase(name, polymer, cavity, cap, film, substrateCtePerK, ambient, wafer, l, recipe, chamber);
    }

    public BakeCase withFilm(FilmProperties f) {
        return new BakeCase(name, polymer, cavity, cap, f, substrateCtePerK, ambient, wafer, limits, recipe, chamber);
    }

    public BakeCase withAmbient(Ambient a) {
        return new BakeCase(name, polymer, cavity, cap, film, substrateCtePerK, a, wafer, limits, recipe, chamber);
    }

    /** The cap as a structure, or null when no mechanical properties are given. */
    public CapStructure capStructure() {
        if (film == null) {
            return null;
        }
        return new CapStructure(film, cap.thicknessM(), cavity.span(), substrateCtePerK,
                new MechanicalLimits(limits.safetyFactor(), limits.maxDeflectionM()));
    }

    public BakeCase withChamber(Chamber c) {
        return new BakeCase(name, polymer, cavity, cap, film, substrateCtePerK, ambient, wafer, limits, recipe, c);
    }

    /** The start setpoint of the recipe; the planner keeps it. */
    public double recipeStartK() {
        if (recipe == null) {
            throw new IllegalArgumentException("the case has no recipe, so no start temperature");
        }
        return recipe.startK();
    }
}
