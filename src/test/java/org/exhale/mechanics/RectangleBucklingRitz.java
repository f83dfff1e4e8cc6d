package org.exhale.mechanics;

import java.util.Locale;

import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.CholeskyDecomposition;
import org.hipparchus.linear.EigenDecompositionSymmetric;
import org.hipparchus.linear.RealMatrix;

/**
 * Buckling of the clamped rectangle under equi-biaxial compression by the Rayleigh–Ritz method: the
 * generator of the constants in {@link RectangleBuckling} (run {@link #main} and paste its output).
 *
 * <p>Half short side a = 1, half long side b = L/w. Under an equi-biaxial compressive force N the
 * plate buckles at the least λ = N a²/D of ∫(∇²w)² dA = λ ∫|∇w|² dA over clamped w (for a clamped
 * plate the Gaussian-curvature term of the bending energy integrates to zero, so λ does not depend on
 * ν). Trial functions w = Σ c_ij (1−x²)² P_i(x) (1−(y/b)²)² P_j(y/b), P the Legendre polynomials,
 * i even (the lowest mode is symmetric across the short side) and j all even or all odd (modes
 * symmetric or antisymmetric along the long side; the lower of the two is taken). Integrals by
 * Gauss–Legendre quadrature, exact for these polynomials; K c = λ G c by a Cholesky factor of G and
 * Hipparchus' symmetric eigen-decomposition. A Ritz value is an upper bound of the true eigenvalue
 * that converges from above as the basis grows; {@link #main} prints two basis sizes to show the
 * digits that have settled.
 */
public final class RectangleBucklingRitz {

    private RectangleBucklingRitz() {
    }

    /** Least λ = N a²/D over both parities along y, with nx even terms across and ny terms along. */
    static double lowest(double aspect, int nx, int ny) {
        return Math.min(lowest(aspect, nx, ny, 0), lowest(aspect, nx, ny, 1));
    }

    /** Least λ of one parity (0 symmetric, 1 antisymmetric in y). */
    static double lowest(double aspect, int nx, int ny, int parity) {
        int[] dx = new int[nx];
        for (int i = 0; i < nx; i++) {
            dx[i] = 2 * i;
        }
        int[] dy = new int[ny];
        for (int j = 0; j < ny; j++) {
            dy[j] = 2 * j + parity;
        }
        double[][][] bx = basis(dx, 2 * nx + 12);
        double[][][] by = basis(dy, 2 * ny + 12);
        double[] wx = gaussWeights(2 * nx + 12);
        double[] wy = gaussWeights(2 * ny + 12);
        double b = aspect;
        // 1D integrals; along y with t = y/b: d/dy = (1/b) d/dt, dy = b dt
        double[][] x22 = integral(bx, 2, bx, 2, wx, 1);
        double[][] x00 = integral(bx, 0, bx, 0, wx, 1);
        double[][] x20 = integral(bx, 2, bx, 0, wx, 1);
        double[][] x11 = integral(bx, 1, bx, 1, wx, 1);
        double[][] y22 = integral(by, 2, by, 2, wy, 1 / (b * b * b));
        double[][] y00 = integral(by, 0, by, 0, wy, b);
        double[][] y20 = integral(by, 2, by, 0, wy, 1 / b);
        double[][] y11 = integral(by, 1, by, 1, wy, 1 / b);
        int n = nx * ny;
        double[][] k = new double[n][n];
        double[][] g = new double[n][n];
        for (int i = 0; i < nx; i++) {
            for (int j = 0; j < ny; j++) {
                int r = i * ny + j;
                for (int p = 0; p < nx; p++) {
                    for (int q = 0; q < ny; q++) {
                        int c = p * ny + q;
                        // ∫(w_xx + w_yy)² and ∫(w_x² + w_y²)
                        k[r][c] = x22[i][p] * y00[j][q] + x00[i][p] * y22[j][q] + x20[i][p] * y20[q][j]
                                + x20[p][i] * y20[j][q];
                        g[r][c] = x11[i][p] * y00[j][q] + x00[i][p] * y11[j][q];
                    }
                }
            }
        }
        RealMatrix kk = new Array2DRowRealMatrix(k, false);
        RealMatrix gg = new Array2DRowRealMatrix(g, false);
        gg = gg.add(gg.transpose()).scalarMultiply(0.5);          // symmetric up to rounding
        CholeskyDecomposition chol = new CholeskyDecomposition(gg, 1e-9, 1e-300);
        RealMatrix lInv = new org.hipparchus.linear.LUDecomposition(chol.getL()).getSolver().getInverse();
        RealMatrix c = lInv.multiply(kk).multiplyTransposed(lInv);
        c = c.add(c.transpose()).scalarMultiply(0.5);
        double[] ev = new EigenDecompositionSymmetric(c).getEigenvalues();
        double min = Double.POSITIVE_INFINITY;
        for (double v : ev) {
            min = Math.min(min, v);
        }
        return min;
    }

