package org.exhale.simulation;

import org.exhale.kinetics.Polymer;
import org.exhale.recipe.Recipe;
import org.exhale.transport.Ambient;
import org.exhale.transport.CapFilm;

/** Everything one bake needs: structure, materials, ambient, limits and the recipe. */
public record BakeCase(String name, Polymer polymer, Cavity cavity, CapFilm cap, Ambient ambient, Wafer wafer,
                       Limits limits, Recipe recipe) {
    public BakeCase {
        if (name == null) {
            name = "";
        }
        if (polymer == null || cavity == null || cap == null || ambient == null || wafer == null || limits == null) {
            throw new IllegalArgumentException("a bake case needs polymer, cavity, cap, ambient, wafer and limits");
        }
    }

    public BakeCase withRecipe(Recipe r) {
        return new BakeCase(name, polymer, cavity, cap, ambient, wafer, limits, r);
    }

    public BakeCase withCap(CapFilm c) {
        return new BakeCase(name, polymer, cavity, c, ambient, wafer, limits, recipe);
    }

    public BakeCase withPolymer(Polymer p) {
        return new BakeCase(name, p, cavity, cap, ambient, wafer, limits, recipe);
    }

    public BakeCase withWafer(Wafer w) {
        return new BakeCase(name, polymer, cavity, cap, ambient, w, limits, recipe);
    }

    public BakeCase withLimits(Limits l) {
        return new BakeCase(name, polymer, cavity, cap, ambient, wafer, l, recipe);
    }
}
