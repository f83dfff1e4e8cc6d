package org.exhale.fitting;

/**
 * Pre-processing of a run: conversion α = (m0 − m)/(m0 − m∞) from the initial and final plateaus
 * (or m∞ = residue · m0), a local-quadratic smoothing of α on time giving dα/dt, the real heating
 * rate from a straight-line fit of T on t over the reaction range (never from a file name), the
 * crossing of each level of the conversion grid (linear interpolation between samples of the
 * smoothed α) and the peak of dα/dt (parabolic refinement over three samples).
 */
public final class Conversion {
    private Conversion() {
    }

    public static ConversionCurve of(TgaRun run, AnalysisOptions options) {
        double[] t = run.timeS();
        double[] temp = run.temperatureK();
        double[] m = run.mass();
        int n = t.length;
        int p = Math.max(3, (int) Math.round(options.plateauFraction() * n));
        double m0 = mean(m, 0, p);
        double mEnd = Double.isNaN(options.residueFraction())
                ? mean(m, n - p, n) : m0 * options.residueFraction();
        if (!(m0 - mEnd > 1e-6 * Math.abs(m0))) {
            throw new IllegalArgumentException("run " + run.label() + ": no mass loss between the initial plateau ("
                    + m0 + ") and the final mass (" + mEnd + ")");
        }
        double[] alpha = new double[n];
        for (int i = 0; i < n; i++) {
            alpha[i] = (m0 - m[i]) / (m0 - mEnd);
        }
        // Crude reaction range on the raw α, to size the smoothing window.
        int rawFrom = firstAtLeast(alpha, options.alphaMin(), 0);
        int rawTo = firstAtLeast(alpha, options.alphaMax(), Math.max(rawFrom, 0));
        if (rawFrom < 0 || rawTo < 0) {
            throw new IllegalArgumentException("run " + run.label() + ": conversion never reaches "
                    + (rawFrom < 0 ? options.alphaMin() : options.alphaMax()) + "; is the run complete?");
        }
        // At least one neighbour each side (the parabola through three samples); coarse runs are not
        // smoothed across the whole reaction.
        int half = Math.max(1, (int) Math.round(options.smoothingFraction() * (rawTo - rawFrom)));
        half = Math.min(half, (n - 1) / 2);
        LocalPolynomial.Smoothed s = LocalPolynomial.quadratic(t, alpha, half);
        double[] as = s.value();
        double[] rate = s.slope();

        int from = firstAtLeast(as, options.alphaMin(), 0);
        int to = firstAtLeast(as, options.alphaMax(), Math.max(from, 0));
        if (from < 0 || to < 0 || to - from < 3) {
            throw new IllegalArgumentException("run " + run.label() + ": fewer than 3 points between conversion "
                    + options.alphaMin() + " and " + options.alphaMax() + "; the run is too coarse");
        }
        LinearRegression heating = LinearRegression.fit(t, temp, from, to + 1);
        if (!(heating.slope() * (t[to] - t[from]) >= MIN_REACTION_RISE_K)) {
            // An isothermal hold (or a cooling segment) during the mass loss: no heating rate to analyse.
            throw new IllegalArgumentException(String.format(java.util.Locale.ROOT, "run %s: the sample temperature "
                    + "does not rise while the mass is lost (%.1f °C to %.1f °C between conversion %s and %s): "
                    + "a heating run is expected", run.label(), temp[from] - 273.15, temp[to] - 273.15,
                    options.alphaMin(), options.alphaMax()));
        }

        double[] grid = options.grid();
        double[] gt = new double[grid.length];
        double[] gT = new double[grid.length];
        double[] gr = new double[grid.length];
        int k = Math.max(1, from);
        for (int g = 0; g < grid.length; g++) {
            while (k < n && as[k] < grid[g]) {
                k++;
            }
            if (k >= n) {
                gt[g] = gT[g] = gr[g] = Double.NaN;
                continue;
            }
            int j = Math.max(k, 1);
            double denom = as[j] - as[j - 1];
            double f = denom > 0 ? (grid[g] - as[j - 1]) / denom : 1;
            f = Math.max(0, Math.min(1, f));
            gt[g] = t[j - 1] + f * (t[j] - t[j - 1]);
            gT[g] = temp[j - 1] + f * (temp[j] - temp[j - 1]);
            gr[g] = rate[j - 1] + f * (rate[j] - rate[j - 1]);
        }

        int kp = from;
        for (int i = from; i <= to; i++) {
            if (rate[i] > rate[kp]) {
                kp = i;
            }
        }
        double[] peak = peak(t, temp, rate, kp);
        double peakT = peak[0];
        double peakTemp = peak[1];
        return new ConversionCurve(run.label(), t, temp, alpha, as, rate, heating.slope(), heating.maxAbsResidual(),
                m0, mEnd, from, to, grid, gt, gT, gr, peakT, peakTemp);
    }

