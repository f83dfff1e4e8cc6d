package org.exhale.report;

import java.util.function.DoubleUnaryOperator;

import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.data.Range;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * One XY panel: series added with their style, limits drawn as lines, the value axis ranged to
 * the data and to every limit that is on scale. A limit far above the data (more than
 * {@link #OFF_SCALE} times its peak) is not drawn, so the curve is not flattened against the
 * axis; {@link #offScale()} says which limits were left out, for the chart's subtitle.
 */
final class PlotBuilder {
    /** A limit more than this many times the data's peak would flatten the curve: it is named, not drawn. */
    static final double OFF_SCALE = 20;

    private final XYSeriesCollection data = new XYSeriesCollection();
    private final StyledRenderer renderer = new StyledRenderer();
    /**
     * Marker-only series (measured points) live in a dataset of their own: a renderer that draws
     * each line as one path carries the path over a series without a line into the next one.
     */
    private final XYSeriesCollection marks = new XYSeriesCollection();
    private final StyledRenderer markRenderer = new StyledRenderer();

    {
        // hollow markers: the model line under the measured points stays visible
        markRenderer.setDefaultShapesFilled(false);
        markRenderer.setUseOutlinePaint(false);
        markRenderer.setDrawOutlines(true);
    }
    private final ValueAxis xAxis;
    private final ValueAxis yAxis;
    private final boolean log;
    private final StringBuilder offScale = new StringBuilder();
    private double lo = Double.POSITIVE_INFINITY;
    private double hi = Double.NEGATIVE_INFINITY;
    private final java.util.List<double[]> limits = new java.util.ArrayList<>();
    private final java.util.List<String> limitLabels = new java.util.ArrayList<>();
    private Range fixed;
    private Range xRange;

    PlotBuilder(String xLabel, String yLabel, boolean logY) {
        NumberAxis x = new NumberAxis(xLabel);
        x.setAutoRangeIncludesZero(false);
        x.setLowerMargin(0);
        x.setUpperMargin(0.01);
        xAxis = x;
        log = logY;
        if (logY) {
            LogAxis y = new LogAxis(yLabel);
            y.setBase(10);
            y.setSmallestValue(1e-300);
            y.setMinorTickCount(9);
            y.setNumberFormatOverride(new DecadeFormat());
            y.setTickUnit(new org.jfree.chart.axis.NumberTickUnit(1));
            yAxis = y;
        } else {
            NumberAxis y = new NumberAxis(yLabel);
            y.setAutoRangeIncludesZero(false);
            yAxis = y;
        }
    }

    /** Series longer than this are thinned for drawing, keeping each bucket's extremes (a slide is 1280 px wide). */
    static final int MAX_POINTS = 600;

    /** Adds a series; returns its index in its dataset (lines 0, markers 1), or -1 when it has no point. */
    int add(XYSeries s0, int colour, int dash, int shape, float width, boolean markersOnly) {
        XYSeries s = markersOnly ? s0 : thin(s0, MAX_POINTS);
        if (s.getItemCount() == 0) {
            return -1;
        }
        XYSeriesCollection into = markersOnly ? marks : data;
        int i = into.getSeriesCount();
        into.addSeries(s);
        (markersOnly ? markRenderer : renderer).series(i, colour, dash, shape, width, s.getItemCount(), markersOnly);
        for (int k = 0; k < s.getItemCount(); k++) {
            double y = s.getY(k).doubleValue();
            if (Double.isFinite(y) && (!log || y > 0)) {
                lo = Math.min(lo, y);
                hi = Math.max(hi, y);
            }
        }
        return i;
    }

    void limit(double value, String label) {
        limits.add(new double[]{value});
        limitLabels.add(label);
    }

    void xRange(double lower, double upper) {
        xRange = new Range(lower, upper);
    }

    void range(double lower, double upper) {
        fixed = new Range(lower, upper);
    }

    boolean isEmpty() {
        return data.getSeriesCount() == 0 && marks.getSeriesCount() == 0;
    }

    String offScale() {
        return offScale.toString();
    }

    XYPlot build() {
        XYPlot plot = new XYPlot(data, xAxis, yAxis, renderer);
        plot.setOrientation(PlotOrientation.VERTICAL);
        renderer.setLegendLine(new java.awt.geom.Line2D.Double(-18, 0, 18, 0));
        if (marks.getSeriesCount() > 0) {
            plot.setDataset(1, marks);
            plot.setRenderer(1, markRenderer);
            // markers under the model lines
            plot.setDatasetRenderingOrder(org.jfree.chart.plot.DatasetRenderingOrder.REVERSE);
        }
        double a = lo;
        double b = hi;
        java.util.List<Integer> drawn = new java.util.ArrayList<>();
        for (int i = 0; i < limits.size(); i++) {
            double v = limits.get(i)[0];
            if (!Double.isFinite(v) || (log && v <= 0)) {
                continue;
            }
            boolean far = Double.isFinite(hi) && hi > 0 && v > OFF_SCALE * hi;
            if (far && fixed == null) {
                offScale.append(offScale.length() == 0 ? "" : "; ").append(limitLabels.get(i)).append(" is off scale");
                continue;
            }
            drawn.add(i);
            a = Math.min(a, v);
            b = Math.max(b, v);
        }
        if (xRange != null) {
            xAxis.setRange(xRange);
        }
        if (fixed != null) {
            yAxis.setRange(fixed);
        } else if (Double.isFinite(a) && Double.isFinite(b)) {
            if (log) {
                yAxis.setRange(a / 2, b * 2);
            } else {
                double pad = b > a ? 0.06 * (b - a) : Math.max(Math.abs(a) * 0.05, 1e-12);
                // room above for the label of a limit drawn at the top
                yAxis.setRange(a - pad, b + 1.6 * pad);
            }
        }
        Range shown = yAxis.getRange();
        for (int i : drawn) {
            double v = limits.get(i)[0];
            // the label goes on the side of the line with more room
            double pos = log ? (Math.log(v) - Math.log(shown.getLowerBound()))
                    / (Math.log(shown.getUpperBound()) - Math.log(shown.getLowerBound()))
                    : (v - shown.getLowerBound()) / shown.getLength();
            ChartStyle.addLimit(plot, v, limitLabels.get(i), pos > 0.5);
        }
        return plot;
    }

    /**
     * At most about {@code max} points: the series is cut into buckets of consecutive points and each
     * bucket keeps its first, lowest, highest and last point, so peaks and steps survive.
     */
    static XYSeries thin(XYSeries s, int max) {
        int n = s.getItemCount();
        if (n <= max) {
            return s;
        }
        int buckets = Math.max(1, max / 4);
        XYSeries out = new XYSeries(s.getKey(), false, true);
        for (int b = 0; b < buckets; b++) {
            int from = (int) ((long) n * b / buckets);
            int to = (int) ((long) n * (b + 1) / buckets);
            if (to <= from) {
                continue;
            }
            int lo = from;
            int hi = from;
            for (int i = from; i < to; i++) {
                double y = s.getY(i).doubleValue();
                if (y < s.getY(lo).doubleValue()) {
                    lo = i;
                }
                if (y > s.getY(hi).doubleValue()) {
                    hi = i;
                }
            }
            java.util.TreeSet<Integer> keep = new java.util.TreeSet<>(java.util.List.of(from, lo, hi, to - 1));
            for (int i : keep) {
                out.add(s.getX(i), s.getY(i));
            }
        }
        return out;
    }

    /** A series from two columns of one corner's rows; scale maps the stored value to the plotted one. */
    static XYSeries series(String name, CsvTable t, String corner, String xCol, DoubleUnaryOperator xScale,
                           String yCol, DoubleUnaryOperator yScale) {
        return series(name, t, "corner", corner, xCol, xScale, yCol, yScale);
    }

    /** A series from the rows whose {@code groupCol} is {@code group} (all rows when group is null). */
    static XYSeries series(String name, CsvTable t, String groupCol, String group, String xCol,
                           DoubleUnaryOperator xScale, String yCol, DoubleUnaryOperator yScale) {
        XYSeries s = new XYSeries(name, false, true);
        boolean byGroup = group != null && t.has(groupCol);
        for (int r = 0; r < t.size(); r++) {
            if (byGroup && !t.text(r, groupCol).equals(group)) {
                continue;
            }
            double x = t.number(r, xCol);
            double y = t.number(r, yCol);
            if (Double.isFinite(x) && Double.isFinite(y)) {
                s.add(xScale.applyAsDouble(x), yScale.applyAsDouble(y));
            }
        }
        return s;
    }
}
