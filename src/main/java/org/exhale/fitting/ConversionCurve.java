package org.exhale.fitting;

/**
 * A run after pre-processing: conversion, its smoothed rate, the measured heating rate and the
 * times and temperatures at which the conversion grid is crossed. Arrays are copied on the way in
 * and on the way out.
 *
 * @param label               run label
 * @param timeS               time [s]
 * @param temperatureK        sample temperature [K]
 * @param alpha               conversion from the mass, unsmoothed
 * @param alphaSmooth         conversion smoothed by a local quadratic on time
 * @param rate                dα/dt from the same local quadratic [1/s]
 * @param heatingRateKPerS    slope of T on t over the reaction range [K/s]
 * @param heatingMaxDevK      largest |T − linear fit| over the reaction range [K]
 * @param initialMass         initial plateau (or the first point's mass basis value)
 * @param finalMass           final plateau, or initial × stated residue
 * @param reactionFrom        first index with smoothed α ≥ alphaMin
 * @param reactionTo          first index with smoothed α ≥ alphaMax
 * @param gridAlpha           the conversion grid
 * @param gridTimeS           time at which each grid level is first reached [s] (NaN if never)
 * @param gridTemperatureK    temperature there [K]
 * @param gridRate            smoothed dα/dt there [1/s]
 * @param peakTimeS           time of the largest smoothed dα/dt [s]
 * @param peakTemperatureK    temperature there [K]
 */
public record ConversionCurve(String label, double[] timeS, double[] temperatureK, double[] alpha,
                              double[] alphaSmooth, double[] rate, double heatingRateKPerS, double heatingMaxDevK,
                              double initialMass, double finalMass, int reactionFrom, int reactionTo,
                              double[] gridAlpha, double[] gridTimeS, double[] gridTemperatureK, double[] gridRate,
                              double peakTimeS, double peakTemperatureK) {
    public ConversionCurve {
        int n = timeS.length;
        if (temperatureK.length != n || alpha.length != n || alphaSmooth.length != n || rate.length != n) {
            throw new IllegalArgumentException("conversion curve columns differ in length");
        }
        int g = gridAlpha.length;
        if (gridTimeS.length != g || gridTemperatureK.length != g || gridRate.length != g) {
            throw new IllegalArgumentException("conversion grid columns differ in length");
        }
        if (!(heatingRateKPerS > 0)) {
            throw new IllegalArgumentException("run " + label + ": heating rate " + heatingRateKPerS * 60
                    + " K/min, expected a rising temperature");
        }
        timeS = timeS.clone();
        temperatureK = temperatureK.clone();
        alpha = alpha.clone();
        alphaSmooth = alphaSmooth.clone();
        rate = rate.clone();
        gridAlpha = gridAlpha.clone();
        gridTimeS = gridTimeS.clone();
        gridTemperatureK = gridTemperatureK.clone();
        gridRate = gridRate.clone();
    }

    @Override public double[] timeS() { return timeS.clone(); }
    @Override public double[] temperatureK() { return temperatureK.clone(); }
    @Override public double[] alpha() { return alpha.clone(); }
    @Override public double[] alphaSmooth() { return alphaSmooth.clone(); }
    @Override public double[] rate() { return rate.clone(); }
    @Override public double[] gridAlpha() { return gridAlpha.clone(); }
    @Override public double[] gridTimeS() { return gridTimeS.clone(); }
    @Override public double[] gridTemperatureK() { return gridTemperatureK.clone(); }
    @Override public double[] gridRate() { return gridRate.clone(); }

    public int size() {
        return timeS.length;
    }

    /** Heating rate in K/min, for messages. */
    public double heatingRateKPerMin() {
        return heatingRateKPerS * 60;
    }
}
