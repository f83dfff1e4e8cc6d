package org.exhale.planning;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;

import org.junit.jupiter.api.Test;

/**
 * The stored-gas programme's bin labels (docs/model.md, "Lower bounds", 5): each bin's label is affine in the stored
 * gas S, and a move's landing labels must lie below every arrival a recipe in the source bins can make. Checked
 * against the arrivals minimised directly: for a closed-form convex, falling duration D (not only its samples at the
 * bin differences) and random affine source labels, the least of E_m(S) + D(S' − S) over the source bins' S (a convex
 * function of S, minimised by golden-section search to 1e-12 of a bin) at 41 points S' of each landing bin. The
 * labels may be no later than that anywhere (a check of the secant extensions and of the least over θ; that a secant
 * of a convex function lies below it outside its own interval is the three-chord lemma: common practice, no source),
 * and should recover most of
 * what one value per bin gave away.
 */
class AffineLabelsTest {
    private static final double W = 1.0;

    /** A convex duration falling in the room x (in bins), infinite where the room is too small for any move. */
    private record Duration(double scale, double length, double floor, double wall, double kinetic) {
        double at(double x) {
            if (x < wall) {
                return Double.POSITIVE_INFINITY;
            }
            return Math.max(kinetic, scale * Math.exp(-x / length) + floor);
        }
    }

    @Test
    void landingLabelsLieBelowEveryArrivalAndGainOverOneValuePerBin() {
        Random rnd = new Random(20261203);
        int cases = 0;
        double gained = 0;
        double given = 0;
        for (int trial = 0; trial < 400; trial++) {
            int nb = 4 + rnd.nextInt(13);
            Duration dur = new Duration(50 + 500 * rnd.nextDouble(), 0.5 + 6 * rnd.nextDouble(), 20 * rnd.nextDouble(),
                    rnd.nextBoolean() ? -nb - 1.0 : -rnd.nextInt(nb), rnd.nextBoolean() ? 0 : 30 + 40 * rnd.nextDouble());
            double[] samples = new double[2 * nb - 1];
            for (int k = 2 - nb; k <= nb; k++) {
                samples[nb - k] = dur.at(k * W) == Double.POSITIVE_INFINITY ? Double.POSITIVE_INFINITY
                        : dur.scale() * Math.exp(-k * W / dur.length()) + dur.floor();
            }
            double arrival = rnd.nextDouble() < 0.2 ? 1000 + 400 * rnd.nextDouble() : Double.NEGATIVE_INFINITY;
            double[] topOf = new double[nb];
            double[] bottom = new double[nb];
            int[] live = new int[nb];
            int count = 0;
            for (int m = 0; m < nb; m++) {
                if (rnd.nextDouble() < 0.6) {
                    topOf[m] = 1000 + 300 * rnd.nextDouble();
                    bottom[m] = topOf[m] + (rnd.nextBoolean() ? 0 : 60 * rnd.nextDouble());
                    live[count++] = m;
                } else {
                    topOf[m] = Double.POSITIVE_INFINITY;
                    bottom[m] = Double.POSITIVE_INFINITY;
                }
            }
            if (count == 0) {
                continue;
            }
            int top = nb - 1 - rnd.nextInt(Math.max(1, nb / 3));
            double[] lo = new double[nb];
            double[] hi = new double[nb];
            JointBound.landing(samples, dur.kinetic(), arrival, nb, live, count, topOf, bottom, 0, top, lo, hi);
            for (int mp = 0; mp <= top; mp++) {
                double oneValue = Double.POSITIVE_INFINITY;
                for (int l = 0; l < count; l++) {
                    int m = live[l];
                    oneValue = Math.min(oneValue, Math.max(arrival, topOf[m] + dur.at((mp + 1 - m) * W)));
                }
                for (int e = 0; e <= 40; e++) {
                    double eta = e / 40.0;
                    double least = Double.POSITIVE_INFINITY;
                    for (int l = 0; l < count; l++) {
                        least = Math.min(least, leastArrival(dur, arrival, topOf[live[l]], bottom[live[l]], mp - live[l], eta));
                    }
                    double label = lo[mp] + (hi[mp] - lo[mp]) * eta;
                    assertTrue(label <= least + 1e-7 * Math.abs(least) || least == Double.POSITIVE_INFINITY,
                            "trial " + trial + " bin " + mp + " η " + eta + ": label " + label + " after the least arrival " + least);
                    if (Double.isFinite(least) && Double.isFinite(oneValue)) {
                        given += least - oneValue;
                        gained += label - oneValue;
                        cases++;
                    }
                }
            }
        }
        assertTrue(cases > 1000, "cases " + cases);
        // one value per bin gives away `given` in all (the least arrivals above it); the labels recover most of it
        System.out.printf("affine labels: %d points, recovered %.1f %% of what one value per bin gave away%n", cases,
                100 * gained / given);
        assertTrue(gained > 0.5 * given, "recovered " + gained + " of " + given);
    }

    /**
     * The least arrival at S' = s_mp + η w over a source bin (S = s_m + θ w, θ ∈ [0, 1]) with label b at its bottom
     * and r at its top: max(arrival, E(θ) + D((k0 + η − θ) w)), convex in θ; golden-section search.
     */
    private static double leastArrival(Duration dur, double arrival, double r, double b, int k0, double eta) {
        java.util.function.DoubleUnaryOperator f = th -> r + (b - r) * (1 - th) + dur.at((k0 + eta - th) * W);
        double a = 0;
        double c = 1;
        double g = (Math.sqrt(5) - 1) / 2;
        double x1 = c - g * (c - a);
        double x2 = a + g * (c - a);
        double f1 = f.applyAsDouble(x1);
        double f2 = f.applyAsDouble(x2);
        while (c - a > 1e-12) {
            if (f1 <= f2) {
                c = x2;
                x2 = x1;
                f2 = f1;
                x1 = c - g * (c - a);
                f1 = f.applyAsDouble(x1);
            } else {
                a = x1;
                x1 = x2;
                f1 = f2;
                x2 = a + g * (c - a);
                f2 = f.applyAsDouble(x2);
            }
        }
        double least = Math.min(Math.min(f.applyAsDouble(0), f.applyAsDouble(1)), Math.min(f1, f2));
        return Math.max(arrival, least);
    }
}
