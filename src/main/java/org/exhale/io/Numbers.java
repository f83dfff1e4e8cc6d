package org.exhale.io;

import java.util.Locale;
import java.util.regex.Pattern;

/** Number formatting for output files: locale-independent, round-trip precise, never NaN. */
public final class Numbers {
    /** Trailing zeros of the mantissa before the exponent, and of a fixed-point number (compiled once: a history has ~10⁵ numbers). */
    private static final Pattern MANTISSA_ZEROS = Pattern.compile("\\.?0+e");
    private static final Pattern TRAILING_ZEROS = Pattern.compile("\\.?0+$");

    private Numbers() {
    }

    /** Nine significant digits; non-finite values become an empty field. */
    public static String csv(double v) {
        if (!Double.isFinite(v)) {
            return "";
        }
        if (v == 0) {
            return "0";
        }
        String s = String.format(Locale.ROOT, "%.9g", v);
        if (s.contains("e")) {
            return MANTISSA_ZEROS.matcher(s).replaceFirst("e");
        }
        return s.contains(".") ? TRAILING_ZEROS.matcher(s).replaceFirst("") : s;
    }

    public static String fixed(double v, int decimals) {
        return String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    public static String sig(double v, int digits) {
        if (!Double.isFinite(v)) {
            return v > 0 ? "inf" : "n/a";
        }
        return String.format(Locale.ROOT, "%." + digits + "g", v);
    }
}
