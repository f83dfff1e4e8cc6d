package org.exhale.fitting;

import org.exhale.kinetics.ReactionModel;

/**
 * One fitted component with its confidence half-widths (delta method on σ²(JᵀJ)⁻¹).
 *
 * @param name                    c1, c2, … in order of rising reference temperature
 * @param fraction                mass fraction w
 * @param fractionHalfWidth       its half-width (0 with one component)
 * @param model                   the reaction model with the fitted shape
 * @param shape                   the shape parameters (n; m, n; n; none)
 * @param shapeHalfWidth          their half-widths
 * @param energyJPerMol           E [J/mol]
 * @param energyHalfWidthJPerMol  half-width of E [J/mol]
 * @param lnPreExponential        ln(A / (1/s))
 * @param lnPreExponentialHalfWidth half-width of ln A
 * @param referenceTemperatureK   temperature at which ln k was fitted [K]
 */
public record FittedComponent(String name, double fraction, double fractionHalfWidth, ReactionModel model,
                              double[] shape, double[] shapeHalfWidth, double energyJPerMol,
                              double energyHalfWidthJPerMol, double lnPreExponential,
                              double lnPreExponentialHalfWidth, double referenceTemperatureK) {
    public FittedComponent {
        shape = shape.clone();
        shapeHalfWidth = shapeHalfWidth.clone();
    }

    @Override public double[] shape() { return shape.clone(); }
    @Override public double[] shapeHalfWidth() { return shapeHalfWidth.clone(); }

    public double preExponentialPerS() {
        return Math.exp(lnPreExponential);
    }
}
