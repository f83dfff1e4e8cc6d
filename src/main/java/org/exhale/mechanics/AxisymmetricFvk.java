package org.exhale.mechanics;

/**
 * Numerical solution of the axisymmetric Föppl–von Kármán equations of a clamped circular plate
 * under a uniform pressure and a uniform in-plane pre-force, by finite differences and Newton's
 * method. It is the source of the disc response table ({@link DiscFvkTable}); it is too slow to
 * call at every step of a bake, and the tests check it against an independent shooting solution.
 *
 * <p>Dimensionless variables: ρ = r/a, Φ = φ a/h (φ the slope), χ = ρ (n_r − n0) with n = N a²/D the
 * radial membrane force, n0 the pre-force, Q = q a⁴/(D h):
 * <pre>
 *   Φ'' + Φ'/ρ − Φ/ρ² − (n0 + χ/ρ) Φ = Q ρ/2          (bending, radial equilibrium of moments)
 *   χ'' + χ'/ρ − χ/ρ² = −6 (1 − ν²) Φ²/ρ                (compatibility of the mid-plane strains)
 *   Φ(0) = χ(0) = 0,  Φ(1) = 0,  χ'(1) = ν χ(1)            (clamped, radially immovable edge)
 * </pre>
 * The grid is uniform in ξ with ρ = (1 − λ) ξ + λ sin(πξ/2), λ = 0.9, which is ten times finer at
 * the clamped edge (where the bending boundary layer of width 1/√n sits) than a uniform grid. Central
 * differences in ξ (second order), the Robin condition through a ghost node, and Richardson
 * extrapolation between n and 2n intervals (fourth order in the smooth regime). Each Newton step
 * solves a block-tridiagonal system with 2×2 blocks.
 */
final class AxisymmetricFvk {
    private static final double LAMBDA = 0.9;

    /**
     * Solution in units of D/(a² h) (face stresses, membrane stresses n) and h (deflection). The
     * stretches are the membrane forces less the pre-force, n − n0, taken from χ directly (so they
     * keep their digits where they are small beside n0).
     */
    record Solution(double edgeMembrane, double centreMembrane, double edgeSlopeDerivative,
                    double centreSlopeDerivative, double deflection, double edgeFaceStress,
                    double centreFaceStress, double largestHoopMembrane, double edgeStretch,
                    double centreStretch) {
    }

    private final int n;
    private final double d;
    private final double[] rho;
    private final double[] g1;
    private final double[] g2;
    private final double nu;
    private final double c;
    /** Current iterate: Φ_i, χ_i at i = 0..n (Φ_0 = χ_0 = Φ_n = 0). */
    private final double[] phi;
    private final double[] chi;

