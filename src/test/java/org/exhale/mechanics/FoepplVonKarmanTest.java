package org.exhale.mechanics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;

import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;

/**
 * The cap against independent Föppl–von Kármán solutions written here: the strip (plane strain) by
 * finite differences of D w'''' − N w'' = q with N = σ_th h + Ē h/(2a)∫½w'² dx, iterated on N; the
 * disc by shooting on the axisymmetric equations (radial force and slope, Hipparchus
 * Dormand–Prince 8(5,3)), Newton on the two edge conditions. Both are numerical solutions of the
 * field equations, not of the code's closed forms.
 */
class FoepplVonKarmanTest {

    private static final double E = 100e9;
    private static final double NU = 0.25;
    private static final double EBAR = E / (1 - NU * NU);
    private static final double T0 = 600;

    private static CapStructure cap(SpanGeometry span, double h, double prestressPa) {
        return new CapStructure(FilmProperties.elastic(E, NU, CapStructure.SILICON_CTE_PER_K, T0, prestressPa), h,
                span, CapStructure.SILICON_CTE_PER_K, MechanicalLimits.withSafetyFactor(1));
    }

    // ---- strip: finite differences ----------------------------------------------------------

    /** {edge face stress, centre face stress, centre deflection} of the clamped strip. */
    static double[] stripFd(double a, double h, double e, double nu, double sigma0, double q, int n) {
        double ebar = e / (1 - nu * nu);
        double d = ebar * h * h * h / 12;
        double n0 = sigma0 * h;
        double ncr = Math.PI * Math.PI * d / (a * a);
        // bracket the force: N − N0 − stretch(N) is increasing in N
        double nForce = membraneForce(Math.max(n0, -ncr * (1 - 1e-9)), a, h, ebar, d, n0, q, n);
        double[] w = beamColumn(a, d, nForce, q, n);
        double dx = 2 * a / n;
        double edgeM = d * 2 * w[1] / (dx * dx);                     // ghost node w[-1] = w[1], w[0] = 0
        int c = n / 2;
        double centreM = d * (w[c + 1] - 2 * w[c] + w[c - 1]) / (dx * dx);
        return new double[] {nForce / h + 6 * Math.abs(edgeM) / (h * h), nForce / h + 6 * Math.abs(centreM) / (h * h),
                w[c]};
    }

