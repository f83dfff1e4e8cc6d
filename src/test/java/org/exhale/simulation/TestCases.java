package org.exhale.simulation;

import java.util.List;

import org.exhale.kinetics.Component;
import org.exhale.kinetics.Polymer;
import org.exhale.kinetics.Product;
import org.exhale.kinetics.ReactionModel;
import org.exhale.mechanics.FilmProperties;
import org.exhale.mechanics.SpanGeometry.Shape;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Step;
import org.exhale.transport.Ambient;
import org.exhale.transport.CapFilm;

/** Invented cases built in code for the tests (demo data, not measurements). */
public final class TestCases {
    private TestCases() {
    }

    public static double c(double celsius) {
        return celsius + 273.15;
    }

    public static Polymer twoComponentPolymer() {
        return new Polymer(1150, 0.02, List.of(
                new Component("backbone", 0.8, new ReactionModel.NthOrder(1), 3.0e10, 150e3, 0,
                        new Product(0.100, 0.6e-9, 7.0e-6)),
                new Component("side", 0.2, new ReactionModel.RandomScission(), 5.0e12, 175e3, 0,
                        new Product(0.058, 0.5e-9, 1.0e-5))), Polymer.DEFAULT_SEED);
    }

    public static Recipe demoRecipe() {
        return new Recipe(c(150), List.of(
                new Step.Ramp(c(300), 5 / 60.0),
                new Step.Hold(20 * 60),
                new Step.Ramp(c(390), 2 / 60.0),
                new Step.Hold(40 * 60)));
    }

    /** Porous nanometre cap over interconnect lines, nitrogen at 1 atm. */
    public static BakeCase porousLine() {
        return new BakeCase("porous line", twoComponentPolymer(),
                new Cavity(Shape.LINE, 100e-9, 100e-9, 200e-9),
                new CapFilm(120e-9, 0.30, 1.5e-9, Double.NaN, 0, 0),
                new FilmProperties(8e9, 0.25, 12e-6, c(350), 40e6, 150e6, 4, 3), 2.6e-6,
                new Ambient(101_325, 3.0e-5, c(25), 101_325),
                Wafer.ideal(),
                new Limits(c(400), 0.005, 50e3, new ThermalDose(100e3, c(400), 7200), 2, 20e-9),
                demoRecipe());
    }

    /** Nearly dense cap (solid-state permeation only) over a wide MEMS disc cavity, in vacuum. */
    public static BakeCase denseDisc() {
        return new BakeCase("dense disc", twoComponentPolymer(),
                new Cavity(Shape.DISC, 200e-6, 200e-6, 2e-6),
                new CapFilm(2e-6, 0.0, 0, Double.NaN, 2.0e-15, 20e3),
                new FilmProperties(120e9, 0.25, 3e-6, c(400), 100e6, 1e9, 10, 5), 2.6e-6,
                new Ambient(0, 3.0e-5, c(25), 101_325),
                Wafer.ideal(),
                new Limits(c(400), 0.005, 500e3, null, 2, 20e-6),
                demoRecipe());
    }

    /** One component of the given model releasing a small product (0.4 nm, 50 g/mol). */
    public static Polymer singleComponent(ReactionModel model, double preExponentialPerS, double activationEnergyJPerMol) {
        return singleComponent(model, preExponentialPerS, activationEnergyJPerMol, new Product(0.050, 0.4e-9, 1.0e-5), 1150);
    }

    public static Polymer singleComponent(ReactionModel model, double preExponentialPerS, double activationEnergyJPerMol,
                                          Product product, double densityKgPerM3) {
        return new Polymer(densityKgPerM3, 0.02, List.of(
                new Component("only", 1.0, model, preExponentialPerS, activationEnergyJPerMol, 0, product)),
                Polymer.DEFAULT_SEED);
    }

    /**
     * A porous nanometre cap in vacuum, wafer at the setpoint, no cap mechanics and a ceiling out of
     * the way: the case for checks of kinetics, dose and Knudsen transport through the simulator.
     */
    public static BakeCase kineticsCase(Polymer polymer, Recipe recipe, ThermalDose dose) {
        return new BakeCase("kinetics", polymer,
                new Cavity(Shape.LINE, 100e-9, 100e-9, 200e-9),
                CapFilm.porous(120e-9, 0.30, 1.5e-9),
                null, 2.6e-6,
                new Ambient(0, 3.0e-5, c(25), 101_325),
                Wafer.ideal(),
                new Limits(2500, 0.005, 1e12, dose, 1, 1),
                recipe);
    }

    /** A hold of the given duration at the given temperature from t = 0. */
    public static Recipe isothermal(double temperatureK, double durationS) {
        return new Recipe(temperatureK, List.of(new Step.Hold(durationS)));
    }

    /** A single ramp at a constant rate. */
    public static Recipe ramp(double fromK, double toK, double rateKPerS) {
        return new Recipe(fromK, List.of(new Step.Ramp(toK, rateKPerS)));
    }
}
