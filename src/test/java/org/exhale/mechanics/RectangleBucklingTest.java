package org.exhale.mechanics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.optim.univariate.UnivariatePointValuePair;
import org.hipparchus.optim.MaxEval;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The clamped rectangle's buckling under equi-biaxial compression ({@link RectangleBuckling}, tabulated
 * from a Rayleigh–Ritz solution) against independent solutions written here: finite differences of
 * D∇⁴w + N∇²w = 0 on the quarter plate (inverse iteration, Richardson-extrapolated), the infinite
 * strip's characteristic equation, and the published square.
 */
class RectangleBucklingTest {

    private static final double PI2 = Math.PI * Math.PI;

    /*
     * Source: Timoshenko & Gere, Theory of Elastic Stability, 2nd ed. (1961), buckling of a square plate
     * clamped on all edges and compressed equally in two perpendicular directions: σ_cr = 5.30 π² D/(b² h)
     * (b the side) — from memory, unconfirmed. In the code's units k = 4λ/π².
     */
    @Test
    void squareMatchesTimoshenkoAndGere() {
        double k = 4 * RectangleBuckling.lambda(1) / PI2;
        assertEquals(5.30, k, 0.02, "buckling coefficient of the clamped square under biaxial compression");
    }

    /*
     * Derived, no published source: the infinite clamped strip, mode f(x) cos ky, f = A cosh kx + B cos px
     * with p tan p = −t tanh t (t = ka, p² = λ − t²); λ∞ = min over t of p² + t², solved here with
     * Hipparchus' Brent solver and optimiser. Beyond the last node the cap uses λ∞, a lower bound for
     * every length (domain monotonicity), and the tabulated values approach it from above.
     */
    @Test
    void longPlatesApproachTheInfiniteStrip() {
        BrentSolver solver = new BrentSolver(1e-15, 1e-14);
        BrentOptimizer opt = new BrentOptimizer(1e-12, 1e-14);
        UnivariatePointValuePair min = opt.optimize(new MaxEval(1000), GoalType.MINIMIZE,
                new SearchInterval(0.1, 3),
                new UnivariateObjectiveFunction(t -> {
                    double p = solver.solve(1000, q -> q * Math.tan(q) + t * Math.tanh(t), Math.PI / 2 + 1e-9, Math.PI - 1e-12);
                    return p * p + t * t;
                }));
        double lambdaInf = min.getValue() / PI2;
        assertEquals(lambdaInf, RectangleBuckling.LONG_PLATE_OVER_PI2, 1e-7, "infinite strip, at ka = " + min.getPoint());
        assertEquals(lambdaInf * PI2, RectangleBuckling.lambda(50), 1e-7 * PI2);
        double last = RectangleBuckling.LAMBDA_OVER_PI2[RectangleBuckling.LAMBDA_OVER_PI2.length - 1];
        assertTrue(last > lambdaInf && last < 1.003 * lambdaInf, "L/w = 10 is within 0.3 % above the infinite strip: " + last);
    }

    /*
     * Monotone: a rectangle lies inside every longer one (domain monotonicity of the clamped problem),
     * so λ may not rise with L/w; the cap's curve keeps that, never drops below λ∞, and crosses the
     * strip's π² between L/w = 1.65 and 1.75 (the Ritz values: 1.0002 π² at 1.70, 0.9954 π² at 1.75) (derived, no published source).
     */
    @Test
    void bucklingFallsWithLengthAndCrossesTheStrip() {
        double previous = Double.POSITIVE_INFINITY;
        for (double a = 1; a < 12; a += 0.0137) {
            double lam = RectangleBuckling.lambda(a);
            assertTrue(lam <= previous + 1e-12, "monotone at L/w " + a + ": " + lam / PI2 + " after " + previous / PI2);
            assertTrue(lam >= RectangleBuckling.LONG_PLATE_OVER_PI2 * PI2 - 1e-12, "above the infinite strip at L/w " + a);
            previous = lam;
        }
        assertTrue(RectangleBuckling.lambda(1.65) > PI2 && RectangleBuckling.lambda(1.75) < PI2,
                "crosses π² at " + RectangleBuckling.lambda(1.65) / PI2 + ", " + RectangleBuckling.lambda(1.75) / PI2);
    }

