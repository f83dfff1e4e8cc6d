package org.exhale.fitting;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Pre-treatment steps checked against closed forms (common practice, no source). */
class PretreatmentTest {
    @Test
    void lagCorrectionOfARampIsTheRampDelayedByTau() {
        // A first-order lag of a ramp T = T0 + β t settles to T0 + β (t − τ) (closed form of
        // dT_s/dt = (T − T_s)/τ); started in that steady lag, it holds at every sample.
        int n = 200;
        double[] t = new double[n], temp = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = 3.7 * i;
            temp[i] = 400 + 0.25 * t[i];
        }
        double[] lagged = Pretreatment.lagged(t, temp, 10);
        for (int i = 0; i < n; i++) {
            assertEquals(400 + 0.25 * (t[i] - 10), lagged[i], 1e-9);
        }
    }

    @Test
    void temperatureWindowKeepsOnlyItsSamples() {
        TgaRun run = SyntheticTga.firstOrder(150e3, 1e12, 10, 380, 660, 0.5);
        Pretreatment.Prepared p = new Pretreatment(450, 600, false, 0, true).apply(run);
        double[] temp = p.run().temperatureK();
        assertTrue(temp[0] >= 450 && temp[temp.length - 1] <= 600);
        assertEquals(301, temp.length);
    }
}
