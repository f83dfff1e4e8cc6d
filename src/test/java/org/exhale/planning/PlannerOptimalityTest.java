package org.exhale.planning;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;

import org.exhale.io.CaseFile;
import org.exhale.io.CaseYamlReader;
import org.exhale.simulation.BakeCase;
import org.exhale.simulation.InstantLimits;
import org.exhale.simulation.Wafer;
import org.hipparchus.analysis.solvers.BrentSolver;
import org.junit.jupiter.api.Test;

/**
 * How close the planner comes to the shortest recipe, measured against optima it did not produce.
 */
class PlannerOptimalityTest {
    private static CaseFile bench(String name) {
        return CaseYamlReader.read(Path.of("data/bench/" + name));
    }

    /** The dense-one bench case with one piece of its text replaced (the replaced text must be there). */
    private static CaseFile denseOneWith(String from, String to) throws java.io.IOException {
        String text = java.nio.file.Files.readString(Path.of("data/bench/dense-one.yaml"));
        assertTrue(text.contains(from), "dense-one.yaml no longer holds: " + from);
        return CaseYamlReader.parse("dense-one-variant.yaml", text.replace(from, to).getBytes(java.nio.charset.StandardCharsets.UTF_8));
    }

    /**
     * One first-order component, quasi-steady gas, no lag and no spread, only the trapped pressure,
     * the ramp rate and the ceiling limiting. The state is the one conversion α, its rate k(T)(1 − α)
     * rises with T, and the pressure limit is p(T, α) ≤ p_max with p rising in T. For such a scalar
     * problem the greedy control is optimal (comparison lemma for dα/dt ≤ r*(α, t); common practice,
     * no source): at every instant the highest temperature the ramp rate, the ceiling and the pressure
     * allow, T(t + dt) = min(T + β dt, T_p(α), T_cap). The test integrates that optimum on its own —
     * midpoint rule in time, Brent's method for T_p(α) — and checks the planner's ride and its plan
     * against it.
     */
    @Test
    void pressureBoundRideAndPlanMatchTheGreedyOptimum() {
        CaseFile cf = bench("qs-one-pressure.yaml");
        BakeCase bake = cf.bake().withWafer(Wafer.ideal());
        Tool tool = cf.tool();
        InstantLimits limits = new InstantLimits(bake);
        double pMax = bake.limits().maxPressurePa();
        double optimum = greedyOptimum(bake, tool, 0.25, (x, a) -> pMax - limits.excessPressure(x, a), 250);
        PlanResult p = Planner.plan(bake, tool);
        assertTrue(p.verified(), "not verified: " + p.infeasibility());
        // the ride is sampled on a control interval, the optimum continuously: 1 % (empirical)
        assertTrue(Math.abs(p.rideS() / optimum - 1) < 0.01, "ride " + p.rideS() + " s vs optimum " + optimum + " s");
        // a verified plan cannot beat the optimum (0.2 % for the optimum's own time step), and with the
        // tool's 12 steps it should come within 3 % of it (the target)
        assertTrue(p.durationS() >= optimum * 0.998, "plan " + p.durationS() + " s beats the optimum " + optimum + " s");
        assertTrue(p.durationS() <= optimum * 1.03, "plan " + p.durationS() + " s vs optimum " + optimum + " s");
    }

    /**
     * The same comparison where the cap's mechanics bind instead of the trapped pressure: the dense-one
     * bench case (one first-order component, no lag, no spread), whose free-span crack sets every ramp,
     * taken under quasi-steady gas. The admissible temperature T_adm(α) of all instantaneous limits
     * rises with α along the path (checked below), so the greedy control is again the optimum
     * (comparison lemma; common practice, no source). Two things are measured against it, written here
     * independently of the planner: the closed-loop ride in the same gas regime, and the joint
     * programme's bound (rigorous under quasi-steady gas), which must not exceed the optimum and should
     * converge to it on a fine clock grid. Measured: optimum 194.8 min, ride 195.3 (30 s control),
     * bound 193.8 with a 0.5 % clock step; with the shipped 10 % step and one part the bound is 185.9,
     * and no finer grid ever gave more than the optimum.
     */
    @Test
    void crackBoundRideAndJointBoundBracketTheGreedyOptimum() {
        CaseFile cf = bench("dense-one.yaml");
        BakeCase bake = cf.bake();
        Tool tool = cf.tool();
        InstantLimits limits = new InstantLimits(bake);
        double optimum = greedyOptimum(bake, tool, 0.5, (x, a) -> limits.margin(x, a) - 1, 300);
        double capK = Planner.floorSetpoint(tool.highestSetpointK(bake.limits().ceilingK(), bake.wafer().spreadK()),
                tool.setpointStepK());
        Rider.Ride ride = new Rider(bake, tool, capK, org.exhale.simulation.GasRegime.QUASI_STEADY, 1).ride(30, 86_400);
        // the ride is sampled on a 30 s control interval: 1 % (empirical, as above)
        assertTrue(ride.timeToTargetS() >= optimum * 0.998 && ride.timeToTargetS() <= optimum * 1.01,
                "ride " + ride.timeToTargetS() + " s vs optimum " + optimum + " s");
        TemperatureCap tc = new TemperatureCap(bake.recipeStartK(), bake.limits().ceilingK(), tool.maxRampUpKPerS(), 0);
        double bound = new JointBound(bake, limits, tc, 0, 0.005, 0.03, 0.01, 1).compute().boundS();
        // rigorous: never above the optimum (0.2 % for the optimum's own time step); fine grid: within 1 %
        assertTrue(bound <= optimum * 1.002, "bound " + bound + " s above the optimum " + optimum + " s");
        assertTrue(bound >= optimum * 0.99, "bound " + bound + " s vs optimum " + optimum + " s");
    }

