package org.exhale.fitting;

import java.util.function.Function;
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
 * @param parameters  the optimum
 * @param covariance  σ² (JᵀJ)⁻¹ (pseudo-inverse where JᵀJ is singular)
 * @param ssr         residual sum of squares
 * @param points      N
 * @param iterations  LM iterations
 * @param residuals   target − model at the optimum
 */
public record LeastSquaresFit(double[] parameters, double[][] covariance, double ssr, int points, int iterations,
                              double[] residuals) {

    public static LeastSquaresFit fit(Function<double[], double[]> model, double[] target, double[] start,
                                      double[] stepScale, int maxIterations) {
        int p = start.length;
        MultivariateJacobianFunction f = point -> {
            double[] q = point.toArray();
            double[] v = model.apply(q);
            double[][] j = jacobian(model, q, v, stepScale, false);
            return new Pair<RealVector, RealMatrix>(new ArrayRealVector(v, false), new Array2DRowRealMatrix(j, false));
        };
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(start).model(f).target(target)
                .maxEvaluations(Math.max(100, 4 * maxIterations)).maxIterations(maxIterations)
                .lazyEvaluation(false).build();
        LevenbergMarquardtOptimizer lm = new LevenbergMarquardtOptimizer()
                .withCostRelativeTolerance(1e-12).withParameterRelativeTolerance(1e-12).withOrthoTolerance(1e-12);
        LeastSquaresOptimizer.Optimum o = lm.optimize(problem);
        double[] q = o.getPoint().toArray();
        double[] v = model.apply(q);
        double[] res = new double[target.length];
        double ssr = 0;
        for (int i = 0; i < res.length; i++) {
            res[i] = target[i] - v[i];
            ssr += res[i] * res[i];
        }
        double[][] j = jacobian(model, q, v, stepScale, true);
        RealMatrix jm = new Array2DRowRealMatrix(j, false);
        RealMatrix jtj = jm.transposeMultiply(jm);
        RealMatrix inv = new SingularValueDecomposition(jtj).getSolver().getInverse();
        double s2 = target.length > p ? ssr / (target.length - p) : Double.NaN;
        double[][] cov = inv.scalarMultiply(s2).getData();
        return new LeastSquaresFit(q, cov, ssr, target.length, o.getIterations(), res);
    }

    private static double[][] jacobian(Function<double[], double[]> model, double[] q, double[] v, double[] scale,
                                       boolean central) {
        int p = q.length;
        double[][] j = new double[v.length][p];
        for (int k = 0; k < p; k++) {
            double h = (central ? 1e-5 : 1e-7) * scale[k];
            double[] qp = q.clone();
            qp[k] += h;
            double[] vp = model.apply(qp);
            if (central) {
                double[] qm = q.clone();
                qm[k] -= h;
                double[] vm = model.apply(qm);
                for (int i = 0; i < v.length; i++) {
                    j[i][k] = (vp[i] - vm[i]) / (2 * h);
                }
            } else {
                for (int i = 0; i < v.length; i++) {
                    j[i][k] = (vp[i] - v[i]) / h;
                }
            }
        }
        return j;
    }

    /** Standard error of parameter k. */
    public double stdError(int k) {
        return Math.sqrt(covariance[k][k]);
    }
}
