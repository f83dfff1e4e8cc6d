package org.exhale.fitting;

import java.util.List;
import org.exhale.PhysicalConstants;
import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.distribution.continuous.FDistribution;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.optim.univariate.UnivariatePointValuePair;

/**
 * Isoconversional activation energy E(α) over several runs.
 *
 * <p>Linear methods: at each α the straight line of {@link IsoconversionalMethod} is fitted over
 * the runs; the interval is the slope's standard error times Student's t with (runs − 2) degrees
 * of freedom (common practice), so it needs at least three runs.
 *
 * <p>Vyazovkin: E minimises Φ(E) = Σᵢ Σⱼ≠ᵢ Jᵢ(E)/Jⱼ(E), Jᵢ = ∫ exp(−E/RTᵢ(t)) dt over the time run i
 * takes from α − Δα/2 to α + Δα/2, along its measured temperature. The interval follows the
 * F-test procedure of Vyazovkin & Wight, Anal. Chem. 72 (2000) 3171 (from memory, unconfirmed):
 * the E where (Φ(E) − n(n−1))/(Φmin − n(n−1)) equals F(p; n−1, n−1); the reported half-width is
 * half the distance between the two such E. With two runs Φmin is 2 exactly at any α, so there is
 * no interval (NaN, shown as "n/a"), as for the linear methods.
 */
public final class Isoconversional {
    private static final double R = PhysicalConstants.GAS_CONSTANT;
    private static final double E_LOW = 5e3;
    private static final double E_HIGH = 1.5e6;

    private Isoconversional() {
    }

    public static IsoconversionalResult compute(IsoconversionalMethod method, List<ConversionCurve> runs,
                                                double confidence) {
        if (runs.size() < 2) {
            throw new IllegalArgumentException("isoconversional methods need at least two runs, got " + runs.size());
        }
        return method == IsoconversionalMethod.VYAZOVKIN ? vyazovkin(runs, confidence) : linear(method, runs, confidence);
    }

    /**
     * The results with the approximation bias of KAS, OFW and Starink added to their half-widths.
     * Two parts, added: (1) the error of the method's closed-form temperature integral for a single
     * step, exact for constant E: the line y = const − c E/RT has the slope −E (p′/p + b/x)/c at
     * x = E/(RT), b = 2 (KAS), 0 (OFW), 1.92 (Starink), p by Senum–Yang (derived, no published
     * source; docs/model.md); (2) for a process whose E varies with α, the bias of integrating
     * from the start of the run, estimated as |E − E_Vyazovkin| (Vyazovkin's method integrates over
     * the step only, along the measured T(t)). Part (2) is left out when Vyazovkin is missing.
     */
    public static List<IsoconversionalResult> withApproximationBias(List<IsoconversionalResult> results,
                                                                    List<ConversionCurve> runs) {
        IsoconversionalResult v = null;
        for (IsoconversionalResult r : results) {
            if (r.method() == IsoconversionalMethod.VYAZOVKIN) {
                v = r;
            }
        }
        double[] grid = runs.get(0).gridAlpha();
        double[] meanT = new double[grid.length];
        for (ConversionCurve c : runs) {
            double[] gt = c.gridTemperatureK();
            for (int g = 0; g < grid.length; g++) {
                meanT[g] += gt[g] / runs.size();
            }
        }
        double[] ev = v == null ? null : v.energyJPerMol();
        List<IsoconversionalResult> out = new java.util.ArrayList<>();
        for (IsoconversionalResult r : results) {
            IsoconversionalMethod m = r.method();
            if (m != IsoconversionalMethod.KAS && m != IsoconversionalMethod.OFW && m != IsoconversionalMethod.STARINK) {
                out.add(r);
                continue;
            }
            double[] e = r.energyJPerMol();
            double[] hw = r.halfWidthJPerMol();
            double[] bias = new double[e.length];
            double b = m == IsoconversionalMethod.KAS ? 2 : m == IsoconversionalMethod.STARINK ? 1.92 : 0;
            for (int g = 0; g < e.length; g++) {
                double x = e[g] / (R * meanT[g]);
                double integral = Double.NaN;
                if (x > 1 && Double.isFinite(x)) {
                    double dlnp = -Math.exp(-x) / (x * x * TemperatureIntegral.senumYang(x));
                    integral = Math.abs(-(dlnp + b / x) / m.slopeFactor() - 1) * Math.abs(e[g]);
                }
                double variable = ev != null && Double.isFinite(ev[g]) ? Math.abs(e[g] - ev[g]) : 0;
                bias[g] = Double.isFinite(integral) ? integral + variable : Double.NaN;
                if (Double.isFinite(bias[g])) {
                    hw[g] = hw[g] + bias[g];
                }
            }
            out.add(new IsoconversionalResult(m, r.alpha(), e, hw, r.confidence(), bias));
        }
        return out;
    }

