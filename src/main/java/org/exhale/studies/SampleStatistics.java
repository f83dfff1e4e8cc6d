package org.exhale.studies;

import java.util.Arrays;

/** The few statistics a robustness study reports. */
public final class SampleStatistics {
    private SampleStatistics() {
    }

    /** The binomial standard error of an estimated probability, sqrt(p (1 − p) / n) (common practice). */
    public static double binomialStandardError(int events, int n) {
        if (n == 0) {
            return Double.NaN;
        }
        double p = (double) events / n;
        return Math.sqrt(p * (1 - p) / n);
    }

    /**
     * A 95 % upper bound on a probability when no event was seen in n trials, 3/n (the "rule of
     * three", Hanley and Lippman-Hand 1983).
     */
    public static double ruleOfThree(int n) {
        return n == 0 ? Double.NaN : Math.min(1, 3.0 / n);
    }

    /**
     * The q-quantile of the values by linear interpolation between order statistics (Hyndman and
     * Fan 1996, definition 7, the default of R and NumPy). NaN values count as +∞ (a target not
     * reached); a quantile that falls on or next to them is +∞.
     */
    public static double quantile(double[] values, double q) {
        if (values.length == 0) {
            return Double.NaN;
        }
        if (!(q >= 0 && q <= 1)) {
            throw new IllegalArgumentException("quantile must be in [0, 1]");
        }
        double[] v = values.clone();
        for (int i = 0; i < v.length; i++) {
            if (Double.isNaN(v[i])) {
                v[i] = Double.POSITIVE_INFINITY;
            }
        }
        Arrays.sort(v);
        double h = (v.length - 1) * q;
        int lo = (int) Math.floor(h);
        int hi = Math.min(v.length - 1, lo + 1);
        double f = h - lo;
        if (f == 0 || v[lo] == v[hi]) {
            return v[lo];
        }
        if (Double.isInfinite(v[hi]) || Double.isInfinite(v[lo])) {
            return Double.POSITIVE_INFINITY;
        }
        return v[lo] + f * (v[hi] - v[lo]);
    }

    /** Ranks 1..n with ties given their mean rank; NaN stays NaN (callers drop such pairs first). */
    static double[] ranks(double[] x) {
        int n = x.length;
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (a, b) -> Double.compare(x[a], x[b]));
        double[] r = new double[n];
        int i = 0;
        while (i < n) {
            int j = i;
            while (j + 1 < n && Double.compare(x[order[j + 1]], x[order[i]]) == 0) {
                j++;
            }
            double mean = (i + j) / 2.0 + 1;
            for (int k = i; k <= j; k++) {
                r[order[k]] = mean;
            }
            i = j + 1;
        }
        return r;
    }

    /**
     * Spearman's rank correlation: Pearson's correlation of the (tie-averaged) ranks. Pairs with a
     * NaN are left out; +∞ ranks above every finite value. NaN when fewer than three pairs remain
     * or either side is constant.
     */
    public static double spearman(double[] x, double[] y) {
        int n = 0;
        for (int i = 0; i < x.length; i++) {
            if (!Double.isNaN(x[i]) && !Double.isNaN(y[i])) {
                n++;
            }
        }
        if (n < 3) {
            return Double.NaN;
        }
        double[] a = new double[n];
        double[] b = new double[n];
        int k = 0;
        for (int i = 0; i < x.length; i++) {
            if (!Double.isNaN(x[i]) && !Double.isNaN(y[i])) {
                a[k] = x[i];
                b[k] = y[i];
                k++;
            }
        }
        return pearson(ranks(a), ranks(b));
    }

    static double pearson(double[] a, double[] b) {
        int n = a.length;
        double ma = 0;
        double mb = 0;
        for (int i = 0; i < n; i++) {
            ma += a[i];
            mb += b[i];
        }
        ma /= n;
        mb /= n;
        double sab = 0;
        double saa = 0;
        double sbb = 0;
        for (int i = 0; i < n; i++) {
            sab += (a[i] - ma) * (b[i] - mb);
            saa += (a[i] - ma) * (a[i] - ma);
            sbb += (b[i] - mb) * (b[i] - mb);
        }
        if (saa == 0 || sbb == 0) {
            return Double.NaN;
        }
        return sab / Math.sqrt(saa * sbb);
    }
}
