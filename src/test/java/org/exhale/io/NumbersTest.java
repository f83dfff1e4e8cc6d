package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

/**
 * {@link Numbers#csv} against the JDK formatter it replaces: {@code %.9g} with the mantissa's trailing
 * zeros dropped, written here the old way (common practice, no source: the formatter is the
 * reference, an independent implementation of the same rounding).
 */
class NumbersTest {
    private static String reference(double v) {
        if (!Double.isFinite(v)) {
            return "";
        }
        if (v == 0) {
            return "0";
        }
        String s = String.format(Locale.ROOT, "%.9g", v);
        if (s.contains("e")) {
            return s.replaceFirst("\\.?0+e", "e");
        }
        return s.contains(".") ? s.replaceFirst("\\.?0+$", "") : s;
    }

    @Test
    void csvWritesWhatTheFormatterWrote() {
        List<Double> values = new ArrayList<>(List.of(0.0, -0.0, 1.0, -1.0, 0.1, 1e-4, 9.9999999949e-5, 9.9999999951e-5,
                1e-5, 123456789.0, 999999999.0, 999999999.4, 999999999.5, 1e9, 1e10, 1.5e100, 2.5e-300,
                Double.MIN_VALUE, Double.MAX_VALUE, 273.15, 1.0000000005, 1.0000000015, 0.12345678949999,
                Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY));
        long seed = 20261202L;
        SplittableRandom rnd = new SplittableRandom(seed);
        for (int i = 0; i < 200_000; i++) {
            double v;
            switch (i % 4) {
                case 0 -> v = Double.longBitsToDouble(rnd.nextLong());           // any double
                case 1 -> v = rnd.nextDouble(-1, 1) * Math.pow(10, rnd.nextInt(-12, 14));  // history-like magnitudes
                case 2 -> v = Math.round(rnd.nextDouble() * 1e10) / Math.pow(10, rnd.nextInt(0, 12)) + 5e-10 * rnd.nextInt(-1, 2);
                default -> v = rnd.nextInt(-100_000, 100_000) / 20.0 + 273.15;      // temperatures, half-steps
            }
            values.add(v);
        }
        for (double v : values) {
            assertEquals(reference(v), Numbers.csv(v), "value " + v + " (seed " + seed + ")");
        }
    }
}