    /** The membrane force that matches the stretching of its own FD deflection, by bisection from lo. */
    private static double membraneForce(double lo, double a, double h, double ebar, double d, double n0, double q, int n) {
        double hi = Math.max(n0, 0) + 1;
        while (residual(hi, a, h, ebar, d, n0, q, n) < 0) {
            hi = 2 * hi + Math.abs(n0);
        }
        for (int it = 0; it < 200 && hi - lo > 1e-12 * Math.abs(hi); it++) {
            double mid = 0.5 * (lo + hi);
            if (residual(mid, a, h, ebar, d, n0, q, n) < 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    /** The FD deflection at nodes 0..n and, at index n + 1, the membrane force N [N/m]. */
    static double[] stripField(double a, double h, double e, double nu, double sigma0, double q, int n) {
        double ebar = e / (1 - nu * nu);
        double d = ebar * h * h * h / 12;
        double n0 = sigma0 * h;
        double nForce = membraneForce(n0, a, h, ebar, d, n0, q, n);
        double[] w = beamColumn(a, d, nForce, q, n);
        double[] out = java.util.Arrays.copyOf(w, n + 2);
        out[n + 1] = nForce;
        return out;
    }

    private static double residual(double nForce, double a, double h, double ebar, double d, double n0, double q, int n) {
        double[] w = beamColumn(a, d, nForce, q, n);
        double dx = 2 * a / n;
        double integral = 0;
        for (int i = 0; i < n; i++) {
            double slope = (w[i + 1] - w[i]) / dx;
            integral += slope * slope * dx;
        }
        return nForce - n0 - ebar * h / (2 * a) * 0.5 * integral;
    }

    /** Pentadiagonal finite differences, nodes 0..n, w = w' = 0 at both ends (ghost nodes mirrored). */
    private static double[] beamColumn(double a, double d, double nForce, double q, int n) {
        double dx = 2 * a / n;
        int m = n - 1;                                   // unknowns w[1..n-1]
        double[][] band = new double[m][5];
        double[] rhs = new double[m];
        double c4 = d / Math.pow(dx, 4);
        double c2 = nForce / (dx * dx);
        for (int k = 0; k < m; k++) {
            band[k][0] = c4;
            band[k][1] = -4 * c4 - c2;
            band[k][2] = 6 * c4 + 2 * c2;
            band[k][3] = -4 * c4 - c2;
            band[k][4] = c4;
            rhs[k] = q;
        }
        band[0][2] += c4;                                // ghost w[-1] = w[1]
        band[m - 1][2] += c4;
        double[] sol = solveBand(band, rhs);
        double[] w = new double[n + 1];
        System.arraycopy(sol, 0, w, 1, m);
        return w;
    }

    /** Gaussian elimination without pivoting on a symmetric pentadiagonal matrix (diagonally dominant enough here). */
    private static double[] solveBand(double[][] b, double[] r) {
        int m = r.length;
        double[][] a = new double[m][];
        for (int i = 0; i < m; i++) {
            a[i] = b[i].clone();
        }
        double[] y = r.clone();
        for (int i = 0; i < m; i++) {
            double piv = a[i][2];
            for (int k = 1; k <= 2 && i + k < m; k++) {
                double f = a[i + k][2 - k] / piv;
                for (int j = 0; j <= 2; j++) {
                    int col = 2 + j - k;                      // row i+k, column i+j
                    if (col >= 0 && col < 5) {
                        a[i + k][col] -= f * a[i][2 + j];
                    }
                }
                y[i + k] -= f * y[i];
            }
        }
        double[] x = new double[m];
        for (int i = m - 1; i >= 0; i--) {
            double v = y[i];
            for (int j = 1; j <= 2 && i + j < m; j++) {
                v -= a[i][2 + j] * x[i + j];
            }
            x[i] = v / a[i][2];
        }
        return x;
    }

    /** Richardson-extrapolated finite differences (second-order scheme, n and 2n). */
    static double[] stripReference(double a, double h, double sigma0, double q) {
        double[] c = stripFd(a, h, E, NU, sigma0, q, 1000);
        double[] f = stripFd(a, h, E, NU, sigma0, q, 2000);
        double[] r = new double[3];
        for (int i = 0; i < 3; i++) {
            r[i] = (4 * f[i] - c[i]) / 3;
        }
        return r;
    }

    // ---- disc: shooting ---------------------------------------------------------------------

    /**
     * Axisymmetric FvK in ρ = r/a, Φ = φ a/h, χ = ρ (n_r − n0), n = N a²/D, Q = q a⁴/(D h):
     * (ρΦ')' /ρ... written as Φ'' = −Φ'/ρ + Φ/ρ² + n_r Φ + Qρ/2, ρ²χ'' + ρχ' − χ = −6(1−ν²) ρ Φ².
     * Unknown centre values Φ'(0) and χ'(0); edge conditions Φ(1) = 0, χ'(1) − ν χ(1) = 0.
     * Returns {edge face stress, centre face stress, deflection} in units of D/(a² h) (stresses) and h.
     */
    static double[] discShooting(double n0, double bigQ, double nu, double guessSlope, double guessN) {
        // continuation in the load from the nearly linear problem (the guess arguments are not used; where the
        // continuation fails, Newton starts from the finite-difference solution, see below)
        double[] x = {0, 0};
        double[] end = null;
        int steps = 4;
        for (int k = 1; k <= steps; k++) {
            double qk = bigQ * Math.pow(k / (double) steps, 3);
            if (k > 1) {
                double ratio = qk / (bigQ * Math.pow((k - 1) / (double) steps, 3));
                x[0] *= ratio > 1 ? Math.pow(ratio, 0.5) : 1;
            }
            x = newton(n0, qk, nu, x);
        }
        end = shoot(n0, bigQ, nu, x);
        if (!converged(end, x)) {
            // strong tension or large loads: the continuation from zero loses its way; start Newton from the
            // centre values of the finite-difference solution instead (a starting point only: the root is
            // the shooting solution's own and is checked below)
            AxisymmetricFvk.Solution fd = AxisymmetricFvk.continued(new AxisymmetricFvk(400, nu), n0, bigQ, 6);
            x = newton(n0, bigQ, nu, new double[] {fd.centreSlopeDerivative(), fd.centreMembrane() - n0});
            end = shoot(n0, bigQ, nu, x);
        }
        assertTrue(converged(end, x),
                "shooting did not converge at n0 " + n0 + ", Q " + bigQ + ": " + end[0] + ", " + end[1] + " from " + x[0] + ", " + x[1]);
        double nEdge = n0 + end[3];
        double mEdge = end[2];
        double nCentre = n0 + x[1];
        double mCentre = (1 + nu) * x[0];
        return new double[] {nEdge + 6 * Math.abs(mEdge), nCentre + 6 * Math.abs(mCentre), -end[4]};
    }

    /** Edge conditions met: Φ(1) within 1e-6 of the centre slope, the force condition within 1e-4. */
    private static boolean converged(double[] end, double[] x) {
        return Math.abs(end[0]) < 1e-6 * Math.abs(x[0]) && Math.abs(end[1]) < 1e-4 * (1 + Math.abs(x[1]));
    }

    private static double[] newton(double n0, double bigQ, double nu, double[] start) {
        double[] x = start.clone();
        double[] end = shoot(n0, bigQ, nu, x);
        for (int it = 0; it < 60; it++) {
            double[][] jac = new double[2][2];
            for (int j = 0; j < 2; j++) {
                double[] xp = x.clone();
                double step = 1e-7 * Math.max(1, Math.abs(x[j]));
                xp[j] += step;
                double[] ep = shoot(n0, bigQ, nu, xp);
                jac[0][j] = (ep[0] - end[0]) / step;
                jac[1][j] = (ep[1] - end[1]) / step;
            }
            double det = jac[0][0] * jac[1][1] - jac[0][1] * jac[1][0];
            double d0 = (end[0] * jac[1][1] - end[1] * jac[0][1]) / det;
            double d1 = (jac[0][0] * end[1] - jac[1][0] * end[0]) / det;
            double norm = Math.hypot(end[0], end[1]);
            double lambda = 1;
            double[] trial;
            double[] te;
            do {
                trial = new double[] {x[0] - lambda * d0, x[1] - lambda * d1};
                te = shoot(n0, bigQ, nu, trial);
                lambda /= 2;
            } while (Math.hypot(te[0], te[1]) > norm && lambda > 1e-4);
            x = trial;
            end = te;
            if (Math.abs(d0) + Math.abs(d1) < 1e-11 * (1 + Math.abs(x[0]) + Math.abs(x[1]))) {
                break;
            }
        }
        return x;
    }

    /** Integrates from the centre; returns {Φ(1), χ'(1) − νχ(1), Φ'(1), χ(1), ∫Φ dρ}. */
    private static double[] shoot(double n0, double bigQ, double nu, double[] x) {
        double c = 6 * (1 - nu * nu);
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 5;
            }

            @Override
            public double[] computeDerivatives(double r, double[] y) {
                double phi = y[0];
                double dphi = y[1];
                double chi = y[2];
                double dchi = y[3];
                double nr = n0 + chi / r;
                return new double[] {dphi, -dphi / r + phi / (r * r) + nr * phi + bigQ * r / 2, dchi,
                        (-r * dchi + chi - c * r * phi * phi) / (r * r), phi};
            }
        };
        double r0 = 1e-4;
        // series start: Φ = Aρ + A3 ρ³, χ = Bρ (the ρ³ terms are below 1e-8 of the leading ones here)
        double a1 = x[0];
        double a3 = ((n0 + x[1]) * a1 + bigQ / 2) / 8;
        double b1 = x[1];
        double b3 = -c * a1 * a1 / 8;
        double[] y0 = {a1 * r0 + a3 * r0 * r0 * r0, a1 + 3 * a3 * r0 * r0, b1 * r0 + b3 * r0 * r0 * r0,
                b1 + 3 * b3 * r0 * r0, a1 * r0 * r0 / 2};
        DormandPrince853Integrator integ = new DormandPrince853Integrator(1e-9, 0.05, 1e-12, 1e-12);
        ODEState end = integ.integrate(ode, new ODEState(r0, y0), 1.0);
        double[] y = end.getPrimaryState();
        return new double[] {y[0], y[3] - nu * y[2], y[1], y[2], y[4]};
    }

    /** Disc reference for a cap: {edge, centre stress [Pa], deflection [m]}. */
    static double[] discReference(double a, double h, double sigma0, double q, CapResponse guess) {
        double d = EBAR * h * h * h / 12;
        double n0 = sigma0 * h * a * a / d;
        double bigQ = q * a * a * a * a / (d * h);
        double scale = d / (a * a * h);
        // initial guess from the code's response (only a starting point; the root is checked above)
        double nGuess = (guess.edgeStressPa() - guess.bendingStressPa()) / scale - n0;
        double slopeGuess = -Math.abs(guess.deflectionM()) / h * 2;
        double[] r = discShooting(n0, bigQ, NU, slopeGuess, nGuess);
        return new double[] {r[0] * scale, r[1] * scale, r[2] * h};
    }

    // ---- the grid ---------------------------------------------------------------------------

    @Test
    void stripMatchesFiniteDifferenceFvkOverGrid() {
        // Independent FD solution of the plane-strain FvK strip (derived, no published source for the grid values).
        // Grid: span/thickness, pre-stress from 0.8 of the buckling compression to strong tension, pressure
        // from plate-like to membrane-dominated. Tolerance 2 % (issue 13); FD error after Richardson < 0.1 %.
        List<String> worst = new ArrayList<>();
        double maxErr = 0;
        for (double aOverH : new double[] {25, 100, 400}) {
            double h = 1e-6;
            double a = aOverH * h;
            double sigmaCr = Math.PI * Math.PI / 3 * EBAR * (h / (2 * a)) * (h / (2 * a)) * 4 / 4;
            for (double pre : new double[] {-0.8 * sigmaCr, -0.3 * sigmaCr, 0, 20e6, 200e6}) {
                for (double pOverPlate : new double[] {0.3, 3, 30, 300}) {
                    // pressure that would give a plate deflection of pOverPlate × h
                    double d = EBAR * h * h * h / 12;
                    double q = pOverPlate * h * 24 * d / Math.pow(a, 4);
                    CapResponse r = cap(SpanGeometry.line(2 * a), h, pre).evaluate(T0, q);
                    double[] ref = stripReference(a, h, pre, q);
                    double scale = Math.max(Math.abs(pre), 1);
                    double eEdge = Math.abs(r.edgeStressPa() - ref[0]) / Math.max(Math.abs(ref[0]), scale);
                    double eDefl = Math.abs(r.deflectionM() / ref[2] - 1);
                    double eCentre = Math.abs(r.centreStressPa() - ref[1]) / Math.max(Math.abs(ref[1]), scale);
                    double e = Math.max(eEdge, Math.max(eDefl, eCentre));
                    if (e > maxErr) {
                        maxErr = e;
                    }
                    String where = "a/h " + aOverH + ", σ0 " + pre + ", q " + q + ": edge " + r.edgeStressPa() + " vs "
                            + ref[0] + ", centre " + r.centreStressPa() + " vs " + ref[1] + ", δ " + r.deflectionM()
                            + " vs " + ref[2];
                    assertTrue(eEdge < 0.02 && eDefl < 0.02 && eCentre < 0.02, where);
                    worst.add(where);
                }
            }
        }
        System.out.println("strip vs FD FvK, largest relative difference " + maxErr);
    }

    @Test
    void discAgainstShootingFvkOverGrid() {
        // Independent shooting solution of the axisymmetric FvK equations (derived, no published source for the
        // grid values). The code's disc is the uniform-force Bessel model corrected by a table computed with a
        // finite-difference FvK solver (a different method from this shooting). Issue 13 asks for 2 % in edge
        // stress; here edge and centre face stress and deflection are all held to 2 %, at parameters off the
        // table's nodes: span/thickness, pre-stress from 0.9 of the buckling compression to strong tension,
        // loads from plate-like to membrane-dominated, three Poisson's ratios.
        double maxEdge = 0;
        double maxCentre = 0;
        double maxDefl = 0;
        double[][] cases = {{0.17, 25}, {0.25, 70}, {0.33, 180}};   // ν, a/h (the grid is dimensionless: one a/h per ν)
        for (double[] nuAndSpan : cases) {
            double nu = nuAndSpan[0];
            double e = 100e9;
            double eb = e / (1 - nu * nu);
            for (double aOverH : new double[] {nuAndSpan[1]}) {
                double h = 1e-6;
                double a = aOverH * h;
                double d = eb * h * h * h / 12;
                double sigmaCr = 14.682 * d / (a * a * h);
                for (double pre : new double[] {-0.9 * sigmaCr, -0.45 * sigmaCr, 0, 2.7 * sigmaCr, 13 * sigmaCr}) {
                    for (double bigQ : new double[] {2.3, 17, 130, 2900}) {
                        double q = bigQ * d * h / Math.pow(a, 4);
                        CapStructure c = new CapStructure(FilmProperties.elastic(e, nu, CapStructure.SILICON_CTE_PER_K, T0, pre),
                                h, SpanGeometry.disc(2 * a), CapStructure.SILICON_CTE_PER_K, MechanicalLimits.withSafetyFactor(1));
                        CapResponse r = c.evaluate(T0, q);
                        double scale = d / (a * a * h);
                        double[] ref = discShooting(pre * h * a * a / d, bigQ, nu, 0, 0);
                        double edge = ref[0] * scale;
                        double centre = ref[1] * scale;
                        double defl = ref[2] * h;
                        // relative to the larger of the reference and the pre-stress (the stress passes zero in compression)
                        double eEdge = Math.abs(r.edgeStressPa() - edge) / Math.max(Math.abs(edge), Math.abs(pre));
                        double eCentre = Math.abs(r.centreStressPa() - centre) / Math.max(Math.abs(centre), Math.abs(pre));
                        double eDefl = Math.abs(r.deflectionM() / defl - 1);
                        maxEdge = Math.max(maxEdge, eEdge);
                        maxCentre = Math.max(maxCentre, eCentre);
                        maxDefl = Math.max(maxDefl, eDefl);
                        String where = "ν " + nu + ", a/h " + aOverH + ", σ0 " + pre + ", Q " + bigQ + ": edge " + r.edgeStressPa()
                                + " vs " + edge + ", centre " + r.centreStressPa() + " vs " + centre + ", δ " + r.deflectionM()
                                + " vs " + defl;
                        assertTrue(eEdge < 0.02 && eCentre < 0.02 && eDefl < 0.02, where);
                    }
                }
            }
        }
        System.out.println("disc vs shooting FvK, largest relative difference: edge " + maxEdge + ", centre " + maxCentre
                + ", deflection " + maxDefl);
    }

    @Test
    void finiteDifferenceSolverAgreesWithShooting() {
        // The table's generator (finite differences on a graded grid, Richardson) against the shooting solution
        // above, two independent numerical methods for the same equations (derived, no published source): 1e-4.
        for (double nu : new double[] {0.0, 0.3, 0.5}) {
            for (double n0 : new double[] {-13.9, -5, 0, 40, 150}) {
                for (double bigQ : new double[] {0.4, 25, 600}) {
                    double[] ref = discShooting(n0, bigQ, nu, 0, 0);
                    AxisymmetricFvk.Solution s = AxisymmetricFvk.extrapolated(n0, bigQ, nu, 200, 6, null);
                    double scale = Math.max(Math.abs(n0), Math.abs(ref[0]));
                    String where = "ν " + nu + ", n0 " + n0 + ", Q " + bigQ;
                    assertEquals(ref[0], s.edgeFaceStress(), 1e-4 * scale, where + " edge");
                    assertEquals(ref[1], s.centreFaceStress(), 1e-4 * Math.max(Math.abs(n0), Math.abs(ref[1])), where + " centre");
                    assertEquals(ref[2], s.deflection(), 1e-4 * ref[2], where + " deflection");
                    assertTrue(s.largestHoopMembrane() <= Math.max(s.edgeMembrane(), s.centreMembrane()) + 1e-9 * scale,
                            where + ": the hoop force across a diameter stays below the larger of the centre and edge forces");
                }
            }
        }
    }

    @Test
    void bundledTableMatchesItsGenerator() {
        // Regression of the bundled resource against its generator at a few nodes (a stale table fails here);
        // the values are stored as floats: within one float ulp (the generator's own rounding).
        int[][] nodes = {{0, 0, 0}, {3, 30, 58}, {2, 50, 88}, {5, 10, 102}, {1, 67, 20}};
        for (int[] n : nodes) {
            double nu = n[0] * DiscFvkTable.NU_STEP;
            double[][] row = DiscFvkTableWriter.row(n[1], nu);
            for (int p = 0; p < DiscFvkTable.PARTS; p++) {
                assertEquals(row[n[2]][p], DiscFvkTable.node(n[0], n[1], n[2], p), Math.ulp((float) row[n[2]][p]),
                        "node " + java.util.Arrays.toString(n) + " part " + p);
            }
        }
    }

    /**
     * The cap's disc at dimensionless pre-force n0, load Q and Poisson's ratio ν (E 100 GPa, h 1 µm,
     * a 500 µm): {edge face stress, centre face stress, deflection} in units of D/(a² h) and h.
     */
    private static double[] discCap(double nu, double n0, double bigQ) {
        double e = 100e9;
        double h = 1e-6;
        double a = 500e-6;
        double d = e / (1 - nu * nu) * h * h * h / 12;
        double scale = d / (a * a * h);
        CapStructure c = new CapStructure(FilmProperties.elastic(e, nu, CapStructure.SILICON_CTE_PER_K, T0, n0 * scale), h,
                SpanGeometry.disc(2 * a), CapStructure.SILICON_CTE_PER_K, MechanicalLimits.withSafetyFactor(1));
        CapResponse r = c.evaluate(T0, bigQ * d * h / Math.pow(a, 4));
        return new double[] {r.edgeStressPa() / scale, r.centreStressPa() / scale, r.deflectionM() / h};
    }

    /** Largest relative difference of edge, centre face stress (against max(|ref|, |n0|)) and deflection. */
    private static double discDifference(double[] code, double[] ref, double n0) {
        double eEdge = Math.abs(code[0] - ref[0]) / Math.max(Math.abs(ref[0]), Math.abs(n0));
        double eCentre = Math.abs(code[1] - ref[1]) / Math.max(Math.abs(ref[1]), Math.abs(n0));
        double eDefl = Math.abs(code[2] / ref[2] - 1);
        return Math.max(eEdge, Math.max(eCentre, eDefl));
    }

    /**
     * {edge face stress, centre face stress, deflection} by {@link AxisymmetricFvk}, continued in load from Q = 1e-3 in
     * steps of at most a factor e (sub-steps where Newton fails), Richardson-extrapolated between n and 2n intervals,
     * n = 200, 400, 800 until the two differ by less than 1e-4.
     */
    private static double[] finiteDifferences(double n0, double bigQ, double nu) {
        for (int n = 200; ; n *= 2) {
            AxisymmetricFvk coarse = new AxisymmetricFvk(n, nu);
            AxisymmetricFvk fine = new AxisymmetricFvk(2 * n, nu);
            int steps = (int) Math.ceil(Math.max(Math.log(bigQ / 1e-3), 0)) + 1;
            AxisymmetricFvk.Solution a = null;
            AxisymmetricFvk.Solution b = null;
            double last = 0;
            for (int k = 1; k <= steps; k++) {
                double q = bigQ * Math.exp(-(steps - k) * Math.log(Math.max(bigQ / 1e-3, 1)) / Math.max(steps - 1, 1));
                a = null;
                for (int sub = 1; sub <= 64 && (a == null || b == null); sub *= 4) {
                    for (int m = 1; m <= sub; m++) {
                        double qm = last + (q - last) * m / sub;
                        a = coarse.solve(n0, qm);
                        b = fine.solve(n0, qm);
                        if (a == null || b == null) {
                            break;
                        }
                    }
                }
                assertTrue(a != null && b != null, "finite differences failed at n0 " + n0 + ", Q " + q);
                last = q;
            }
            double change = Math.max(Math.abs(a.edgeFaceStress() / b.edgeFaceStress() - 1),
                    Math.max(Math.abs(a.centreFaceStress() / b.centreFaceStress() - 1), Math.abs(a.deflection() / b.deflection() - 1)));
            if (change < 1e-4 || n == 800) {
                assertTrue(change < 1e-3, "finite differences at n0 " + n0 + ", Q " + bigQ + " change by " + change);
                return new double[] {b.edgeFaceStress() + (b.edgeFaceStress() - a.edgeFaceStress()) / 3,
                    b.centreFaceStress() + (b.centreFaceStress() - a.centreFaceStress()) / 3,
                    b.deflection() + (b.deflection() - a.deflection()) / 3};
            }
        }
    }

    @Test
    void discTableInterpolationAgainstShootingMidCell() {
        // The table's interpolation error where it is largest: in the middle of a cell in ln Q, in the pre-force
        // coordinate and between two ν slices. Cells drawn at random (seeded). Up to n0 ≈ 100 and Q ≈ 1e3 (the
        // shooting's reach: beyond it the centre-to-edge growth e^{√n} of the solution defeats the shooting) against
        // the independent shooting solution (derived, no published source); over the whole table (Q 1e-3 … 1e8, n0 up
        // to 1e5) against the finite-difference solver solved afresh at the cell's centre (the table's method, but
        // not its nodes: this measures the interpolation; the solver itself is checked against the shooting above).
        // Measured largest differences on these cells 4.9e-5 (shooting) and 8.7e-5 (finite differences); a one-off run
        // over every cell of the ν = 0.3 slice (finite differences at 22 410 points on a grid of half the table's steps)
        // gave 1.2e-4 (edge), 2.0e-4 (centre) and 8.9e-5 (deflection). Held to 1e-3.
        long seed = 20251202L;
        java.util.Random random = new java.util.Random(seed);
        double worstShooting = 0;
        double worstFd = 0;
        for (int trial = 0; trial < 28; trial++) {
            boolean shooting = trial < 16;
            int i = random.nextInt(shooting ? 56 : DiscFvkTable.NX - 1);        // Q up to 1e3 (shooting) or 1e8
            int j = random.nextInt(shooting ? 34 : DiscFvkTable.NY - 1);         // n0 up to 100 (shooting) or 1e5
            int k = random.nextInt(DiscFvkTable.NNU - 1);
            double bigQ = Math.exp(DiscFvkTable.X_MIN + (i + 0.5) * DiscFvkTable.X_STEP);
            double n0 = -DiscFvkTable.BUCKLING * Math.expm1(DiscFvkTable.Y_MIN + (j + 0.5) * DiscFvkTable.Y_STEP);
            double nu = (k + 0.5) * DiscFvkTable.NU_STEP;
            double[] ref;
            if (shooting) {
                ref = discShooting(n0, bigQ, nu, 0, 0);
            } else {
                ref = finiteDifferences(n0, bigQ, nu);
            }
            double[] code = discCap(nu, n0, bigQ);
            double diff = discDifference(code, ref, n0);
            if (shooting) {
                worstShooting = Math.max(worstShooting, diff);
            } else {
                worstFd = Math.max(worstFd, diff);
            }
            assertTrue(diff < 1e-3, "seed " + seed + ", trial " + trial + ": ν " + nu + ", n0 " + n0 + ", Q " + bigQ
                    + ": code " + java.util.Arrays.toString(code) + " vs " + (shooting ? "shooting " : "finite differences ")
                    + java.util.Arrays.toString(ref));
        }
        System.out.println("disc table mid-cell, largest relative difference: vs shooting " + worstShooting
                + ", vs finite differences " + worstFd);
    }

    @Test
    void discBeyondTheTableIsContinuousAndFollowsShooting() {
        // Outside the table the uniform-force model carries the FvK/model ratio of the nearest grid point. Across each
        // edge of the grid the response must not jump (1e-6: only the interpolation across 2e-9 of a step), and
        // beyond it stay near the independent shooting solution (derived, no published source): below the grid in
        // Q the plate is linear (1e-3); just beyond 0.99 of the buckling compression and for ν < 0 the ratio held
        // is that of the neighbouring point (2 %, the tolerance; measured figures in docs/model.md).
        double xMax = DiscFvkTable.X_MIN + (DiscFvkTable.NX - 1) * DiscFvkTable.X_STEP;
        double yMax = DiscFvkTable.Y_MIN + (DiscFvkTable.NY - 1) * DiscFvkTable.Y_STEP;
        double[][] edges = {   // {ν, n0, Q} on the edges
            {0.25, 3, Math.exp(DiscFvkTable.X_MIN)},
            {0.25, 3, Math.exp(xMax)},
            {0.3, DiscFvkTable.n0At(0), 40},
            {0.3, -DiscFvkTable.BUCKLING * Math.expm1(yMax), 1e6},
        };
        for (double[] e : edges) {
            for (int dir = 0; dir < 2; dir++) {
                double f = 1 + 1e-9 * (dir == 0 ? 1 : -1);
                double[] a = discCap(e[0], e[1], e[2]);
                double[] b = dir == 0 ? discCap(e[0], e[1], e[2] * f) : discCap(e[0], e[1] + 1e-9 * Math.abs(e[1]) * (e[1] < 0 ? -1 : 1), e[2]);
                String where = "edge ν " + e[0] + ", n0 " + e[1] + ", Q " + e[2];
                for (int p = 0; p < 3; p++) {
                    assertEquals(a[p], b[p], 1e-6 * Math.abs(a[p]) + 1e-9 * Math.abs(e[1]), where + " part " + p);
                }
            }
        }
        double[][] beyond = {  // {ν, n0, Q, tolerance}
            {0.25, 3, 2e-4, 1e-3},
            {0.3, -14.0, 1e-4, 1e-3},
            {0.3, 0.995 * DiscFvkTable.BUCKLING, 0.5, 0.02},
            {0.3, 0.995 * DiscFvkTable.BUCKLING, 30, 0.02},
            {-0.2, 5, 50, 0.02},
            {-0.2, -7, 5, 0.02},
        };
        for (double[] b : beyond) {
            double[] ref = discShooting(b[1], b[2], b[0], 0, 0);
            double[] code = discCap(b[0], b[1], b[2]);
            double diff = discDifference(code, ref, b[1]);
            System.out.println("disc beyond the table, ν " + b[0] + ", n0 " + b[1] + ", Q " + b[2] + ": relative difference " + diff);
            assertTrue(diff < b[3], "ν " + b[0] + ", n0 " + b[1] + ", Q " + b[2] + ": code " + java.util.Arrays.toString(code)
                    + " vs shooting " + java.util.Arrays.toString(ref));
        }
    }

    @Test
    void denseDemoBindingInstantMatchesIndependentFvk() {
        // Dense demo at its binding instant (cold corner): disc 200 µm, cap 2 µm, E 120 GPa, ν 0.25,
        // σ_th ≈ 106 MPa, Δp ≈ 299 kPa. Independent axisymmetric FvK (shooting here; issue 13 quotes ≈ 428 MPa
        // from another independent solution): within 2 %.
        double e = 120e9;
        double nu = 0.25;
        double h = 2e-6;
        double a = 100e-6;
        FilmProperties f = FilmProperties.elastic(e, nu, CapStructure.SILICON_CTE_PER_K, T0, 106e6);
        CapResponse r = new CapStructure(f, h, SpanGeometry.disc(2 * a), CapStructure.SILICON_CTE_PER_K,
                MechanicalLimits.withSafetyFactor(2)).evaluate(T0, 299e3);
        double d = e / (1 - nu * nu) * h * h * h / 12;
        double n0 = 106e6 * h * a * a / d;
        double bigQ = 299e3 * Math.pow(a, 4) / (d * h);
        double[] ref = discShooting(n0, bigQ, nu, -2 * r.deflectionM() / h, 4);
        double scale = d / (a * a * h);
        assertEquals(428e6, ref[0] * scale, 1e6, "independent FvK edge face stress");
        assertEquals(ref[0] * scale, r.edgeStressPa(), 0.02 * ref[0] * scale);
        assertEquals(ref[2] * h, r.deflectionM(), 0.02 * ref[2] * h);
    }

    @Test
    void shootingReferenceMatchesTimoshenkoApproximateLargeDeflection() {
        // Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, 2nd ed. (1959), large-deflection chapter:
        // clamped circular plate, energy solution w0/h + 0.488 (w0/h)³ = q a⁴/(64 D h) for ν = 0.3, said there to
        // agree with S. Way's (1934) exact series within a few per cent — from memory, unconfirmed. Checked on the
        // independent shooting solution (within 5 %), and the code's disc against the shooting solution within 2 %.
        double nu = 0.3;
        for (double w0 : new double[] {0.5, 1.0}) {
            double bigQ = 64 * (w0 + 0.488 * w0 * w0 * w0);
            double[] ref = discShooting(0, bigQ, nu, -2 * w0, 0.5 * w0 * w0 * 6);
            assertEquals(w0, ref[2], 0.05 * w0, "shooting FvK deflection at Q = " + bigQ);
            double h = 1e-6;
            double a = 50e-6;
            double eb = E / (1 - nu * nu);
            double d = eb * h * h * h / 12;
            CapStructure c = new CapStructure(FilmProperties.elastic(E, nu, CapStructure.SILICON_CTE_PER_K, T0, 0), h,
                    SpanGeometry.disc(2 * a), CapStructure.SILICON_CTE_PER_K, MechanicalLimits.withSafetyFactor(1));
            double delta = c.deflectionM(T0, bigQ * d * h / Math.pow(a, 4)) / h;
            assertEquals(ref[2], delta, 0.02 * ref[2], "code's disc deflection at Q = " + bigQ);
        }
    }

    @Test
    void thinDiscApproachesPublishedMembraneSolutions() {
        // Membrane limit of the clamped circular plate (a/h = 1000, δ/h 30 … 140, ν = 0.3):
        // Hencky's membrane solution as given by Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, 2nd ed.
        // (1959), large-deflection chapter: w0 = 0.662 a (q a/(E h))^(1/3), radial stress at the edge
        // 0.328 (E q² a²/h²)^(1/3) — from memory, unconfirmed; and the bulge-test relation of Small & Nix,
        // J. Mater. Res. 7 (1992) 1553: q = (8/3)(1 − 0.24ν) E h w0³/((1 − ν) a⁴) (shared/CHECKS.md, an energy
        // approximation). The plate's bending stiffness lowers the deflection by a boundary layer of relative width
        // 1/(ka) ≈ 0.5–1 % here, so deflections are held to 2.5 %, the edge membrane stress to 2 % at δ/h = 30 and 1 % from 65 on.
        double e = 100e9;
        double nu = 0.3;
        double h = 0.1e-6;
        double a = 100e-6;
        CapStructure c = new CapStructure(FilmProperties.elastic(e, nu, CapStructure.SILICON_CTE_PER_K, T0, 0), h,
                SpanGeometry.disc(2 * a), CapStructure.SILICON_CTE_PER_K, MechanicalLimits.withSafetyFactor(1));
        for (double q : new double[] {1e4, 1e5, 1e6}) {
            CapResponse r = c.evaluate(T0, q);
            double hencky = 0.662 * a * Math.cbrt(q * a / (e * h));
            double smallNix = Math.cbrt(q * (1 - nu) * Math.pow(a, 4) / ((8.0 / 3) * (1 - 0.24 * nu) * e * h));
            double edgeMembrane = 0.328 * Math.cbrt(e * q * q * a * a / (h * h));
            assertEquals(hencky, r.deflectionM(), 0.025 * hencky, "Hencky deflection at " + q + " Pa");
            assertEquals(smallNix, r.deflectionM(), 0.025 * smallNix, "Small & Nix deflection at " + q + " Pa");
            // the edge membrane stress converges more slowly (−1.7 % at δ/h = 30): checked from δ/h = 65 on
            assertEquals(edgeMembrane, r.edgeStressPa() - r.bendingStressPa(), (q < 1e5 ? 0.02 : 0.01) * edgeMembrane,
                    "Hencky edge membrane stress at " + q + " Pa");
        }
    }
}
