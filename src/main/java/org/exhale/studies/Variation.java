package org.exhale.studies;

import java.util.ArrayList;
import java.util.List;

import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;
import org.exhale.io.Names;
import org.exhale.io.Quantities;
import org.exhale.io.UnitKind;

/**
 * One {@code --vary KEY=VALUES} argument: a key and its values (SI), from a comma list
 * ({@code 1nm,2nm,3nm}) or an inclusive range {@code FROM:TO:STEP} ({@code 0.2:0.5:0.05} is seven
 * values). Every value takes the key's units; a bare number is accepted only for dimensionless
 * keys. The range's step of a temperature is a temperature difference ({@code 380C:400C:5K}).
 */
public record Variation(StudyKey key, List<Double> values) {
    /** Most values one key may take. */
    public static final int MAX_VALUES = 1000;
    private static final String WHERE = "--vary";

    public Variation {
        values = List.copyOf(values);
        if (values.isEmpty()) {
            throw new IllegalArgumentException("a variation needs at least one value");
        }
    }

    public static Variation parse(String spec) {
        int eq = spec.indexOf('=');
        if (eq <= 0) {
            throw bad("'" + spec + "' is not KEY=VALUES (e.g. cap.porosity=0.2:0.5:0.05 or cap.pore_radius=1nm,2nm)");
        }
        String name = spec.substring(0, eq).trim();
        StudyKey key = StudyKey.of(name);
        if (key == null) {
            String best = Names.closest(name, StudyKey.names());
            throw new InputException(ErrorKind.UNKNOWN_KEY, "command line", WHERE, 0, "unknown key '" + name + "'"
                    + (best != null ? " (did you mean '" + best + "'?)" : "") + "; known: " + String.join(", ", StudyKey.names()));
        }
        String text = spec.substring(eq + 1).trim();
        if (text.isEmpty()) {
            throw bad(name + ": no values given");
        }
        List<Double> values = new ArrayList<>();
        for (String part : text.split(",", -1)) {
            String p = part.trim();
            if (p.isEmpty()) {
                throw bad(name + ": empty value in '" + text + "'");
            }
            if (p.contains(":")) {
                values.addAll(range(key, p));
            } else {
                values.add(value(key, p, key.kind()));
            }
            if (values.size() > MAX_VALUES) {
                throw new InputException(ErrorKind.OUT_OF_RANGE, "command line", WHERE, 0,
                        name + ": more than " + MAX_VALUES + " values");
            }
        }
        for (int i = 0; i < values.size(); i++) {
            for (int j = 0; j < i; j++) {
                if (values.get(i).doubleValue() == values.get(j).doubleValue()) {
                    throw new InputException(ErrorKind.INCONSISTENT, "command line", WHERE, 0, name + ": a value appears twice");
                }
            }
        }
        return new Variation(key, values);
    }

    private static List<Double> range(StudyKey key, String p) {
        String[] f = p.split(":", -1);
        if (f.length != 3) {
            throw bad(key.key() + ": a range is FROM:TO:STEP, got '" + p + "'");
        }
        double from = value(key, f[0], key.kind());
        double to = value(key, f[1], key.kind());
        UnitKind stepKind = key.kind() == UnitKind.TEMPERATURE ? UnitKind.TEMPERATURE_DIFFERENCE : key.kind();
        double step = value(key, f[2], stepKind);
        if (!(step > 0)) {
            throw new InputException(ErrorKind.OUT_OF_RANGE, "command line", WHERE, 0, key.key() + ": the step of '" + p
                    + "' must be positive");
        }
        if (to < from) {
            throw new InputException(ErrorKind.INCONSISTENT, "command line", WHERE, 0, key.key() + ": range '" + p
                    + "' ends below its start");
        }
        // Inclusive end: a last value within a millionth of a step of TO is TO (0.2:0.5:0.05 has 7 values).
        double count = (to - from) / step;
        if (!(count < MAX_VALUES)) {
            // checked before the count is made a whole number: 0.4/1e-300 overflows a long
            throw new InputException(ErrorKind.OUT_OF_RANGE, "command line", WHERE, 0, key.key() + ": range '" + p + "' has "
                    + (Double.isFinite(count) ? String.format(java.util.Locale.ROOT, "%.3g", Math.floor(count) + 1) : "too many")
                    + " values, more than " + MAX_VALUES);
        }
        long n = (long) Math.floor(count + 1e-6) + 1;
        List<Double> out = new ArrayList<>();
        for (long i = 0; i < n; i++) {
            double v = from + i * step;
            out.add(Math.abs(v - to) < 1e-6 * step ? to : v);
        }
        return out;
    }

    private static double value(StudyKey key, String text, UnitKind kind) {
        try {
            return Quantities.parse(text, kind, false);
        } catch (Quantities.BadQuantity e) {
            throw new InputException(e.kind(), "command line", WHERE, 0, key.key() + ": " + e.getMessage());
        }
    }

    private static InputException bad(String what) {
        return new InputException(ErrorKind.BAD_ARGUMENT, "command line", WHERE, 0, what);
    }
}
