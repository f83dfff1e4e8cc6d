package org.exhale.mechanics;

/**
 * A clamped rectangular plate under pressure and equi-biaxial pre-stress, solved as a
 * two-dimensional Föppl–von Kármán problem by finite differences: an independent solver for the
 * tests (it shares no code or formula with {@link CapStructure}).
 *
 * <p>Dimensionless variables (a = w/2 the half short side, b = L/w the half long side in units of
 * a): x, y in a; deflection ŵ in h; in-plane displacements û, v̂ in h²/a; n̂ = N a²/D;
 * s0 = σ0 h a²/D; Q = q a⁴/(D h). Then ε̂_x = û_x + ½ŵ_x², ε̂_y = v̂_y + ½ŵ_y², γ̂ = û_y + v̂_x + ŵ_xŵ_y,
 * n̂_x = s0 + 12(ε̂_x + ν ε̂_y), n̂_y = s0 + 12(ε̂_y + ν ε̂_x), n̂_xy = 6(1−ν) γ̂ (since Ē h·h²/D = 12), and
 * <pre>
 *   ∇⁴ŵ − (n̂_x ŵ_xx + 2 n̂_xy ŵ_xy + n̂_y ŵ_yy) = Q
 *   ∂x n̂_x + ∂y n̂_xy = 0,   ∂x n̂_xy + ∂y n̂_y = 0   (written out in û, v̂, ŵ)
 * </pre>
 * on the quarter plate 0 ≤ x ≤ 1, 0 ≤ y ≤ b with symmetry on x = 0 and y = 0 (ŵ even, û odd in x,
 * v̂ odd in y) and clamped, in-plane immovable edges x = 1, y = b (ŵ = ŵ_n = û = v̂ = 0). The face
 * stress is σ = N/h ± 6M/h², in units of Ē h²/a²: σ̂ = n̂/12 ± m̂/2 with m̂ = −(ŵ_xx + νŵ_yy) etc.
 *
 * <p>Discretisation: a tensor grid, uniform in mapped coordinates ξ, η ∈ [0, 1] with
 * x = ξ + (β/π) sin(πξ) (and y = b times the same in η, its own β), which clusters nodes at the
 * clamped edges where the bending boundary layer of the membrane regime sits (spacing (1−β)/n there,
 * (1+β)/n at the centre) and is symmetric about the edges and the symmetry lines, so that mirrored
 * ghost nodes are mirror images in x and y too; second-order central
 * differences through the chain rule; the biharmonic as the Laplacian of the nodal Laplacian; the
 * clamped condition by mirrored ghost nodes. Newton's method with a Jacobian by forward
 * differences (coloured: unknowns five nodes apart share a residual evaluation) and a banded
 * LU solve, continuation in the load.
 */
final class QuarterPlateFvk {

    /** Clustering of the mapping along the short direction x (wall spacing (1−β)/nx, centre (1+β)/nx). */
    final double betaX;

    /** Largest accepted contraction of the Newton steps before the Jacobian is rebuilt. */
    private static final double CONTRACTION = 0.5;

    final int nx;
    final int ny;
    final double b;
    final double nu;
    final double s0;
    private final double dXi;
    private final double dEta;
    private final double betaY;
    private final double[] xp;
    private final double[] xpp;
    private final double[] yp;
    private final double[] ypp;
    private final int unknowns;
    private final int band;
    /** Current solution (ŵ, û, v̂ at nodes 0 ≤ i < nx, 0 ≤ j < ny, interleaved). */
    private double[] state;
    private double[] previous;
    /** Factored Jacobian (banded LU) and whether it belongs to a state of the present solve. */
    private double[] lu;
    private boolean fresh;
    /** Whether a solve may start from the factors of the previous one (rebuilt when Newton stalls). */
    boolean keepFactors;
    private boolean factored;
    private double previousQ = Double.NaN;
    private double stateQ = 0;
    /** Newton iterations used so far (for the cost statement of the tests). */
    int iterations;
    /** Jacobian factorisations so far. */
    int factorisations;

    // padded fields, index (i + 2) + (j + 2) * px
    private final int px;
    private final double[] wp;
    private final double[] up;
    private final double[] vp;
    private final double[] lap;

