package org.exhale.report;

import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Rectangle2D;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;

import javax.imageio.ImageIO;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.text.TextUtils;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.SVGHints;
import org.jfree.svg.ViewBox;

/** Draws a chart headless into SVG (real text elements) or PNG. */
public final class ChartRenderer {
    static {
        // JFreeChart draws rotated text (the value-axis labels) through a TextLayout by default, which
        // an SVG canvas can only record as outlines; plain drawString keeps them real, searchable text.
        TextUtils.setUseDrawRotatedStringWorkaround(false);
    }

    private ChartRenderer() {
    }

    /**
     * The chart as an SVG element.
     *
     * @param idPrefix prefix for clip-path ids, so that several charts can sit in one page
     * @param sized    true for a standalone file (width and height given), false for a page (scales to its box)
     */
    public static String svg(JFreeChart chart, int width, int height, String idPrefix, boolean sized) {
        limitTicks(chart);
        SVGGraphics2D g = new SVGGraphics2D(width, height);
        g.setDefsKeyPrefix(idPrefix);
        g.setRenderingHint(SVGHints.KEY_DRAW_STRING_TYPE, SVGHints.VALUE_DRAW_STRING_TYPE_STANDARD);
        chart.draw(g, new Rectangle2D.Double(0, 0, width, height));
        String svg = g.getSVGElement(idPrefix + "svg", sized, new ViewBox(0, 0, width, height), null, null);
        return clean(svg);
    }

    /** Most ticks on a linear axis: more only clutter the chart. */
    static final int MAX_TICKS = 8;

    /**
     * Gives every linear axis a round tick step (1, 2 or 5 × 10^n) that puts at most
     * {@link #MAX_TICKS} ticks on it; log axes keep their decades.
     */
    static void limitTicks(JFreeChart chart) {
        java.util.List<org.jfree.chart.plot.XYPlot> plots = new java.util.ArrayList<>();
        if (chart.getPlot() instanceof org.jfree.chart.plot.CombinedDomainXYPlot c) {
            plots.add(c);
            plots.addAll(c.getSubplots());
        } else if (chart.getPlot() instanceof org.jfree.chart.plot.XYPlot x) {
            plots.add(x);
        } else if (chart.getPlot() instanceof org.jfree.chart.plot.CategoryPlot c) {
            for (int i = 0; i < c.getRangeAxisCount(); i++) {
                roundTicks(c.getRangeAxis(i));
            }
        }
        for (org.jfree.chart.plot.XYPlot p : plots) {
            for (int i = 0; i < p.getDomainAxisCount(); i++) {
                roundTicks(p.getDomainAxis(i));
            }
            for (int i = 0; i < p.getRangeAxisCount(); i++) {
                roundTicks(p.getRangeAxis(i));
            }
        }
    }

    private static void roundTicks(org.jfree.chart.axis.ValueAxis a) {
        if (!(a instanceof org.jfree.chart.axis.NumberAxis n) || a.getClass() != org.jfree.chart.axis.NumberAxis.class) {
            return;
        }
        double span = n.getRange().getLength();
        if (!(span > 0) || !Double.isFinite(span)) {
            return;
        }
        double step = Math.pow(10, Math.floor(Math.log10(span / MAX_TICKS)));
        for (double m : new double[]{1, 2, 2.5, 5, 10, 20, 25, 50, 100}) {
            if (span / (step * m) <= MAX_TICKS) {
                step *= m;
                break;
            }
        }
        java.text.DecimalFormat f = new java.text.DecimalFormat(Math.abs(step) >= 1e-4 ? "0.####" : "0.##E0",
                java.text.DecimalFormatSymbols.getInstance(java.util.Locale.ROOT));
        n.setTickUnit(new org.jfree.chart.axis.NumberTickUnit(step, f), false, true);
    }

    /** A standalone SVG file. */
    public static String svgDocument(JFreeChart chart, int width, int height, String idPrefix) {
        return "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + svg(chart, width, height, idPrefix, true) + "\n";
    }

    /**
     * Drops the renderer's own namespace declaration and attributes: the page must reference no
     * address but the SVG namespace.
     */
    static String clean(String svg) {
        String s = svg.replaceAll("\\s+xmlns:jfreesvg=(['\"])[^'\"]*\\1", "")
                .replaceAll("\\s+jfreesvg:[A-Za-z-]+=(['\"])[^'\"]*\\1", "");
        if (!s.contains("xlink:")) {
            s = s.replaceAll("\\s+xmlns:xlink=(['\"])[^'\"]*\\1", "");
        }
        return s;
    }

    public static byte[] png(JFreeChart chart, int width, int height) {
        limitTicks(chart);
        BufferedImage img = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = img.createGraphics();
        try {
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
            chart.draw(g, new Rectangle2D.Double(0, 0, width, height));
        } finally {
            g.dispose();
        }
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            ImageIO.setUseCache(false);
            ImageIO.write(img, "png", out);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toByteArray();
    }
}
