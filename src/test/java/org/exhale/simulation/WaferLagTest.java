package org.exhale.simulation;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.exhale.kinetics.ReactionModel;
import org.exhale.recipe.Recipe;
import org.exhale.recipe.Segment;
import org.exhale.recipe.Step;
import org.junit.jupiter.api.Test;

/**
 * The wafer's first-order lag dT/dt = (T_s − T)/τ_w of MODEL.md §2. The simulator solves it in closed
 * form per segment; the reference here integrates the ODE itself, independently, with the classical
 * fourth-order Runge–Kutta method on a fine fixed step over the piecewise-linear setpoint (common
 * practice, no source).
 */
class WaferLagTest {
    /** Setpoint of the recipe at t (linear within each segment). */
    private static double setpoint(Recipe r, double t) {
        for (Segment s : r.segments()) {
            if (t <= s.endTimeS()) {
                return s.setpointAt(t);
            }
        }
        List<Segment> all = r.segments();
        return all.get(all.size() - 1).endK();
    }

    /** T(t) on the grid {@code times} (ascending, from 0), RK4 with step h, from T(0) = T_s(0). */
    private static double[] integrate(Recipe r, double tau, double[] times, double h) {
        double[] out = new double[times.length];
        double t = 0;
        double temp = r.startK();
        for (int i = 0; i < times.length; i++) {
            while (t < times[i] - 1e-12) {
                double dt = Math.min(h, times[i] - t);
                double k1 = (setpoint(r, t) - temp) / tau;
                double k2 = (setpoint(r, t + dt / 2) - (temp + dt / 2 * k1)) / tau;
                double k3 = (setpoint(r, t + dt / 2) - (temp + dt / 2 * k2)) / tau;
                double k4 = (setpoint(r, t + dt) - (temp + dt * k3)) / tau;
                temp += dt / 6 * (k1 + 2 * k2 + 2 * k3 + k4);
                t += dt;
            }
            out[i] = temp;
        }
        return out;
    }

    /*
     * Ramp up, hold, ramp down (a kink in the setpoint at every breakpoint). RK4 at 0.05 s against τ = 30 s:
     * its own error is of order (h/τ)^4 · ΔT ≈ 1e-11 K away from the kinks, and a step that straddles a kink
     * loses its fourth order (error ≈ β h² ≈ 4e-4 K per kink at 10 K/min, so the grid is aligned with the
     * breakpoints: every step ends on one). Tolerance 1e-4 K: the simulator's closed form is exact, the
     * comparison measures the reference (measured worst difference printed).
     */
    @Test
    void lagFollowsAnIndependentIntegrationThroughRampsAndHolds() {
        double tau = 30;
        Recipe recipe = new Recipe(450, List.of(new Step.Ramp(550, 10 / 60.0), new Step.Hold(600),
                new Step.Ramp(500, 5 / 60.0), new Step.Hold(300)));
        BakeCase bake = TestCases.kineticsCase(TestCases.singleComponent(new ReactionModel.NthOrder(1), 1e12, 150e3),
                recipe, null).withWafer(new Wafer(tau, 0));
        CornerResult c = BakeSimulator.simulate(bake, SimulationSettings.defaults().withSampleInterval(5)).corners().get(0);
        int it = c.column("time_s");
        int iw = c.column("wafer_K");
        double[] times = c.history().stream().mapToDouble(row -> row[it]).toArray();
        // the breakpoints (600, 1200, 1800, 2100 s) fall on the 5 s grid, and the reference steps to each row
        double[] reference = integrate(recipe, tau, times, 0.05);
        double worst = 0;
        for (int i = 0; i < times.length; i++) {
            worst = Math.max(worst, Math.abs(c.history().get(i)[iw] - reference[i]));
        }
        System.out.printf("wafer lag: %d rows, worst |ΔT| against RK4 %.3g K%n", times.length, worst);
        assertTrue(times.length > 400);
        assertTrue(worst <= 1e-4, "worst |ΔT| = " + worst + " K");
        // the lagging wafer never overshoots the hold setpoint (the reference does not either)
        assertTrue(c.maxWafer().value() <= 550 + 1e-9, "max wafer " + (c.maxWafer().value() - 550) + " K above");
        assertTrue(c.maxWafer().value() > 549.99, "the wafer reaches the hold temperature");
    }
}
