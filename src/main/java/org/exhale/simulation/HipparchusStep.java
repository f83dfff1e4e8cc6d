package org.exhale.simulation;

import org.hipparchus.ode.sampling.ODEStateInterpolator;

/** Adapter from a Hipparchus step interpolator. */
final class HipparchusStep implements StepView {
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