    /** The bundled constants are those of the generator (a stale table fails here). */
    @ParameterizedTest
    @CsvSource({"0", "13", "33"})
    void constantsMatchTheirGenerator(int node) {
        double a = RectangleBuckling.ASPECTS[node];
        assertEquals(RectangleBucklingRitz.converged(a) / PI2, RectangleBuckling.LAMBDA_OVER_PI2[node], 6e-8,
                "node L/w " + a);
    }

    /*
     * The cap's value against finite differences (independent: a different method from the Ritz
     * generator), off the table's nodes. The FD eigenvalue is Richardson-extrapolated from 12 and 24
     * intervals across the half width (measured: within 2e-5 of the Ritz values and of a 24/36
     * extrapolation). The cap lies below it by the stated margin (measured 0.18–0.20 %), never above it
     * by more than the FD error. Derived, no published source.
     */
    @ParameterizedTest
    @CsvSource({"1.0", "1.37", "1.83", "2.55", "3.33"})
    void tabulatedBucklingMatchesFiniteDifferences(double aspect) {
        double coarse = fdLowest(aspect, 12);
        double fine = fdLowest(aspect, 24);
        double fd = fine + (fine - coarse) / 3;
        double cap = RectangleBuckling.lambda(aspect);
        String at = "L/w " + aspect + ": cap " + cap / PI2 + " π², FD " + fd / PI2 + " π² (24 intervals "
                + fine / PI2 + ")";
        assertTrue(cap <= fd * (1 + 1e-4), "not above the FD value: " + at);
        assertTrue(cap >= fd * (1 - RectangleBuckling.MARGIN - 1e-4), "close below: " + at);
    }

    /** Least λ of both parities along the length, n intervals across the half width. */
    static double fdLowest(double aspect, int n) {
        return Math.min(fdLowest(aspect, n, 0), fdLowest(aspect, n, 1));
    }

    /**
     * Finite differences on the quarter plate 0 ≤ x ≤ 1, 0 ≤ y ≤ b (units of a), uniform spacing, w
     * even in x; even (parity 0) or odd (1) in y. K = Δ_h(Δ_h w) with the clamped edges by mirrored
     * ghost nodes (w_{n+1} = w_{n−1}), G = −Δ_h w; the least λ of K w = λ G w by inverse iteration
     * with a shift below it (banded LU of K − σG).
     */
    static double fdLowest(double aspect, int n, int parity) {
        int m = (int) Math.round(aspect * n);
        double hx = 1.0 / n;
        double hy = aspect / m;
        int j0 = parity;
        int rows = m - j0;
        int size = n * rows;
        int band = 2 * n + 2;
        // operators as functions on a full node field (with ghosts)
        java.util.function.Function<double[], double[]> lapK = w -> apply(w, n, m, j0, hx, hy, parity, true);
        java.util.function.Function<double[], double[]> lapG = w -> apply(w, n, m, j0, hx, hy, parity, false);
        // assemble the banded matrices: unknowns five nodes apart in both directions share one evaluation
        // (the stencils, mirrored ghosts included, reach two nodes)
        double[][] kb = new double[size][2 * band + 1];
        double[][] gb = new double[size][2 * band + 1];
        double[] e = new double[size];
        for (int ci = 0; ci < 5; ci++) {
            for (int cj = 0; cj < 5; cj++) {
                java.util.Arrays.fill(e, 0);
                for (int j = j0; j < m; j++) {
                    for (int i = 0; i < n; i++) {
                        if (i % 5 == ci && j % 5 == cj) {
                            e[(j - j0) * n + i] = 1;
                        }
                    }
                }
                double[] kc = lapK.apply(e);
                double[] gc = lapG.apply(e);
                for (int j = j0; j < m; j++) {
                    for (int i = 0; i < n; i++) {
                        int r = (j - j0) * n + i;
                        // the one column of this colour within two nodes
                        int ic = i - Math.floorMod(i - ci + 2, 5) + 2;
                        int jc = j - Math.floorMod(j - cj + 2, 5) + 2;
                        if (ic < 0 || ic >= n || jc < j0 || jc >= m) {
                            continue;
                        }
                        int c = (jc - j0) * n + ic;
                        kb[r][c - r + band] = kc[r];
                        gb[r][c - r + band] = gc[r];
                    }
                }
            }
        }
        double sigma = 0.9 * RectangleBuckling.lambda(Math.max(1, aspect));
        double[][] lu = new double[size][2 * band + 1];
        for (int r = 0; r < size; r++) {
            for (int k = 0; k <= 2 * band; k++) {
                lu[r][k] = kb[r][k] - sigma * gb[r][k];
            }
        }
        factor(lu, band);
        double[] w = new double[size];
        java.util.Arrays.fill(w, 1);
        double lambda = 0;
        for (int it = 0; it < 500; it++) {
            double[] rhs = multiply(gb, w, band);
            solve(lu, rhs, band);
            double norm = 0;
            for (double v : rhs) {
                norm = Math.max(norm, Math.abs(v));
            }
            for (int k = 0; k < size; k++) {
                w[k] = rhs[k] / norm;
            }
            double[] kw = multiply(kb, w, band);
            double[] gw = multiply(gb, w, band);
            double num = 0;
            double den = 0;
            for (int k = 0; k < size; k++) {
                num += w[k] * kw[k];
                den += w[k] * gw[k];
            }
            double next = num / den;
            if (Math.abs(next - lambda) < 1e-12 * next) {
                return next;
            }
            lambda = next;
        }
        return lambda;
    }

