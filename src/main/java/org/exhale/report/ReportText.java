package org.exhale.report;

import java.util.Locale;

/** Text helpers for the page: escaping and number formatting. */
public final class ReportText {
    private ReportText() {
    }

    /** Escapes text for HTML and XML element content and attribute values. */
    public static String escape(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '&' -> b.append("&amp;");
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> {
                    // control characters other than tab and newline are not allowed in XML 1.0
                    if (c < 0x20 && c != '\t' && c != '\n' && c != '\r') {
                        b.append('\uFFFD');
                    } else {
                        b.append(c);
                    }
                }
            }
        }
        return b.toString();
    }

    /** Chart labels come from user files: keep them printable (SVG and XML refuse control characters). */
    static String label(String s) {
        return s == null ? "" : s.replaceAll("[\\p{Cntrl}]", "\uFFFD");
    }

    /** Significant digits without exponent clutter for everyday sizes. */
    public static String sig(double v, int digits) {
        if (Double.isNaN(v)) {
            return "n/a";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "∞" : "−∞";
        }
        if (v == 0) {
            return "0";
        }
        double a = Math.abs(v);
        String s;
        if (a >= 1e-3 && a < 1e6) {
            int decimals = Math.max(0, digits - 1 - (int) Math.floor(Math.log10(a)));
            s = String.format(Locale.ROOT, "%." + decimals + "f", v);
        } else {
            s = String.format(Locale.ROOT, "%." + (digits - 1) + "e", v).replace("e+0", "e").replace("e-0", "e-")
                    .replace("e+", "e");
        }
        return s.replace('-', '−');
    }

    /** Like {@link #sig} without trailing zeros after the decimal point ("400", "2.5"): for labels of limits. */
    public static String plain(double v, int digits) {
        String s = sig(v, digits);
        if (s.contains(".") && !s.contains("e")) {
            s = s.replaceFirst("0+$", "").replaceFirst("\\.$", "");
        }
        return s;
    }

    static String minutes(double s) {
        return Double.isFinite(s) ? sig(s / 60, 4) + " min" : "n/a";
    }
}
