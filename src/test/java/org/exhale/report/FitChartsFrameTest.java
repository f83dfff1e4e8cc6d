package org.exhale.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.jfree.chart.ChartRenderingInfo;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.text.TextUtils;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.title.Title;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Fit charts: titled from the runs, not the folder, and the Kissinger labels inside the frame. */
class FitChartsFrameTest {

    private static List<Figure> figures(Path dir) throws Exception {
        Path fit = ReportFixtures.fit(dir.resolve("scratch-folder-0815"), "demo_run_at_rate_", 160e3, 1e12);
        return Report.of(RunFolder.read(fit), "charts/").figures();
    }

    private static String titles(JFreeChart c) {
        StringBuilder sb = new StringBuilder(c.getTitle() == null ? "" : c.getTitle().getText());
        for (Object o : c.getSubtitles()) {
            if (o instanceof TextTitle t) {
                sb.append(" | ").append(t.getText());
            }
        }
        return sb.toString();
    }

    @Test
    void titlesNameTheRunsNotTheFolder(@TempDir Path dir) throws Exception {
        List<Figure> figs = figures(dir);
        assertEquals(4, figs.size());
        for (Figure f : figs) {
            String t = titles(f.chart());
            assertFalse(t.contains("scratch"), t);
            assertTrue(t.contains("Kinetics from 4 runs"), t);
        }
    }

    @Test
    void kissingerLabelsStayInsideTheFrame(@TempDir Path dir) throws Exception {
        Figure k = figures(dir).stream().filter(f -> f.id().equals("kissinger")).findFirst().orElseThrow();
        JFreeChart chart = k.chart();
        BufferedImage img = new BufferedImage(ChartStyle.WIDTH, ChartStyle.HEIGHT, BufferedImage.TYPE_INT_RGB);
        Graphics2D g2 = img.createGraphics();
        ChartRenderingInfo info = new ChartRenderingInfo();
        chart.draw(g2, new Rectangle2D.Double(0, 0, ChartStyle.WIDTH, ChartStyle.HEIGHT), info);
        Rectangle2D area = info.getPlotInfo().getDataArea();
        XYPlot plot = chart.getXYPlot();
        List<XYTextAnnotation> labels = new ArrayList<>();
        for (XYAnnotation a : plot.getAnnotations()) {
            if (a instanceof XYTextAnnotation t) {
                labels.add(t);
            }
        }
        assertEquals(4, labels.size());
        for (XYTextAnnotation t : labels) {
            double x = plot.getDomainAxis().valueToJava2D(t.getX(), area, plot.getDomainAxisEdge());
            double y = plot.getRangeAxis().valueToJava2D(t.getY(), area, plot.getRangeAxisEdge());
            g2.setFont(t.getFont());
            Rectangle2D b = TextUtils.calcAlignedStringBounds(t.getText(), g2, (float) x, (float) y, t.getTextAnchor()).getBounds2D();
            assertTrue(area.contains(b), t.getText().strip() + " at " + b + " outside " + area);
        }
        g2.dispose();
    }
}