    /**
     * @param nx  intervals across the half short side
     * @param ny  intervals along the half long side
     * @param aspect L/w (so the half long side is b = aspect in units of a)
     * @param nu  Poisson's ratio
     * @param s0  pre-stress σ0 h a²/D (negative in compression)
     */
    QuarterPlateFvk(int nx, int ny, double aspect, double nu, double s0, double betaX) {
        this.betaX = betaX;
        this.nx = nx;
        this.ny = ny;
        this.b = aspect;
        this.nu = nu;
        this.s0 = s0;
        this.dXi = 1.0 / nx;
        this.dEta = 1.0 / ny;
        // the same wall spacing along y as along x: b (1 − βy)/ny = (1 − βx)/nx
        betaY = 1 - (1 - betaX) * ny / (nx * aspect);
        xp = new double[nx + 1];
        xpp = new double[nx + 1];
        yp = new double[ny + 1];
        ypp = new double[ny + 1];
        for (int i = 0; i <= nx; i++) {
            double t = Math.PI * i * dXi;
            xp[i] = 1 + betaX * Math.cos(t);
            xpp[i] = -betaX * Math.PI * Math.sin(t);
        }
        for (int j = 0; j <= ny; j++) {
            double t = Math.PI * j * dEta;
            yp[j] = aspect * (1 + betaY * Math.cos(t));
            ypp[j] = -aspect * betaY * Math.PI * Math.sin(t);
        }
        unknowns = 3 * nx * ny;
        band = 3 * (2 * nx + 2) + 2;
        state = new double[unknowns];
        px = nx + 5;
        int size = px * (ny + 5);
        wp = new double[size];
        up = new double[size];
        vp = new double[size];
        lap = new double[size];
    }

    /**
     * Intervals along the half long side for n across: n·L/w up to 1.5 n, and beyond L/w = 4 growing
     * with the length (0.375 n L/w) so that the waves of a long plate near buckling (wavelength about
     * 5 a) keep several nodes each.
     */
    static int intervalsAlong(int n, double aspect) {
        return (int) Math.round(n * (aspect <= 4 ? Math.min(1.5, aspect) : 0.375 * aspect));
    }

    /** x of node i (units of a). */
    double x(int i) {
        double xi = i * dXi;
        return xi + betaX / Math.PI * Math.sin(Math.PI * xi);
    }

    /** y of node j (units of a). */
    double y(int j) {
        double eta = j * dEta;
        return b * (eta + betaY / Math.PI * Math.sin(Math.PI * eta));
    }

    private int idx(int i, int j) {
        return 3 * (j * nx + i);
    }

    private int p(int i, int j) {
        return (i + 2) + (j + 2) * px;
    }

    /** Fills the padded fields from a state vector (mirrors and walls). */
    private void pad(double[] s) {
        for (int j = -2; j <= ny + 2; j++) {
            int jr = j < 0 ? -j : (j > ny ? 2 * ny - j : j);
            for (int i = -2; i <= nx + 2; i++) {
                int ir = i < 0 ? -i : (i > nx ? 2 * nx - i : i);
                double w = 0;
                if (ir < nx && jr < ny) {
                    w = s[idx(ir, jr)];
                }
                wp[p(i, j)] = w;
                // û odd in x, even in y; v̂ even in x, odd in y; zero on the walls (not used beyond them)
                double u = 0;
                double v = 0;
                if (i <= nx && j <= ny && ir < nx && jr < ny) {
                    u = s[idx(ir, jr) + 1] * (i < 0 ? -1 : 1);
                    v = s[idx(ir, jr) + 2] * (j < 0 ? -1 : 1);
                }
                up[p(i, j)] = u;
                vp[p(i, j)] = v;
            }
        }
        // the symmetry lines carry û = 0 (x = 0) and v̂ = 0 (y = 0)
        for (int j = -2; j <= ny + 2; j++) {
            up[p(0, j)] = 0;
        }
        for (int i = -2; i <= nx + 2; i++) {
            vp[p(i, 0)] = 0;
        }
        // nodal Laplacian of ŵ on 0..nx, 0..ny, mirrored to −1
        for (int j = 0; j <= ny; j++) {
            for (int i = 0; i <= nx; i++) {
                lap[p(i, j)] = dxx(wp, i, j) + dyy(wp, i, j);
            }
        }
        for (int j = 0; j <= ny; j++) {
            lap[p(-1, j)] = lap[p(1, j)];
        }
        for (int i = -1; i <= nx; i++) {
            lap[p(i, -1)] = lap[p(i, 1)];
        }
    }

