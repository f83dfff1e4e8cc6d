package org.exhale.fitting;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.exhale.PhysicalConstants;

/**
 * Nonlinear least-squares fit of the parallel-component model (MODEL.md §3) to all runs at once:
 * α(t) = Σ w_j α_j(t), dα_j/dt = A_j exp(−E_j/RT(t)) f_j(α_j), simulated along each run's
 * measured temperature history, by Levenberg–Marquardt.
 *
 * <p>Simulation. Each component depends on time only through Θ_j(t) = ∫ k_j(T(t′)) dt′, computed
 * along the sampled history (T linear between samples, three-point Gauss–Legendre per piece).
 * Then α_j = g(Θ_j) in closed form: n-th order (1 − α)^(1−n) = 1 + (n − 1)Θ (α = 1 − e^(−Θ) for
 * n = 1); Avrami–Erofeev α = 1 − exp(−(Θ + Θ₀)^n); random scission (L = 2)
 * √α = 1 − (1 − √α₀) e^(−Θ); Šesták–Berggren by fourth-order Runge–Kutta in Θ. Cost is
 * O(runs × points × components) per evaluation; each run is subsampled to at most
 * {@link ModelFitOptions#maxPointsPerRun()} evenly spaced points.
 *
 * <p>Parametrisation (well conditioned): per component ln k_j(T_ref,j) at a reference temperature
 * inside its own reaction range, E_j / (100 kJ/mol), the logarithms of the shape exponents; the
 * fractions by a softmax of k − 1 logits. Seeds come from an isoconversional E(α): the α range is
 * cut into k equal slices, E_j is the mean E over slice j, T_ref,j the temperature at the slice's
 * middle in the median-rate run and k_j = β E_j/(R T_ref,j²) (Kissinger's peak condition).
 *
 * <p>Intervals from σ²(JᵀJ)⁻¹ at the optimum mapped to E, ln A, shape and fractions by the delta
 * method, times Student's t with N − p degrees of freedom. The residuals of neighbouring samples
 * are correlated in real data, so these intervals are optimistic; the isoconversional intervals
 * across runs are the more honest ones.
 */
public final class ModelFit {
    private static final double R = PhysicalConstants.GAS_CONSTANT;
    private static final double E_SCALE = 1e5;
    private static final double[] GL_NODE = {0.5 - Math.sqrt(0.15), 0.5, 0.5 + Math.sqrt(0.15)};
    private static final double[] GL_WEIGHT = {5.0 / 18, 8.0 / 18, 5.0 / 18};

    private final ModelFitOptions options;
    private final int k;
    private final int shapeCount;
    private final int perComponent;
    private final double[][] time;
    private final double[][] temp;
    private final double[][] measured;
    private final double[] referenceK;
    private final String[] labels;
    private final int points;

    private ModelFit(List<ConversionCurve> runs, ModelFitOptions options, double[] referenceK) {
        this.options = options;
        this.k = options.components();
        this.shapeCount = options.model().shapeParameters();
        this.perComponent = 2 + shapeCount;
        this.referenceK = referenceK.clone();
        int m = runs.size();
        time = new double[m][];
        temp = new double[m][];
        measured = new double[m][];
        labels = new String[m];
        int total = 0;
        for (int r = 0; r < m; r++) {
            ConversionCurve c = runs.get(r);
            double[] t = c.timeS(), tk = c.temperatureK(), a = c.alpha();
            int n = t.length;
            int stride = Math.max(1, (int) Math.ceil((double) n / options.maxPointsPerRun()));
            int count = (n - 1) / stride + 1 + ((n - 1) % stride == 0 ? 0 : 1);
            time[r] = new double[count];
            temp[r] = new double[count];
            measured[r] = new double[count];
            for (int i = 0, j = 0; j < count; i += stride, j++) {
                int src = Math.min(i, n - 1);
                time[r][j] = t[src];
                temp[r][j] = tk[src];
                measured[r][j] = a[src];
            }
            labels[r] = c.label();
            total += count;
        }
        points = total;
    }

