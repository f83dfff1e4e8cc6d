package org.exhale.io;

import java.util.List;

import org.exhale.PhysicalConstants;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.CornerResult;

/**
 * Writes the bake history as CSV: one row per sample and corner, a {@code corner} column first.
 * Temperatures are written in °C (columns ending {@code _C}); everything else in SI with the unit
 * in the column name.
 */
public final class HistoryCsvWriter {
    private HistoryCsvWriter() {
    }

    public static String write(BakeResult result) {
        StringBuilder sb = new StringBuilder();
        List<String> cols = result.corners().get(0).columns();
        sb.append("corner");
        for (String c : cols) {
            sb.append(',').append(header(c));
        }
        sb.append('\n');
        for (CornerResult corner : result.corners()) {
            for (double[] row : corner.history()) {
                sb.append(corner.corner());
                for (int i = 0; i < cols.size(); i++) {
                    double v = row[i];
                    if (cols.get(i).endsWith("_K")) {
                        v -= PhysicalConstants.ZERO_CELSIUS_K;
                    }
                    sb.append(',').append(Numbers.csv(v));
                }
                sb.append('\n');
            }
        }
        return sb.toString();
    }

    /** The CSV column name of a history column: kelvin columns become Celsius, names made CSV-safe. */
    public static String header(String column) {
        String c = column.endsWith("_K") ? column.substring(0, column.length() - 2) + "_C" : column;
        return c.replaceAll("[^A-Za-z0-9_.+-]", "_");
    }
}
