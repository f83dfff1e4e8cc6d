package org.exhale.simulation;

import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.DecompositionSolver;
import org.hipparchus.linear.LUDecomposition;

/**
 * The L-stable second-order Rosenbrock (W-) method with a third-order error estimate and
 * continuous extension of Shampine &amp; Reichelt, "The MATLAB ODE Suite", SIAM J. Sci. Comput.
 * 18 (1997) 1–22, §3 (the formulas of the "ode23s" scheme), written here because Hipparchus
 * offers only non-stiff integrators and the gas under a dense cap relaxes 10³–10⁶ times faster
 * than the kinetics change. The Jacobian and ∂f/∂t are formed by forward differences once per
 * step; the linear systems use Hipparchus' LU decomposition. States here have at most a dozen
 * components, so dense linear algebra costs little.
 */
final class RosenbrockIntegrator {
    /** Right-hand side, writing dy/dt into dy. */
    interface Rhs {
        void derivatives(double t, double[] y, double[] dy);
    }

    /** Receives every accepted step. */
    interface Listener {
        void step(StepView step);
    }

    private static final double D = 1 / (2 + Math.sqrt(2));
    private static final double E32 = 6 + Math.sqrt(2);

    private final double rtol;
    private final double[] atol;
    private final int n;
    private long evaluations;
    private long steps;

    RosenbrockIntegrator(double rtol, double[] atol) {
        this.rtol = rtol;
        this.atol = atol.clone();
        this.n = atol.length;
    }

    long evaluations() {
        return evaluations;
    }

    long steps() {
        return steps;
    }

