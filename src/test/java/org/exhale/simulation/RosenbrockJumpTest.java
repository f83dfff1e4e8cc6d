package org.exhale.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The Rosenbrock integrator steps over a jump of the right-hand side (a rate that drops to zero when
 * a state reaches 1, as a near-zero-order reaction does at full conversion) instead of failing with a
 * step-size underflow, and reports a state that stops being finite as {@link OutOfReach}.
 */
class RosenbrockJumpTest {
    @Test
    void stepsOverARateThatDropsToZero() {
        // y' = 1e-3 while y < 1, then 0; z' = y' − 1e7 z, a fast follower of about 1e-10 with a tight tolerance
        // (as the gas under a porous cap follows its generation). Closed form: y = min(1e-3 t, 1), reached at
        // t = 1000 s, and z → 0 after it (derived, no published source). The jump of z' at t = 1000 s made the
        // step fall below 1e-14 of the time: "step size underflow", an internal error.
        RosenbrockIntegrator ri = new RosenbrockIntegrator(1e-6, new double[] {1e-12, 1e-17});
        double[] y = {0, 0};
        int[] steps = {0};
        ri.integrate((t, s, d) -> {
            double r = s[0] < 1 ? 1e-3 : 0;
            d[0] = r;
            d[1] = r - 1e7 * s[1];
        }, 0, y, 3000, 0, step -> steps[0]++);
        assertEquals(1, y[0], 1e-5, "y stops at 1 (within the relative tolerance of the crossing step)");
        assertEquals(0, y[1], 1e-15, "z relaxes to 0");
        assertTrue(steps[0] < 100_000, "steps: " + steps[0]);
    }

    @Test
    void aStateThatOverflowsIsOutOfReachNotAnInternalError() {
        RosenbrockIntegrator ri = new RosenbrockIntegrator(1e-6, new double[] {1e-12});
        double[] y = {1};
        assertThrows(OutOfReach.class, () -> ri.integrate((t, s, d) -> d[0] = t > 5 ? Double.NaN : 1, 0, y, 10, 0, step -> { }));
    }
}