    private double dx(double[] f, int i, int j) {
        return (f[p(i + 1, j)] - f[p(i - 1, j)]) / (2 * dXi) / xp[i];
    }

    private double dy(double[] f, int i, int j) {
        return (f[p(i, j + 1)] - f[p(i, j - 1)]) / (2 * dEta) / yp[j];
    }

    private double dxx(double[] f, int i, int j) {
        double f1 = (f[p(i + 1, j)] - f[p(i - 1, j)]) / (2 * dXi);
        double f2 = (f[p(i + 1, j)] - 2 * f[p(i, j)] + f[p(i - 1, j)]) / (dXi * dXi);
        return (f2 - xpp[i] / xp[i] * f1) / (xp[i] * xp[i]);
    }

    private double dyy(double[] f, int i, int j) {
        double f1 = (f[p(i, j + 1)] - f[p(i, j - 1)]) / (2 * dEta);
        double f2 = (f[p(i, j + 1)] - 2 * f[p(i, j)] + f[p(i, j - 1)]) / (dEta * dEta);
        return (f2 - ypp[j] / yp[j] * f1) / (yp[j] * yp[j]);
    }

    private double dxy(double[] f, int i, int j) {
        return (f[p(i + 1, j + 1)] - f[p(i + 1, j - 1)] - f[p(i - 1, j + 1)] + f[p(i - 1, j - 1)])
                / (4 * dXi * dEta * xp[i] * yp[j]);
    }

    /** Residuals at all unknowns for state s and load Q (in-plane rows negated: a nearly symmetric positive Jacobian). */
    private void residual(double[] s, double bigQ, double[] r) {
        pad(s);
        double g = 0.5 * (1 - nu);
        double h = 0.5 * (1 + nu);
        for (int j = 0; j < ny; j++) {
            for (int i = 0; i < nx; i++) {
                int k = idx(i, j);
                double wx = dx(wp, i, j);
                double wy = dy(wp, i, j);
                double wxx = dxx(wp, i, j);
                double wyy = dyy(wp, i, j);
                double wxy = dxy(wp, i, j);
                double ex = dx(up, i, j) + 0.5 * wx * wx;
                double ey = dy(vp, i, j) + 0.5 * wy * wy;
                double gam = dy(up, i, j) + dx(vp, i, j) + wx * wy;
                double nX = s0 + 12 * (ex + nu * ey);
                double nY = s0 + 12 * (ey + nu * ex);
                double nXY = 12 * g * gam;
                double bih = dxx(lap, i, j) + dyy(lap, i, j);
                r[k] = bih - (nX * wxx + 2 * nXY * wxy + nY * wyy) - bigQ;
                if (i == 0) {
                    r[k + 1] = s[k + 1];
                } else {
                    r[k + 1] = -(dxx(up, i, j) + g * dyy(up, i, j) + h * dxy(vp, i, j)
                            + wx * wxx + nu * wy * wxy + g * (wxy * wy + wx * wyy));
                }
                if (j == 0) {
                    r[k + 2] = s[k + 2];
                } else {
                    r[k + 2] = -(dyy(vp, i, j) + g * dxx(vp, i, j) + h * dxy(up, i, j)
                            + wy * wyy + nu * wx * wxy + g * (wxy * wx + wy * wxx));
                }
            }
        }
    }

