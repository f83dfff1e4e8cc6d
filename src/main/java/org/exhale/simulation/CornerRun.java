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
    /** The step at whose end the residue target applies, and the unconverted fraction there. */
    private final int checkpointStep;
    private double unconvertedAtCheckpoint = Double.NaN;
    /** ∫ vent flux dt so far [mol/m²]. */
    private double ventIntegral;
    private double pressureLag;
    private double storageRate;
    private double peakFlux;
    private final boolean chamberMatters;
    private boolean first = true;
    private long evaluations;

    private final double gasScale;
    /** Spacing of the history rows [s]: the requested interval, widened to keep at most MAX_HISTORY_ROWS rows. */
    private final double historyInterval;

    /**
     * @param gasScale expected peak of the normalised moles under the cap (from a quasi-steady
     *                 pre-run), which sets the absolute tolerance of the gas states
     */
    CornerRun(BakeCase bake, String corner, double offsetK, GasRegime regime, SimulationSettings settings,
              double gasScale) {
        this(bake, corner, offsetK, regime, settings, gasScale, bake.chamber() != null);
    }

    /**
     * @param chamberMatters whether the case's chamber limit sees the vent flux (a light pre-run drops the
     *                       chamber but still judges the storage error on the flux)
     */
    CornerRun(BakeCase bake, String corner, double offsetK, GasRegime regime, SimulationSettings settings,
              double gasScale, boolean chamberMatters) {
        this.chamberMatters = chamberMatters;
        this.gasScale = Double.isFinite(gasScale) && gasScale > 0 ? Math.min(gasScale, 1) : 1;
        this.model = new BakeModel(bake, offsetK, regime);
        this.recipe = bake.recipe();
        this.historyInterval = settings.historyIntervalS(recipe.durationS());
        this.settings = settings;
        this.residueTarget = bake.limits().residue();
        this.checkpointStep = recipe.residueCheckpoint().stepIndex();
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
        double[] absTol = model.absoluteTolerances(gasScale);
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
        OrdinaryDifferentialEquation ode = model.asOde();
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
                if (seg.stepIndex() == checkpointStep) {
                    unconvertedAtCheckpoint = samples[samplesPerStep][model.oUnconverted];
                }
                continue;
            }
            try {
                if (useRosenbrock) {
                    hNext = stiff.integrate(model::derivatives, seg.startTimeS(), y, seg.endTimeS(), hNext, this::onStep);
                } else {
                    explicit.clearStepHandlers();
                    explicit.addStepHandler(interpolator -> onStep(new HipparchusStep(interpolator)));
                    ODEStateAndDerivative end = explicit.integrate(ode, new ODEState(seg.startTimeS(), y), seg.endTimeS());
                    y = end.getPrimaryState();
                    count[0] += explicit.getEvaluations();
                }
            } catch (RosenbrockIntegrator.StepFailure e) {
                throw outOfReach(e.time, stateName(e.index), e.overflow, e);
            } catch (org.hipparchus.exception.MathIllegalStateException e) {
                throw outOfReach(seg.startTimeS(), "the decomposition kinetics", false, e);
            }
            // segment end always recorded
            double[] last = samples[samplesPerStep];
            if (seg.stepIndex() == checkpointStep) {
                unconvertedAtCheckpoint = last[model.oUnconverted];
            }
            if (historyInterval > 0 && (history.isEmpty() || history.get(history.size() - 1)[0] < last[0])) {
                history.add(last.clone());
            }
        }
        evaluations = useRosenbrock ? stiff.evaluations() : count[0];
        double[] end = samples[samplesPerStep];
        // mass balance against the quadrature of the vent flux: full gas, gasified = vented + stored; quasi-steady,
        // where the storage is neglected (dn/dt = 0), gasified = vented
        double gasified = end[model.oGasified];
        double held = model.regime == GasRegime.FULL_GAS ? end[model.oStored] : 0;
        double balance = Math.abs(gasified - ventIntegral - held) / Math.max(gasified, 1e-300);
        Map<String, Extremum> maxima = new LinkedHashMap<>();
        Map<String, double[]> rows = new LinkedHashMap<>();
        for (int i = 0; i < tracked.length; i++) {
            maxima.put(columns.get(tracked[i]), new Extremum(maxValue[i], maxTime[i]));
            rows.put(columns.get(tracked[i]), maxRow[i]);
        }
        double qsError = model.regime == GasRegime.QUASI_STEADY ? storageError() : 0;
        return new CornerResult(corner, offsetK, model.regime, qsError, maxima, rows, timeTo1pct, timeToTarget,
                end[model.oUnconverted], unconvertedAtCheckpoint, end[model.oDose], balance, columns, history, evaluations);
    }

    /** What state component i means, in the words of the case file. */
    private String stateName(int i) {
        List<String> names = model.componentNames();
        if (i < model.k) {
            return "the conversion of component '" + names.get(i) + "'";
        }
        if (model.iGas >= 0 && i >= model.iGas && i < model.iGas + model.k) {
            return "the gas of component '" + names.get(i - model.iGas) + "' trapped under the cap";
        }
        if (model.iVent >= 0 && i >= model.iVent && i < model.iVent + model.k) {
            return "the gas of component '" + names.get(i - model.iVent) + "' vented through the cap";
        }
        if (i == model.iDose) {
            return "the thermal dose";
        }
        return "the product concentration in the chamber";
    }

    private OutOfReach outOfReach(double t, String what, boolean overflow, Throwable cause) {
        String when = String.format(java.util.Locale.ROOT, "at t = %.6g s (%s corner)", t, corner);
        return new OutOfReach((overflow
                ? "the model overflows: " + what + " stops being finite " + when
                  + "; the cap is effectively sealed or the rates are beyond the model's range"
                : "the model cannot resolve " + what + " " + when
                  + ": it changes faster than the time resolution of the simulation (about 1e-14 of the time) allows")
                + "; such a case is outside the model's reach, check the kinetics and cap values", cause);
    }

    private static double[] fill(double v, int n) {
        double[] a = new double[n];
        java.util.Arrays.fill(a, v);
        return a;
    }

    private void initialObservation(double[] obs) {
        for (int i = 0; i < tracked.length; i++) {
            maxValue[i] = obs[tracked[i]];
            maxTime[i] = obs[0];
            maxRow[i] = obs.clone();
        }
        if (historyInterval > 0) {
            history.add(obs.clone());
            nextSample = obs[0] + historyInterval;
        }
        checkCrossings(obs, obs, null);
        peakFlux = obs[model.oFlux];
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
        // the moles vented, by quadrature of the observed vent flux over the step's equally spaced samples
        // (independent of the states, so that the mass balance below is a check, not an identity)
        ventIntegral += quadrature(model.oFlux, t1 - t0);
        // history on the fixed grid
        if (historyInterval > 0) {
            while (nextSample <= t1) {
                double[] row = new double[model.observableCount];
                step.state(nextSample, scratchState);
                model.observe(nextSample, scratchState, row);
                history.add(row);
                nextSample += historyInterval;
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
        // storage error of the quasi-steady solution, on what the limits see (BakeSimulator's class javadoc)
        if (model.regime == GasRegime.QUASI_STEADY) {
            for (int i = 1; i <= samplesPerStep; i++) {
                double dt = sampleTimes[i] - sampleTimes[i - 1];
                if (!(dt > 0)) {
                    continue;
                }
                double n0 = samples[i - 1][model.oStored];
                double n1 = samples[i][model.oStored];
                double rate = Math.abs(n1 - n0) / dt;
                double relax = Math.max(samples[i][model.oRelax], samples[i - 1][model.oRelax]);
                // R T / V_g = Δp / n at either end of the interval
                double perMole = Math.max(n0 > 0 ? samples[i - 1][model.oPressure] / n0 : 0,
                        n1 > 0 ? samples[i][model.oPressure] / n1 : 0);
                double lag = relax * rate * perMole;
                pressureLag = Math.max(pressureLag, Double.isNaN(lag) ? Double.POSITIVE_INFINITY : lag);
                storageRate = Math.max(storageRate, Double.isNaN(rate) ? Double.POSITIVE_INFINITY : rate);
                peakFlux = Math.max(peakFlux, samples[i][model.oFlux]);
            }
        }
    }

    /**
     * The estimated storage error of the quasi-steady solution: the first-order lag of the excess
     * pressure, max τ_g |dn/dt| R T/V_g, relative to its peak; with a chamber also the stored gas's
     * share of the vent flux, max |dn/dt|, relative to the peak flux. The initial layer (the cavity
     * starts with no gas, the quasi-steady solution at once with G/K, for a few τ_g) is left out: there
     * the quasi-steady pressure is the higher one, on the safe side for every limit.
     */
    private double storageError() {
        double peak = maxValue[2];
        double onPressure = pressureLag == 0 ? 0 : peak > 0 ? pressureLag / peak : Double.POSITIVE_INFINITY;
        double onFlux = !chamberMatters || storageRate == 0 ? 0 : peakFlux > 0 ? storageRate / peakFlux : Double.POSITIVE_INFINITY;
        return Math.max(onPressure, onFlux);
    }

    /** ∫ of one observable over the current step from its samples: composite Simpson, Simpson's 3/8 for three intervals. */
    private double quadrature(int col, double span) {
        int n = samplesPerStep;
        double h = span / n;
        if (n % 2 == 0) {
            double sum = samples[0][col] + samples[n][col];
            for (int i = 1; i < n; i++) {
                sum += (i % 2 == 1 ? 4 : 2) * samples[i][col];
            }
            return sum * h / 3;
        }
        if (n == 3) {
            return 3 * h / 8 * (samples[0][col] + 3 * samples[1][col] + 3 * samples[2][col] + samples[3][col]);
        }
        double sum = 0.5 * (samples[0][col] + samples[n][col]);
        for (int i = 1; i < n; i++) {
            sum += samples[i][col];
        }
        return sum * h;
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
}