    /** Δ_hΔ_h w (biharmonic) or −Δ_h w at the unknown nodes; w holds the unknowns. */
    private static double[] apply(double[] w, int n, int m, int j0, double hx, double hy, int parity, boolean biharmonic) {
        // padded node field −2..n+2, −2..m+2
        int px = n + 5;
        double[] f = new double[px * (m + 5)];
        for (int j = -2; j <= m + 2; j++) {
            int jr = j < 0 ? -j : (j > m ? 2 * m - j : j);
            double sy = j < 0 && parity == 1 ? -1 : 1;
            for (int i = -2; i <= n + 2; i++) {
                int ir = i < 0 ? -i : (i > n ? 2 * n - i : i);
                double v = 0;
                if (ir < n && jr < m && jr >= j0) {
                    v = w[(jr - j0) * n + ir];
                }
                f[(i + 2) + (j + 2) * px] = sy * v;
            }
        }
        double[] lap = new double[f.length];
        for (int j = -1; j <= m + 1; j++) {
            for (int i = -1; i <= n + 1; i++) {
                int k = (i + 2) + (j + 2) * px;
                lap[k] = (f[k + 1] - 2 * f[k] + f[k - 1]) / (hx * hx) + (f[k + px] - 2 * f[k] + f[k - px]) / (hy * hy);
            }
        }
        double[] out = new double[w.length];
        for (int j = j0; j < m; j++) {
            for (int i = 0; i < n; i++) {
                int k = (i + 2) + (j + 2) * px;
                out[(j - j0) * n + i] = biharmonic
                        ? (lap[k + 1] - 2 * lap[k] + lap[k - 1]) / (hx * hx) + (lap[k + px] - 2 * lap[k] + lap[k - px]) / (hy * hy)
                        : -lap[k];
            }
        }
        return out;
    }

    private static double[] multiply(double[][] a, double[] x, int band) {
        double[] y = new double[x.length];
        for (int r = 0; r < x.length; r++) {
            double s = 0;
            for (int c = Math.max(0, r - band); c <= Math.min(x.length - 1, r + band); c++) {
                s += a[r][c - r + band] * x[c];
            }
            y[r] = s;
        }
        return y;
    }

    /** Banded LU without pivoting (K − σG is close to symmetric positive definite below λ). */
    private static void factor(double[][] a, int band) {
        int n = a.length;
        for (int k = 0; k < n; k++) {
            double piv = a[k][band];
            for (int i = k + 1; i <= Math.min(n - 1, k + band); i++) {
                double l = a[i][k - i + band] / piv;
                a[i][k - i + band] = l;
                if (l != 0) {
                    for (int j = k + 1; j <= Math.min(n - 1, k + band); j++) {
                        a[i][j - i + band] -= l * a[k][j - k + band];
                    }
                }
            }
        }
    }

    private static void solve(double[][] a, double[] b, int band) {
        int n = b.length;
        for (int k = 0; k < n; k++) {
            for (int i = k + 1; i <= Math.min(n - 1, k + band); i++) {
                b[i] -= a[i][k - i + band] * b[k];
            }
        }
        for (int k = n - 1; k >= 0; k--) {
            double s = b[k];
            for (int j = k + 1; j <= Math.min(n - 1, k + band); j++) {
                s -= a[k][j - k + band] * b[j];
            }
            b[k] = s / a[k][band];
        }
    }
}