    /** f_k = (1−t²)² P_k(t) and its first two derivatives at the Gauss nodes: [k][derivative][node]. */
    private static double[][][] basis(int[] degrees, int points) {
        double[] t = gaussNodes(points);
        double[][][] out = new double[degrees.length][3][points];
        for (int m = 0; m < degrees.length; m++) {
            int deg = degrees[m];
            for (int q = 0; q < points; q++) {
                double x = t[q];
                double[] p = legendre(deg, x);
                double g = (1 - x * x) * (1 - x * x);
                double g1 = -4 * x * (1 - x * x);
                double g2 = -4 + 12 * x * x;
                out[m][0][q] = g * p[0];
                out[m][1][q] = g1 * p[0] + g * p[1];
                out[m][2][q] = g2 * p[0] + 2 * g1 * p[1] + g * p[2];
            }
        }
        return out;
    }

    /** P_n(x), P_n'(x), P_n''(x) by the three-term recurrence (and its derivatives). */
    static double[] legendre(int n, double x) {
        double p0 = 1;
        double d0 = 0;
        double e0 = 0;
        if (n == 0) {
            return new double[] {1, 0, 0};
        }
        double p1 = x;
        double d1 = 1;
        double e1 = 0;
        for (int k = 1; k < n; k++) {
            double p2 = ((2 * k + 1) * x * p1 - k * p0) / (k + 1);
            double d2 = ((2 * k + 1) * (p1 + x * d1) - k * d0) / (k + 1);
            double e2 = ((2 * k + 1) * (2 * d1 + x * e1) - k * e0) / (k + 1);
            p0 = p1;
            p1 = p2;
            d0 = d1;
            d1 = d2;
            e0 = e1;
            e1 = e2;
        }
        return new double[] {p1, d1, e1};
    }

    private static double[][] integral(double[][][] f, int df, double[][][] g, int dg, double[] w, double factor) {
        double[][] out = new double[f.length][g.length];
        for (int i = 0; i < f.length; i++) {
            for (int j = 0; j < g.length; j++) {
                double s = 0;
                for (int q = 0; q < w.length; q++) {
                    s += w[q] * f[i][df][q] * g[j][dg][q];
                }
                out[i][j] = s * factor;
            }
        }
        return out;
    }

    private static double[] gaussNodes(int n) {
        return gauss(n)[0];
    }

    private static double[] gaussWeights(int n) {
        return gauss(n)[1];
    }

    /** Gauss–Legendre nodes and weights on [−1, 1] (Newton on P_n from the Chebyshev guesses). */
    private static double[][] gauss(int n) {
        double[] x = new double[n];
        double[] w = new double[n];
        for (int i = 0; i < n; i++) {
            double z = Math.cos(Math.PI * (i + 0.75) / (n + 0.5));
            for (int it = 0; it < 100; it++) {
                double[] p = legendre(n, z);
                double dz = p[0] / p[1];
                z -= dz;
                if (Math.abs(dz) < 1e-16) {
                    break;
                }
            }
            double[] p = legendre(n, z);
            x[i] = z;
            w[i] = 2 / ((1 - z * z) * p[1] * p[1]);
        }
        return new double[][] {x, w};
    }

    /** Basis sizes used for the constants: 8 terms across, 8 b + 6 along. */
    static double converged(double aspect) {
        return lowest(aspect, 8, (int) Math.ceil(8 * aspect) + 6);
    }

    /** The same for the modes symmetric along the long side only (the ones a uniform pressure excites). */
    static double convergedSymmetric(double aspect) {
        return lowest(aspect, 8, (int) Math.ceil(8 * aspect) + 6, 0);
    }

    /**
     * Prints λ/π² at the nodes of {@link RectangleBuckling} with the basis of {@link #converged} and a
     * smaller one (6 across, 6 b + 2 along), the largest difference between them, and the largest
     * overestimate of the linear interpolation at the midpoints between nodes.
     */
    public static void main(String[] args) {
        double[] nodes = RectangleBuckling.ASPECTS;
        double[] values = new double[nodes.length];
        double settled = 0;
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < nodes.length; i++) {
            values[i] = converged(nodes[i]) / (Math.PI * Math.PI);
            double small = lowest(nodes[i], 6, (int) Math.ceil(6 * nodes[i]) + 2) / (Math.PI * Math.PI);
            settled = Math.max(settled, Math.abs(small - values[i]) / values[i]);
            sb.append(String.format(Locale.ROOT, "%.7f,%s", values[i], i % 8 == 7 ? "\n" : " "));
        }
        System.out.println(sb);
        StringBuilder sym = new StringBuilder();
        for (int i = 0; i < nodes.length; i++) {
            sym.append(String.format(Locale.ROOT, "%.7f,%s", convergedSymmetric(nodes[i]) / (Math.PI * Math.PI), i % 8 == 7 ? "\n" : " "));
        }
        System.out.println("symmetric:\n" + sym);
        double over = 0;
        double at = 0;
        for (int i = 0; i + 1 < nodes.length; i++) {
            double mid = 0.5 * (nodes[i] + nodes[i + 1]);
            double exact = converged(mid) / (Math.PI * Math.PI);
            double lin = 0.5 * (values[i] + values[i + 1]);
            if ((lin - exact) / exact > over) {
                over = (lin - exact) / exact;
                at = mid;
            }
        }
        System.out.printf(Locale.ROOT, "basis change (6 vs 8 across): %.2e; interpolation overestimate at midpoints: %.2e at L/w %.3f%n",
                settled, over, at);
    }
}
