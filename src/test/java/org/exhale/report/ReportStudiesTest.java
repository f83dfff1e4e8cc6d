package org.exhale.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import javax.imageio.ImageIO;

import org.exhale.cli.Main;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;

/**
 * The report of folders that exhale compare and exhale robust wrote from the bundled demo cases, with
 * a limit name and an uncertain value's name made hostile afterwards.
 */
class ReportStudiesTest {
    private static final String SVG_NS = SelfContainedPage.SVG_NS;
    /** Replaces the limit name "strength" in options.csv: shows in the map's cells and the ranked table. */
    private static final String LIMIT = "<b>str&ength";
    /** Replaces the uncertain value "spread_K" in robust.json: shows in the sensitivity chart and tables. */
    private static final String VALUE = "<i>spread&K";

    @TempDir
    static Path tmp;
    static Path compareDir;
    static Path robustDir;
    static Report compare;
    static Report robust;

    @BeforeAll
    static void render() throws Exception {
        compareDir = tmp.resolve("compare");
        // a safety factor of 2.5 leaves the cap's strength no margin at the start temperature: two infeasible options
        assertEquals(Main.OK, Main.execute("compare", "data/demo/porous-line.yaml", "--vary", "limits.safety_factor=1.5,2.5",
                "--vary", "limits.ceiling=380C,400C", "-o", compareDir.toString(), "-q"));
        Path csv = compareDir.resolve("options.csv");
        Files.writeString(csv, Files.readString(csv).replace("strength", LIMIT));
        compare = Report.of(RunFolder.read(compareDir), "charts/");
        compare.write(compareDir, compareDir.resolve("report.html"));

        robustDir = tmp.resolve("robust");
        assertEquals(Main.OK, Main.execute("robust", "data/demo/porous-line-uncertain.yaml", "--samples", "40", "--plan",
                "--quantile", "0.9", "--seed", "7", "-o", robustDir.toString(), "-q"));
        Path json = robustDir.resolve("robust.json");
        Files.writeString(json, Files.readString(json).replace("\"spread_K\"", ReportFixtures.jsonString(VALUE)));
        robust = Report.of(RunFolder.read(robustDir), "charts/");
        robust.write(robustDir, robustDir.resolve("report.html"));
    }

    private static List<String> ids(Report r) {
        return r.figures().stream().map(Figure::id).toList();
    }

    private static List<String> texts(Path dir, String id) throws Exception {
        Document d = ReportFixtures.parseXml(Files.readString(dir.resolve("charts").resolve(id + ".svg")));
        assertEquals("svg", d.getDocumentElement().getLocalName(), id);
        assertEquals(SVG_NS, d.getDocumentElement().getNamespaceURI(), id);
        return ReportFixtures.texts(d).stream().map(String::strip).toList();
    }

    @Test
    void eachFolderGetsItsCharts() {
        assertEquals(List.of("compare-pareto", "compare-map"), ids(compare));
        assertEquals(List.of("robust-time", "robust-margins", "robust-tightest", "robust-headroom", "robust-violation",
                "robust-sensitivity", "robust-plan"), ids(robust));
    }

    @Test
    void everySvgParsesAndNamesItsSeriesAndAxes() throws Exception {
        Map<String, List<String>> cmp = Map.of(
                "compare-pareto", List.of("feasible option", "Pareto front (shortest for its margin)",
                        "infeasible: no plan (drawn at its lower bound, in the band below margin 1)",
                        "Planned duration to the residue target [min]", "Smallest margin, allowed / actual [–]",
                        "margin 1: the limit", "2 feasible, 1 point on the Pareto front (1 option), 2 infeasible"),
                "compare-map", List.of("limits.safety_factor [–]", "limits.ceiling [°C]", "Planned duration [min]",
                        "infeasible", "1.5", "2.5", "380", "400"));
        for (Map.Entry<String, List<String>> e : cmp.entrySet()) {
            List<String> t = texts(compareDir, e.getKey());
            for (String want : e.getValue()) {
                assertTrue(t.contains(want), e.getKey() + ": no text '" + want + "' in " + t);
            }
        }
        Map<String, List<String>> rob = Map.of(
                "robust-time", List.of("Time to the residue target [min]", "Samples [count]"),
                "robust-margins", List.of("Margin, allowed / actual [–, log scale]", "margin 1: the limit", "strength",
                        "pressure", "Limit (one histogram per row) [–]"),
                "robust-tightest", List.of("Margin of strength, allowed / actual [–]", "Samples [count]",
                        "margin 1: the limit"),
                "robust-headroom", List.of("Ceiling headroom, ceiling − hottest wafer [K]", "limit: headroom 0 K"),
                "robust-violation", List.of("P(violate) ± 1 standard error",
                        "95 % upper bound when none was seen (rule of three)", "Probability of violating the limit [%]"),
                "robust-sensitivity", List.of("smallest margin", "time to target", VALUE,
                        "Spearman rank correlation with the outcome [–]", "Uncertain value, most influential first"),
                "robust-plan", List.of("Duration to the residue target [min]", "nominal plan", "robust plan"));
        for (Map.Entry<String, List<String>> e : rob.entrySet()) {
            List<String> t = texts(robustDir, e.getKey());
            for (String want : e.getValue()) {
                assertTrue(t.contains(want), e.getKey() + ": no text '" + want + "' in " + t);
            }
            assertTrue(t.contains("line air gap, porous cap B, with uncertainty"), e.getKey() + ": case name as subtitle");
        }
    }

