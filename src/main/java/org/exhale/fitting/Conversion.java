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
        int half = Math.max(3, (int) Math.round(options.smoothingFraction() * (rawTo - rawFrom)));
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
        double peakT = t[kp];
        double peakTemp = temp[kp];
        if (kp > 0 && kp < n - 1) {
            double r0 = rate[kp - 1], r1 = rate[kp], r2 = rate[kp + 1];
            double t0 = t[kp - 1], t1 = t[kp], t2 = t[kp + 1];
            // Vertex of the parabola through the three samples (uneven spacing allowed).
            double d0 = (r1 - r0) / (t1 - t0), d1 = (r2 - r1) / (t2 - t1);
            double curv = (d1 - d0) / (t2 - t0);
            if (curv < 0) {
                // Newton form p(t) = r0 + d0 (t − t0) + curv (t − t0)(t − t1); p'(t) = 0 at the vertex.
                double vertex = Math.max(t0, Math.min(t2, (t0 + t1) / 2 - d0 / (2 * curv)));
                peakT = vertex;
                int j = vertex <= t1 ? kp : kp + 1;
                double f = (vertex - t[j - 1]) / (t[j] - t[j - 1]);
                peakTemp = temp[j - 1] + f * (temp[j] - temp[j - 1]);
            }
        }
        return new ConversionCurve(run.label(), t, temp, alpha, as, rate, heating.slope(), heating.maxAbsResidual(),
                m0, mEnd, from, to, grid, gt, gT, gr, peakT, peakTemp);
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
