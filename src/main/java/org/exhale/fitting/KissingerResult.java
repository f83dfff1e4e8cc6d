package org.exhale.fitting;

/**
 * Kissinger's peak method: ln(β/Tp²) = ln(AR/E) − E/(R Tp) over the runs.
 * Kissinger, Anal. Chem. 29 (1957) 1702.
 *
 * @param energyJPerMol          E [J/mol]
 * @param energyHalfWidthJPerMol confidence half-width of E [J/mol] (NaN with two runs)
 * @param lnPreExponential       ln(A / (1/s))
 * @param lnPreExponentialHalfWidth confidence half-width of ln A (NaN with two runs)
 * @param confidence             confidence level
 * @param peakTemperatureK       peak temperature of dα/dt of each run [K]
 * @param heatingRateKPerS       measured heating rate of each run [K/s]
 * @param energySpread           (max − min)/mean of the isoconversional E(α) over α 0.1–0.9 (NaN
 *                               when no isoconversional result was given)
 * @param flagged                E(α) varies by more than {@link Kissinger#MAX_SPREAD}: a single
 *                               Kissinger E is not meaningful
 */
public record KissingerResult(double energyJPerMol, double energyHalfWidthJPerMol, double lnPreExponential,
                              double lnPreExponentialHalfWidth, double confidence, double[] peakTemperatureK,
                              double[] heatingRateKPerS, double energySpread, boolean flagged) {
    public KissingerResult {
        peakTemperatureK = peakTemperatureK.clone();
        heatingRateKPerS = heatingRateKPerS.clone();
    }

    @Override public double[] peakTemperatureK() { return peakTemperatureK.clone(); }
    @Override public double[] heatingRateKPerS() { return heatingRateKPerS.clone(); }

    public double preExponentialPerS() {
        return Math.exp(lnPreExponential);
    }
}
