package org.exhale.report;

/**
 * An SI prefix chosen so that the largest plotted value reads between 1 and 1000.
 *
 * @param factor multiply SI values by this to plot them
 * @param unit   the prefixed unit, e.g. "kPa"
 */
record SiScale(double factor, String unit) {
    private static final String[] PREFIX = {"p", "n", "µ", "m", "", "k", "M", "G", "T"};

    static SiScale of(double largest, String unit) {
        if (!(largest > 0) || !Double.isFinite(largest)) {
            return new SiScale(1, unit);
        }
        int e = (int) Math.floor(Math.log10(largest) / 3);
        if (e < -4 || e > 4) {
            // beyond pico and tera a prefix helps nobody: the plain SI unit with an exponent
            return new SiScale(1, unit);
        }
        return new SiScale(Math.pow(10, -3 * e), PREFIX[e + 4] + unit);
    }

    double apply(double si) {
        return si * factor;
    }

    String format(double si) {
        return ReportText.plain(si * factor, 3) + " " + unit;
    }
}
