package org.exhale.io;

import java.util.List;
import java.util.Locale;
import org.exhale.fitting.FittedComponent;
import org.exhale.fitting.ModelFitResult;

/**
 * Writes the fitted components as a {@code polymer: components:} block for a case file, one flow
 * mapping per component:
 * {@code - {name: c1, fraction: 1.0, model: nth-order, n: 1.0, A: 3.0e10 1/s, Ea: 150 kJ/mol, char: 0, product: {molar_mass: 100 g/mol, diameter: 0.6 nm}}}.
 * Fractions are written to six decimals with the last one closing the sum to exactly 1.
 */
public final class KineticsYamlWriter {
    private KineticsYamlWriter() {
    }

    /**
     * @param fit            the chosen fit
     * @param charFraction   char left by every component (from the final plateau or the stated residue)
     * @param charOrigin     how the char was found, for the comment
     * @param molarMassGPerMol product molar mass from the options [g/mol]
     * @param diameterNm     product kinetic diameter from the options [nm]
     * @param header         comment lines describing the fit
     */
    public static String format(ModelFitResult fit, double charFraction, String charOrigin, double molarMassGPerMol,
                                double diameterNm, List<String> header) {
        StringBuilder sb = new StringBuilder();
        for (String h : header) {
            sb.append("# ").append(h.replace('\n', ' ')).append('\n');
        }
        sb.append("# char: ").append(charOrigin).append('\n');
        sb.append("# product molar_mass and diameter are NOT fitted: they are the values given to exhale fit\n");
        sb.append("# (--molar-mass, --diameter); replace them with the real decomposition products.\n");
        sb.append("polymer:\n  components:\n");
        List<FittedComponent> cs = fit.components();
        double sum = 0;
        for (int j = 0; j < cs.size(); j++) {
            FittedComponent c = cs.get(j);
            double w = j < cs.size() - 1 ? round6(c.fraction()) : round6(1 - sum);
            sum += w;
            sb.append("    - {name: ").append(c.name())
                    .append(", fraction: ").append(fmt("%.6f", w))
                    .append(", model: ").append(c.model().id());
            double[] s = c.shape();
            switch (c.model().id()) {
                case "nth-order", "avrami-erofeev" -> sb.append(", n: ").append(fmt("%.4f", s[0]));
                case "sestak-berggren" -> sb.append(", m: ").append(fmt("%.4f", s[0])).append(", n: ").append(fmt("%.4f", s[1]));
                default -> { }
            }
            sb.append(", A: ").append(fmt("%.4e", c.preExponentialPerS())).append(" 1/s")
                    .append(", Ea: ").append(fmt("%.2f", c.energyJPerMol() / 1e3)).append(" kJ/mol")
                    .append(", char: ").append(fmt("%.4f", charFraction))
                    .append(", product: {molar_mass: ").append(fmt("%.4g", molarMassGPerMol)).append(" g/mol")
                    .append(", diameter: ").append(fmt("%.4g", diameterNm)).append(" nm}}\n");
        }
        return sb.toString();
    }

    private static double round6(double v) {
        return Math.round(v * 1e6) / 1e6;
    }

    private static String fmt(String f, double v) {
        return String.format(Locale.ROOT, f, v);
    }
}
