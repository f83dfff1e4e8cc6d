package org.exhale.fitting;

import java.util.Arrays;
import java.util.function.Function;
import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.linear.SingularValueDecomposition;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresProblem;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.MultivariateJacobianFunction;
import org.hipparchus.util.Pair;

/**
 * Levenberg–Marquardt (Hipparchus) on a model given as a function from parameters to predicted
 * values, with a forward-difference Jacobian during the search and a central-difference Jacobian
 * at the optimum for the covariance σ² (JᵀJ)⁻¹, σ² = SSR/(N − p) (common practice; the form NIST
 * StRD certifies its standard deviations with).
 *
 * <p>Simple bounds are kept by Hipparchus' parameter validator (a proposed step is clipped into
 * the box). A parameter that ends on its bound is reported as such: it is left out of the
 * covariance (its row and column are NaN) and the others' covariance is that of the fit with it
 * held fixed.
 *
 * @param parameters  the optimum
 * @param covariance  σ² (JᵀJ)⁻¹ over the free parameters (pseudo-inverse where singular); NaN for
 *                    parameters at a bound
 * @param ssr         residual sum of squares
 * @param points      N
 * @param iterations  LM iterations
 * @param residuals   target − model at the optimum
 * @param atBound     which parameters ended on a bound
 */
public record LeastSquaresFit(double[] parameters, double[][] covariance, double ssr, int points, int iterations,
                              double[] residuals, boolean[] atBound) {

    /** The optimiser did not reach its convergence tests within the iteration limit. */
    public static final class NotConverged extends RuntimeException {
        NotConverged(int iterations) {
            super("did not settle within " + iterations + " iterations");
        }
    }

    public static LeastSquaresFit fit(Function<double[], double[]> model, double[] target, double[] start,
                                      double[] stepScale, int maxIterations) {
        double[] lo = new double[start.length];
        double[] hi = new double[start.length];
        Arrays.fill(lo, Double.NEGATIVE_INFINITY);
        Arrays.fill(hi, Double.POSITIVE_INFINITY);
        return fit(model, target, start, stepScale, maxIterations, lo, hi);
    }

    public static LeastSquaresFit fit(Function<double[], double[]> model, double[] target, double[] start,
                                      double[] stepScale, int maxIterations, double[] lower, double[] upper) {
        int p = start.length;
        double[] s0 = start.clone();
        for (int i = 0; i < p; i++) {
            s0[i] = Math.max(lower[i], Math.min(upper[i], s0[i]));
        }
        MultivariateJacobianFunction f = point -> {
            double[] q = point.toArray();
            double[] v = model.apply(q);
            double[][] j = jacobian(model, q, v, stepScale, false, lower, upper);
            return new Pair<RealVector, RealMatrix>(new ArrayRealVector(v, false), new Array2DRowRealMatrix(j, false));
        };
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(s0).model(f).target(target)
                .parameterValidator(v -> {
                    double[] q = v.toArray();
                    for (int i = 0; i < p; i++) {
                        q[i] = Math.max(lower[i], Math.min(upper[i], q[i]));
                    }
                    return new ArrayRealVector(q, false);
                })
                .maxEvaluations(Math.max(100, 4 * maxIterations)).maxIterations(maxIterations)
                .lazyEvaluation(false).build();
        LevenbergMarquardtOptimizer lm = new LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(1e-12).withParameterRelativeTolerance(1e-12).withOrthoTolerance(1e-12);
        LeastSquaresOptimizer.Optimum o;
        try {
            o = lm.optimize(problem);
        } catch (MathIllegalStateException e) {
            throw new NotConverged(maxIterations);
        }
        double[] q = o.getPoint().toArray();
        boolean[] fixed = new boolean[p];
        for (int i = 0; i < p; i++) {
            double tol = Double.isFinite(upper[i] - lower[i]) ? 1e-7 * (upper[i] - lower[i]) : 0;
            fixed[i] = q[i] <= lower[i] + tol || q[i] >= upper[i] - tol;
        }
        double[] v = model.apply(q);
        double[] res = new double[target.length];
        double ssr = 0;
        for (int i = 0; i < res.length; i++) {
            res[i] = target[i] - v[i];
            ssr += res[i] * res[i];
        }
        int free = 0;
        for (boolean b : fixed) {
            free += b ? 0 : 1;
        }
        double[][] cov = new double[p][p];
        for (double[] row : cov) {
            Arrays.fill(row, Double.NaN);
        }
        if (free > 0) {
            double[][] jFull = jacobian(model, q, v, stepScale, true, lower, upper);
            double[][] j = new double[target.length][free];
            int[] map = new int[free];
            for (int k = 0, c = 0; k < p; k++) {
                if (!fixed[k]) {
                    map[c++] = k;
                }
            }
            for (int i = 0; i < target.length; i++) {
                for (int c = 0; c < free; c++) {
                    j[i][c] = jFull[i][map[c]];
                }
            }
            RealMatrix jm = new Array2DRowRealMatrix(j, false);
            RealMatrix inv = new SingularValueDecomposition(jm.transposeMultiply(jm)).getSolver().getInverse();
            double s2 = target.length > free ? ssr / (target.length - free) : Double.NaN;
            for (int a = 0; a < free; a++) {
                for (int b = 0; b < free; b++) {
                    cov[map[a]][map[b]] = inv.getEntry(a, b) * s2;
                }
            }
        }
        return new LeastSquaresFit(q, cov, ssr, target.length, o.getIterations(), res, fixed);
    }

    /** Difference Jacobian; near a bound the step goes inward so the model is never evaluated outside the box. */
    private static double[][] jacobian(Function<double[], double[]> model, double[] q, double[] v, double[] scale,
                                       boolean central, double[] lower, double[] upper) {
        int p = q.length;
        double[][] j = new double[v.length][p];
        for (int k = 0; k < p; k++) {
            double h = (central ? 1e-5 : 1e-7) * scale[k];
            boolean roomUp = q[k] + h <= upper[k];
            boolean roomDown = q[k] - h >= lower[k];
            if (central && roomUp && roomDown) {
                double[] qp = q.clone();
                qp[k] += h;
                double[] vp = model.apply(qp);
                double[] qm = q.clone();
                qm[k] -= h;
                double[] vm = model.apply(qm);
                for (int i = 0; i < v.length; i++) {
                    j[i][k] = (vp[i] - vm[i]) / (2 * h);
                }
            } else {
                double step = roomUp ? h : -h;
                double[] qp = q.clone();
                qp[k] += step;
                double[] vp = model.apply(qp);
                for (int i = 0; i < v.length; i++) {
                    j[i][k] = (vp[i] - v[i]) / step;
                }
            }
        }
        return j;
    }

    /** Standard error of parameter k (NaN at a bound). */
    public double stdError(int k) {
        return Math.sqrt(covariance[k][k]);
    }
}
