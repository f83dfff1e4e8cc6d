package org.exhale.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.Axis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.Plot;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.HorizontalAlignment;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;

/**
 * The look of every exhale chart, sized for a slide. Series differ by colour, dash pattern and
 * marker shape at once, so a chart printed in greyscale still tells them apart; limits are dark
 * dash-dot lines with their value written beside them.
 */
public final class ChartStyle {
    private ChartStyle() {
    }

    public static final int WIDTH = 1280;
    public static final int HEIGHT = 720;

    /** The logical sans-serif family: every JDK has it and SVG viewers map it to their own sans-serif. */
    static final String FAMILY = Font.SANS_SERIF;
    static final Font TITLE = new Font(FAMILY, Font.BOLD, 26);
    static final Font SUBTITLE = new Font(FAMILY, Font.PLAIN, 17);
    static final Font LABEL = new Font(FAMILY, Font.PLAIN, 19);
    static final Font TICK = new Font(FAMILY, Font.PLAIN, 16);
    static final Font LEGEND = new Font(FAMILY, Font.PLAIN, 16);
    static final Font NOTE = new Font(FAMILY, Font.PLAIN, 15);

    static final Color INK = new Color(0x22, 0x26, 0x2b);
    static final Color GRID = new Color(0xd5, 0xd9, 0xde);
    static final Color LIMIT = new Color(0x6e, 0x12, 0x12);
    static final Color BACKGROUND = Color.WHITE;

    /** Our palette: dark enough to read on white, spread in lightness for greyscale. */
    static final Color[] PALETTE = {
            new Color(0x1d, 0x4f, 0x7c), // ink blue
            new Color(0xc4, 0x5a, 0x1c), // rust
            new Color(0x2f, 0x7a, 0x4b), // pine
            new Color(0x6b, 0x3d, 0x9a), // violet
            new Color(0x9a, 0x7b, 0x0c), // ochre
            new Color(0x4b, 0x4f, 0x55), // graphite
            new Color(0xa8, 0x2f, 0x63), // berry
            new Color(0x3f, 0x9f, 0xb0), // lagoon
    };

    private static final float[][] DASHES = {
            null, {12f, 6f}, {2.5f, 5f}, {14f, 5f, 3f, 5f}, {24f, 7f}, {6f, 4f, 2f, 4f, 2f, 4f},
    };

    public static Color colour(int i) {
        return PALETTE[Math.floorMod(i, PALETTE.length)];
    }

