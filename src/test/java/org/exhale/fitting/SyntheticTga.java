package org.exhale.fitting;

import java.util.List;
import java.util.Random;
import org.exhale.PhysicalConstants;
import org.exhale.kinetics.ReactionModel;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.ode.sampling.ODEStateInterpolator;
import org.hipparchus.ode.sampling.ODEStepHandler;

/**
 * Synthetic thermogravimetric runs made independently of the fitter: direct numerical integration
 * of dα_j/dt = A_j exp(−E_j/(R T)) f_j(α_j), T = T0 + β t, with Hipparchus's Dormand–Prince 8(5,3)
 * at relative tolerance 1e-12, sampled by its dense output. The mass is 1 − Σ w_j α_j (no char),
 * as a fraction of the initial mass; optional Gaussian noise on the mass from a seeded
 * {@link Random}.
 */
public final class SyntheticTga {
    private SyntheticTga() {
    }

    /** One parallel component of the synthetic polymer. */
    public record Part(double fraction, double preExponentialPerS, double energyJPerMol, ReactionModel model) {
    }

    public static TgaRun run(String label, List<Part> parts, double betaKPerMin, double t0K, double t1K,
                             double stepK, double seedAlpha, double noiseSd, Random random) {
        double beta = betaKPerMin / 60;
        int n = (int) Math.round((t1K - t0K) / stepK) + 1;
        double[] time = new double[n];
        double[] temp = new double[n];
        double[] mass = new double[n];
        for (int i = 0; i < n; i++) {
            temp[i] = t0K + i * stepK;
            time[i] = (temp[i] - t0K) / beta;
        }
        int k = parts.size();
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return k;
            }

            @Override
            public double[] computeDerivatives(double t, double[] y) {
                double tk = t0K + beta * t;
                double[] d = new double[k];
                for (int j = 0; j < k; j++) {
                    Part p = parts.get(j);
                    d[j] = p.preExponentialPerS() * Math.exp(-p.energyJPerMol() / (PhysicalConstants.GAS_CONSTANT * tk))
                            * p.model().f(Math.min(y[j], 1));
                }
                return d;
            }
        };
        double[] y0 = new double[k];
        for (int j = 0; j < k; j++) {
            y0[j] = parts.get(j).model().needsSeed() ? seedAlpha : 0;
        }
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-12, time[n - 1] / 20, 1e-14, 1e-12);
        double[][] states = new double[n][];
        states[0] = y0.clone();
        integrator.addStepHandler(new ODEStepHandler() {
            private int next = 1;

            @Override
            public void handleStep(ODEStateInterpolator interpolator) {
                double end = interpolator.getCurrentState().getTime();
                while (next < n && time[next] <= end + 1e-9) {
                    states[next] = interpolator.getInterpolatedState(Math.min(time[next], end)).getPrimaryState();
                    next++;
                }
            }
        });
        integrator.integrate(ode, new ODEState(0, y0), time[n - 1]);
        for (int i = 0; i < n; i++) {
            double m = 1;
            for (int j = 0; j < k; j++) {
                m -= parts.get(j).fraction() * Math.min(1, states[i][j]);
            }
            mass[i] = m + (noiseSd > 0 ? noiseSd * random.nextGaussian() : 0);
        }
        return new TgaRun(label, time, temp, mass, TgaRun.MassBasis.FRACTION);
    }

    /**
     * A run sampled every {@code dtS} seconds with the artefacts of a real balance. The furnace
     * follows T_p = T0 + β t and the thermocouple records T_p; the sample lags behind it as a
     * first-order system from rest, T_s = T0 + β (t − τ (1 − e^(−t/τ))) (τ = {@code lagS}, 0 for
     * none), and reacts at T_s. The recorded mass (fraction of the initial) is 1 − Σ w_j α_j plus
     * a buoyancy drift of {@code driftPer500K} × (T_p − T0)/500 K and Gaussian noise of sd
     * {@code noiseSd} from {@code random}.
     */
    public static TgaRun artefacts(String label, List<Part> parts, double betaKPerMin, double t0K, double t1K,
                                   double dtS, double lagS, double driftPer500K, double noiseSd, Random random) {
        double beta = betaKPerMin / 60;
        double duration = (t1K - t0K) / beta;
        int n = (int) Math.floor(duration / dtS) + 1;
        double[] time = new double[n];
        double[] recorded = new double[n];
        for (int i = 0; i < n; i++) {
            time[i] = i * dtS;
            recorded[i] = t0K + beta * time[i];
        }
        java.util.function.DoubleUnaryOperator sampleT = lagS > 0
                ? t -> t0K + beta * (t - lagS * (1 - Math.exp(-t / lagS)))
                : t -> t0K + beta * t;
        int k = parts.size();
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return k;
            }

            @Override
            public double[] computeDerivatives(double t, double[] y) {
                double tk = sampleT.applyAsDouble(t);
                double[] d = new double[k];
                for (int j = 0; j < k; j++) {
                    Part p = parts.get(j);
                    d[j] = p.preExponentialPerS() * Math.exp(-p.energyJPerMol() / (PhysicalConstants.GAS_CONSTANT * tk))
                            * p.model().f(Math.min(y[j], 1));
                }
                return d;
            }
        };
        double[] y0 = new double[k];
        for (int j = 0; j < k; j++) {
            y0[j] = parts.get(j).model().needsSeed() ? 1e-4 : 0;
        }
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-12, duration / 20, 1e-14, 1e-12);
        double[][] states = new double[n][];
        states[0] = y0.clone();
        integrator.addStepHandler(new ODEStepHandler() {
            private int next = 1;

            @Override
            public void handleStep(ODEStateInterpolator interpolator) {
                double end = interpolator.getCurrentState().getTime();
                while (next < n && time[next] <= end + 1e-9) {
                    states[next] = interpolator.getInterpolatedState(Math.min(time[next], end)).getPrimaryState();
                    next++;
                }
            }
        });
        integrator.integrate(ode, new ODEState(0, y0), time[n - 1]);
        double[] mass = new double[n];
        for (int i = 0; i < n; i++) {
            double m = 1;
            for (int j = 0; j < k; j++) {
                m -= parts.get(j).fraction() * Math.min(1, states[i][j]);
            }
            m += driftPer500K * (recorded[i] - t0K) / 500;
            mass[i] = m + (noiseSd > 0 ? noiseSd * random.nextGaussian() : 0);
        }
        return new TgaRun(label, time, recorded, mass, TgaRun.MassBasis.FRACTION);
    }

    /** First-order single-component run, no noise. */
    public static TgaRun firstOrder(double energy, double a, double betaKPerMin, double t0K, double t1K, double stepK) {
        return run("beta" + betaKPerMin, List.of(new Part(1, a, energy, new ReactionModel.NthOrder(1))),
                betaKPerMin, t0K, t1K, stepK, 1e-4, 0, null);
    }
}
