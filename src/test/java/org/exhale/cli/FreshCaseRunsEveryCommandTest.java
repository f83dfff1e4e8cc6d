package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.io.TempDir;

/**
 * A case written by {@code exhale new} runs through every command as written: its chamber and
 * uncertainty sections let {@code robust} and the exhaust check run without editing the file.
 */
class FreshCaseRunsEveryCommandTest {

    @ParameterizedTest(name = "{0} dense={1}")
    @CsvSource({"line, false", "disc, true"})
    void everyCommandRunsOnAFreshCase(String kind, boolean dense, @TempDir Path dir) throws Exception {
        Path c = dir.resolve("case.yaml");
        List<String> made = new ArrayList<>(List.of("new", kind, "-o", c.toString()));
        if (dense) {
            made.add("--dense");
        }
        assertEquals(Main.OK, Main.execute(made.toArray(String[]::new)));
        String text = Files.readString(c);
        assertTrue(text.contains("\nchamber:") && text.contains("\nuncertainty:") && text.contains("overshoot:"), text);
        String vary = dense ? "cap.thickness=1.9um,2um" : "cap.thickness=50nm,60nm";
        String[][] runs = {
                {"check", c.toString(), "--no-values"},
                {"simulate", c.toString(), "-q", "-o", dir.resolve("sim").toString()},
                {"plan", c.toString(), "-q", "-o", dir.resolve("plan").toString()},
                {"compare", c.toString(), "--vary", vary, "-q", "-o", dir.resolve("compare").toString()},
                {"robust", c.toString(), "--samples", "2", "-q", "-o", dir.resolve("robust").toString()},
                {"report", dir.resolve("plan").toString(), "-q"},
        };
        for (String[] r : runs) {
            if (dense && r[0].equals("compare")) {
                continue; // compare plans every option; on a dense cap that takes several seconds each, and the porous case covers it
            }
            assertEquals(Main.OK, Main.execute(r), String.join(" ", r) + " on a fresh '" + kind + "' case");
        }
        assertTrue(Files.exists(dir.resolve("robust/robust.json")));
        // robust's tightest limit is a ratio margin (allowed/actual): the ceiling, in K, is followed apart
        List<String> samples = Files.readAllLines(dir.resolve("robust/samples.csv"));
        List<String> head = List.of(samples.get(0).split(","));
        assertTrue(head.contains("tightest_limit") && head.contains("smallest_margin"), samples.get(0));
        for (String row : samples.subList(1, samples.size())) {
            assertTrue(!row.split(",")[head.indexOf("tightest_limit")].equals("ceiling"), row);
        }
        if (!dense) {
            assertEquals(Main.OK, Main.execute("report", dir.resolve("robust").toString(), "-q"));
            // seed 1, two samples of the fresh line case: no limit is violated, and the page and chart say so
            assertTrue(Files.readString(dir.resolve("robust/charts/robust-violation.svg")).contains("No violations in 2 samples"));
            assertTrue(Files.readString(dir.resolve("robust/report.html")).contains("No limit violated in 2 samples"));
        }
        assertTrue(Files.readString(dir.resolve("sim/summary.json")).contains("\"chamber\""), "the exhaust is checked");
    }
}
