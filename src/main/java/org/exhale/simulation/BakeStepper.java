package org.exhale.simulation;

import org.exhale.mechanics.CapStructure;
import org.exhale.recipe.Segment;
import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;

/**
 * A bake advanced one linear setpoint segment at a time from wherever it stands, at every wafer
 * corner at once, with the same equations ({@link BakeModel}) and integrators as
 * {@link BakeSimulator}. The planner's closed-loop rider uses it to try a next segment from the
 * real simulated state, and to look ahead, without simulating the bake again from its start.
 *
 * <p>A stepper is a small value: time, setpoint and each corner's state. {@link #copy()} is cheap
 * (the models are shared), so trials branch off a state and are thrown away. Not thread-safe.
 *
 * <p>{@link #advance} returns the smallest margin (allowed/actual) of the limits that can be read at
 * an instant — trapped pressure, cap strength, cracking, delamination, buckling, deflection, the
 * chamber concentration and the thermal dose so far — sampled at three points of every accepted
 * integration step. The ceiling is the caller's to keep (through the setpoints it asks for).
 */
public final class BakeStepper {
    private static final int SAMPLES = 3;

    private final Shared shared;
    private double timeS;
    private double setpointK;
    private final double[][] y;
    private final double[] waferK;
    private final double[] hNext;

    /** What every copy shares: the case, one model and integrator per corner, limits and scratch space. */
    private static final class Shared {
        final BakeModel[] models;
        final double[] offsets;
        final RosenbrockIntegrator[] stiff;
        final DormandPrince853Integrator[] explicit;
        final double maxPressurePa;
        final CapStructure cap;
        final double chamberPpm;
        final double doseMaxS;
        final double residue;
        final double[] obs;
        final double[] state;
        long evaluations;

        Shared(BakeCase bake, GasRegime regime, double gasScale, SimulationSettings settings) {
            double spread = bake.wafer().spreadK();
            offsets = spread > 0 ? new double[]{spread, -spread} : new double[]{0};
            int n = offsets.length;
            models = new BakeModel[n];
            stiff = new RosenbrockIntegrator[n];
            explicit = new DormandPrince853Integrator[n];
            for (int c = 0; c < n; c++) {
                models[c] = new BakeModel(bake, offsets[c], regime);
                double[] atol = models[c].absoluteTolerances(gasScale);
                if (regime == GasRegime.FULL_GAS) {
                    stiff[c] = new RosenbrockIntegrator(settings.stiffRelativeTolerance(), atol);
                } else {
                    double[] rtol = new double[atol.length];
                    java.util.Arrays.fill(rtol, settings.relativeTolerance());
                    explicit[c] = new DormandPrince853Integrator(1e-9, 1e7, atol, rtol);
                }
            }
            maxPressurePa = bake.limits().maxPressurePa();
            cap = bake.capStructure();
            chamberPpm = bake.chamber() != null && bake.chamber().hasLimit() ? bake.chamber().limitFraction() * 1e6
                    : Double.POSITIVE_INFINITY;
            doseMaxS = bake.limits().dose() != null ? bake.limits().dose().maxS() : Double.POSITIVE_INFINITY;
            residue = bake.limits().residue();
            obs = new double[models[0].observableCount];
            state = new double[models[0].dim];
        }
    }

    private BakeStepper(Shared shared, double timeS, double setpointK, double[][] y, double[] waferK, double[] hNext) {
        this.shared = shared;
        this.timeS = timeS;
        this.setpointK = setpointK;
        this.y = y;
        this.waferK = waferK;
        this.hNext = hNext;
    }

    /**
     * A bake at its start (the recipe start setpoint, initial conversions, no gas).
     *
     * @param regime   the gas equations to integrate (quasi-steady or full gas), at every corner
     * @param gasScale expected peak of the normalised moles under the cap, which sets the absolute
     *                 tolerance of the gas states in the full-gas regime (1 when unknown)
     */
    public static BakeStepper start(BakeCase bake, GasRegime regime, double gasScale, SimulationSettings settings) {
        Shared s = new Shared(bake, regime, Double.isFinite(gasScale) && gasScale > 0 ? Math.min(gasScale, 1) : 1, settings);
        int n = s.models.length;
        double startK = bake.recipeStartK();
        double[][] y = new double[n][];
        double[] wafer = new double[n];
        for (int c = 0; c < n; c++) {
            y[c] = s.models[c].initialState(startK);
            wafer[c] = startK + s.offsets[c];
        }
        return new BakeStepper(s, 0, startK, y, wafer, new double[n]);
    }

    public BakeStepper copy() {
        double[][] yc = new double[y.length][];
        for (int c = 0; c < y.length; c++) {
            yc[c] = y[c].clone();
        }
        return new BakeStepper(shared, timeS, setpointK, yc, waferK.clone(), hNext.clone());
    }

    public double timeS() {
        return timeS;
    }

    public double setpointK() {
        return setpointK;
    }

