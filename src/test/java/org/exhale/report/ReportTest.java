package org.exhale.report;

import static org.exhale.report.ReportFixtures.HOSTILE;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import javax.imageio.ImageIO;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;

/** The report of hand-made bake and fit folders: what the page and the chart files must and must not hold. */
class ReportTest {
    private static final String SVG_NS = SelfContainedPage.SVG_NS;
    private static final String COMPONENT = "<b>side&groups";

    @TempDir
    static Path tmp;
    static Path bakeDir;
    static Path fitDir;
    static Report bake;
    static Report fit;

    @BeforeAll
    static void render() throws Exception {
        bakeDir = ReportFixtures.bake(tmp.resolve("bake"), HOSTILE, COMPONENT, true);
        bake = Report.of(RunFolder.read(bakeDir), "charts/");
        bake.write(bakeDir, bakeDir.resolve("report.html"));
        fitDir = ReportFixtures.fit(tmp.resolve("fit"), HOSTILE, 160e3, 1e12);
        fit = Report.of(RunFolder.read(fitDir), "charts/");
        fit.write(fitDir, fitDir.resolve("report.html"));
    }

    private static List<String> ids(Report r) {
        return r.figures().stream().map(Figure::id).toList();
    }

    @Test
    void bakeFolderGetsEveryBakeChartAndFitFolderEveryFitChart() {
        assertEquals(List.of("temperature", "unconverted", "pressure", "cap-mechanics", "margins"), ids(bake));
        assertEquals(List.of("conversion", "activation-energy", "kissinger", "residuals"), ids(fit));
    }

    @Test
    void chartsWhoseInputsAreAbsentAreLeftOut(@TempDir Path dir) throws Exception {
        ReportFixtures.bake(dir, "no cap", "b", false);
        Report r = Report.of(RunFolder.read(dir), "charts/");
        assertFalse(ids(r).contains("cap-mechanics"), ids(r).toString());
        assertTrue(ids(r).contains("margins"));
    }

    @Test
    void everySvgFileParsesAndNamesItsSeriesAndAxes() throws Exception {
        Map<String, List<String>> expected = Map.of(
                "temperature", List.of("wafer, hot", "setpoint", "Time [min]", "Temperature [°C]", "ceiling 400 °C"),
                "unconverted", List.of("unconverted, hot", "unconverted, cold", "residue target 0.5 %",
                        "Unconverted polymer [fraction, log scale]"),
                "pressure", List.of("total, hot", "total, cold", "a, hot", COMPONENT + ", hot",
                        "Excess pressure in the cavity [kPa]", "max pressure 120 kPa"),
                "cap-mechanics", List.of("edge stress, hot", "deflection, cold", "cracking G, hot", "delamination G, cold",
                        "Stress [MPa]", "Deflection [µm]", "Cracking G [J/m²]", "Delamination G [J/m²]", "strength 300 MPa"),
                "margins", List.of("pressure — tightest, hot", "strength, hot",
                        "ceiling headroom, hot", "Margin, allowed / actual [–, log]", "Ceiling headroom [K]"));
        for (Map.Entry<String, List<String>> e : expected.entrySet()) {
            String svg = Files.readString(bakeDir.resolve("charts").resolve(e.getKey() + ".svg"));
            Document d = ReportFixtures.parseXml(svg);
            assertEquals("svg", d.getDocumentElement().getLocalName());
            assertEquals(SVG_NS, d.getDocumentElement().getNamespaceURI());
            List<String> texts = ReportFixtures.texts(d);
            for (String want : e.getValue()) {
                assertTrue(texts.contains(want), e.getKey() + ": no text '" + want + "' in " + texts);
            }
            // the hostile case name is the subtitle: text, not markup
            assertTrue(texts.contains(HOSTILE), e.getKey());
        }
        Map<String, List<String>> fitExpected = Map.of(
                "conversion", List.of(HOSTILE + "0 (2.00 K/min) measured", HOSTILE + "3 (20.0 K/min) model",
                        "Sample temperature [°C]", "Conversion α [–]"),
                "activation-energy", List.of("Friedman ± CI", "KAS ± CI", "Conversion α [–]",
                        "Activation energy E [kJ/mol]", "Kissinger 160.0 kJ/mol"),
                "kissinger", List.of("runs: peak of the conversion rate", "Kissinger line, Ea 160.0 ± 2.00 kJ/mol",
                        "1000 / peak temperature Tp [1/K]", "ln(β / Tp²) [β in K/s, Tp in K]"),
                "residuals", List.of(HOSTILE + "1 (5.00 K/min)", "Residual, measured − model α [–]"));
        for (Map.Entry<String, List<String>> e : fitExpected.entrySet()) {
            Document d = ReportFixtures.parseXml(Files.readString(fitDir.resolve("charts").resolve(e.getKey() + ".svg")));
            List<String> texts = ReportFixtures.texts(d);
            for (String want : e.getValue()) {
                assertTrue(texts.stream().anyMatch(t -> t.strip().equals(want)),
                        e.getKey() + ": no text '" + want + "' in " + texts);
            }
        }
    }

    @Test
    void pngFilesAreSlideSized() throws Exception {
        for (Report r : List.of(bake, fit)) {
            Path dir = r == bake ? bakeDir : fitDir;
            for (Figure f : r.figures()) {
                BufferedImage img = ImageIO.read(dir.resolve("charts").resolve(f.id() + ".png").toFile());
                assertEquals(ChartStyle.WIDTH, img.getWidth(), f.id());
                assertEquals(ChartStyle.HEIGHT, img.getHeight(), f.id());
            }
        }
    }

