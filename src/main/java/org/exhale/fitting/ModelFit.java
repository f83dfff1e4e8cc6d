package org.exhale.fitting;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
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
 * √α = 1 − (1 − √α₀) e^(−Θ). Šesták–Berggren has no closed form: Θ(α) = ∫ dα/(α^m (1−α)^n) is
 * tabulated once per evaluation on the logit u = ln(α/(1−α)), where the integrand becomes the
 * bounded α^(1−m) (1−α)^(1−n) du (trapezoid, Δu = 0.01, from the seed to α = 1 − 1e-13), and
 * inverted by interpolation; the cost no longer grows with how far past completion a run goes.
 * Each run is subsampled to at most {@link ModelFitOptions#maxPointsPerRun()} evenly spaced points.
 *
 * <p>Parametrisation (well conditioned): per component ln k_j(T_ref,j) at a reference temperature
 * inside its own reaction range, E_j / (100 kJ/mol), the shape exponents; the fractions by a
 * softmax of k − 1 logits. Every parameter has a box ({@link #E_MIN_J_PER_MOL} to
 * {@link #E_MAX_J_PER_MOL}, the case-file shape ranges, logits within ±12); a parameter that ends
 * on its bound is reported as at the bound, without an interval. Seeds come from an isoconversional
 * E(α): the α range is cut into k equal slices, E_j is the mean E over slice j, T_ref,j the
 * temperature at the slice's middle in the median-rate run and k_j = β E_j/(R T_ref,j²)
 * (Kissinger's peak condition).
 *
 * <p>Intervals. Residuals of neighbouring samples are correlated (smooth misfit, drift, a lag),
 * so the N residuals are not N independent pieces of information. The lag-1 autocorrelation ρ of
 * the residuals gives an effective sample size N_eff = N (1 − ρ)/(1 + ρ) (the AR(1) variance
 * inflation, common practice, no source); the covariance σ²(JᵀJ)⁻¹ is inflated by N/N_eff and the
 * Student t quantile takes N_eff − p degrees of freedom. Mapped to E, ln A, shape and fractions by
 * the delta method. {@link KineticsAnalysis} widens them further by a jackknife over the runs.
 */
public final class ModelFit {
    private static final double R = PhysicalConstants.GAS_CONSTANT;
    private static final double E_SCALE = 1e5;
    /** Lowest activation energy a fitted component may take [J/mol]. */
    public static final double E_MIN_J_PER_MOL = 10e3;
    /** Highest activation energy a fitted component may take [J/mol]. */
    public static final double E_MAX_J_PER_MOL = 800e3;
    private static final double LOGIT_MAX = 12;
    private static final double[] GL_NODE = {0.5 - Math.sqrt(0.15), 0.5, 0.5 + Math.sqrt(0.15)};
    private static final double[] GL_WEIGHT = {5.0 / 18, 8.0 / 18, 5.0 / 18};
    private static final double SB_STEP = 0.01;
    private static final double SB_U_END = 30;

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
        ModelKind kind = options.model();
        List<ConversionCurve> byRate = new ArrayList<>(runs);
        byRate.sort(Comparator.comparingDouble(ConversionCurve::heatingRateKPerS));
        ConversionCurve mid = byRate.get(byRate.size() / 2);
        double[] alpha = seed.alpha();
        double[] energy = seed.energyJPerMol();
        double fallback = seed.meanEnergy();
        if (!Double.isFinite(fallback)) {
            fallback = 150e3;
        }
        int per = 2 + kind.shapeParameters();
        int p = k * per + (k - 1);
        double[] tref = new double[k];
        double[] start = new double[p];
        double[] lower = new double[p];
        double[] upper = new double[p];
        double[] midT = mid.temperatureK();
        double[] midA = mid.alphaSmooth();
        double[] midTime = mid.timeS();
        double[] shape0 = kind.initialShape();
        double[] shLo = kind.shapeLower();
        double[] shHi = kind.shapeUpper();
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
            e = Math.max(30e3, Math.min(600e3, e));
            double level = Math.max(0.02, Math.min(0.98, (lo + hi) / 2));
            double tMid = Isoconversional.crossingTimes(midTime, midA, new double[] {level}, mid.reactionFrom())[0];
            tref[j] = Double.isFinite(tMid) ? Isoconversional.interpolate(midTime, midT, tMid) : mid.peakTemperatureK();
            double kRef = mid.heatingRateKPerS() * e / (R * tref[j] * tref[j]);
            start[j * per] = Math.log(kRef);
            lower[j * per] = Math.log(kRef) - 40;
            upper[j * per] = Math.log(kRef) + 40;
            start[j * per + 1] = e / E_SCALE;
            lower[j * per + 1] = E_MIN_J_PER_MOL / E_SCALE;
            upper[j * per + 1] = E_MAX_J_PER_MOL / E_SCALE;
            for (int s = 0; s < shape0.length; s++) {
                start[j * per + 2 + s] = shape0[s];
                lower[j * per + 2 + s] = shLo[s];
                upper[j * per + 2 + s] = shHi[s];
            }
        }
        for (int z = k * per; z < p; z++) {
            lower[z] = -LOGIT_MAX;
            upper[z] = LOGIT_MAX;
        }
        ModelFit problem = new ModelFit(runs, options, tref);
        double[] target = new double[problem.points];
        int o = 0;
        for (double[] a : problem.measured) {
            System.arraycopy(a, 0, target, o, a.length);
            o += a.length;
        }
        double[] scale = new double[p];
        java.util.Arrays.fill(scale, 1.0);
        LeastSquaresFit lsq = LeastSquaresFit.fit(problem::predict, target, start, scale, options.maxIterations(),
                lower, upper);
        return problem.result(lsq);
    }

    private ModelFitResult result(LeastSquaresFit lsq) {
        double[] q = lsq.parameters();
        double[][] cov0 = lsq.covariance();
        int p = q.length;
        boolean[] fixed = lsq.atBound();
        int free = 0;
        for (boolean b : fixed) {
            free += b ? 0 : 1;
        }
        // Effective sample size from the lag-1 autocorrelation of the residuals within each run.
        double[] res = lsq.residuals();
        double num = 0, den = 0;
        int o0 = 0;
        for (double[] run : time) {
            for (int i = o0; i < o0 + run.length; i++) {
                den += res[i] * res[i];
                if (i > o0) {
                    num += res[i] * res[i - 1];
                }
            }
            o0 += run.length;
        }
        double rho = den > 0 ? Math.max(0, Math.min(0.9999, num / den)) : 0;
        double neff = Math.max(Math.min(points, free + 2.0), points * (1 - rho) / (1 + rho));
        double inflate = points / neff;
        double[][] cov = new double[p][p];
        for (int a = 0; a < p; a++) {
            for (int b = 0; b < p; b++) {
                cov[a][b] = cov0[a][b] * inflate;
            }
        }
        int dof = Math.max(1, (int) Math.floor(neff) - free);
        double t = LinearRegression.studentT(options.confidence(), dof);
        double[] w = fractions(q);
        String[] shapeNames = options.model().shapeNames();
        List<FittedComponent> parts = new ArrayList<>();
        int zb = k * perComponent;
        for (int j = 0; j < k; j++) {
            int b = j * perComponent;
            Set<String> atBound = new TreeSet<>();
            double e = q[b + 1] * E_SCALE;
            double sdE = E_SCALE * Math.sqrt(Math.max(0, cov[b + 1][b + 1]));
            if (fixed[b + 1]) {
                atBound.add("Ea");
            }
            double g1 = E_SCALE / (R * referenceK[j]);
            double varLnA = fixed[b + 1] ? cov[b][b] : cov[b][b] + g1 * g1 * cov[b + 1][b + 1] + 2 * g1 * cov[b][b + 1];
            double lnA = q[b] + e / (R * referenceK[j]);
            double[] shape = new double[shapeCount];
            double[] shapeHw = new double[shapeCount];
            for (int s = 0; s < shapeCount; s++) {
                shape[s] = q[b + 2 + s];
                shapeHw[s] = t * Math.sqrt(Math.max(0, cov[b + 2 + s][b + 2 + s]));
                if (fixed[b + 2 + s]) {
                    atBound.add(shapeNames[s]);
                    shapeHw[s] = Double.NaN;
                }
            }
            double wHw = 0;
            if (k > 1) {
                // ∂w_j/∂z_i = w_j (δ_ji − w_i), i = 1..k−1 (z_0 = 0 fixed); logits at a bound held fixed.
                double[] grad = new double[k - 1];
                for (int i = 1; i < k; i++) {
                    grad[i - 1] = w[j] * ((i == j ? 1 : 0) - w[i]);
                }
                double var = 0;
                boolean anyFree = false;
                for (int a = 0; a < k - 1; a++) {
                    for (int c = 0; c < k - 1; c++) {
                        if (!fixed[zb + a] && !fixed[zb + c]) {
                            var += grad[a] * grad[c] * cov[zb + a][zb + c];
                            anyFree = true;
                        }
                    }
                }
                boolean logitFixed = (j > 0 && fixed[zb + j - 1]);
                if (logitFixed || !anyFree) {
                    atBound.add("fraction");
                    wHw = Double.NaN;
                } else {
                    wHw = t * Math.sqrt(Math.max(0, var));
                }
            }
            parts.add(new FittedComponent("c" + (j + 1), w[j], wHw, options.model().model(shape), shape, shapeHw,
                    e, fixed[b + 1] ? Double.NaN : t * sdE, lnA, t * Math.sqrt(Math.max(0, varLnA)), referenceK[j],
                    atBound));
        }
        parts.sort(Comparator.comparingDouble(FittedComponent::referenceTemperatureK));
        List<FittedComponent> named = new ArrayList<>();
        for (int j = 0; j < parts.size(); j++) {
            named.add(parts.get(j).withName("c" + (j + 1)));
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
                lsq.iterations(), runs, rho, neff);
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
        double seed = options.seedConversion();
        double[][] sbTables = new double[k][];
        for (int j = 0; j < k && options.model() == ModelKind.SESTAK_BERGGREN; j++) {
            int b = j * perComponent;
            sbTables[j] = sestakBerggrenTable(q[b + 2], q[b + 3], seed);
        }
        double uStart = Math.log(seed / (1 - seed));
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
                double shape0 = shapeCount > 0 ? q[b + 2] : 0;
                double[] table = sbTables[j];
                int node = 0;
                for (int i = 0; i < n; i++) {
                    if (i > 0) {
                        double h = t[i] - t[i - 1];
                        double dTheta = 0;
                        for (int g = 0; g < 3; g++) {
                            double temperature = tk[i - 1] + GL_NODE[g] * (tk[i] - tk[i - 1]);
                            double x = lnk - eOverR * (1 / temperature - invRef);
                            dTheta += GL_WEIGHT[g] * h * Math.exp(Math.min(x, 50));
                        }
                        theta += dTheta;
                    }
                    double a;
                    switch (options.model()) {
                        case NTH_ORDER -> a = nthOrder(theta, shape0);
                        case AVRAMI_EROFEEV -> a = avrami(theta, shape0, seed);
                        case RANDOM_SCISSION -> {
                            double s0 = Math.sqrt(seed);
                            double s = 1 - (1 - s0) * Math.exp(-theta);
                            a = s * s;
                        }
                        default -> {
                            while (node + 1 < table.length && table[node + 1] < theta) {
                                node++;
                            }
                            if (node + 1 >= table.length) {
                                a = 1;
                            } else {
                                double d = table[node + 1] - table[node];
                                double f = d > 0 ? Math.max(0, Math.min(1, (theta - table[node]) / d)) : 0;
                                double u = uStart + (node + f) * SB_STEP;
                                a = 1 / (1 + Math.exp(-u));
                            }
                        }
                    }
                    out[o + i] += w[j] * a;
                }
            }
            o += n;
        }
        return out;
    }

    /**
     * Θ at u = u0 + i Δu for the Šesták–Berggren model, Θ(u0) = 0, u0 the logit of the seed:
     * dΘ/du = α^(1−m) (1−α)^(1−n), α = 1/(1 + e^(−u)), trapezoid rule.
     */
    static double[] sestakBerggrenTable(double m, double n, double seed) {
        double u0 = Math.log(seed / (1 - seed));
        int count = (int) Math.ceil((SB_U_END - u0) / SB_STEP) + 1;
        double[] theta = new double[count];
        double prev = sbIntegrand(u0, m, n);
        for (int i = 1; i < count; i++) {
            double g = sbIntegrand(u0 + i * SB_STEP, m, n);
            theta[i] = theta[i - 1] + 0.5 * SB_STEP * (prev + g);
            prev = g;
        }
        return theta;
    }

    private static double sbIntegrand(double u, double m, double n) {
        // ln α = −ln(1 + e^(−u)), ln(1 − α) = −ln(1 + e^u), both without overflow.
        double lnA = u > 0 ? -Math.log1p(Math.exp(-u)) : u - Math.log1p(Math.exp(u));
        double ln1mA = u > 0 ? -u - Math.log1p(Math.exp(-u)) : -Math.log1p(Math.exp(u));
        return Math.exp((1 - m) * lnA + (1 - n) * ln1mA);
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
}
