package org.exhale.simulation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.exhale.kinetics.ReactionModel;
import org.exhale.recipe.Recipe;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Thermal dose t_eq = ∫ exp(−(E_b/R)(1/T − 1/T_ref)) dt of MODEL.md §7 against its closed forms. */
class ThermalDoseTest {
    private static final double R = 8.314462618;
    private static final double EB = 100e3;
    private static final double TREF = 673.15;

    private static double dose(Recipe recipe) {
        BakeCase bake = TestCases.kineticsCase(
                TestCases.singleComponent(new ReactionModel.NthOrder(1), 1e12, 150e3), recipe,
                new ThermalDose(EB, TREF, 7200));
        CornerResult c = BakeSimulator.simulate(bake).corners().get(0);
        return c.thermalDoseS();
    }

    /*
     * Isothermal hold: t_eq = exp(−(E_b/R)(1/T − 1/T_ref)) t, and t_eq = t at T_ref (MODEL.md §7, closed form).
     * The integrand is constant, so only rounding remains: 1e-10 relative.
     */
    @ParameterizedTest
    @CsvSource({"673.15, 3600", "623.15, 5400", "700, 1800", "500, 36000"})
    void isothermalHoldGivesTheArrheniusWeightedTime(double temp, double seconds) {
        double expected = Math.exp(-(EB / R) * (1 / temp - 1 / TREF)) * seconds;
        double got = dose(TestCases.isothermal(temp, seconds));
        if (temp == TREF) {
            assertEquals(seconds, got, 1e-10 * seconds);
        }
        assertEquals(expected, got, 1e-10 * expected, "T = " + temp + " K");
    }

    /*
     * Linear ramp at rate β: t_eq = (E_b/(R β)) e^{E_b/(R T_ref)} [p(x1) − p(x0)], x = E_b/(R T), with the
     * temperature integral p(x) of Senum & Yang, J. Therm. Anal. 11 (1977) 445 (relative error < 1e-8 for
     * x ≥ 17, here x ≥ 17.9). Tolerance 1e-7 relative: approximation plus the dose's absolute tolerance 1e-6 s
     * on a dose of order 1e3 s.
     */
    @Test
    void rampMatchesSenumYangTemperatureIntegral() {
        double t0 = 573.15;
        double t1 = 673.15;
        double beta = 2 / 60.0;
        double x0 = EB / (R * t0);
        double x1 = EB / (R * t1);
        double expected = EB / (R * beta) * Math.exp(EB / (R * TREF))
                * (KineticsThroughSimulatorTest.senumYang(x1) - KineticsThroughSimulatorTest.senumYang(x0));
        double got = dose(TestCases.ramp(t0, t1, beta));
        System.out.printf("dose over a 2 K/min ramp 300→400 °C: %.6f s, closed form %.6f s%n", got, expected);
        assertEquals(expected, got, 1e-7 * expected);
    }
}