    /** Where the limits of a greedy schedule hold: headroom ≥ 0 at temperature T [K] and conversions α. */
    private interface Headroom {
        double at(double temperatureK, double[] alpha);
    }

    /**
     * The greedy optimum's time to the residue target [s]: at every step the highest temperature the ramp rate, the
     * ceiling and the limits allow (Brent's method between {@code lowK} and the ramp's reach where the limits fail
     * there), α by the midpoint rule. Asserts the comparison lemma's premise with a ramp limit: T_adm(α) never falls.
     */
    private static double greedyOptimum(BakeCase bake, Tool tool, double dt, Headroom headroom, double lowK) {
        InstantLimits limits = new InstantLimits(bake);
        double cap = Planner.floorSetpoint(bake.limits().ceilingK(), tool.setpointStepK());
        double target = 1 - bake.limits().residue();
        double[] a = {bake.polymer().initialConversion(0)};
        double temp = bake.recipeStartK();
        BrentSolver brent = new BrentSolver(1e-9, 1e-12);
        double t = 0;
        while (a[0] < target) {
            double[] probe = a.clone();
            double hi = Math.min(temp + tool.maxRampUpKPerS() * dt, cap);
            double next = hi;
            if (headroom.at(hi, probe) < 0) {
                next = brent.solve(200, x -> headroom.at(x, probe), lowK, hi);
            }
            assertTrue(next >= temp - 1e-6, "T_adm fell along the path: " + temp + " -> " + next + " K");
            // midpoint rule for α over the step at the chosen temperature
            double k1 = limits.rate(0, next, a[0]);
            double mid = a[0] + 0.5 * dt * k1;
            double aNew = a[0] + dt * limits.rate(0, next, mid);
            if (aNew >= target) {
                t += dt * (target - a[0]) / (aNew - a[0]);
                break;
            }
            a[0] = aNew;
            temp = next;
            t += dt;
        }
        return t;
    }

    /**
     * Stored gas under a dense cap (one component, no lag or spread): the plan keeps within 3 % of the
     * closed-loop ride with unlimited steps, and the ride is no shorter than the lower bound.
     */
    @Test
    void denseCapPlanComesWithinThreePercentOfTheRide() {
        CaseFile cf = bench("dense-one.yaml");
        PlanResult p = Planner.plan(cf.bake(), cf.tool());
        assertTrue(p.verified(), "not verified: " + p.infeasibility());
        assertTrue(p.rideAdmissible(), "the ride crossed a limit");
        assertTrue(p.rideRatio() <= 1.03, "plan/ride " + p.rideRatio());
        assertTrue(p.rideS() >= p.lowerBound().boundS(), "ride " + p.rideS() + " s beats the bound " + p.lowerBound().boundS());
    }

    /**
     * Two components under a dense cap that vents only by permeation (stored gas, 20 s wafer lag,
     * ±1.5 K spread, the tool's 1 °C grid and 12 steps), about a second of planning: the plan keeps
     * within 3 % of the closed-loop ride (the project's aim, issue 14; no published source). Ramps timed
     * on the ride's own clock fell about 10 min behind it where the grid rounded their ends down, the
     * last ramp then ended before the ride's fast final climb, and a 30 min hold at 315 °C followed:
     * plan/ride 1.099 before the ramps were measured from the recipe's progress on the ride.
     */
    @Test
    void twoComponentStoredGasPlanComesWithinThreePercentOfTheRide() {
        CaseFile cf = bench("two-component-stored.yaml");
        PlanResult p = Planner.plan(cf.bake(), cf.tool());
        assertTrue(p.verified(), "not verified: " + p.infeasibility());
        assertTrue(p.recipe().steps().size() <= cf.tool().maxSteps(), "steps " + p.recipe().steps().size());
        assertTrue(p.rideAdmissible(), "the ride crossed a limit");
        assertTrue(p.rideRatio() <= 1.03, "plan/ride " + p.rideRatio());
        assertTrue(p.rideS() >= p.lowerBound().boundS(), "ride " + p.rideS() + " s beats the bound " + p.lowerBound().boundS());
    }

