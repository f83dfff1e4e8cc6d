package org.exhale.report;

import java.util.Locale;

import org.exhale.PhysicalConstants;
import org.exhale.simulation.Margin;

/**
 * Figures as people read them, shared by the terminal, recipe.txt and the report, so the same
 * figure reads the same everywhere: temperatures in °C, a unit on every value (with an SI prefix
 * chosen for the value), percent for fractions, minutes for long times, no "−0", and margins above
 * {@link #LARGE_MARGIN} shown as "> 1000" since the exact size of a limit the bake does not
 * approach tells the reader nothing.
 *
 * <p>The vocabulary (docs/model.md, "Margins"): a limit's <em>margin</em> is allowed / actual
 * (1 or more holds); the ceiling's is the <em>headroom</em> in kelvin (0 or more holds). A limit
 * whose quantity stays zero is <em>not loaded</em>.
 */
public final class Readable {
    /** Margins above this are shown as "> 1000". */
    public static final double LARGE_MARGIN = 1000;

    private Readable() {
    }

    /** A ratio margin: "1.24", "> 1000", or "not loaded" when the quantity stayed zero. */
    public static String ratio(double margin) {
        if (Double.isNaN(margin)) {
            return "n/a";
        }
        if (Double.isInfinite(margin)) {
            return "not loaded";
        }
        if (margin > LARGE_MARGIN) {
            return "> 1000";
        }
        return noMinusZero(ReportText.plain(margin, 3)).replace('−', '-');
    }

    /** "headroom 7.0 K", "margin 1.24", "margin > 1000", "not loaded". */
    public static String margin(Margin m) {
        if (m.headroom()) {
            return "headroom " + kelvin(m.margin());
        }
        String r = ratio(m.margin());
        return r.equals("not loaded") ? r : "margin " + r;
    }

    /** Worst value reached at t = 0: set by the starting state, before any step of the recipe acts. */
    public static boolean setAtStart(Margin m) {
        return m.timeS() <= 1e-6;
    }

    /** A temperature difference with one decimal: "0.0 K", "7.0 K". */
    public static String kelvin(double k) {
        return noMinusZero(String.format(Locale.ROOT, "%.1f", k)) + " K";
    }

    /** An absolute temperature [K] in °C with one decimal. */
    public static String celsius(double kelvin) {
        return noMinusZero(String.format(Locale.ROOT, "%.1f", kelvin - PhysicalConstants.ZERO_CELSIUS_K)) + " °C";
    }

    /** A time: seconds below 2 min, minutes below 10 h, else hours. */
    public static String time(double s) {
        if (!Double.isFinite(s)) {
            return "not reached";
        }
        if (Math.abs(s) < 120) {
            return noMinusZero(String.format(Locale.ROOT, "%.0f", s)) + " s";
        }
        if (Math.abs(s) < 36_000) {
            return String.format(Locale.ROOT, "%.1f min", s / 60);
        }
        return String.format(Locale.ROOT, "%.2f h", s / 3600);
    }

    /** Minutes and seconds, as bake tools show step times: "24:42". */
    public static String mmss(double s) {
        long t = Math.round(s);
        return String.format(Locale.ROOT, "%d:%02d", t / 60, t % 60);
    }

    /** A fraction as a percentage with three significant digits. */
    public static String percent(double fraction) {
        return number(fraction * 100) + " %";
    }

    /**
     * A value with its unit, as read: SI unit names as margins carry them ("K" is an absolute
     * temperature, "" a fraction).
     */
    public static String value(double si, String unit) {
        if (!Double.isFinite(si)) {
            return "n/a";
        }
        return switch (unit) {
            case "K" -> celsius(si);
            case "" -> percent(si);
            case "s" -> time(si);
            case "Pa", "m" -> si == 0 ? "0 " + unit : noMinusZero(SiScale.of(Math.abs(si), unit).format(si)).replace('−', '-');
            case "J/m2" -> number(si) + " J/m²";
            default -> number(si) + " " + unit;
        };
    }

    /** Three significant digits, plain for everyday sizes, never "−0". */
    public static String number(double v) {
        if (v == 0 || !Double.isFinite(v)) {
            return v == 0 ? "0" : "n/a";
        }
        return noMinusZero(ReportText.plain(v, 3)).replace('−', '-');
    }

    /** A plain figure with a fixed number of decimals, never "-0.0000"; "n/a" when not finite. */
    public static String fixed(double v, int decimals) {
        if (!Double.isFinite(v)) {
            return "n/a";
        }
        return noMinusZero(String.format(Locale.ROOT, "%." + decimals + "f", v));
    }

    private static String noMinusZero(String s) {
        return s.matches("[-−]0(\\.0*)?( .*)?") ? s.substring(1) : s;
    }
}