    /** Solves at load Q by Newton's method from the current state (predicted along the load path). */
    void solve(double bigQ) {
        double[] guess = state.clone();
        if (!Double.isNaN(previousQ) && stateQ > 0 && previousQ > 0) {
            // secant predictor in ln Q
            double t = Math.log(bigQ / stateQ) / Math.log(stateQ / previousQ);
            for (int k = 0; k < unknowns; k++) {
                guess[k] += t * (state[k] - previous[k]);
            }
        } else if (stateQ > 0) {
            for (int k = 0; k < unknowns; k++) {
                guess[k] *= Math.cbrt(bigQ / stateQ);
            }
        }
        double[] s = guess;
        double[] r = new double[unknowns];
        double[] rp = new double[unknowns];
        if (lu == null) {
            lu = new double[unknowns * (2 * band + 1)];
        }
        boolean converged = false;
        fresh = keepFactors && factored;
        double lastStep = Double.POSITIVE_INFINITY;
        // Newton's method with the factored Jacobian kept while the steps shrink by at least a factor 2
        for (int it = 0; it < 200 && !converged; it++) {
            iterations++;
            residual(s, bigQ, r);
            if (!fresh) {
                jacobian(s, bigQ, r, rp, lu);
                factor(lu);
                factorisations++;
                fresh = true;
                factored = true;
            }
            double[] d = r.clone();
            solveFactored(lu, d);
            double wMax = 0;
            double uMax = 0;
            double dw = 0;
            double du = 0;
            for (int k = 0; k < unknowns; k += 3) {
                s[k] -= d[k];
                s[k + 1] -= d[k + 1];
                s[k + 2] -= d[k + 2];
                wMax = Math.max(wMax, Math.abs(s[k]));
                uMax = Math.max(uMax, Math.max(Math.abs(s[k + 1]), Math.abs(s[k + 2])));
                dw = Math.max(dw, Math.abs(d[k]));
                du = Math.max(du, Math.max(Math.abs(d[k + 1]), Math.abs(d[k + 2])));
            }
            if (!(wMax < 1e6)) {
                throw new IllegalStateException("Newton diverged at Q " + bigQ);
            }
            converged = dw <= 1e-9 * wMax && du <= 1e-9 * uMax + 1e-14;
            double step = dw / wMax + du / (uMax + 1e-300);
            if (step > CONTRACTION * lastStep || it % 40 == 39) {
                fresh = false;
            }
            lastStep = step;
        }
        if (!converged) {
            throw new IllegalStateException("Newton did not converge at Q " + bigQ + " s0 " + s0 + " aspect " + b);
        }
        previous = state;
        previousQ = stateQ;
        state = s;
        stateQ = bigQ;
    }

    /** Continuation from the present load to Q in steps of at most a factor {@code ratio}. */
    void solveTo(double bigQ, double ratio) {
        double q = stateQ;
        if (q <= 0) {
            q = Math.min(bigQ, 1.0);
            solve(q);
        }
        while (q < bigQ) {
            q = Math.min(bigQ, q * ratio);
            solve(q);
        }
    }

    private void jacobian(double[] s, double bigQ, double[] r, double[] rp, double[] lu) {
        java.util.Arrays.fill(lu, 0);
        int width = 2 * band + 1;
        double[] scale = new double[3];
        for (int k = 0; k < unknowns; k += 3) {
            for (int f = 0; f < 3; f++) {
                scale[f] = Math.max(scale[f], Math.abs(s[k + f]));
            }
        }
        double[] sp = s.clone();
        for (int f = 0; f < 3; f++) {
            double step = 1e-7 * (1 + scale[f]);
            for (int ci = 0; ci < 5; ci++) {
                for (int cj = 0; cj < 5; cj++) {
                    for (int j = cj; j < ny; j += 5) {
                        for (int i = ci; i < nx; i += 5) {
                            sp[idx(i, j) + f] += step;
                        }
                    }
                    residual(sp, bigQ, rp);
                    for (int j = cj; j < ny; j += 5) {
                        for (int i = ci; i < nx; i += 5) {
                            int col = idx(i, j) + f;
                            sp[col] = s[col];
                            for (int j2 = Math.max(0, j - 2); j2 <= Math.min(ny - 1, j + 2); j2++) {
                                for (int i2 = Math.max(0, i - 2); i2 <= Math.min(nx - 1, i + 2); i2++) {
                                    int row0 = idx(i2, j2);
                                    for (int f2 = 0; f2 < 3; f2++) {
                                        int row = row0 + f2;
                                        double v = (rp[row] - r[row]) / step;
                                        if (v != 0) {
                                            lu[row * width + (col - row + band)] = v;
                                        }
                                    }
                                }
                            }
                        }
                    }
                }
            }
        }
    }

