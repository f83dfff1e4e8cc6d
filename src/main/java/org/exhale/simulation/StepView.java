package org.exhale.simulation;

/** One accepted integration step with dense output, as seen by observers. */
interface StepView {
    double start();

    double end();

    /** The interpolated state at t in [start, end], into out. */
    void state(double t, double[] out);
}
