package org.exhale.studies;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class SampleStatisticsTest {
    /** Hyndman and Fan (1996), definition 7; values checked against R's quantile(c(1, 2, 3, 4), ...). */
    @Test
    void quantileDefinitionSeven() {
        double[] v = {4, 1, 3, 2};
        assertEquals(2.5, SampleStatistics.quantile(v, 0.5), 1e-12);
        assertEquals(3.85, SampleStatistics.quantile(v, 0.95), 1e-12);
        assertEquals(1, SampleStatistics.quantile(v, 0), 0);
        assertEquals(4, SampleStatistics.quantile(v, 1), 0);
        // A target never reached (NaN) counts as infinitely slow.
        assertEquals(Double.POSITIVE_INFINITY, SampleStatistics.quantile(new double[]{1, 2, Double.NaN, Double.NaN}, 0.95));
        assertEquals(1.5, SampleStatistics.quantile(new double[]{1, 2, Double.NaN}, 0.25), 1e-12);
    }

    /** Spearman's ρ with tie-averaged ranks; the example's value 0.8 worked by hand (common practice, no source). */
    @Test
    void spearmanRankCorrelation() {
        assertEquals(1, SampleStatistics.spearman(new double[]{1, 2, 3, 4}, new double[]{1, 10, 100, 1000}), 1e-12);
        assertEquals(-1, SampleStatistics.spearman(new double[]{1, 2, 3, 4}, new double[]{4, 3, 2, 1}), 1e-12);
        // Ranks (1, 2, 3, 4, 5) against (2, 1, 4, 3, 5): 1 − 6 Σd²/(n(n²−1)) = 1 − 6·4/120 = 0.8.
        assertEquals(0.8, SampleStatistics.spearman(new double[]{1, 2, 3, 4, 5}, new double[]{2, 1, 4, 3, 5}), 1e-12);
        double[] r = SampleStatistics.ranks(new double[]{5, 1, 5, 2});
        assertEquals(3.5, r[0], 0);
        assertEquals(3.5, r[2], 0);
        assertTrue(Double.isNaN(SampleStatistics.spearman(new double[]{1, 2, 3}, new double[]{1, 1, 1})));
        // +∞ (a limit never loaded) ranks above every finite value.
        assertEquals(1, SampleStatistics.spearman(new double[]{1, 2, 3}, new double[]{1, 2, Double.POSITIVE_INFINITY}), 1e-12);
    }

    /** The binomial standard error sqrt(p(1−p)/n) and the rule of three 3/n (Hanley and Lippman-Hand 1983). */
    @Test
    void binomialErrors() {
        assertEquals(Math.sqrt(0.2 * 0.8 / 100), SampleStatistics.binomialStandardError(20, 100), 1e-15);
        assertEquals(0, SampleStatistics.binomialStandardError(0, 100), 0);
        assertEquals(0.03, SampleStatistics.ruleOfThree(100), 1e-15);
    }
}
