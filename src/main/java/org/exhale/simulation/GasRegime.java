package org.exhale.simulation;

/** How the gas under the cap is computed. */
public enum GasRegime {
    /**
     * The gas relaxes far faster than the kinetics change: dn/dt ≈ 0, the excess pressure is the
     * algebraic root of generation = venting (MODEL.md §5), and only conversions are integrated.
     */
    QUASI_STEADY,
    /** Moles under the cap are integrated as states, with an L-stable Rosenbrock method. */
    FULL_GAS;

    public String label() {
        return this == QUASI_STEADY ? "quasi-steady" : "full-gas";
    }
}
