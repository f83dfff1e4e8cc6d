package org.exhale.io;

import java.util.List;

import org.exhale.PhysicalConstants;
import org.exhale.simulation.BakeResult;
import org.exhale.simulation.CornerResult;

/**
 * Writes the bake history as CSV: one row per sample and corner, a {@code corner} column first.
 * Temperatures are written in °C (columns ending {@code _C}); everything else in SI with the unit
 * in the column name. {@code setpoint_C} is the tool's one setpoint, the same at every corner at a
 * given time; {@code wafer_C} is each corner's wafer temperature (the corner's offset, the
 * across-wafer spread, is in summary.json as {@code offset_K}).
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
                    if (cols.get(i).equals("setpoint_K")) {
                        v -= corner.offsetK(); // the model's corner sees setpoint + offset; the tool has one setpoint
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