    /** Right-hand-side evaluations so far, over every copy. */
    public long evaluations() {
        return shared.evaluations;
    }

    /** The largest unconverted fraction over the corners. */
    public double unconverted() {
        double u = 0;
        for (int c = 0; c < y.length; c++) {
            u = Math.max(u, unconverted(c));
        }
        return u;
    }

    private double unconverted(int c) {
        BakeModel m = shared.models[c];
        m.startSegment(new Segment(0, timeS, timeS, setpointK, setpointK), waferK[c]);
        m.observe(timeS, y[c], shared.obs);
        return shared.obs[m.oUnconverted];
    }

    /** The hottest corner's wafer temperature now [K]. */
    public double hottestWaferK() {
        double w = Double.NEGATIVE_INFINITY;
        for (double v : waferK) {
            w = Math.max(w, v);
        }
        return w;
    }

    /** The slowest gas relaxation over the corners now, V_g/(R T K) [s]. */
    public double relaxationTimeS() {
        double r = 0;
        for (int c = 0; c < y.length; c++) {
            BakeModel m = shared.models[c];
            m.startSegment(new Segment(0, timeS, timeS, setpointK, setpointK), waferK[c]);
            m.observe(timeS, y[c], shared.obs);
            r = Math.max(r, shared.obs[m.oRelax]);
        }
        return r;
    }

    /**
     * Moves the setpoint linearly to {@code endK} over {@code durationS} and integrates every corner.
     *
     * @return the smallest instantaneous margin over the segment and the corners (+∞ when nothing is loaded)
     */
    public double advance(double endK, double durationS) {
        if (!(durationS > 0)) {
            return Double.POSITIVE_INFINITY;
        }
        Segment seg = new Segment(0, timeS, timeS + durationS, setpointK, endK);
        double min = Double.POSITIVE_INFINITY;
        for (int c = 0; c < y.length; c++) {
            min = Math.min(min, integrate(c, seg));
        }
        timeS = seg.endTimeS();
        setpointK = endK;
        return min;
    }

    private double integrate(int c, Segment seg) {
        Shared s = shared;
        BakeModel model = s.models[c];
        model.startSegment(seg, waferK[c]);
        double t0 = seg.startTimeS();
        double t1 = seg.endTimeS();
        double[] result = {Double.POSITIVE_INFINITY};
        if (model.regime == GasRegime.FULL_GAS) {
            RosenbrockIntegrator ri = s.stiff[c];
            long before = ri.evaluations();
            hNext[c] = ri.integrate(model::derivatives, t0, y[c], t1, hNext[c], step -> observeStep(model, step, result));
            s.evaluations += ri.evaluations() - before;
        } else {
            DormandPrince853Integrator ei = s.explicit[c];
            ei.clearStepHandlers();
            ei.addStepHandler(interpolator -> observeStep(model, new HipparchusStep(interpolator), result));
            OrdinaryDifferentialEquation ode = model.asOde();
            double[] end = ei.integrate(ode, new ODEState(t0, y[c]), t1).getPrimaryState();
            s.evaluations += ei.getEvaluations();
            System.arraycopy(end, 0, y[c], 0, end.length);
        }
        waferK[c] = model.waferTemperature(t1, y[c]);
        return result[0];
    }

    /** Margins at three points of the step. */
    private void observeStep(BakeModel model, StepView step, double[] result) {
        double[] scratch = shared.state;
        double[] obs = shared.obs;
        double a = step.start();
        double b = step.end();
        for (int i = 1; i <= SAMPLES; i++) {
            double t = a + (b - a) * i / SAMPLES;
            step.state(t, scratch);
            model.observe(t, scratch, obs);
            result[0] = Math.min(result[0], margin(model, obs));
        }
    }

    /** The smallest instantaneous margin in one observation row. */
    private double margin(BakeModel m, double[] obs) {
        Shared s = shared;
        double r = ratio(s.maxPressurePa, obs[m.oPressure]);
        if (s.cap != null) {
            r = Math.min(r, ratio(s.cap.allowedStressPa(), obs[m.oEdgeStress]));
            r = Math.min(r, ratio(s.cap.allowedCrackingJPerM2(), obs[m.oCrack]));
            r = Math.min(r, ratio(s.cap.allowedDelaminationJPerM2(), obs[m.oDelam]));
            r = Math.min(r, ratio(s.cap.bucklingStressPa(), obs[m.oCompression]));
            r = Math.min(r, ratio(s.cap.maxDeflectionM(), Math.abs(obs[m.oDeflection])));
        }
        if (m.oPpm >= 0) {
            r = Math.min(r, ratio(s.chamberPpm, obs[m.oPpm]));
        }
        r = Math.min(r, ratio(s.doseMaxS, obs[m.oDose]));
        return r;
    }

    private static double ratio(double allowed, double actual) {
        if (!Double.isFinite(allowed) || actual <= 0) {
            return Double.POSITIVE_INFINITY;
        }
        return Double.isFinite(actual) ? allowed / actual : 0;
    }
}
