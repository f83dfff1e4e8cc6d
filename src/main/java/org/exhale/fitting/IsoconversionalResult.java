package org.exhale.fitting;

/**
 * E(α) by one method.
 *
 * @param method           the method
 * @param alpha            conversion levels
 * @param energyJPerMol    activation energy at each level [J/mol] (NaN where not computable)
 * @param halfWidthJPerMol half-width of the interval [J/mol] (NaN where not computable): the
 *                         statistical half-width plus, for KAS, OFW and Starink, the approximation
 *                         bias below
 * @param confidence       confidence level of the intervals
 * @param biasJPerMol      the method's approximation bias included in the half-width [J/mol]: for
 *                         the methods that integrate from the start of the run with a closed-form
 *                         temperature integral (KAS, OFW, Starink), |E − E_Vyazovkin| at the same
 *                         level (Vyazovkin's method integrates over the step only along the
 *                         measured T(t), so it carries neither approximation); 0 for the others
 */
public record IsoconversionalResult(IsoconversionalMethod method, double[] alpha, double[] energyJPerMol,
                                    double[] halfWidthJPerMol, double confidence, double[] biasJPerMol) {
    public IsoconversionalResult {
        if (method == null || alpha.length != energyJPerMol.length || alpha.length != halfWidthJPerMol.length
                || alpha.length != biasJPerMol.length) {
            throw new IllegalArgumentException("isoconversional result needs a method and equal-length columns");
        }
        alpha = alpha.clone();
        energyJPerMol = energyJPerMol.clone();
        halfWidthJPerMol = halfWidthJPerMol.clone();
        biasJPerMol = biasJPerMol.clone();
    }

    /** A result without approximation bias. */
    public IsoconversionalResult(IsoconversionalMethod method, double[] alpha, double[] energyJPerMol,
                                 double[] halfWidthJPerMol, double confidence) {
        this(method, alpha, energyJPerMol, halfWidthJPerMol, confidence, new double[alpha.length]);
    }

    @Override public double[] biasJPerMol() { return biasJPerMol.clone(); }

    /** Statistical half-width alone (the half-width less the approximation bias) [J/mol]. */
    public double[] statisticalHalfWidthJPerMol() {
        double[] s = new double[alpha.length];
        for (int i = 0; i < s.length; i++) {
            s[i] = halfWidthJPerMol[i] - (Double.isFinite(biasJPerMol[i]) ? biasJPerMol[i] : 0);
        }
        return s;
    }

    /** Relative spread (max − min)/mean of the finite E values with α in [lo, hi]. */
    public double relativeSpread(double lo, double hi) {
        double min = Double.POSITIVE_INFINITY, max = Double.NEGATIVE_INFINITY, sum = 0;
        int n = 0;
        for (int i = 0; i < alpha.length; i++) {
            if (alpha[i] >= lo - 1e-9 && alpha[i] <= hi + 1e-9 && Double.isFinite(energyJPerMol[i])) {
                min = Math.min(min, energyJPerMol[i]);
                max = Math.max(max, energyJPerMol[i]);
                sum += energyJPerMol[i];
                n++;
            }
        }
        return n < 2 ? Double.NaN : (max - min) / (sum / n);
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
