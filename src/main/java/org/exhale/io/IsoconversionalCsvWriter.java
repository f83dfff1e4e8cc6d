package org.exhale.io;

import java.util.List;
import java.util.Locale;
import org.exhale.fitting.IsoconversionalResult;

/**
 * E(α) table: {@code alpha}, then for each method {@code E_<method>_kJ_mol} and
 * {@code E_<method>_ci_kJ_mol} (half-width: statistical, plus for KAS, OFW and Starink the
 * approximation bias, which {@code E_<method>_bias_kJ_mol} states separately); empty cells where
 * not computable.
 */
public final class IsoconversionalCsvWriter {
    private IsoconversionalCsvWriter() {
    }

    public static String format(List<IsoconversionalResult> results) {
        StringBuilder sb = new StringBuilder("alpha");
        for (IsoconversionalResult r : results) {
            sb.append(",E_").append(r.method().id()).append("_kJ_mol,E_").append(r.method().id()).append("_ci_kJ_mol");
            if (hasBias(r)) {
                sb.append(",E_").append(r.method().id()).append("_bias_kJ_mol");
            }
        }
        sb.append('\n');
        if (results.isEmpty()) {
            return sb.toString();
        }
        double[] alpha = results.get(0).alpha();
        double[][] e = new double[results.size()][];
        double[][] ci = new double[results.size()][];
        double[][] bias = new double[results.size()][];
        for (int m = 0; m < results.size(); m++) {
            e[m] = results.get(m).energyJPerMol();
            ci[m] = results.get(m).halfWidthJPerMol();
            bias[m] = hasBias(results.get(m)) ? results.get(m).biasJPerMol() : null;
        }
        for (int g = 0; g < alpha.length; g++) {
            sb.append(String.format(Locale.ROOT, "%.4f", alpha[g]));
            for (int m = 0; m < results.size(); m++) {
                sb.append(',').append(cell(e[m][g])).append(',').append(cell(ci[m][g]));
                if (bias[m] != null) {
                    sb.append(',').append(cell(bias[m][g]));
                }
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static boolean hasBias(IsoconversionalResult r) {
        for (double b : r.biasJPerMol()) {
            if (b != 0) {
                return true;
            }
        }
        return false;
    }

    private static String cell(double jPerMol) {
        return Double.isFinite(jPerMol) ? String.format(Locale.ROOT, "%.4f", jPerMol / 1e3) : "";
    }
}