    @Test
    void mapCellsCarryTheOptionsOwnDurationsAndInfeasibleLimits() throws Exception {
        CsvTable t = CsvTable.read(compareDir.resolve("options.csv"));
        List<String> cells = texts(compareDir, "compare-map");
        int infeasible = 0;
        for (int r = 0; r < t.size(); r++) {
            String name = "#" + t.text(r, "option");
            if ("true".equals(t.text(r, "feasible"))) {
                String d = ReportText.sig(t.number(r, "duration_s") / 60, 3) + " min";
                assertTrue(cells.contains(d), name + ": no cell '" + d + "' in " + cells);
            } else {
                infeasible++;
                String want = name + ": " + t.text(r, "infeasible_limit");
                assertEquals(LIMIT, t.text(r, "infeasible_limit"));
                assertTrue(cells.contains(want), "no cell '" + want + "' in " + cells);
            }
        }
        assertEquals(2, infeasible);
        // the best option (rank 1) is named so in its cell
        assertTrue(cells.contains("#" + t.text(0, "option") + " best, Pareto"), cells.toString());
    }

    @Test
    void robustTimeMarksTheStudysQuantiles() throws Exception {
        List<String> t = texts(robustDir, "robust-time");
        assertTrue(t.stream().anyMatch(s -> s.startsWith("P50 ") && s.endsWith(" min")), t.toString());
        assertTrue(t.stream().anyMatch(s -> s.startsWith("P90 ")), t.toString());
        assertTrue(t.contains("40 samples, seed 7; every sample reached the target"), t.toString());
    }

    @Test
    void pngFilesAreSlideSized() throws Exception {
        for (Path dir : List.of(compareDir, robustDir)) {
            Report r = dir == compareDir ? compare : robust;
            for (Figure f : r.figures()) {
                BufferedImage img = ImageIO.read(dir.resolve("charts").resolve(f.id() + ".png").toFile());
                assertEquals(ChartStyle.WIDTH, img.getWidth(), f.id());
                assertEquals(ChartStyle.HEIGHT, img.getHeight(), f.id());
            }
        }
    }

    @Test
    void pageHasNoScriptAndNoAddressButTheSvgNamespace() throws Exception {
        for (Path dir : List.of(compareDir, robustDir)) {
            SelfContainedPage.check(dir);
        }
    }

    @Test
    void hostileNamesAppearAsText() throws Exception {
        String c = Files.readString(compareDir.resolve("report.html"));
        assertTrue(c.contains("&lt;b&gt;str&amp;ength"), "limit name in the ranked table and the map");
        assertFalse(c.contains("<b>str"));
        String r = Files.readString(robustDir.resolve("report.html"));
        assertTrue(r.contains("&lt;i&gt;spread&amp;K"), "uncertain value in the tables and the sensitivity chart");
        assertFalse(r.contains("<i>spread"));
    }