    /** Integrates y from t0 to t1 in place; returns the last step size taken, to seed the next call. */
    double integrate(Rhs f, double t0, double[] y, double t1, double hInit, Listener listener) {
        double[] f0 = new double[n];
        double[] f1 = new double[n];
        double[] f2 = new double[n];
        double[] ft = new double[n];
        double[] dfdt = new double[n];
        double[] k1 = new double[n];
        double[] k2 = new double[n];
        double[] k3 = new double[n];
        double[] yt = new double[n];
        double[] y1 = new double[n];
        double[] rhs = new double[n];
        double[][] jac = new double[n][n];
        double span = t1 - t0;
        double t = t0;
        double h = hInit > 0 ? Math.min(hInit, span) : span * 1e-4;
        f.derivatives(t, y, f0);
        evaluations++;
        boolean jacobianFresh = false;
        DenseStep view = new DenseStep(n);
        int forcedSteps = 0;
        while (t < t1) {
            if (t + h > t1 || t1 - (t + h) < 1e-12 * span) {
                h = t1 - t;
            }
            if (!jacobianFresh) {
                jacobian(f, t, y, f0, jac, yt, ft, dfdt, span);
                jacobianFresh = true;
            }
            Array2DRowRealMatrix w = new Array2DRowRealMatrix(n, n);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    w.setEntry(i, j, (i == j ? 1 : 0) - h * D * jac[i][j]);
                }
            }
            DecompositionSolver lu = new LUDecomposition(w, 1e-300).getSolver();
            for (int i = 0; i < n; i++) {
                rhs[i] = f0[i] + h * D * dfdt[i];
            }
            solve(lu, rhs, k1);
            for (int i = 0; i < n; i++) {
                yt[i] = y[i] + 0.5 * h * k1[i];
            }
            f.derivatives(t + 0.5 * h, yt, f1);
            for (int i = 0; i < n; i++) {
                rhs[i] = f1[i] - k1[i];
            }
            solve(lu, rhs, k2);
            for (int i = 0; i < n; i++) {
                k2[i] += k1[i];
                y1[i] = y[i] + h * k2[i];
            }
            f.derivatives(t + h, y1, f2);
            for (int i = 0; i < n; i++) {
                rhs[i] = f2[i] - E32 * (k2[i] - f1[i]) - 2 * (k1[i] - f0[i]) + h * D * dfdt[i];
            }
            solve(lu, rhs, k3);
            evaluations += 2;
            double err = 0;
            for (int i = 0; i < n; i++) {
                double e = h / 6 * (k1[i] - 2 * k2[i] + k3[i]);
                double sc = atol[i] + rtol * Math.max(Math.abs(y[i]), Math.abs(y1[i]));
                err = Math.max(err, Math.abs(e) / sc);
            }
            if (!Double.isFinite(err)) {
                err = 1e10;
            }
            if (!(err <= 1)) {
                double hMin = 1e-14 * Math.max(1, Math.abs(t));
                double hNew = h * Math.max(0.1, 0.8 * Math.pow(err, -1.0 / 3));
                if (hNew >= hMin) {
                    h = hNew;
                    continue;
                }
                if (h > hMin * (1 + 1e-9)) {
                    h = hMin;
                    continue;
                }
                // At the smallest step the clock resolves, the error is still too large: the right-hand
                // side jumps here (a component's conversion reaching 1 cuts its rate to 0 at once, as
                // under a near-zero reaction order). Step over the jump at this size: the error of such a
                // step is bounded by the jump times hMin. Refuse only when the state stops being finite
                // or the jumps never end.
                if (err >= 1e10 || !finite(y1) || ++forcedSteps > MAX_FORCED_STEPS) {
                    throw new StepFailure(t, worst(y, y1, k1, k2, k3, h), err >= 1e10 || !finite(y1));
                }
            }
            view.set(t, h, y, k1, k2);
            double tNew = t + h;
            steps++;
            System.arraycopy(y1, 0, y, 0, n);
            System.arraycopy(f2, 0, f0, 0, n);
            t = tNew;
            listener.step(view);
            jacobianFresh = false;
            double fac = err == 0 ? 5 : Math.min(5, 0.8 * Math.pow(Math.max(err, 1e-30), -1.0 / 3));
            h *= Math.max(0.2, fac);
        }
        return h;
    }

    /** Most steps per call taken over a jump of the right-hand side at the smallest step size. */
    static final int MAX_FORCED_STEPS = 10_000;

    private static boolean finite(double[] v) {
        for (double x : v) {
            if (!Double.isFinite(x)) {
                return false;
            }
        }
        return true;
    }

    /** The state component with the largest scaled error of the last attempted step. */
    private int worst(double[] y, double[] y1, double[] k1, double[] k2, double[] k3, double h) {
        int at = 0;
        double max = -1;
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(y1[i])) {
                return i;
            }
            double e = Math.abs(h / 6 * (k1[i] - 2 * k2[i] + k3[i])) / (atol[i] + rtol * Math.max(Math.abs(y[i]), Math.abs(y1[i])));
            if (Double.isNaN(e) || e > max) {
                max = Double.isNaN(e) ? Double.POSITIVE_INFINITY : e;
                at = i;
            }
        }
        return at;
    }

    /** The integrator cannot go on: the step size fell to the clock's resolution, or the state stopped being finite. */
    static final class StepFailure extends OutOfReach {
        final double time;
        final int index;
        final boolean overflow;

        StepFailure(double time, int index, boolean overflow) {
            // callers that know what state component `index` means say so (CornerRun); this text is the fallback
            super((overflow ? "the model overflows: the bake's state stops being finite"
                    : "the model cannot resolve the bake: a quantity changes faster than the time resolution of the "
                      + "simulation (about 1e-14 of the time) allows") + String.format(java.util.Locale.ROOT, " at t = %.6g s", time)
                    + "; such a case is outside the model's reach, check the kinetics and cap values", null);
            this.time = time;
            this.index = index;
            this.overflow = overflow;
        }
    }

    private void solve(DecompositionSolver lu, double[] b, double[] x) {
        double[] sol = lu.solve(new org.hipparchus.linear.ArrayRealVector(b, false)).toArray();
        System.arraycopy(sol, 0, x, 0, n);
    }

    private void jacobian(Rhs f, double t, double[] y, double[] f0, double[][] jac, double[] yt, double[] ft,
                          double[] dfdt, double span) {
        System.arraycopy(y, 0, yt, 0, n);
        for (int j = 0; j < n; j++) {
            double scale = Math.max(Math.abs(y[j]), atol[j] / rtol);
            double delta = 1.5e-8 * scale;
            if (delta == 0) {
                delta = 1e-12;
            }
            yt[j] = y[j] + delta;
            delta = yt[j] - y[j];
            f.derivatives(t, yt, ft);
            for (int i = 0; i < n; i++) {
                jac[i][j] = (ft[i] - f0[i]) / delta;
            }
            yt[j] = y[j];
        }
        double dt = 1.5e-8 * Math.max(Math.abs(t), span);
        f.derivatives(t + dt, y, ft);
        for (int i = 0; i < n; i++) {
            dfdt[i] = (ft[i] - f0[i]) / dt;
        }
        evaluations += n + 1;
    }

    /** Continuous extension y(t0 + s h) = y0 + h [s(1−s)/(1−2d) k1 + s(s−2d)/(1−2d) k2]. */
    private static final class DenseStep implements StepView {
        private final double[] y0;
        private final double[] k1;
        private final double[] k2;
        private double t0;
        private double h;

        DenseStep(int n) {
            y0 = new double[n];
            k1 = new double[n];
            k2 = new double[n];
        }

        void set(double t, double step, double[] y, double[] a, double[] b) {
            t0 = t;
            h = step;
            System.arraycopy(y, 0, y0, 0, y.length);
            System.arraycopy(a, 0, k1, 0, a.length);
            System.arraycopy(b, 0, k2, 0, b.length);
        }

        @Override
        public double start() {
            return t0;
        }

        @Override
        public double end() {
            return t0 + h;
        }

        @Override
        public void state(double t, double[] out) {
            double s = (t - t0) / h;
            double c1 = s * (1 - s) / (1 - 2 * D);
            double c2 = s * (s - 2 * D) / (1 - 2 * D);
            for (int i = 0; i < y0.length; i++) {
                out[i] = y0[i] + h * (c1 * k1[i] + c2 * k2[i]);
            }
        }
    }
}