    @Test
    void pageHasNoScriptAndNoAddressButTheSvgNamespace() throws Exception {
        for (Path dir : List.of(bakeDir, fitDir)) {
            SelfContainedPage.check(dir);
        }
    }

    @Test
    void hostileNamesAppearAsText() throws Exception {
        String html = Files.readString(bakeDir.resolve("report.html"));
        assertTrue(html.contains("&lt;script&gt;alert(1)&lt;/script&gt;"));
        assertTrue(html.contains("<title>&lt;script&gt;alert(1)&lt;/script&gt; — exhale report</title>"));
        assertTrue(html.contains("warning about &lt;script&gt;"));
        assertTrue(html.contains("&lt;b&gt;side&amp;groups"));
        assertFalse(html.contains("<b>side"));
        String fitHtml = Files.readString(fitDir.resolve("report.html"));
        assertTrue(fitHtml.contains("&lt;script&gt;alert(1)&lt;/script&gt;0"));
    }

    @Test
    void pageCarriesHeadlineMarginsWarningsAndCautions() throws Exception {
        String html = Files.readString(bakeDir.resolve("report.html"));
        for (String want : List.of("All limits met", "At a glance", "Peak excess pressure", "100 kPa",
                "Margins to the limits", "pressure (tightest)", ">1.2<", "headroom 18.0 K", "not loaded",
                "Confirm every recipe on test wafers.", "<figure id=\"fig-margins\">", "href=\"charts/margins.svg\"")) {
            assertTrue(html.contains(want), "page lacks " + want);
        }
        String fitHtml = Files.readString(fitDir.resolve("report.html"));
        for (String want : List.of("Kinetics fit", "Kissinger Ea", "a warning from the fit", "Model fits compared",
                "kinetics.yaml", "<figure id=\"fig-kissinger\">")) {
            assertTrue(fitHtml.contains(want), "fit page lacks " + want);
        }
    }

    @Test
    void eachRunIsItsOwnSeries() {
        Figure conversion = fit.figures().get(0);
        org.jfree.data.xy.XYDataset lines = conversion.chart().getXYPlot().getDataset(0);
        assertEquals(4, lines.getSeriesCount());
        for (int s = 0; s < lines.getSeriesCount(); s++) {
            // the fixture has 100 rows per run, temperatures rising
            assertEquals(100, lines.getItemCount(s), "series " + s);
            for (int i = 1; i < lines.getItemCount(s); i++) {
                assertTrue(lines.getXValue(s, i) > lines.getXValue(s, i - 1));
            }
        }
    }

    @Test
    void kissingerLinePassesThroughPeaksThatObeyTheRelation() {
        // the fixture's peak temperatures solve Kissinger's relation exactly for Ea 160 kJ/mol, A 1e12 1/s
        // (Kissinger, Anal. Chem. 29 (1957) 1702): the drawn line must pass through every point
        org.jfree.chart.plot.XYPlot plot = fit.figures().get(2).chart().getXYPlot();
        org.jfree.data.xy.XYDataset line = plot.getDataset(0);
        org.jfree.data.xy.XYDataset pts = plot.getDataset(1);
        assertEquals(4, pts.getItemCount(0));
        for (int i = 0; i < pts.getItemCount(0); i++) {
            double x = pts.getXValue(0, i);
            int k = 1;
            while (line.getXValue(0, k) < x) {
                k++;
            }
            double x0 = line.getXValue(0, k - 1);
            double x1 = line.getXValue(0, k);
            double y = line.getYValue(0, k - 1) + (line.getYValue(0, k) - line.getYValue(0, k - 1)) * (x - x0) / (x1 - x0);
            // the line is straight in 1000/Tp, so interpolation is exact up to rounding
            assertEquals(pts.getYValue(0, i), y, 1e-9, "run " + i);
        }
    }

    @Test
    void thinningKeepsThePeak() {
        org.jfree.data.xy.XYSeries s = new org.jfree.data.xy.XYSeries("s", false, true);
        for (int i = 0; i < 5000; i++) {
            s.add(i, i == 3217 ? 10.0 : Math.sin(i / 100.0));
        }
        org.jfree.data.xy.XYSeries t = PlotBuilder.thin(s, 600);
        assertTrue(t.getItemCount() <= 600, "" + t.getItemCount());
        assertEquals(10.0, t.getMaxY());
        assertEquals(0.0, t.getMinX());
        assertEquals(4999.0, t.getMaxX());
    }

    @Test
    void decadeLabels() {
        DecadeFormat f = new DecadeFormat();
        assertEquals("10⁻⁶", f.format(1e-6));
        assertEquals("0.01", f.format(0.01));
        assertEquals("1", f.format(1));
        assertEquals("1000", f.format(1000));
        assertEquals("10¹²", f.format(1e12));
    }

    @Test
    void inlineChartsHaveDistinctClipIds() {
        String html = bake.html();
        Matcher m = Pattern.compile("<clipPath id=['\"]([^'\"]+)['\"]").matcher(html);
        java.util.Set<String> seen = new java.util.HashSet<>();
        int n = 0;
        while (m.find()) {
            n++;
            assertTrue(seen.add(m.group(1)), "clip id used twice: " + m.group(1));
        }
        assertTrue(n > 0);
    }
}
