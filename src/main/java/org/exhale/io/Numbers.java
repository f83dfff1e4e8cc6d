package org.exhale.io;

import java.util.Locale;

/** Number formatting for output files: locale-independent, round-trip precise, never NaN. */
public final class Numbers {
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
            return s.replaceFirst("\\.?0+e", "e");
        }
        return s.contains(".") ? s.replaceFirst("\\.?0+$", "") : s;
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
