package org.exhale.fitting;

/**
 * The isoconversional methods. For the linear ones, at each conversion α a straight line
 * y = const − c · E/(R T_α) is fitted over the runs; E follows from its slope.
 */
public enum IsoconversionalMethod {
    /** ln(dα/dt) = ln[A f(α)] − E/(RT). Friedman, J. Polym. Sci. C 6 (1964) 183. */
    FRIEDMAN("friedman", 1.0),
    /** ln(β/T²) = const − E/(RT). Kissinger–Akahira–Sunose, as tabulated in Sci. Rep. (2019), doi 10.1038/s41598-018-38434-1. */
    KAS("kas", 1.0),
    /** ln β = const − 1.052 E/(RT), Doyle's approximation. Doyle, J. Appl. Polym. Sci. 6 (1962) 639. */
    OFW("ofw", 1.052),
    /** ln(β/T^1.92) = const − 1.0008 E/(RT). Starink, Thermochim. Acta 404 (2003) 163. */
    STARINK("starink", 1.0008),
    /**
     * Vyazovkin's advanced integral method over the measured T(t): minimise
     * Σᵢ Σⱼ≠ᵢ Jᵢ/Jⱼ over E, J the temperature integral across the step α ± Δα/2.
     * Vyazovkin, J. Comput. Chem. 22 (2001) 178.
     */
    VYAZOVKIN("vyazovkin", Double.NaN);

    private final String id;
    private final double slopeFactor;

    IsoconversionalMethod(String id, double slopeFactor) {
        this.id = id;
        this.slopeFactor = slopeFactor;
    }

    /** Name used in output columns. */
    public String id() {
        return id;
    }

    /** c in y = const − c E/(RT); NaN for the non-linear method. */
    public double slopeFactor() {
        return slopeFactor;
    }
}