    private static IsoconversionalResult linear(IsoconversionalMethod method, List<ConversionCurve> runs,
                                                double confidence) {
        double[] grid = runs.get(0).gridAlpha();
        int m = runs.size();
        double[][] temp = new double[m][];
        double[][] rate = new double[m][];
        double[] beta = new double[m];
        for (int i = 0; i < m; i++) {
            temp[i] = runs.get(i).gridTemperatureK();
            rate[i] = runs.get(i).gridRate();
            beta[i] = runs.get(i).heatingRateKPerS();
        }
        double t = LinearRegression.studentT(confidence, m - 2);
        double[] e = new double[grid.length];
        double[] ci = new double[grid.length];
        double c = method.slopeFactor();
        double[] x = new double[m];
        double[] y = new double[m];
        for (int g = 0; g < grid.length; g++) {
            boolean ok = true;
            for (int i = 0; i < m; i++) {
                double tk = temp[i][g];
                x[i] = 1 / tk;
                y[i] = switch (method) {
                    case FRIEDMAN -> Math.log(rate[i][g]);
                    case KAS -> Math.log(beta[i] / (tk * tk));
                    case OFW -> Math.log(beta[i]);
                    case STARINK -> Math.log(beta[i] / Math.pow(tk, 1.92));
                    case VYAZOVKIN -> throw new IllegalStateException();
                };
                ok &= Double.isFinite(x[i]) && Double.isFinite(y[i]);
            }
            if (!ok) {
                e[g] = ci[g] = Double.NaN;
                continue;
            }
            LinearRegression lr = LinearRegression.fit(x, y);
            e[g] = -lr.slope() * R / c;
            ci[g] = t * lr.slopeStdError() * R / c;
        }
        return new IsoconversionalResult(method, grid, e, ci, confidence);
    }

    private static IsoconversionalResult vyazovkin(List<ConversionCurve> runs, double confidence) {
        double[] grid = runs.get(0).gridAlpha();
        double step = grid.length > 1 ? grid[1] - grid[0] : 0.01;
        int m = runs.size();
        double[][] t = new double[m][];
        double[][] temp = new double[m][];
        double[][] tLo = new double[m][];
        double[][] tHi = new double[m][];
        for (int i = 0; i < m; i++) {
            ConversionCurve c = runs.get(i);
            t[i] = c.timeS();
            temp[i] = c.temperatureK();
            double[] as = c.alphaSmooth();
            double[] lo = new double[grid.length];
            double[] hi = new double[grid.length];
            for (int g = 0; g < grid.length; g++) {
                lo[g] = Math.max(1e-6, grid[g] - step / 2);
                hi[g] = Math.min(1 - 1e-6, grid[g] + step / 2);
            }
            tLo[i] = crossingTimes(t[i], as, lo, c.reactionFrom());
            tHi[i] = crossingTimes(t[i], as, hi, c.reactionFrom());
        }
        double fQuantile = new FDistribution(m - 1, m - 1).inverseCumulativeProbability(confidence);
        double[] e = new double[grid.length];
        double[] ci = new double[grid.length];
        for (int g = 0; g < grid.length; g++) {
            final int gg = g;
            boolean ok = true;
            double tref = 0;
            for (int i = 0; i < m; i++) {
                ok &= Double.isFinite(tLo[i][g]) && Double.isFinite(tHi[i][g]) && tHi[i][g] > tLo[i][g];
                if (ok) {
                    tref += interpolate(t[i], temp[i], tHi[i][g]) / m;
                }
            }
            if (!ok) {
                e[g] = ci[g] = Double.NaN;
                continue;
            }
            final double tr = tref;
            UnivariateFunction phi = energy -> {
                double[] j = new double[m];
                for (int i = 0; i < m; i++) {
                    j[i] = TemperatureIntegral.alongHistory(t[i], temp[i], tLo[i][gg], tHi[i][gg], energy, tr);
                }
                double s = 0;
                for (int i = 0; i < m; i++) {
                    for (int k = 0; k < m; k++) {
                        if (k != i) {
                            s += j[i] / j[k];
                        }
                    }
                }
                return s;
            };
            double best = minimise(phi);
            e[g] = best;
            double phiMin = phi.value(best);
            double floor = m * (m - 1.0);
            double excess = phiMin - floor;
            if (m < 3) {
                // Two runs always agree exactly at the minimum (Φmin = 2): no scatter is left to set
                // an interval, as for the linear methods, which need three runs too.
                ci[g] = Double.NaN;
                continue;
            }
            if (!(excess > 1e-14 * floor)) {
                ci[g] = 0;
                continue;
            }
            double level = floor + fQuantile * excess;
            double lower = side(phi, best, level, -1);
            double upper = side(phi, best, level, +1);
            ci[g] = (upper - lower) / 2;
        }
        return new IsoconversionalResult(IsoconversionalMethod.VYAZOVKIN, grid, e, ci, confidence);
    }

