package org.exhale.fitting;

/**
 * Measured against model conversion along one run, at the samples the fit used.
 *
 * @param label        run label
 * @param timeS        time [s]
 * @param temperatureK temperature [K]
 * @param measured     measured α
 * @param model        model α
 */
public record RunFit(String label, double[] timeS, double[] temperatureK, double[] measured, double[] model) {
    public RunFit {
        timeS = timeS.clone();
        temperatureK = temperatureK.clone();
        measured = measured.clone();
        model = model.clone();
    }

    @Override public double[] timeS() { return timeS.clone(); }
    @Override public double[] temperatureK() { return temperatureK.clone(); }
    @Override public double[] measured() { return measured.clone(); }
    @Override public double[] model() { return model.clone(); }
}
