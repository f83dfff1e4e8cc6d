package org.exhale.simulation;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.exhale.recipe.Recipe;
import org.exhale.recipe.Segment;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.ODEStateAndDerivative;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.hipparchus.ode.sampling.ODEStateInterpolator;

/**
 * Drives the integrator over one corner's bake, segment by segment (restarting at every recipe
 * breakpoint), and observes every accepted step through its dense output: history rows on a fixed
 * grid, maxima refined between samples by golden-section search, residue crossings by Brent's
 * method, and the quasi-steady error estimate.
 */
final class CornerRun {
    /**
     * Samples per accepted step at which observables are evaluated: 8 across the long steps of the
     * eighth-order explicit method, 3 across the many short steps of the second-order Rosenbrock
     * method (whose dense output is only quadratic).
     */
    private final int samplesPerStep;

    private final BakeModel model;
    private final Recipe recipe;
    private final SimulationSettings settings;
    private final double residueTarget;
    private final String corner;
    private final double offsetK;
    private final List<String> columns;
    private final int[] tracked;
    private final double[] maxValue;
    private final double[] maxTime;
    private final double[][] maxRow;
    private final double[][] samples;
    private final double[] sampleTimes;
    private final double[] scratchState;
    private final double[] scratchObs;
    private final List<double[]> history = new ArrayList<>();
    private double nextSample;
    private double timeTo1pct = Double.NaN;
    private double timeToTarget = Double.NaN;
    private double qsError;
    private double storedPeak;
    private boolean first = true;
    private long evaluations;

    private final double gasScale;

    /**
     * @param gasScale expected peak of the normalised moles under the cap (from a quasi-steady
     *                 pre-run), which sets the absolute tolerance of the gas states
     */
    CornerRun(BakeCase bake, String corner, double offsetK, GasRegime regime, SimulationSettings settings,
              double gasScale) {
        this.gasScale = Double.isFinite(gasScale) && gasScale > 0 ? Math.min(gasScale, 1) : 1;
        this.model = new BakeModel(bake, offsetK, regime);
        this.recipe = bake.recipe();
        this.settings = settings;
        this.residueTarget = bake.limits().residue();
        this.corner = corner;
        this.offsetK = offsetK;
        this.columns = model.observableNames();
        java.util.List<Integer> t = new java.util.ArrayList<>(java.util.List.of(
                model.oSetpoint, model.oWafer, model.oPressure, model.oRelax, model.oStored));
        if (model.structure() != null) {
            t.addAll(java.util.List.of(model.oCentreStress + 1, model.oDeflection, model.oCrack, model.oDelam, model.oCompression));
        }
        if (model.oLoad >= 0) {
            t.addAll(java.util.List.of(model.oLoad, model.oPpm));
        }
        this.tracked = t.stream().mapToInt(Integer::intValue).toArray();
        this.maxValue = new double[tracked.length];
        this.maxTime = new double[tracked.length];
        this.maxRow = new double[tracked.length][];
        java.util.Arrays.fill(maxValue, Double.NEGATIVE_INFINITY);
        this.samplesPerStep = regime == GasRegime.FULL_GAS && !settings.explicitFullGas() ? 3 : 8;
        this.samples = new double[samplesPerStep + 1][model.observableCount];
        this.sampleTimes = new double[samplesPerStep + 1];
        this.scratchState = new double[model.dim];
        this.scratchObs = new double[model.observableCount];
    }

    CornerResult run() {
        List<Segment> segments = recipe.segments();
        double[] y = model.initialState(recipe.startK());
        double[] absTol = absoluteTolerances();
        double rtol = settings.relativeTolerance();
        double hNext = 0;
        RosenbrockIntegrator stiff = null;
        DormandPrince853Integrator explicit = null;
        boolean useRosenbrock = model.regime == GasRegime.FULL_GAS && !settings.explicitFullGas();
        if (useRosenbrock) {
            stiff = new RosenbrockIntegrator(settings.stiffRelativeTolerance(), absTol);
        } else {
            explicit = new DormandPrince853Integrator(1e-9, 1e7, absTol, fill(rtol, absTol.length));
        }
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return model.dim;
            }

