package org.exhale.simulation;

/**
 * How far a bake stays from one limit. For ratio limits {@code margin} = allowed / worst actual
 * (≥ 1 holds); for the thermal ceiling it is the headroom allowed − actual in kelvin (≥ 0 holds).
 *
 * @param limit    limit name (e.g. "ceiling", "residue", "pressure", "strength")
 * @param allowed  the allowed value, SI
 * @param actual   the worst actual value over the bake and the corners, SI
 * @param margin   allowed/actual, or the headroom in K for the ceiling; +∞ when never loaded
 * @param timeS    when the worst value occurs [s]
 * @param corner   which corner
 * @param unit     SI unit of allowed and actual
 * @param headroom true when {@code margin} is a difference in kelvin rather than a ratio
 * @param detail   extra words (the dominant term, for instance), may be empty
 */
public record Margin(String limit, double allowed, double actual, double margin, double timeS, String corner,
                     String unit, boolean headroom, String detail) {

    public boolean holds() {
        return headroom ? margin >= 0 : margin >= 1;
    }

    static Margin ratio(String limit, double allowed, double actual, double timeS, String corner, String unit,
                        String detail) {
        double m = actual <= 0 ? Double.POSITIVE_INFINITY : allowed / actual;
        return new Margin(limit, allowed, actual, m, timeS, corner, unit, false, detail);
    }
}