    /**
     * Fits the model.
     *
     * @param runs     pre-processed runs (at least one)
     * @param options  settings
     * @param seed     an isoconversional E(α) to start from (Friedman recommended)
     */
    public static ModelFitResult fit(List<ConversionCurve> runs, ModelFitOptions options, IsoconversionalResult seed) {
        if (runs.isEmpty()) {
            throw new IllegalArgumentException("the model fit needs at least one run");
        }
        int k = options.components();
        List<ConversionCurve> byRate = new ArrayList<>(runs);
        byRate.sort(Comparator.comparingDouble(ConversionCurve::heatingRateKPerS));
        ConversionCurve mid = byRate.get(byRate.size() / 2);
        double[] alpha = seed.alpha();
        double[] energy = seed.energyJPerMol();
        double fallback = seed.meanEnergy();
        if (!Double.isFinite(fallback)) {
            fallback = 150e3;
        }
        double[] tref = new double[k];
        double[] start = new double[k * (2 + options.model().shapeParameters()) + (k - 1)];
        int per = 2 + options.model().shapeParameters();
        double[] midT = mid.temperatureK();
        double[] midA = mid.alphaSmooth();
        double[] midTime = mid.timeS();
        for (int j = 0; j < k; j++) {
            double lo = (double) j / k, hi = (double) (j + 1) / k;
            double sum = 0;
            int n = 0;
            for (int g = 0; g < alpha.length; g++) {
                if (alpha[g] >= lo && alpha[g] <= hi && Double.isFinite(energy[g]) && energy[g] > 0) {
                    sum += energy[g];
                    n++;
                }
            }
            double e = n > 0 ? sum / n : fallback;
            e = Math.max(20e3, Math.min(600e3, e));
            double level = Math.max(0.02, Math.min(0.98, (lo + hi) / 2));
            double tMid = Isoconversional.crossingTimes(midTime, midA, new double[] {level}, mid.reactionFrom())[0];
            tref[j] = Double.isFinite(tMid) ? Isoconversional.interpolate(midTime, midT, tMid) : mid.peakTemperatureK();
            double kRef = mid.heatingRateKPerS() * e / (R * tref[j] * tref[j]);
            start[j * per] = Math.log(kRef);
            start[j * per + 1] = e / E_SCALE;
            double[] shape = options.model().initialShape();
            for (int s = 0; s < shape.length; s++) {
                start[j * per + 2 + s] = Math.log(shape[s]);
            }
        }
        ModelFit problem = new ModelFit(runs, options, tref);
        double[] target = new double[problem.points];
        int o = 0;
        for (double[] a : problem.measured) {
            System.arraycopy(a, 0, target, o, a.length);
            o += a.length;
        }
        double[] scale = new double[start.length];
        java.util.Arrays.fill(scale, 1.0);
        LeastSquaresFit lsq = LeastSquaresFit.fit(problem::predict, target, start, scale, options.maxIterations());
        return problem.result(lsq);
    }

    private ModelFitResult result(LeastSquaresFit lsq) {
        double[] q = lsq.parameters();
        double[][] cov = lsq.covariance();
        int p = q.length;
        int dof = Math.max(1, points - p);
        double t = LinearRegression.studentT(options.confidence(), dof);
        double[] w = fractions(q);
        List<FittedComponent> parts = new ArrayList<>();
        for (int j = 0; j < k; j++) {
            int b = j * perComponent;
            double e = q[b + 1] * E_SCALE;
            double sdE = E_SCALE * Math.sqrt(Math.max(0, cov[b + 1][b + 1]));
            double g1 = E_SCALE / (R * referenceK[j]);
            double varLnA = cov[b][b] + g1 * g1 * cov[b + 1][b + 1] + 2 * g1 * cov[b][b + 1];
            double lnA = q[b] + e / (R * referenceK[j]);
            double[] shape = new double[shapeCount];
            double[] shapeHw = new double[shapeCount];
            for (int s = 0; s < shapeCount; s++) {
                shape[s] = Math.exp(q[b + 2 + s]);
                shapeHw[s] = t * shape[s] * Math.sqrt(Math.max(0, cov[b + 2 + s][b + 2 + s]));
            }
            double wHw = 0;
            if (k > 1) {
                // ∂w_j/∂z_i = w_j (δ_ji − w_i), i = 1..k−1 (z_0 = 0 fixed).
                double[] grad = new double[k - 1];
                for (int i = 1; i < k; i++) {
                    grad[i - 1] = w[j] * ((i == j ? 1 : 0) - w[i]);
                }
                int zb = k * perComponent;
                double var = 0;
                for (int a = 0; a < k - 1; a++) {
                    for (int c = 0; c < k - 1; c++) {
                        var += grad[a] * grad[c] * cov[zb + a][zb + c];
                    }
                }
                wHw = t * Math.sqrt(Math.max(0, var));
            }
            parts.add(new FittedComponent("c" + (j + 1), w[j], wHw, options.model().model(shape), shape, shapeHw,
                    e, t * sdE, lnA, t * Math.sqrt(Math.max(0, varLnA)), referenceK[j]));
        }
        parts.sort(Comparator.comparingDouble(FittedComponent::referenceTemperatureK));
        List<FittedComponent> named = new ArrayList<>();
        for (int j = 0; j < parts.size(); j++) {
            FittedComponent c = parts.get(j);
            named.add(new FittedComponent("c" + (j + 1), c.fraction(), c.fractionHalfWidth(), c.model(), c.shape(),
                    c.shapeHalfWidth(), c.energyJPerMol(), c.energyHalfWidthJPerMol(), c.lnPreExponential(),
                    c.lnPreExponentialHalfWidth(), c.referenceTemperatureK()));
        }
        double[] model = predict(q);
        List<RunFit> runs = new ArrayList<>();
        int o = 0;
        for (int r = 0; r < time.length; r++) {
            int n = time[r].length;
            runs.add(new RunFit(labels[r], time[r], temp[r], measured[r], java.util.Arrays.copyOfRange(model, o, o + n)));
            o += n;
        }
        double ssr = lsq.ssr();
        double base = points * Math.log(Math.max(ssr, Double.MIN_NORMAL) / points);
        return new ModelFitResult(options, named, ssr, points, p, base + 2 * p, base + p * Math.log(points),
                lsq.iterations(), runs);
    }

