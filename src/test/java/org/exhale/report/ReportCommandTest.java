package org.exhale.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.exhale.cli.Main;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The command end to end: on a folder that exhale simulate wrote from a bundled demo case, and with -o. */
class ReportCommandTest {
    @Test
    void reportsASimulatedDemoCase(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("porous-line");
        assertEquals(Main.OK, Main.execute("simulate", "data/demo/porous-line.yaml", "-o", out.toString(), "-q"));
        assertEquals(Main.OK, Main.execute("report", out.toString(), "-q"));
        String html = Files.readString(out.resolve("report.html"));
        assertTrue(html.contains("line air gap, porous cap B"));
        for (String id : List.of("temperature", "unconverted", "pressure", "cap-mechanics", "margins")) {
            assertTrue(Files.size(out.resolve("charts").resolve(id + ".svg")) > 1000, id);
            assertTrue(Files.size(out.resolve("charts").resolve(id + ".png")) > 1000, id);
            assertTrue(html.contains("<figure id=\"fig-" + id + "\">"), id);
            ReportFixtures.parseXml(Files.readString(out.resolve("charts").resolve(id + ".svg")));
        }
        // the cap's strength has the smallest margin, but it is set at the start of the bake (t = 0), so
        // no recipe changes it: the tightest limit is another, and the page says why strength is not it
        assertFalse(html.contains("strength (binding)") || html.contains("strength (tightest)"), html);
        assertTrue(html.contains("(tightest)"));
        assertTrue(html.contains("set at the start of the bake and no recipe changes it"));
    }

    @Test
    void pageElsewhereLinksBackToTheCharts(@TempDir Path dir) throws Exception {
        Path run = ReportFixtures.bake(dir.resolve("run"), "case", "b", true);
        Path page = dir.resolve("pages").resolve("case.html");
        Files.createDirectories(page.getParent());
        assertEquals(Main.OK, Main.execute("report", run.toString(), "-o", page.toString(), "-q"));
        String html = Files.readString(page);
        assertTrue(html.contains("href=\"../run/charts/margins.svg\""));
        assertTrue(Files.exists(run.resolve("charts").resolve("margins.png")));
        assertTrue(Files.notExists(run.resolve("report.html")));
    }

    @Test
    void badFolderIsExitTwo(@TempDir Path dir) {
        assertEquals(Main.BAD_INPUT, org.exhale.cli.Quiet.execute("report", dir.resolve("absent").toString()));
    }
}