    /** Banded LU without pivoting, in place (the Jacobian is close to symmetric positive definite). */
    private void factor(double[] a) {
        int n = unknowns;
        int width = 2 * band + 1;
        for (int k = 0; k < n; k++) {
            double piv = a[k * width + band];
            if (!(Math.abs(piv) > 0)) {
                throw new IllegalStateException("zero pivot at " + k);
            }
            int last = Math.min(n - 1, k + band);
            for (int i = k + 1; i <= last; i++) {
                int ik = i * width + (k - i + band);
                double l = a[ik];
                if (l == 0) {
                    continue;
                }
                l /= piv;
                a[ik] = l;
                int rowI = i * width - i + band;
                int rowK = k * width - k + band;
                for (int j = k + 1; j <= last; j++) {
                    a[rowI + j] -= l * a[rowK + j];
                }
            }
        }
    }

    /** Forward and back substitution with the factors of {@link #factor}. */
    private void solveFactored(double[] a, double[] rhs) {
        int n = unknowns;
        int width = 2 * band + 1;
        for (int k = 0; k < n; k++) {
            int last = Math.min(n - 1, k + band);
            double v = rhs[k];
            if (v != 0) {
                for (int i = k + 1; i <= last; i++) {
                    rhs[i] -= a[i * width + (k - i + band)] * v;
                }
            }
        }
        for (int k = n - 1; k >= 0; k--) {
            double v = rhs[k];
            int last = Math.min(n - 1, k + band);
            int rowK = k * width - k + band;
            for (int j = k + 1; j <= last; j++) {
                v -= a[rowK + j] * rhs[j];
            }
            rhs[k] = v / a[rowK + k];
        }
    }

    // ---- results ------------------------------------------------------------------------------

    /** ŵ at the centre. */
    double centreDeflection() {
        return state[0];
    }

    /** The largest deflection magnitude anywhere (in h), with the sign of the pressure (positive). */
    double largestDeflection() {
        double m = 0;
        for (int k = 0; k < unknowns; k += 3) {
            m = Math.max(m, Math.abs(state[k]));
        }
        return m;
    }

    /**
     * Mean deflection over the plate (in h): the work of the uniform pressure per unit load; near a
     * buckling load it is dominated by that mode for any shape of the mode, since every mode enters
     * with the square of its projection on the load.
     */
    double meanDeflection() {
        double sum = 0;
        for (int j = 0; j < ny; j++) {
            double wy = (j == 0 ? 0.5 : 1) * dEta * yp[j];
            for (int i = 0; i < nx; i++) {
                double wx = (i == 0 ? 0.5 : 1) * dXi * xp[i];
                sum += state[idx(i, j)] * wx * wy;
            }
        }
        return sum / b;
    }

    /** The face-stress field of the present state (units of Ē h²/a²). */
    Stresses stresses() {
        pad(state);
        Stresses out = new Stresses(nx, ny);
        out.edge = Double.NEGATIVE_INFINITY;
        double g = 0.5 * (1 - nu);
        for (int j = 0; j <= ny; j++) {
            for (int i = 0; i <= nx; i++) {
                double wx = dx(wp, i, j);
                double wy = dy(wp, i, j);
                double wxx = dxx(wp, i, j);
                double wyy = dyy(wp, i, j);
                double wxy = dxy(wp, i, j);
                double ux = i == nx ? oneSidedX(up, j) : dx(up, i, j);
                double vx = i == nx ? oneSidedX(vp, j) : dx(vp, i, j);
                double uy = j == ny ? oneSidedY(up, i) : dy(up, i, j);
                double vy = j == ny ? oneSidedY(vp, i) : dy(vp, i, j);
                double ex = ux + 0.5 * wx * wx;
                double ey = vy + 0.5 * wy * wy;
                double gam = uy + vx + wx * wy;
                out.stretchX[i][j] = 12 * (ex + nu * ey);
                out.stretchY[i][j] = 12 * (ey + nu * ex);
                double sx = (s0 + 12 * (ex + nu * ey)) / 12;
                double sy = (s0 + 12 * (ey + nu * ex)) / 12;
                double sxy = g * gam;
                double mx = -(wxx + nu * wyy) / 2;
                double my = -(wyy + nu * wxx) / 2;
                double mxy = -(1 - nu) * wxy / 2;
                for (int face = -1; face <= 1; face += 2) {
                    double ax = sx + face * mx;
                    double ay = sy + face * my;
                    double axy = sxy + face * mxy;
                    double mean = 0.5 * (ax + ay);
                    double rad = Math.hypot(0.5 * (ax - ay), axy);
                    double principal = mean + rad;
                    out.min = Math.min(out.min, mean - rad);
                    if (principal > out.max) {
                        out.max = principal;
                        out.maxI = i;
                        out.maxJ = j;
                    }
                    if (i == nx && j == 0) {
                        out.edge = Math.max(out.edge, ax);
                    }
                    if (i == nx && ax > out.longEdge[j]) {
                        out.longEdge[j] = ax;
                        out.longEdgeStretch[j] = 12 * (ex + nu * ey);
                        out.longEdgeM[j] = 2 * face * mx;
                    }
                    if (j == ny && ay > out.shortEdgeAt[i]) {
                        out.shortEdgeAt[i] = ay;
                        out.shortEdgeStretch[i] = 12 * (ey + nu * ex);
                        out.shortEdgeM[i] = 2 * face * my;
                    }
                    if (i == 0 && j == 0) {
                        out.centreX = Math.max(out.centreX, ax);
                        out.centreY = Math.max(out.centreY, ay);
                        out.centreStretchX = 12 * (ex + nu * ey);
                        out.centreStretchY = 12 * (ey + nu * ex);
                        out.centreMX = Math.abs(2 * mx);
                        out.centreMY = Math.abs(2 * my);
                    }
                    if (i == 0 && j == ny) {
                        out.shortEdge = Math.max(out.shortEdge, ay);
                    }
                }
            }
        }
        return out;
    }

