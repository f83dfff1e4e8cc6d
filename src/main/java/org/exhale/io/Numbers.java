package org.exhale.io;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.Locale;

/** Number formatting for output files: locale-independent, round-trip precise, never NaN. */
public final class Numbers {
    /** Nine significant digits, rounded half up as {@code %.9g} rounds. */
    private static final MathContext NINE = new MathContext(9, RoundingMode.HALF_UP);

    private Numbers() {
    }

    /**
     * Nine significant digits; non-finite values become an empty field. The text is that of
     * {@code String.format(Locale.ROOT, "%.9g", v)} with the trailing zeros of the mantissa dropped
     * (and the point with them): fixed-point when the rounded value's decimal exponent is in
     * [−4, 9), else {@code d.ddde±XX}. Built from {@link BigDecimal} rather than the formatter,
     * which parses its pattern on every call: a history has ~10⁵ numbers.
     */
    public static String csv(double v) {
        if (!Double.isFinite(v)) {
            return "";
        }
        if (v == 0) {
            return "0";
        }
        // the formatter rounds the shortest decimal digits of the double half up, as this does
        BigDecimal r = new BigDecimal(Double.toString(v)).round(NINE).stripTrailingZeros();
        int exp = r.precision() - r.scale() - 1;
        if (exp >= -4 && exp < 9) {
            return r.toPlainString();
        }
        String digits = r.unscaledValue().abs().toString();
        StringBuilder sb = new StringBuilder(16);
        if (r.signum() < 0) {
            sb.append('-');
        }
        sb.append(digits.charAt(0));
        if (digits.length() > 1) {
            sb.append('.').append(digits, 1, digits.length());
        }
        sb.append('e').append(exp < 0 ? '-' : '+');
        int a = Math.abs(exp);
        if (a < 10) {
            sb.append('0');
        }
        return sb.append(a).toString();
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
