package org.exhale.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.jfree.chart.plot.CategoryPlot;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The plan-against-bound chart shows the closed-loop ride between bound and plan where plan.json has one. */
class PlanChartsTest {
    @TempDir
    Path tmp;

    private Figure figure(String rideJson, String admissible) throws Exception {
        Path dir = ReportFixtures.bake(tmp.resolve("run" + rideJson.length() + admissible), "chart case", "b", false);
        Files.writeString(dir.resolve("plan.json"), "{\"duration_s\": 14378, \"lower_bound_s\": 12406.6, \"lower_bound_rigorous\": true, "
                + "\"ride_s\": " + rideJson + ", \"ride_admissible\": " + admissible + "}");
        return PlanCharts.lowerBound(RunFolder.read(dir)).orElseThrow();
    }

    private List<?> bars(String rideJson) throws Exception {
        // as plan.json has them: ride_admissible is null where there is no ride
        Figure f = figure(rideJson, rideJson.equals("null") ? "null" : "true");
        CategoryPlot plot = f.chart().getCategoryPlot();
        List<?> keys = plot.getDataset().getColumnKeys();
        assertTrue(f.caption().contains("closed-loop ride") == (keys.size() == 3), f.caption());
        return keys;
    }

    @Test
    void rideBetweenBoundAndPlanWhenKnown() throws Exception {
        assertEquals(List.of("lower bound", "closed-loop ride", "plan"), bars("14267.4"));
        assertEquals(List.of("lower bound", "plan"), bars("null"));
    }

    @Test
    void aRideThatCrossedALimitIsMarkedAsAReferenceOnly() throws Exception {
        Figure f = figure("10513.8", "false");
        assertEquals(List.of("lower bound", "ride (crossed a limit)", "plan"), f.chart().getCategoryPlot().getDataset().getColumnKeys());
        assertTrue(f.caption().contains("crossed a limit on the way"), f.caption());
    }
}