    /** Least temperature rise over the analysed conversion range for a run to count as heating [K]. */
    static final double MIN_REACTION_RISE_K = 1;

    /** Share of the peak rate above which the top of the peak is fitted. */
    static final double PEAK_TOP_SHARE = 0.9;

    /**
     * Time and temperature of the rate peak by a least-squares cubic through the smoothed rate over
     * the top of the peak (every sample around the largest one with a rate of at least
     * {@link #PEAK_TOP_SHARE} of it), where its slope vanishes: many samples share the noise, and the
     * cubic term absorbs the asymmetry of a reaction peak. Fewer than 7 samples on top: the parabola
     * through the three around the largest.
     */
    static double[] peak(double[] t, double[] temp, double[] rate, int kp) {
        int n = t.length;
        int lo = kp, hi = kp;
        while (lo > 0 && rate[lo - 1] >= PEAK_TOP_SHARE * rate[kp]) {
            lo--;
        }
        while (hi < n - 1 && rate[hi + 1] >= PEAK_TOP_SHARE * rate[kp]) {
            hi++;
        }
        double peakT = t[kp];
        if (hi - lo + 1 >= 7) {
            double scale = Math.max(t[hi] - t[kp], t[kp] - t[lo]);
            double[][] a = new double[hi - lo + 1][4];
            double[] b = new double[hi - lo + 1];
            for (int i = lo; i <= hi; i++) {
                double u = (t[i] - t[kp]) / scale;
                a[i - lo] = new double[] {1, u, u * u, u * u * u};
                b[i - lo] = rate[i];
            }
            double[] c = new org.hipparchus.linear.QRDecomposition(new org.hipparchus.linear.Array2DRowRealMatrix(a, false))
                    .getSolver().solve(new org.hipparchus.linear.ArrayRealVector(b, false)).toArray();
            // c1 + 2 c2 u + 3 c3 u² = 0: the root with negative curvature nearest u = 0.
            double best = Double.NaN;
            if (Math.abs(c[3]) < 1e-12 * Math.abs(c[2])) {
                best = c[2] < 0 ? -c[1] / (2 * c[2]) : Double.NaN;
            } else {
                double disc = 4 * c[2] * c[2] - 12 * c[3] * c[1];
                if (disc >= 0) {
                    for (double sign : new double[] {-1, 1}) {
                        double u = (-2 * c[2] + sign * Math.sqrt(disc)) / (6 * c[3]);
                        double curv = 2 * c[2] + 6 * c[3] * u;
                        if (curv < 0 && (Double.isNaN(best) || Math.abs(u) < Math.abs(best))) {
                            best = u;
                        }
                    }
                }
            }
            double uLo = (t[lo] - t[kp]) / scale, uHi = (t[hi] - t[kp]) / scale;
            if (Double.isFinite(best) && best >= uLo && best <= uHi) {
                peakT = t[kp] + best * scale;
                int j = Math.max(1, TemperatureIntegral.upperIndex(t, peakT));
                double f = (peakT - t[j - 1]) / (t[j] - t[j - 1]);
                return new double[] {peakT, temp[j - 1] + f * (temp[j] - temp[j - 1])};
            }
        }
        double peakTemp = temp[kp];
        if (kp > 0 && kp < n - 1) {
            double r0 = rate[kp - 1], r1 = rate[kp], r2 = rate[kp + 1];
            double t0 = t[kp - 1], t1 = t[kp], t2 = t[kp + 1];
            // Vertex of the parabola through the three samples (uneven spacing allowed).
            double d0 = (r1 - r0) / (t1 - t0), d1 = (r2 - r1) / (t2 - t1);
            double curv = (d1 - d0) / (t2 - t0);
            if (curv < 0) {
                double vertex = Math.max(t0, Math.min(t2, (t0 + t1) / 2 - d0 / (2 * curv)));
                peakT = vertex;
                int j = vertex <= t1 ? kp : kp + 1;
                double f = (vertex - t[j - 1]) / (t[j] - t[j - 1]);
                peakTemp = temp[j - 1] + f * (temp[j] - temp[j - 1]);
            }
        }
        return new double[] {peakT, peakTemp};
    }

    private static double mean(double[] v, int from, int to) {
        double s = 0;
        for (int i = from; i < to; i++) {
            s += v[i];
        }
        return s / (to - from);
    }

    private static int firstAtLeast(double[] v, double level, int start) {
        for (int i = Math.max(0, start); i < v.length; i++) {
            if (v[i] >= level) {
                return i;
            }
        }
        return -1;
    }
}