    /** Coarse logarithmic scan, then Brent's method in the best bracket. */
    private static double minimise(UnivariateFunction phi) {
        int n = 48;
        double[] es = new double[n];
        double bestV = Double.POSITIVE_INFINITY;
        int best = 0;
        for (int k = 0; k < n; k++) {
            es[k] = E_LOW * Math.pow(E_HIGH / E_LOW, k / (n - 1.0));
            double v = phi.value(es[k]);
            if (v < bestV) {
                bestV = v;
                best = k;
            }
        }
        double lo = es[Math.max(0, best - 1)];
        double hi = es[Math.min(n - 1, best + 1)];
        BrentOptimizer opt = new BrentOptimizer(1e-12, 1e-3);
        UnivariatePointValuePair p = opt.optimize(new MaxEval(500), new UnivariateObjectiveFunction(phi),
                GoalType.MINIMIZE, new SearchInterval(lo, hi, es[best]));
        return p.getPoint();
    }

    /** The E on one side of the minimum where Φ reaches {@code level}; the search limit if it never does. */
    private static double side(UnivariateFunction phi, double best, double level, int direction) {
        double delta = 1e-4 * best;
        double outer = best + direction * delta;
        while (phi.value(outer) < level) {
            delta *= 2;
            outer = best + direction * delta;
            if (outer <= E_LOW || outer >= E_HIGH) {
                return Math.max(E_LOW, Math.min(E_HIGH, outer));
            }
        }
        double inner = best + direction * delta / 2;
        if (delta <= 1e-4 * best) {
            inner = best;
        }
        UnivariateFunction g = energy -> phi.value(energy) - level;
        double a = Math.min(inner, outer), b = Math.max(inner, outer);
        return new BrentSolver(1e-9 * best).solve(200, g, a, b);
    }

    /** Times at which a rising, possibly noisy, curve first reaches each of the ascending levels (NaN if never). */
    static double[] crossingTimes(double[] t, double[] a, double[] levels, int start) {
        double[] out = new double[levels.length];
        int k = Math.max(1, start);
        for (int g = 0; g < levels.length; g++) {
            while (k < a.length && a[k] < levels[g]) {
                k++;
            }
            if (k >= a.length) {
                out[g] = Double.NaN;
                continue;
            }
            double d = a[k] - a[k - 1];
            double f = d > 0 ? Math.max(0, Math.min(1, (levels[g] - a[k - 1]) / d)) : 1;
            out[g] = t[k - 1] + f * (t[k] - t[k - 1]);
        }
        return out;
    }

    static double interpolate(double[] t, double[] y, double x) {
        int i = TemperatureIntegral.upperIndex(t, x);
        double f = (x - t[i - 1]) / (t[i] - t[i - 1]);
        return y[i - 1] + f * (y[i] - y[i - 1]);
    }
}