    public static Stroke line(int dash, float width) {
        float[] d = DASHES[Math.floorMod(dash, DASHES.length)];
        return d == null ? new BasicStroke(width, BasicStroke.CAP_ROUND, BasicStroke.JOIN_ROUND)
                : new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, d, 0f);
    }

    public static Shape shape(int i) {
        double s = 10;
        double h = s / 2;
        return switch (Math.floorMod(i, 7)) {
            case 0 -> new Ellipse2D.Double(-h, -h, s, s);
            case 1 -> new Rectangle2D.Double(-h, -h, s, s);
            case 2 -> polygon(0, -h - 1, h + 1, h, -h - 1, h);
            case 3 -> polygon(0, -h - 1, h + 1, 0, 0, h + 1, -h - 1, 0);
            case 4 -> polygon(-h - 1, -h, h + 1, -h, 0, h + 1);
            case 5 -> cross(h + 1);
            default -> polygon(-h, -h, h, -h, -h, h, h, h); // bow tie
        };
    }

    private static Shape polygon(double... xy) {
        Path2D.Double p = new Path2D.Double();
        p.moveTo(xy[0], xy[1]);
        for (int i = 2; i < xy.length; i += 2) {
            p.lineTo(xy[i], xy[i + 1]);
        }
        p.closePath();
        return p;
    }

    private static Shape cross(double h) {
        double w = h / 3;
        Path2D.Double p = new Path2D.Double();
        p.moveTo(-w, -h);
        p.lineTo(w, -h);
        p.lineTo(w, -w);
        p.lineTo(h, -w);
        p.lineTo(h, w);
        p.lineTo(w, w);
        p.lineTo(w, h);
        p.lineTo(-w, h);
        p.lineTo(-w, w);
        p.lineTo(-h, w);
        p.lineTo(-h, -w);
        p.lineTo(-w, -w);
        p.closePath();
        return p;
    }

    /** A chart with our title, an optional subtitle (the case name, a note) and the legend below. */
    static JFreeChart chart(String title, Plot plot, String... subtitles) {
        JFreeChart c = new JFreeChart(title, TITLE, plot, true);
        c.setBackgroundPaint(BACKGROUND);
        c.setAntiAlias(true);
        c.setTextAntiAlias(true);
        c.setPadding(new RectangleInsets(10, 14, 10, 24));
        c.getTitle().setPaint(INK);
        c.getTitle().setHorizontalAlignment(HorizontalAlignment.LEFT);
        for (String s : subtitles) {
            if (s != null && !s.isBlank()) {
                TextTitle t = new TextTitle(s, SUBTITLE);
                t.setPaint(INK);
                t.setHorizontalAlignment(HorizontalAlignment.LEFT);
                c.addSubtitle(t);
            }
        }
        LegendTitle legend = c.getLegend();
        legend.setItemFont(LEGEND);
        legend.setItemPaint(INK);
        legend.setFrame(BlockBorder.NONE);
        legend.setBackgroundPaint(BACKGROUND);
        legend.setPosition(RectangleEdge.BOTTOM);
        legend.setItemLabelPadding(new RectangleInsets(2, 4, 2, 14));
        style(plot);
        return c;
    }

    static void style(Plot plot) {
        plot.setBackgroundPaint(BACKGROUND);
        plot.setOutlinePaint(INK);
        if (plot instanceof CombinedDomainXYPlot cp) {
            axis(cp.getDomainAxis());
            for (XYPlot sub : cp.getSubplots()) {
                style(sub);
            }
        } else if (plot instanceof XYPlot xy) {
            xy.setDomainGridlinePaint(GRID);
            xy.setRangeGridlinePaint(GRID);
            xy.setDomainGridlineStroke(new BasicStroke(1f));
            xy.setRangeGridlineStroke(new BasicStroke(1f));
            xy.setAxisOffset(RectangleInsets.ZERO_INSETS);
            for (int i = 0; i < xy.getDomainAxisCount(); i++) {
                axis(xy.getDomainAxis(i));
            }
            for (int i = 0; i < xy.getRangeAxisCount(); i++) {
                axis(xy.getRangeAxis(i));
            }
        }
    }

    static void axis(Axis a) {
        if (a == null) {
            return;
        }
        a.setLabelFont(LABEL);
        a.setLabelPaint(INK);
        a.setTickLabelFont(TICK);
        a.setTickLabelPaint(INK);
        a.setAxisLinePaint(INK);
        a.setTickMarkPaint(INK);
        if (a instanceof ValueAxis v) {
            v.setTickMarkOutsideLength(5f);
        }
    }

    /** A horizontal limit line with its label written at the right end, below the line (or above it). */
    static ValueMarker limit(double value, String label, boolean below) {
        ValueMarker m = new ValueMarker(value, LIMIT, line(3, 2.2f));
        m.setLabel(label);
        m.setLabelFont(NOTE);
        m.setLabelPaint(LIMIT);
        m.setLabelAnchor(RectangleAnchor.TOP_RIGHT);
        m.setLabelTextAnchor(below ? TextAnchor.TOP_RIGHT : TextAnchor.BOTTOM_RIGHT);
        m.setLabelBackgroundColor(new Color(255, 255, 255, 210));
        m.setLabelOffset(new RectangleInsets(4, 4, 4, 8));
        return m;
    }

    static void addLimit(XYPlot plot, double value, String label) {
        addLimit(plot, value, label, true);
    }

    static void addLimit(XYPlot plot, double value, String label, boolean below) {
        plot.addRangeMarker(0, limit(value, label, below), Layer.FOREGROUND);
    }

    static Paint translucent(Color c, int alpha) {
        return new Color(c.getRed(), c.getGreen(), c.getBlue(), alpha);
    }
}