    private double[] fractions(double[] q) {
        double[] w = new double[k];
        int zb = k * perComponent;
        double max = 0;
        for (int j = 1; j < k; j++) {
            max = Math.max(max, q[zb + j - 1]);
        }
        double sum = 0;
        for (int j = 0; j < k; j++) {
            w[j] = Math.exp((j == 0 ? 0 : q[zb + j - 1]) - max);
            sum += w[j];
        }
        for (int j = 0; j < k; j++) {
            w[j] /= sum;
        }
        return w;
    }

    /** Model α at every sample of every run, runs concatenated. */
    double[] predict(double[] q) {
        double[] out = new double[points];
        double[] w = fractions(q);
        int o = 0;
        for (int r = 0; r < time.length; r++) {
            double[] t = time[r], tk = temp[r];
            int n = t.length;
            for (int j = 0; j < k; j++) {
                int b = j * perComponent;
                double lnk = q[b];
                double eOverR = q[b + 1] * E_SCALE / R;
                double invRef = 1 / referenceK[j];
                double theta = 0;
                double alphaSb = options.seedConversion();
                double[] shape = new double[shapeCount];
                for (int s = 0; s < shapeCount; s++) {
                    shape[s] = Math.max(0.02, Math.min(20, Math.exp(q[b + 2 + s])));
                }
                for (int i = 0; i < n; i++) {
                    if (i > 0) {
                        double h = t[i] - t[i - 1];
                        double dTheta = 0;
                        for (int g = 0; g < 3; g++) {
                            double temp = tk[i - 1] + GL_NODE[g] * (tk[i] - tk[i - 1]);
                            double x = lnk - eOverR * (1 / temp - invRef);
                            dTheta += GL_WEIGHT[g] * h * Math.exp(Math.min(x, 50));
                        }
                        theta += dTheta;
                        if (options.model() == ModelKind.SESTAK_BERGGREN) {
                            alphaSb = rk4SestakBerggren(alphaSb, dTheta, shape[0], shape[1]);
                        }
                    }
                    double a = switch (options.model()) {
                        case NTH_ORDER -> nthOrder(theta, shape[0]);
                        case AVRAMI_EROFEEV -> avrami(theta, shape[0], options.seedConversion());
                        case RANDOM_SCISSION -> {
                            double s0 = Math.sqrt(options.seedConversion());
                            double s = 1 - (1 - s0) * Math.exp(-theta);
                            yield s * s;
                        }
                        case SESTAK_BERGGREN -> Math.min(1, alphaSb);
                    };
                    out[o + i] += w[j] * a;
                }
            }
            o += n;
        }
        return out;
    }

    static double nthOrder(double theta, double n) {
        if (Math.abs(n - 1) < 1e-9) {
            return -Math.expm1(-theta);
        }
        double base = 1 + (n - 1) * theta;
        if (base <= 0) {
            return 1;
        }
        return 1 - Math.pow(base, 1 / (1 - n));
    }

    static double avrami(double theta, double n, double seed) {
        double theta0 = n == 1 ? 0 : Math.pow(-Math.log1p(-seed), 1 / n);
        return -Math.expm1(-Math.pow(theta + theta0, n));
    }

    private static double rk4SestakBerggren(double a, double dTheta, double m, double n) {
        int steps = Math.max(1, (int) Math.ceil(dTheta / 0.02));
        double h = dTheta / steps;
        for (int s = 0; s < steps; s++) {
            double k1 = sb(a, m, n), k2 = sb(a + h / 2 * k1, m, n), k3 = sb(a + h / 2 * k2, m, n), k4 = sb(a + h * k3, m, n);
            a += h / 6 * (k1 + 2 * k2 + 2 * k3 + k4);
        }
        return a;
    }

    private static double sb(double a, double m, double n) {
        if (a >= 1) {
            return 0;
        }
        double x = Math.max(a, 0);
        return Math.pow(x, m) * Math.pow(1 - x, n);
    }
}
