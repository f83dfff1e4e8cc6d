package org.exhale.report;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The recipe sheet's line on the closed-loop ride: "bound ≤ ride ≤ plan" only for a ride that kept every limit; a ride
 * that crossed one is called a reference only; no line where plan.json has no ride.
 */
class RecipeSheetRideTest {
    private static final String CSV = "step,action,start_C,end_C,rate_C_per_min,duration_s,elapsed_s\n"
            + "1,ramp,150,300,10,900,900\n2,hold,300,300,0,600,1500\n";

    private static String sheet(String ride, String admissible) {
        String plan = "{\"feasible\": true, \"verified\": true, \"duration_s\": 1500, \"lower_bound_s\": 1400, "
                + "\"lower_bound_rigorous\": true, \"ride_s\": " + ride + ", \"ride_admissible\": " + admissible + "}";
        return RecipeSheet.of(plan, CSV, null).text("test");
    }

    @Test
    void aRideThatKeptEveryLimitSitsBetweenBoundAndPlan() {
        String s = sheet("1450", "true");
        assertTrue(s.contains("Closed-loop ride") && s.contains("bound ≤ ride ≤ plan"), s);
        assertFalse(s.contains("reference only"), s);
    }

    @Test
    void aRideThatCrossedALimitIsAReferenceOnly() {
        String s = sheet("1380", "false");
        assertTrue(s.contains("crossed a limit on the way") && s.contains("reference only"), s);
        assertFalse(s.contains("bound ≤ ride ≤ plan"), s);
    }

    @Test
    void noRideNoLine() {
        String s = sheet("null", "null");
        assertFalse(s.contains("Closed-loop ride"), s);
    }
}