    private double oneSidedX(double[] f, int j) {
        return (3 * f[p(nx, j)] - 4 * f[p(nx - 1, j)] + f[p(nx - 2, j)]) / (2 * dXi) / xp[nx];
    }

    private double oneSidedY(double[] f, int i) {
        return (3 * f[p(i, ny)] - 4 * f[p(i, ny - 1)] + f[p(i, ny - 2)]) / (2 * dEta) / yp[ny];
    }

    /** Face stresses in units of Ē h²/a² (σ̂ = n̂/12 ± m̂/2). */
    static final class Stresses {
        /** Largest principal face stress anywhere, and its node. */
        double max = Double.NEGATIVE_INFINITY;
        /** Smallest (most compressive) principal face stress anywhere. */
        double min = Double.POSITIVE_INFINITY;
        int maxI;
        int maxJ;
        /** σ_x on the face in tension at the middle of the long edge. */
        double edge;
        /** Face stresses at the centre across (x) and along (y) the span. */
        double centreX = Double.NEGATIVE_INFINITY;
        double centreY = Double.NEGATIVE_INFINITY;
        /** σ_y at the middle of the short edge. */
        double shortEdge = Double.NEGATIVE_INFINITY;
        /** σ_x on the face in tension along the long edge, node j = 0..ny. */
        final double[] longEdge;

        /**
         * The stretching part n̂_x − s0 of the membrane force (from the strains, without the pre-stress,
         * so free of cancellation) and the bending moment m̂_x with the sign of the face in tension, at
         * those nodes: σ̂ = (s0 + stretch)/12 + m̂/2.
         */
        final double[] longEdgeStretch;
        final double[] longEdgeM;
        /** σ_y on the face in tension along the short edge, node i = 0..nx, with n̂_y − s0 and m̂_y. */
        final double[] shortEdgeAt;
        final double[] shortEdgeStretch;
        final double[] shortEdgeM;
        /** Stretching parts n̂ − s0 and moment magnitudes |m̂| at the centre, across (x) and along (y). */
        double centreStretchX;
        double centreStretchY;
        double centreMX;
        double centreMY;

        /** Stretching parts n̂_x − s0 and n̂_y − s0 at every node [i][j]. */
        final double[][] stretchX;
        final double[][] stretchY;

        Stresses(int nx, int ny) {
            stretchX = new double[nx + 1][ny + 1];
            stretchY = new double[nx + 1][ny + 1];
            longEdge = new double[ny + 1];
            java.util.Arrays.fill(longEdge, Double.NEGATIVE_INFINITY);
            longEdgeStretch = new double[ny + 1];
            longEdgeM = new double[ny + 1];
            shortEdgeAt = new double[nx + 1];
            java.util.Arrays.fill(shortEdgeAt, Double.NEGATIVE_INFINITY);
            shortEdgeStretch = new double[nx + 1];
            shortEdgeM = new double[nx + 1];
        }
    }
}