            @Override
            public double[] computeDerivatives(double t, double[] state) {
                double[] dy = new double[state.length];
                model.derivatives(t, state, dy);
                return dy;
            }
        };
        long[] count = new long[1];
        for (Segment seg : segments) {
            model.setSegment(seg);
            if (first) {
                model.observe(seg.startTimeS(), y, samples[samplesPerStep]);
                sampleTimes[samplesPerStep] = seg.startTimeS();
                initialObservation(samples[samplesPerStep]);
                first = false;
            }
            if (seg.durationS() <= 0) {
                continue;
            }
            if (useRosenbrock) {
                hNext = stiff.integrate(model::derivatives, seg.startTimeS(), y, seg.endTimeS(), hNext, this::onStep);
            } else {
                explicit.clearStepHandlers();
                explicit.addStepHandler(interpolator -> onStep(new HipparchusStep(interpolator)));
                ODEStateAndDerivative end = explicit.integrate(ode, new ODEState(seg.startTimeS(), y), seg.endTimeS());
                y = end.getPrimaryState();
                count[0] += explicit.getEvaluations();
            }
            // segment end always recorded
            double[] last = samples[samplesPerStep];
            if (settings.sampleIntervalS() > 0 && (history.isEmpty() || history.get(history.size() - 1)[0] < last[0])) {
                history.add(last.clone());
            }
        }
        evaluations = useRosenbrock ? stiff.evaluations() : count[0];
        double[] end = samples[samplesPerStep];
        double gasified = end[model.oGasified];
        double balance = model.regime == GasRegime.FULL_GAS
                ? Math.abs(gasified - end[model.oVented] - end[model.oStored]) / Math.max(gasified, 1e-300)
                : end[model.oStored] / Math.max(gasified, 1e-300);
        Map<String, Extremum> maxima = new LinkedHashMap<>();
        Map<String, double[]> rows = new LinkedHashMap<>();
        for (int i = 0; i < tracked.length; i++) {
            maxima.put(columns.get(tracked[i]), new Extremum(maxValue[i], maxTime[i]));
            rows.put(columns.get(tracked[i]), maxRow[i]);
        }
        return new CornerResult(corner, offsetK, model.regime, qsError, maxima, rows, timeTo1pct, timeToTarget,
                end[model.oUnconverted], end[model.oDose], balance, columns, history, evaluations);
    }

    private static double[] fill(double v, int n) {
        double[] a = new double[n];
        java.util.Arrays.fill(a, v);
        return a;
    }

    private double[] absoluteTolerances() {
        double[] a = new double[model.dim];
        for (int j = 0; j < model.k; j++) {
            a[j] = 1e-12;
        }
        if (model.regime == GasRegime.FULL_GAS) {
            for (int j = 0; j < model.k; j++) {
                a[model.iGas + j] = Math.max(1e-7 * gasScale, 1e-30);
                a[model.iVent + j] = 1e-12;
            }
        }
        a[model.iDose] = 1e-6;
        if (model.iChamber >= 0) {
            for (int j = 0; j < model.k; j++) {
                a[model.iChamber + j] = 1e-14;
                a[model.iExhaust + j] = 1e-12;
            }
        }
        return a;
    }

    private void initialObservation(double[] obs) {
        for (int i = 0; i < tracked.length; i++) {
            maxValue[i] = obs[tracked[i]];
            maxTime[i] = obs[0];
            maxRow[i] = obs.clone();
        }
        if (settings.sampleIntervalS() > 0) {
            history.add(obs.clone());
            nextSample = obs[0] + settings.sampleIntervalS();
        }
        checkCrossings(obs, obs, null);
        storedPeak = obs[model.oStored];
    }

    private void onStep(StepView step) {
        double t0 = step.start();
        double t1 = step.end();
        // samples[samplesPerStep] holds the observation at t0 from the previous step
        double[] tmp = samples[0];
        samples[0] = samples[samplesPerStep];
        samples[samplesPerStep] = tmp;
        sampleTimes[0] = t0;
        for (int i = 1; i <= samplesPerStep; i++) {
            double t = i == samplesPerStep ? t1 : t0 + (t1 - t0) * i / samplesPerStep;
            sampleTimes[i] = t;
            step.state(t, scratchState);
            model.observe(t, scratchState, samples[i]);
        }
        // history on the fixed grid
        if (settings.sampleIntervalS() > 0) {
            while (nextSample <= t1) {
                double[] row = new double[model.observableCount];
                step.state(nextSample, scratchState);
                model.observe(nextSample, scratchState, row);
                history.add(row);
                nextSample += settings.sampleIntervalS();
            }
        }
        // maxima, refined inside the step
        for (int c = 0; c < tracked.length; c++) {
            int col = tracked[c];
            int best = 0;
            for (int i = 1; i <= samplesPerStep; i++) {
                if (samples[i][col] > samples[best][col]) {
                    best = i;
                }
            }
            double v = samples[best][col];
            double tv = sampleTimes[best];
            if (v >= maxValue[c]) {
                // refine around an interior best sample; at an end of the step only when the
                // parabola through the three end samples peaks inside the end interval
                if (best > 0 && best < samplesPerStep || best == samplesPerStep && vertexInside(col, samplesPerStep - 2)
                        || best == 0 && vertexInside(col, 0)) {
                    double[] refined = refineMax(step, col, sampleTimes[Math.max(best - 1, 0)],
                            sampleTimes[Math.min(best + 1, samplesPerStep)]);
                    if (refined[1] > v) {
                        v = refined[1];
                        tv = refined[0];
                    }
                }
                maxValue[c] = v;
                maxTime[c] = tv;
                // keep the whole row at the maximum, copied from the sample when it is one
                if (maxRow[c] == null || maxRow[c].length != model.observableCount) {
                    maxRow[c] = new double[model.observableCount];
                }
                if (tv == sampleTimes[best]) {
                    System.arraycopy(samples[best], 0, maxRow[c], 0, model.observableCount);
                } else {
                    step.state(tv, scratchState);
                    model.observe(tv, scratchState, maxRow[c]);
                }
            }
        }
        // residue crossings
        for (int i = 1; i <= samplesPerStep; i++) {
            checkCrossings(samples[i - 1], samples[i], step);
        }
        // quasi-steady error estimate: τ_g |d ln n/dt| where the stored gas matters
        if (model.regime == GasRegime.QUASI_STEADY) {
            for (int i = 1; i <= samplesPerStep; i++) {
                double n1 = samples[i][model.oStored];
                double n0 = samples[i - 1][model.oStored];
                storedPeak = Math.max(storedPeak, n1);
                double dt = sampleTimes[i] - sampleTimes[i - 1];
                if (dt > 0 && n1 > 1e-3 * storedPeak && n0 > 0) {
                    double relax = Math.max(samples[i][model.oRelax], samples[i - 1][model.oRelax]);
                    double est = relax * Math.abs(Math.log(n1 / n0)) / dt;
                    qsError = Math.max(qsError, Double.isNaN(est) ? Double.POSITIVE_INFINITY : est);
                }
            }
        }
    }

    private void checkCrossings(double[] before, double[] after, StepView step) {
        double u1 = after[model.oUnconverted];
        if (Double.isNaN(timeTo1pct) && u1 <= 0.01) {
            timeTo1pct = crossing(step, before, after, 0.01);
        }
        if (Double.isNaN(timeToTarget) && u1 <= residueTarget) {
            timeToTarget = crossing(step, before, after, residueTarget);
        }
    }

    private double crossing(StepView step, double[] before, double[] after, double level) {
        double ta = before[0];
        double tb = after[0];
        if (step == null || before[model.oUnconverted] <= level || tb <= ta) {
            return tb == ta ? ta : tb;
        }
        BrentSolver solver = new BrentSolver(1e-9 * Math.max(1, tb), 1e-14);
        return solver.solve(200, t -> {
            step.state(t, scratchState);
            model.observe(t, scratchState, scratchObs);
            return scratchObs[model.oUnconverted] - level;
        }, ta, tb);
    }

    /** Whether the parabola through samples i, i+1, i+2 of a column is concave with its vertex in [t_i, t_{i+2}]. */
    private boolean vertexInside(int col, int i) {
        double x0 = sampleTimes[i];
        double x1 = sampleTimes[i + 1];
        double x2 = sampleTimes[i + 2];
        double y0 = samples[i][col];
        double y1 = samples[i + 1][col];
        double y2 = samples[i + 2][col];
        double d1 = (y1 - y0) / (x1 - x0);
        double d2 = (y2 - y1) / (x2 - x1);
        double curvature = (d2 - d1) / (x2 - x0);
        if (!(curvature < 0)) {
            return false;
        }
        double vertex = 0.5 * (x0 + x1) - d1 / (2 * curvature);
        return vertex > x0 && vertex < x2;
    }

    /** Golden-section search for the maximum of one observable on [a, b]; returns {t, value}. */
    private double[] refineMax(StepView step, int col, double a, double b) {
        final double g = (Math.sqrt(5) - 1) / 2;
        double x1 = b - g * (b - a);
        double x2 = a + g * (b - a);
        double f1 = valueAt(step, col, x1);
        double f2 = valueAt(step, col, x2);
        double tol = 1e-10 * Math.max(1, Math.abs(b));
        for (int it = 0; it < 80 && b - a > tol; it++) {
            if (f1 < f2) {
                a = x1;
                x1 = x2;
                f1 = f2;
                x2 = a + g * (b - a);
                f2 = valueAt(step, col, x2);
            } else {
                b = x2;
                x2 = x1;
                f2 = f1;
                x1 = b - g * (b - a);
                f1 = valueAt(step, col, x1);
            }
        }
        return f1 > f2 ? new double[]{x1, f1} : new double[]{x2, f2};
    }

    private double valueAt(StepView step, int col, double t) {
        step.state(t, scratchState);
        model.observe(t, scratchState, scratchObs);
        return scratchObs[col];
    }

    /** Adapter from a Hipparchus step interpolator. */
    private static final class HipparchusStep implements StepView {
        private final ODEStateInterpolator interpolator;

        HipparchusStep(ODEStateInterpolator interpolator) {
            this.interpolator = interpolator;
        }

        @Override
        public double start() {
            return interpolator.getPreviousState().getTime();
        }

        @Override
        public double end() {
            return interpolator.getCurrentState().getTime();
        }

        @Override
        public void state(double t, double[] out) {
            double[] s = interpolator.getInterpolatedState(t).getPrimaryState();
            System.arraycopy(s, 0, out, 0, out.length);
        }
    }
}