    @Test
    void pagesCarryTheBestOptionSeedSamplesCostAndCautions() throws Exception {
        String c = Files.readString(compareDir.resolve("report.html"));
        String best = new com.fasterxml.jackson.databind.ObjectMapper().readTree(compareDir.resolve("compare.json").toFile())
                .path("best").asText();
        assertTrue(best.startsWith("Best option: #"), best);
        assertTrue(c.contains(ReportText.escape(best)), "the best option in words");
        assertTrue(c.contains("2 of 4 options are feasible"), "counts");
        assertTrue(c.contains("<h3>Ranked options</h3>"));
        String r = Files.readString(robustDir.resolve("report.html"));
        assertTrue(r.contains("<tr><th>Seed</th><td>7</td></tr>"), "seed");
        assertTrue(r.contains("<tr><th>Samples</th><td>40 of 40</td></tr>"), "sample count");
        assertTrue(r.contains("The robust plan takes "), "robust plan against the nominal plan");
        assertTrue(r.contains("<h2 id=\"recipe\">Ramp table</h2>"), "the robust recipe");
        for (String page : List.of(c, r)) {
            for (String caution : Cautions.BAKE) {
                assertTrue(page.contains(ReportText.escape(caution)), caution);
            }
        }
    }

    @Test
    void oneVariedKeyGivesALineAndNoMap(@TempDir Path dir) throws Exception {
        Path out = dir.resolve("one");
        assertEquals(Main.OK, Main.execute("compare", "data/demo/porous-line.yaml", "--vary", "limits.ceiling=380C,400C",
                "-o", out.toString(), "-q"));
        Report r = Report.of(RunFolder.read(out), "charts/");
        assertEquals(List.of("compare-pareto", "compare-line"), ids(r));
        r.write(out, out.resolve("report.html"));
        List<String> t = texts(out, "compare-line");
        assertTrue(t.contains("limits.ceiling [°C]"), t.toString());
        assertTrue(t.contains("planned duration"), t.toString());
    }

    @Test
    void compareJsonAloneIsEnough(@TempDir Path dir) throws Exception {
        Files.copy(compareDir.resolve("compare.json"), dir.resolve("compare.json"));
        Report r = Report.of(RunFolder.read(dir), "charts/");
        assertEquals(List.of("compare-pareto", "compare-map"), ids(r));
        assertFalse(r.html().contains("Ranked options"), "no options.csv, no ranked table");
    }

    @Test
    void samplesAloneGiveTheHistograms(@TempDir Path dir) throws Exception {
        Files.copy(robustDir.resolve("samples.csv"), dir.resolve("samples.csv"));
        Report r = Report.of(RunFolder.read(dir), "charts/");
        assertEquals(List.of("robust-time", "robust-margins", "robust-tightest", "robust-headroom"), ids(r));
    }

    @Test
    void axisLabelsCarryTheUnitsOfTheVariedColumns() {
        assertEquals("limits.ceiling [°C]", CompareCharts.axisLabel("limits.ceiling_C", null));
        assertEquals("cap.pore_radius [nm]", CompareCharts.axisLabel("cap.pore_radius_nm", null));
        assertEquals("cap.porosity [–]", CompareCharts.axisLabel("cap.porosity", null));
        assertEquals("polymer.density [g/cm3]", CompareCharts.axisLabel("polymer.density_g_per_cm3", null));
        assertEquals("other.thing [mm]", CompareCharts.axisLabel("other.thing_mm", null));
    }

    @Test
    void durationScaleDarkensWithDuration() {
        CompareCharts.DurationScale s = new CompareCharts.DurationScale(20, 30);
        double last = Double.POSITIVE_INFINITY;
        for (double v = 20; v <= 30; v += 2.5) {
            Color c = (Color) s.getPaint(v);
            double lum = 0.299 * c.getRed() + 0.587 * c.getGreen() + 0.114 * c.getBlue();
            // lightness alone orders the cells: the map reads in greyscale
            assertTrue(lum < last, "luminance falls with duration at " + v + ": " + lum + " after " + last);
            last = lum;
        }
        assertFalse(s.dark(21));
        assertTrue(s.dark(29));
    }

    @Test
    void nonFiniteCellsAreRefusedAndEmptyCellsReadAsMissing() {
        // the writers leave a value that is not loaded empty; inf, NaN and 1e999 are not theirs (issue: LInfinity in a path)
        CsvTable t = CsvTable.parse("s.csv", "a_margin,b_margin\ninf,1.5\n1e999,nan\n,2\n");
        for (int[] rc : new int[][]{{0, 0}, {1, 0}, {1, 1}}) {
            org.exhale.io.InputException e = org.junit.jupiter.api.Assertions.assertThrows(org.exhale.io.InputException.class,
                    () -> t.number(rc[0], rc[1] == 0 ? "a_margin" : "b_margin"));
            assertEquals(org.exhale.io.ErrorKind.BAD_NUMBER, e.kind());
        }
        assertEquals(1.5, t.number(0, "b_margin"));
        assertTrue(Double.isNaN(t.number(2, "a_margin")));
    }
}
