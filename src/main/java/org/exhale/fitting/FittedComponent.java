package org.exhale.fitting;

import java.util.Set;
import org.exhale.kinetics.ReactionModel;

/**
 * One fitted component with its confidence half-widths (delta method on the effective-sample
 * covariance, see {@link ModelFit}).
 *
 * @param name                    c1, c2, … in order of rising reference temperature
 * @param fraction                mass fraction w
 * @param fractionHalfWidth       its half-width (0 with one component)
 * @param model                   the reaction model with the fitted shape
 * @param shape                   the shape parameters (n; m, n; n; none)
 * @param shapeHalfWidth          their half-widths (NaN for a shape parameter at a bound)
 * @param energyJPerMol           E [J/mol]
 * @param energyHalfWidthJPerMol  half-width of E [J/mol] (NaN when E is at a bound)
 * @param lnPreExponential        ln(A / (1/s))
 * @param lnPreExponentialHalfWidth half-width of ln A
 * @param referenceTemperatureK   temperature at which ln k was fitted [K]
 * @param atBound                 names of the parameters that ended at a bound of their allowed
 *                                range ("Ea", "n", "m", "fraction"): the value is the bound, it
 *                                has no interval
 */
public record FittedComponent(String name, double fraction, double fractionHalfWidth, ReactionModel model,
                              double[] shape, double[] shapeHalfWidth, double energyJPerMol,
                              double energyHalfWidthJPerMol, double lnPreExponential,
                              double lnPreExponentialHalfWidth, double referenceTemperatureK, Set<String> atBound) {
    public FittedComponent {
        shape = shape.clone();
        shapeHalfWidth = shapeHalfWidth.clone();
        atBound = Set.copyOf(atBound);
    }

    @Override public double[] shape() { return shape.clone(); }
    @Override public double[] shapeHalfWidth() { return shapeHalfWidth.clone(); }

    public double preExponentialPerS() {
        return Math.exp(lnPreExponential);
    }

    /** A copy with another name. */
    public FittedComponent withName(String n) {
        return new FittedComponent(n, fraction, fractionHalfWidth, model, shape, shapeHalfWidth, energyJPerMol,
                energyHalfWidthJPerMol, lnPreExponential, lnPreExponentialHalfWidth, referenceTemperatureK, atBound);
    }

    /** A copy with the half-widths of E, ln A and the fraction widened to at least these values. */
    public FittedComponent widened(double energyHw, double lnAHw, double fractionHw) {
        return new FittedComponent(name, fraction, wider(fractionHalfWidth, fractionHw), model, shape, shapeHalfWidth,
                energyJPerMol, wider(energyHalfWidthJPerMol, energyHw), lnPreExponential,
                wider(lnPreExponentialHalfWidth, lnAHw), referenceTemperatureK, atBound);
    }

    private static double wider(double a, double b) {
        if (Double.isNaN(a)) {
            return a;
        }
        return Double.isFinite(b) ? Math.max(a, b) : a;
    }
}
