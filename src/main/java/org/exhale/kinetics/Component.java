package org.exhale.kinetics;

import org.exhale.PhysicalConstants;

/**
 * One of the independent parallel decomposition components of the polymer.
 *
 * @param name                      label for outputs
 * @param fraction                  mass fraction w of the polymer (the fractions sum to 1)
 * @param model                     conversion function f(α)
 * @param preExponentialPerS        Arrhenius pre-exponential factor A [1/s]
 * @param activationEnergyJPerMol   activation energy E [J/mol]
 * @param charFraction              non-volatile char fraction c left by this component, in [0, 1)
 * @param product                   the released gas
 */
public record Component(String name, double fraction, ReactionModel model, double preExponentialPerS,
                        double activationEnergyJPerMol, double charFraction, Product product) {
    public Component {
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("component name must not be empty");
        }
        if (!(fraction > 0 && fraction <= 1)) {
            throw new IllegalArgumentException("component fraction must be in (0, 1], got " + fraction);
        }
        if (!(preExponentialPerS > 0 && preExponentialPerS <= 1e40)) {
            throw new IllegalArgumentException("pre-exponential factor A must be in (0, 1e40] 1/s, got "
                    + preExponentialPerS);
        }
        if (!(activationEnergyJPerMol > 0 && activationEnergyJPerMol <= 1e6)) {
            throw new IllegalArgumentException("activation energy must be in (0, 1000] kJ/mol, got "
                    + activationEnergyJPerMol / 1e3 + " kJ/mol");
        }
        if (!(charFraction >= 0 && charFraction < 1)) {
            throw new IllegalArgumentException("char fraction must be in [0, 1), got " + charFraction);
        }
        if (model == null || product == null) {
            throw new IllegalArgumentException("component needs a model and a product");
        }
    }

    /** Arrhenius rate constant k(T) = A exp(−E/(R T)) [1/s]. */
    public double rateConstant(double temperatureK) {
        return preExponentialPerS * Math.exp(-activationEnergyJPerMol / (PhysicalConstants.GAS_CONSTANT * temperatureK));
    }

    /** The Arrhenius rate dα/dt at temperature T and conversion α [1/s]. */
    public double rate(double temperatureK, double alpha) {
        return rateConstant(temperatureK) * model.f(alpha);
    }

    /** Temperature at which k(T) equals the given rate constant [K]. */
    public double temperatureForRateConstant(double kPerS) {
        return activationEnergyJPerMol / (PhysicalConstants.GAS_CONSTANT * Math.log(preExponentialPerS / kPerS));
    }

    public Component withArrhenius(double preExponential, double activationEnergy) {
        return new Component(name, fraction, model, preExponential, activationEnergy, charFraction, product);
    }

    public Component withFraction(double newFraction) {
        return new Component(name, newFraction, model, preExponentialPerS, activationEnergyJPerMol, charFraction, product);
    }
}
