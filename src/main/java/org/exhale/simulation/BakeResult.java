package org.exhale.simulation;

import java.util.List;

/**
 * The result of a simulated bake: one {@link CornerResult} per corner (nominal, or hot and cold),
 * the margins to every limit over all corners, and warnings.
 */
public record BakeResult(BakeCase bake, List<CornerResult> corners, List<Margin> margins, List<String> warnings) {
    public BakeResult {
        corners = List.copyOf(corners);
        margins = List.copyOf(margins);
        warnings = List.copyOf(warnings);
    }

    /** True when every limit holds. */
    public boolean feasible() {
        return margins.stream().allMatch(Margin::holds);
    }

    public List<Margin> violated() {
        return margins.stream().filter(m -> !m.holds()).toList();
    }

    /** The smallest ratio margin (the ceiling headroom is not a ratio and is left out). */
    public Margin tightest() {
        Margin best = null;
        for (Margin m : margins) {
            if (!m.headroom() && (best == null || m.margin() < best.margin())) {
                best = m;
            }
        }
        return best;
    }

    public Margin margin(String limit) {
        return margins.stream().filter(m -> m.limit().equals(limit)).findFirst().orElse(null);
    }

    /** "full-gas" if any corner needed the full gas equations, else "quasi-steady". */
    public GasRegime regime() {
        return corners.stream().anyMatch(c -> c.regime() == GasRegime.FULL_GAS) ? GasRegime.FULL_GAS
                : GasRegime.QUASI_STEADY;
    }

    /** The corner with the highest peak excess pressure. */
    public CornerResult pressureCorner() {
        CornerResult best = corners.get(0);
        for (CornerResult c : corners) {
            if (c.peakPressure().value() > best.peakPressure().value()) {
                best = c;
            }
        }
        return best;
    }

    /**
     * The corner that leaves most polymer where the residue target applies, the end of the final hold
     * (the cold one when there is a spread).
     */
    public CornerResult residueCorner() {
        CornerResult best = corners.get(0);
        for (CornerResult c : corners) {
            if (c.unconvertedAtCheckpoint() > best.unconvertedAtCheckpoint()) {
                best = c;
            }
        }
        return best;
    }

    public CornerResult hottest() {
        CornerResult best = corners.get(0);
        for (CornerResult c : corners) {
            if (c.offsetK() > best.offsetK()) {
                best = c;
            }
        }
        return best;
    }

    /** The largest value of a tracked history column over all corners. */
    public Extremum max(String column) {
        Extremum best = null;
        for (CornerResult c : corners) {
            Extremum e = c.max(column);
            if (e != null && (best == null || e.value() > best.value())) {
                best = e;
            }
        }
        return best;
    }

    public double peakExcessPressurePa() {
        return pressureCorner().peakPressure().value();
    }

    /** Unconverted fraction at the end of the recipe (after any cool-down), at the corner that leaves most. */
    public double finalUnconverted() {
        return corners.stream().mapToDouble(CornerResult::finalUnconverted).max().orElse(Double.NaN);
    }

    /** Unconverted fraction where the residue target applies (the end of the final hold), worst corner. */
    public double unconvertedAtCheckpoint() {
        return residueCorner().unconvertedAtCheckpoint();
    }

    /** Where the residue target applies. */
    public org.exhale.recipe.ResidueCheckpoint residueCheckpoint() {
        return bake.recipe().residueCheckpoint();
    }

    /** Time to the residue target at the slowest corner; NaN if never reached. */
    public double timeToTargetS() {
        double t = 0;
        for (CornerResult c : corners) {
            if (Double.isNaN(c.timeToTargetS())) {
                return Double.NaN;
            }
            t = Math.max(t, c.timeToTargetS());
        }
        return t;
    }

    public double timeTo1pctS() {
        double t = 0;
        for (CornerResult c : corners) {
            if (Double.isNaN(c.timeTo1pctS())) {
                return Double.NaN;
            }
            t = Math.max(t, c.timeTo1pctS());
        }
        return t;
    }

    public double thermalDoseS() {
        return hottest().thermalDoseS();
    }

    public double maxWaferTemperatureK() {
        return hottest().maxWafer().value();
    }

    public double massBalanceError() {
        return corners.stream().mapToDouble(CornerResult::massBalanceError).max().orElse(0);
    }
}