    AxisymmetricFvk(int intervals, double poisson) {
        if (intervals < 8) {
            throw new IllegalArgumentException("need at least 8 intervals, got " + intervals);
        }
        n = intervals;
        d = 1.0 / n;
        nu = poisson;
        c = 6 * (1 - poisson * poisson);
        rho = new double[n + 1];
        g1 = new double[n + 1];
        g2 = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            double xi = i * d;
            rho[i] = (1 - LAMBDA) * xi + LAMBDA * Math.sin(Math.PI * xi / 2);
            g1[i] = (1 - LAMBDA) + LAMBDA * Math.PI / 2 * Math.cos(Math.PI * xi / 2);
            g2[i] = -LAMBDA * Math.PI * Math.PI / 4 * Math.sin(Math.PI * xi / 2);
        }
        rho[n] = 1;
        phi = new double[n + 1];
        chi = new double[n + 1];
    }

    /** Forgets the last solution (the next solve starts from the plate's linear response). */
    void reset() {
        java.util.Arrays.fill(phi, 0);
        java.util.Arrays.fill(chi, 0);
    }

    /**
     * Solves at pre-force n0 and load Q, starting from the last solution (continuation). Returns
     * null if Newton's method does not converge.
     */
    Solution solve(double n0, double bigQ) {
        double[][] b = new double[n + 1][4];
        double[][] lo = new double[n + 1][2];
        double[][] up = new double[n + 1][2];
        double[] r1 = new double[n + 1];
        double[] r2 = new double[n + 1];
        double previous = Double.POSITIVE_INFINITY;
        for (int it = 0; it < 80; it++) {
            double norm = assemble(n0, bigQ, b, lo, up, r1, r2);
            if (!Double.isFinite(norm)) {
                return null;
            }
            double[][] step = solveBlocks(b, lo, up, r1, r2);
            if (step == null) {
                return null;
            }
            // damped Newton: halve the step while the residual grows
            double lambda = 1;
            double[] phi0 = phi.clone();
            double[] chi0 = chi.clone();
            while (true) {
                for (int i = 1; i <= n; i++) {
                    phi[i] = phi0[i] - lambda * step[0][i];
                    chi[i] = chi0[i] - lambda * step[1][i];
                }
                phi[n] = 0;
                double trial = residualNorm(n0, bigQ);
                if (trial <= norm * (1 - 1e-4 * lambda) || lambda < 1e-3 || norm < 1e-12) {
                    break;
                }
                lambda /= 2;
            }
            double size = 0;
            double scale = 1e-300;
            for (int i = 1; i <= n; i++) {
                size = Math.max(size, Math.abs(lambda * step[0][i]) + Math.abs(lambda * step[1][i]));
                scale = Math.max(scale, Math.abs(phi[i]) + Math.abs(chi[i]));
            }
            if (size <= 1e-12 * scale) {
                return solution(n0);
            }
            previous = norm;
        }
        return previous < 1e-9 ? solution(n0) : null;
    }

    private Solution solution(double n0) {
        double gE = g1[n] * 2 * d;
        double dPhiEdge = (3 * phi[n] - 4 * phi[n - 1] + phi[n - 2]) / gE;
        double gC = g1[0] * 2 * d;
        double dPhiCentre = (-3 * phi[0] + 4 * phi[1] - phi[2]) / gC;
        double dChiCentre = (-3 * chi[0] + 4 * chi[1] - chi[2]) / gC;
        // deflection −∫Φ dρ = −∫Φ g' dξ by Simpson's rule (n even)
        double sum = 0;
        for (int i = 0; i <= n; i++) {
            double w = i == 0 || i == n ? 1 : (i % 2 == 1 ? 4 : 2);
            sum += w * phi[i] * g1[i];
        }
        double delta = -sum * d / 3;
        double nEdge = n0 + chi[n];
        double nCentre = n0 + dChiCentre;
        // hoop force n_θ = d(ρ n_r)/dρ = n0 + χ'
        double hoop = Math.max(nCentre, n0 + nu * chi[n]);
        for (int i = 1; i < n; i++) {
            hoop = Math.max(hoop, n0 + (chi[i + 1] - chi[i - 1]) / (2 * d * g1[i]));
        }
        return new Solution(nEdge, nCentre, dPhiEdge, dPhiCentre, delta,
                nEdge + 6 * Math.abs(dPhiEdge), nCentre + 6 * (1 + nu) * Math.abs(dPhiCentre), hoop, chi[n], dChiCentre);
    }

    /** Residuals and the block-tridiagonal Jacobian; returns the largest residual. */
    private double assemble(double n0, double bigQ, double[][] b, double[][] lo, double[][] up,
                            double[] r1, double[] r2) {
        double norm = 0;
        for (int i = 1; i <= n; i++) {
            double r = rho[i];
            double a = 1 / (g1[i] * g1[i]);
            double cm = a * (1 / (d * d) + g2[i] / g1[i] / (2 * d)) - 1 / (2 * d * g1[i] * r);
            double cp = a * (1 / (d * d) - g2[i] / g1[i] / (2 * d)) + 1 / (2 * d * g1[i] * r);
            double c0 = -2 * a / (d * d) - 1 / (r * r);
            if (i == n) {
                // Φ_n = 0; χ with the ghost node χ_{n+1} = χ_{n−1} + 2 d g' ν χ_n
                r1[i] = phi[i];
                b[i][0] = 1;
                b[i][1] = 0;
                b[i][2] = 0;
                double diag = c0 + cp * 2 * d * g1[i] * nu;
                r2[i] = (cm + cp) * chi[i - 1] + diag * chi[i] + c * phi[i] * phi[i] / r;
                b[i][3] = diag;
                lo[i][0] = 0;
                lo[i][1] = cm + cp;
                up[i][0] = 0;
                up[i][1] = 0;
            } else {
                double nr = n0 + chi[i] / r;
                r1[i] = cm * phi[i - 1] + c0 * phi[i] + cp * phi[i + 1] - nr * phi[i] - bigQ * r / 2;
                r2[i] = cm * chi[i - 1] + c0 * chi[i] + cp * chi[i + 1] + c * phi[i] * phi[i] / r;
                b[i][0] = c0 - nr;                 // ∂r1/∂Φ_i
                b[i][1] = -phi[i] / r;             // ∂r1/∂χ_i
                b[i][2] = 2 * c * phi[i] / r;      // ∂r2/∂Φ_i
                b[i][3] = c0;                      // ∂r2/∂χ_i
                lo[i][0] = i > 1 ? cm : 0;
                lo[i][1] = i > 1 ? cm : 0;
                up[i][0] = i < n - 1 ? cp : 0;     // Φ_n is fixed at zero
                up[i][1] = cp;
            }
            norm = Math.max(norm, Math.max(Math.abs(r1[i]), Math.abs(r2[i])));
        }
        return norm;
    }

    private double residualNorm(double n0, double bigQ) {
        double[][] b = new double[n + 1][4];
        double[][] lo = new double[n + 1][2];
        double[][] up = new double[n + 1][2];
        double[] r1 = new double[n + 1];
        double[] r2 = new double[n + 1];
        return assemble(n0, bigQ, b, lo, up, r1, r2);
    }

    /** Block Thomas algorithm: J step = r, with diagonal sub- and super-blocks. */
    private double[][] solveBlocks(double[][] b, double[][] lo, double[][] up, double[] r1, double[] r2) {
        double[][] m = new double[n + 1][4];   // modified diagonal blocks' inverses times super-blocks
        double[] y1 = new double[n + 1];
        double[] y2 = new double[n + 1];
        // forward: B'_i = B_i − L_i M_{i−1}, y_i = r_i − L_i y'_{i−1}; M_i = B'_i^{-1} U_i, y'_i = B'_i^{-1} y_i
        double[] pm = {0, 0, 0, 0};
        double py1 = 0;
        double py2 = 0;
        for (int i = 1; i <= n; i++) {
            double l0 = lo[i][0];
            double l1 = lo[i][1];
            double b00 = b[i][0] - l0 * pm[0];
            double b01 = b[i][1] - l0 * pm[1];
            double b10 = b[i][2] - l1 * pm[2];
            double b11 = b[i][3] - l1 * pm[3];
            double v1 = r1[i] - l0 * py1;
            double v2 = r2[i] - l1 * py2;
            double det = b00 * b11 - b01 * b10;
            if (!(Math.abs(det) > 0) || !Double.isFinite(det)) {
                return null;
            }
            double i00 = b11 / det;
            double i01 = -b01 / det;
            double i10 = -b10 / det;
            double i11 = b00 / det;
            // M = B'^{-1} diag(u0, u1)
            m[i][0] = i00 * up[i][0];
            m[i][1] = i01 * up[i][1];
            m[i][2] = i10 * up[i][0];
            m[i][3] = i11 * up[i][1];
            y1[i] = i00 * v1 + i01 * v2;
            y2[i] = i10 * v1 + i11 * v2;
            pm = m[i];
            py1 = y1[i];
            py2 = y2[i];
        }
        double[][] x = new double[2][n + 1];
        x[0][n] = y1[n];
        x[1][n] = y2[n];
        for (int i = n - 1; i >= 1; i--) {
            x[0][i] = y1[i] - m[i][0] * x[0][i + 1] - m[i][1] * x[1][i + 1];
            x[1][i] = y2[i] - m[i][2] * x[0][i + 1] - m[i][3] * x[1][i + 1];
        }
        return x;
    }

    /**
     * Richardson-extrapolated solution from grids of n and 2n intervals, each continued in load from
     * the plate's linear response; null if either does not converge. {@code errorOut[0]} receives the
     * largest relative change of the face stresses and deflection between the two grids.
     */
    static Solution extrapolated(double n0, double bigQ, double poisson, int intervals, int loadSteps, double[] errorOut) {
        Solution coarse = continued(new AxisymmetricFvk(intervals, poisson), n0, bigQ, loadSteps);
        Solution fine = continued(new AxisymmetricFvk(2 * intervals, poisson), n0, bigQ, loadSteps);
        if (coarse == null || fine == null) {
            return null;
        }
        if (errorOut != null) {
            errorOut[0] = Math.max(rel(fine.edgeFaceStress(), coarse.edgeFaceStress()),
                    Math.max(rel(fine.centreFaceStress(), coarse.centreFaceStress()), rel(fine.deflection(), coarse.deflection())));
        }
        return new Solution(rich(fine.edgeMembrane(), coarse.edgeMembrane()),
                rich(fine.centreMembrane(), coarse.centreMembrane()),
                rich(fine.edgeSlopeDerivative(), coarse.edgeSlopeDerivative()),
                rich(fine.centreSlopeDerivative(), coarse.centreSlopeDerivative()),
                rich(fine.deflection(), coarse.deflection()),
                rich(fine.edgeFaceStress(), coarse.edgeFaceStress()),
                rich(fine.centreFaceStress(), coarse.centreFaceStress()),
                rich(fine.largestHoopMembrane(), coarse.largestHoopMembrane()),
                rich(fine.edgeStretch(), coarse.edgeStretch()),
                rich(fine.centreStretch(), coarse.centreStretch()));
    }

    /** Continuation in the load Q_k = Q (k/steps)³ from zero. */
    static Solution continued(AxisymmetricFvk solver, double n0, double bigQ, int steps) {
        solver.reset();
        Solution s = null;
        for (int k = 1; k <= steps; k++) {
            s = solver.solve(n0, bigQ * Math.pow(k / (double) steps, 3));
            if (s == null) {
                return null;
            }
        }
        return s;
    }

    private static double rich(double fine, double coarse) {
        return fine + (fine - coarse) / 3;
    }

    private static double rel(double a, double b) {
        return Math.abs(a - b) / Math.max(Math.abs(a), 1e-300);
    }
}