    /**
     * Under kinetics whose rate rises with conversion (Šesták–Berggren m = 0.5, n = 1.5: f grows from the seed), the
     * admissible temperature falls after the first climb faster than the ride's look-ahead sees, and the ride crosses the
     * crack limit (measured: it overshoots to 311 °C at minute 17); a second ride that looks four times further keeps
     * every limit and is the one reported. Each ride's own flag is checked against the full verification: its setpoint
     * path replayed as a recipe (an independent judge, not the rider's own trials).
     */
    @Test
    void aRideThatCrossedALimitIsRiddenAgainAndEachFlagMatchesTheVerification() throws Exception {
        CaseFile cf = denseOneWith("model: nth-order, n: 1.0", "model: sestak-berggren, m: 0.5, n: 1.5");
        PlanResult p = Planner.plan(cf.bake(), cf.tool());
        assertTrue(p.verified(), "not verified: " + p.infeasibility());
        assertTrue(p.durationS() >= p.lowerBound().boundS(), "the verified plan beats the bound");
        Rider.Ride[] rides = Planner.ridesFor(cf.bake(), cf.tool());
        // each ride's flag against its own path replayed (measured today: the first crosses, the second keeps every limit;
        // should the rider improve, the first keeps every limit and is the one reported)
        assertEquals(rides[0].admissibleThroughout(), keepsEveryLimit(cf, rides[0]), "the first ride's path as a recipe");
        assertEquals(rides[1].admissibleThroughout(), keepsEveryLimit(cf, rides[1]), "the reported ride's path as a recipe");
        assertTrue(rides[1].admissibleThroughout(), "the reported ride crossed a limit");
        assertTrue(rides[0].admissibleThroughout() == (rides[1] == rides[0]), "a second ride only where the first crossed");
        assertTrue(p.rideAdmissible());
        assertEquals(rides[1].timeToTargetS(), p.rideS(), 1e-6);
        assertTrue(p.rideS() >= p.lowerBound().boundS(), "ride " + p.rideS() + " s beats the bound " + p.lowerBound().boundS());
        // dense-one as shipped: one ride, admissible, and its path keeps every limit
        CaseFile one = bench("dense-one.yaml");
        Rider.Ride[] oneRides = Planner.ridesFor(one.bake(), one.tool());
        assertTrue(oneRides[0].admissibleThroughout() && oneRides[1] == oneRides[0]);
        assertEquals(true, keepsEveryLimit(one, oneRides[0]), "dense-one's ride as a recipe");
    }

    /** A ride replayed as a recipe (a ramp or hold per control interval) under the full verification. */
    private static boolean keepsEveryLimit(CaseFile cf, Rider.Ride ride) {
        java.util.List<org.exhale.recipe.Step> steps = new java.util.ArrayList<>();
        double[] t = ride.timesS();
        double[] sp = ride.setpointsK();
        for (int i = 1; i < t.length; i++) {
            double dt = t[i] - t[i - 1];
            double dT = sp[i] - sp[i - 1];
            steps.add(Math.abs(dT) < 1e-9 ? new org.exhale.recipe.Step.Hold(dt)
                    : new org.exhale.recipe.Step.Ramp(sp[i], Math.abs(dT) / dt));
        }
        steps.add(new org.exhale.recipe.Step.Hold(600));
        var r = org.exhale.simulation.BakeSimulator.simulate(cf.bake().withRecipe(
                new org.exhale.recipe.Recipe(cf.bake().recipeStartK(), steps)));
        return r.margins().stream().filter(m -> !m.limit().equals("residue")).allMatch(org.exhale.simulation.Margin::holds);
    }

    /** A cap whose own stress fails a limit before any gas gets advice about the cap's stress, not the pressure. */
    @Test
    void capStressFailingAtTheStartIsAdvisedAsSuch() throws Exception {
        CaseFile cf = denseOneWith("intrinsic_stress: 40 MPa", "intrinsic_stress: 100 MPa");
        PlanResult p = Planner.plan(cf.bake(), cf.tool());
        assertTrue(!p.feasible(), "a cap that fails before any gas cannot be planned");
        assertTrue(p.infeasibility().suggestion().contains("own stress"), p.infeasibility().suggestion());
        assertTrue(!p.infeasibility().suggestion().contains("trapped pressure"), p.infeasibility().suggestion());
    }
}
