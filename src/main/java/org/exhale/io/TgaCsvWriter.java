package org.exhale.io;

import java.util.List;
import java.util.Locale;
import org.exhale.PhysicalConstants;
import org.exhale.fitting.TgaRun;

/**
 * Writes runs in the CSV layout {@link TgaCsvReader} reads: header {@code time_min} or
 * {@code time_s}, {@code temperature_C} or {@code temperature_K}, {@code mass_mg} or
 * {@code mass_pct}, optionally preceded by a {@code run} column when several runs share a file.
 *
 * @param separator     ',', ';' or '\t'
 * @param decimalComma  write decimal commas (only with ';' or tab)
 * @param minutes       time in minutes rather than seconds
 * @param celsius       temperature in °C rather than K
 */
public record TgaCsvWriter(char separator, boolean decimalComma, boolean minutes, boolean celsius) {
    public static final TgaCsvWriter DEFAULT = new TgaCsvWriter(',', false, true, true);

    public TgaCsvWriter {
        if (separator != ',' && separator != ';' && separator != '\t') {
            throw new IllegalArgumentException("separator must be ',', ';' or tab");
        }
        if (decimalComma && separator == ',') {
            throw new IllegalArgumentException("a decimal comma needs ';' or tab as separator");
        }
    }

    public String format(List<TgaRun> runs) {
        boolean runColumn = runs.size() > 1;
        TgaRun.MassBasis basis = runs.get(0).basis();
        StringBuilder sb = new StringBuilder(64 * runs.stream().mapToInt(TgaRun::size).sum() + 64);
        if (runColumn) {
            sb.append("run").append(separator);
        }
        sb.append(minutes ? "time_min" : "time_s").append(separator)
                .append(celsius ? "temperature_C" : "temperature_K").append(separator)
                .append(basis == TgaRun.MassBasis.FRACTION ? "mass_pct" : "mass_mg").append('\n');
        for (TgaRun run : runs) {
            if (run.basis() != basis) {
                throw new IllegalArgumentException("runs in one file must share the mass basis");
            }
            double[] t = run.timeS(), temp = run.temperatureK(), m = run.mass();
            for (int i = 0; i < t.length; i++) {
                if (runColumn) {
                    sb.append(run.label()).append(separator);
                }
                sb.append(num(minutes ? t[i] / 60 : t[i])).append(separator)
                        .append(num(celsius ? temp[i] - PhysicalConstants.ZERO_CELSIUS_K : temp[i])).append(separator)
                        .append(num(basis == TgaRun.MassBasis.FRACTION ? m[i] * 100 : m[i] * 1e6)).append('\n');
            }
        }
        return sb.toString();
    }

    private String num(double v) {
        String s = String.format(Locale.ROOT, "%.10g", v);
        return decimalComma ? s.replace('.', ',') : s;
    }
}
