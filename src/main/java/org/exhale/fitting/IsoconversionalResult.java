package org.exhale.fitting;

/**
 * E(α) by one method.
 *
 * @param method           the method
 * @param alpha            conversion levels
 * @param energyJPerMol    activation energy at each level [J/mol] (NaN where not computable)
 * @param halfWidthJPerMol half-width of the confidence interval [J/mol] (NaN where not computable)
 * @param confidence       confidence level of the intervals
 */
public record IsoconversionalResult(IsoconversionalMethod method, double[] alpha, double[] energyJPerMol,
                                    double[] halfWidthJPerMol, double confidence) {
    public IsoconversionalResult {
        if (method == null || alpha.length != energyJPerMol.length || alpha.length != halfWidthJPerMol.length) {
            throw new IllegalArgumentException("isoconversional result needs a method and equal-length columns");
        }
        alpha = alpha.clone();
        energyJPerMol = energyJPerMol.clone();
        halfWidthJPerMol = halfWidthJPerMol.clone();
    }

    @Override public double[] alpha() { return alpha.clone(); }
    @Override public double[] energyJPerMol() { return energyJPerMol.clone(); }
    @Override public double[] halfWidthJPerMol() { return halfWidthJPerMol.clone(); }

    public int size() {
        return alpha.length;
    }

    /** E at the grid level nearest to {@code level} [J/mol]. */
    public double energyAt(double level) {
        return energyJPerMol[nearest(level)];
    }

    /** Interval half-width at the grid level nearest to {@code level} [J/mol]. */
    public double halfWidthAt(double level) {
        return halfWidthJPerMol[nearest(level)];
    }

    private int nearest(double level) {
        int best = 0;
        for (int i = 1; i < alpha.length; i++) {
            if (Math.abs(alpha[i] - level) < Math.abs(alpha[best] - level)) {
                best = i;
            }
        }
        return best;
    }

    /** Mean of the finite E values [J/mol]. */
    public double meanEnergy() {
        double s = 0;
        int n = 0;
        for (double e : energyJPerMol) {
            if (Double.isFinite(e)) {
                s += e;
                n++;
            }
        }
        return n == 0 ? Double.NaN : s / n;
    }

    /** (max − min)/mean of the finite E values. */
    public double relativeSpread() {
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (double e : energyJPerMol) {
            if (Double.isFinite(e)) {
                lo = Math.min(lo, e);
                hi = Math.max(hi, e);
            }
        }
        return hi >= lo ? (hi - lo) / meanEnergy() : Double.NaN;
    }
}
