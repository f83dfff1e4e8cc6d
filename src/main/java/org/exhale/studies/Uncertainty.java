package org.exhale.studies;

import java.util.Map;

/**
 * The {@code uncertainty} section of a case file: standard deviations of normal distributions
 * around the case's (nominal) values, for Monte Carlo robustness studies. Zero means "not
 * uncertain". Every sample draws each parameter from a normal distribution truncated to the
 * parameter's physical range (see {@link MonteCarlo}).
 *
 * @param kinetics          the spread of every component's Arrhenius parameters (overridable per component)
 * @param components        per-component overrides by component name
 * @param porositySd        standard deviation of the cap's open porosity (absolute)
 * @param poreRadiusSdM     of the mean pore radius [m]
 * @param thicknessSdM      of the cap thickness [m]
 * @param tortuositySd      of the tortuosity (absolute)
 * @param spreadSdK         of the across-wafer spread [K]
 * @param lagSdS            of the wafer lag time constant [s]
 * @param purgeSdRelative   of the chamber purge flow, relative to its nominal value
 * @param densitySdKgPerM3  of the polymer density [kg/m³]
 */
public record Uncertainty(Kinetics kinetics, Map<String, Kinetics> components, double porositySd, double poreRadiusSdM,
                          double thicknessSdM, double tortuositySd, double spreadSdK, double lagSdS,
                          double purgeSdRelative, double densitySdKgPerM3) {

    /**
     * The spread of one component's Arrhenius parameters.
     *
     * @param eaSdJPerMol  standard deviation of the activation energy [J/mol]
     * @param lnASd        of the natural logarithm of the pre-exponential factor
     * @param correlation  correlation of E and ln A in [−1, 1]; fits of thermogravimetric data
     *                     usually give a strong positive one (the kinetic compensation effect)
     */
    public record Kinetics(double eaSdJPerMol, double lnASd, double correlation) {
        public static final Kinetics NONE = new Kinetics(0, 0, 0);

        public Kinetics {
            if (!(eaSdJPerMol >= 0 && eaSdJPerMol <= 1e5)) {
                throw new IllegalArgumentException("Ea_sd must be in [0, 100] kJ/mol");
            }
            if (!(lnASd >= 0 && lnASd <= 20)) {
                throw new IllegalArgumentException("lnA_sd must be in [0, 20]");
            }
            if (!(correlation >= -1 && correlation <= 1)) {
                throw new IllegalArgumentException("Ea_lnA_correlation must be in [-1, 1]");
            }
        }

        public boolean any() {
            return eaSdJPerMol > 0 || lnASd > 0;
        }
    }

    public static final Uncertainty NONE = new Uncertainty(Kinetics.NONE, Map.of(), 0, 0, 0, 0, 0, 0, 0, 0);

    public Uncertainty {
        components = Map.copyOf(components);
        double[] sds = {porositySd, poreRadiusSdM, thicknessSdM, tortuositySd, spreadSdK, lagSdS, purgeSdRelative,
                densitySdKgPerM3};
        for (double s : sds) {
            if (!(s >= 0 && Double.isFinite(s))) {
                throw new IllegalArgumentException("standard deviations must be finite and not negative");
            }
        }
    }

    /** The spread of the named component's kinetics: its override, else the section's. */
    public Kinetics kineticsOf(String component) {
        return components.getOrDefault(component, kinetics);
    }

    /** True when some value is uncertain for a case with these component names. */
    public boolean any(Iterable<String> componentNames) {
        for (String c : componentNames) {
            if (kineticsOf(c).any()) {
                return true;
            }
        }
        return porositySd > 0 || poreRadiusSdM > 0 || thicknessSdM > 0 || tortuositySd > 0 || spreadSdK > 0
                || lagSdS > 0 || purgeSdRelative > 0 || densitySdKgPerM3 > 0;
    }
}
