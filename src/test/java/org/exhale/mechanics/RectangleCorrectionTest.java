package org.exhale.mechanics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The bundled rectangle correction table against its generator, and the lookup's behaviour at and
 * beyond the grid's edges (the physics is checked against the 2D solution in {@link RectangleFvkTest}).
 */
class RectangleCorrectionTest {

    /** Regression of the bundled resource against its generator on one row (a stale table fails here). */
    @Test
    void bundledTableMatchesItsGenerator() {
        int k = 0;
        int j = 8;
        int m = 2;
        double[][] row = RectangleCorrectionWriter.row(k, j, m);
        double[] out = new double[RectangleCorrection.PARTS];
        for (int i = 0; i < RectangleCorrection.NX; i += 3) {
            RectangleCorrection.ratios(RectangleCorrection.ASPECTS[k], RectangleCorrection.s0At(k, j),
                    RectangleCorrection.qAt(i), RectangleCorrection.NUS[m], out);
            for (int p = 0; p < RectangleCorrection.PARTS; p++) {
                assertEquals(row[i][p] * (1 + RectangleCorrection.SAFETY), out[p], 3e-6, "node " + i + " part " + p);
            }
        }
    }

    /*
     * Beyond the largest tabulated load and pre-stress the lookup maps the point along the membrane
     * similarity (s0, Q) → (κ s0, κ^{3/2} Q) onto the grid's edge: the ratios are continuous there, the
     * centre's and the deflection's constant along the similarity ray, the edge's raised by the stated
     * bound 1 + M (1 − √κ) (derived, no published source; the bound is fitted in RectangleCorrection).
     */
    @Test
    void beyondTheGridTheRatiosFollowTheMembraneSimilarity() {
        double[] a = new double[RectangleCorrection.PARTS];
        double[] b = new double[RectangleCorrection.PARTS];
        double qMax = RectangleCorrection.Q_MAX;
        RectangleCorrection.ratios(2.1, 30, qMax * (1 - 1e-9), 0.3, a);
        RectangleCorrection.ratios(2.1, 30, qMax * (1 + 1e-9), 0.3, b);
        for (int p = 0; p < a.length; p++) {
            assertEquals(a[p], b[p], 1e-6, "continuous at the largest load, part " + p);
        }
        double kappa = 0.01;
        RectangleCorrection.ratios(2.1, 30 / kappa, qMax / Math.pow(kappa, 1.5), 0.3, b);
        double rise = 1 + RectangleCorrection.beyondMargin(2.1, 0.3) * (1 - Math.sqrt(kappa));
        for (int p = 0; p < a.length; p++) {
            assertEquals(a[p] * (p == 0 || p == 2 ? rise : 1), b[p], 1e-9, "along the similarity ray, part " + p);
        }
    }

    /** Every tabulated ratio is finite and positive (each part of the 2D solution has the base's sign). */
    @Test
    void tabulatedRatiosArePositive() {
        double[] out = new double[RectangleCorrection.PARTS];
        for (double aspect : RectangleCorrection.ASPECTS) {
            for (double y : RectangleCorrection.YS) {
                for (double nu : RectangleCorrection.NUS) {
                    for (int i = 0; i < RectangleCorrection.NX; i++) {
                        RectangleCorrection.ratios(aspect, RectangleCorrection.s0Of(aspect, y), RectangleCorrection.qAt(i), nu, out);
                        for (int p = 0; p < out.length; p++) {
                            assertTrue(out[p] > 0 && out[p] < 10, "part " + p + " at L/w " + aspect + ", y " + y + ", ν " + nu
                                    + ", Q " + RectangleCorrection.qAt(i) + ": " + out[p]);
                        }
                    }
                }
            }
        }
    }
}
