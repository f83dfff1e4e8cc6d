package org.exhale.io;

import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Strict reader of "number unit" strings as engineers type them ("350 C", "1.5nm", "8 GPa",
 * "3.0e10 1/s", "0.5 %"). A value is a plain decimal number (point, never comma) with an optional
 * exponent, then an optional unit from the kind's table. Anything else — trailing text, a unit of
 * another kind, NaN, infinity — is refused with a message naming what was expected.
 */
public final class Quantities {
    /**
     * Number, then the rest. Applied to trimmed text; the rest is taken greedily so the match never
     * backtracks (a lazy group before trailing blanks was quadratic in the length of a blank run).
     */
    private static final Pattern NUMBER_UNIT =
            Pattern.compile("([+-]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?)(.*)", Pattern.DOTALL);

    /** A refused quantity; {@link #kind()} says whether the number or the unit is at fault. */
    public static final class BadQuantity extends IllegalArgumentException {
        private final ErrorKind kind;

        BadQuantity(ErrorKind kind, String message) {
            super(message);
            this.kind = kind;
        }

        public ErrorKind kind() {
            return kind;
        }
    }

    private static BadQuantity badNumber(String message) {
        return new BadQuantity(ErrorKind.BAD_NUMBER, message);
    }

    private static BadQuantity badUnit(String message) {
        return new BadQuantity(ErrorKind.BAD_UNIT, message);
    }

    private Quantities() {
    }

    /**
     * Parses text to an SI value.
     *
     * @param text      the text as typed
     * @param kind      the expected kind of quantity
     * @param allowBare whether a bare number (no unit) is taken as SI / dimensionless
     * @throws BadQuantity with a message saying what was expected
     */
    public static double parse(String text, UnitKind kind, boolean allowBare) {
        if (text == null || text.isBlank()) {
            throw badNumber("empty value, expected a " + kind.description() + expectedUnits(kind));
        }
        Matcher m = NUMBER_UNIT.matcher(text.strip());
        if (!m.matches()) {
            throw badNumber("'" + text + "' is not a number, expected a " + kind.description() + expectedUnits(kind));
        }
        String rest = m.group(2);
        if (!rest.isEmpty() && ",.0123456789".indexOf(rest.charAt(0)) >= 0) {
            throw badNumber("'" + text + "' is not a number (use a decimal point and no separators), expected a "
                    + kind.description() + expectedUnits(kind));
        }
        double value = Double.parseDouble(m.group(1));
        if (!Double.isFinite(value)) {
            throw badNumber("'" + text + "' is too large, expected a finite " + kind.description());
        }
        String symbol = normaliseSymbol(rest);
        if (symbol.isEmpty() && !allowBare && kind.unit("") == null) {
            throw badUnit("'" + text + "' has no unit, expected a " + kind.description()
                    + expectedUnits(kind));
        }
        UnitKind.Unit unit = symbol.isEmpty() && kind.unit("") == null
                ? new UnitKind.Unit("", 1, 0) : kind.unit(symbol);
        if (unit == null) {
            UnitKind other = kindOf(symbol);
            String hint = other != null ? " ('" + symbol + "' is a " + other.description() + " unit)"
                    : didYouMean(symbol, kind);
            throw badUnit("unit '" + symbol + "' in '" + text + "' is not a "
                    + kind.description() + " unit" + hint + expectedUnits(kind));
        }
        double si = unit.toSi(value);
        if (!Double.isFinite(si)) {
            throw badNumber("'" + text + "' is too large");
        }
        return si;
    }

    /** Parses a number with no unit at all (model exponents, counts, plain fractions). */
    public static double parseNumber(String text) {
        return parse(text, UnitKind.NUMBER, true);
    }

    static String normaliseSymbol(String s) {
        String t = s.trim();
        // powers may be written m2, m^2 or m²; s-1, s^-1 or s⁻¹ (the same for every unit: g/cm^3, J/m^2, 1/K)
        t = t.replace("^", "").replace("²", "2").replace("³", "3").replace("⁻¹", "-1").replace("·", " ");
        return t.replaceAll("\\s+", " ");
    }

    private static UnitKind kindOf(String symbol) {
        if (symbol.isEmpty()) {
            return null;
        }
        for (UnitKind k : UnitKind.values()) {
            if (k != UnitKind.STRESS && k != UnitKind.TEMPERATURE_DIFFERENCE && k.unit(symbol) != null) {
                return k;
            }
        }
        return null;
    }

    private static String expectedUnits(UnitKind kind) {
        return " (units: " + String.join(", ", kind.symbols().stream()
                .map(s -> s.isEmpty() ? "none" : s).toList()) + ")";
    }

    private static String didYouMean(String symbol, UnitKind kind) {
        String best = Names.closest(symbol, kind.symbols());
        return best == null || best.isEmpty() ? "" : " (did you mean '" + best + "'?)";
    }
}
