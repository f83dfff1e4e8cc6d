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
    private final ValueAxis xAxis;
    private final ValueAxis yAxis;
    private final boolean log;
    private final StringBuilder offScale = new StringBuilder();
    private double lo = Double.POSITIVE_INFINITY;
    private double hi = Double.NEGATIVE_INFINITY;
    private final java.util.List<double[]> limits = new java.util.ArrayList<>();
    private final java.util.List<String> limitLabels = new java.util.ArrayList<>();
    private Range fixed;

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
            y.setNumberFormatOverride(new java.text.DecimalFormat("0.###E0"));
            yAxis = y;
        } else {
            NumberAxis y = new NumberAxis(yLabel);
            y.setAutoRangeIncludesZero(false);
            yAxis = y;
        }
    }

    /** Adds a series; returns its index, or -1 when it has no point. */
    int add(XYSeries s, int colour, int dash, int shape, float width, boolean markersOnly) {
        if (s.getItemCount() == 0) {
            return -1;
        }
        int i = data.getSeriesCount();
        data.addSeries(s);
        renderer.series(i, colour, dash, shape, width, s.getItemCount(), markersOnly);
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

    void range(double lower, double upper) {
        fixed = new Range(lower, upper);
    }

    boolean isEmpty() {
        return data.getSeriesCount() == 0;
    }

    String offScale() {
        return offScale.toString();
    }

    XYPlot build() {
        XYPlot plot = new XYPlot(data, xAxis, yAxis, renderer);
        plot.setOrientation(PlotOrientation.VERTICAL);
        double a = lo;
        double b = hi;
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
            ChartStyle.addLimit(plot, v, limitLabels.get(i));
            a = Math.min(a, v);
            b = Math.max(b, v);
        }
        if (fixed != null) {
            yAxis.setRange(fixed);
        } else if (Double.isFinite(a) && Double.isFinite(b)) {
            if (log) {
                yAxis.setRange(a / 2, b * 2);
            } else {
                double pad = b > a ? 0.06 * (b - a) : Math.max(Math.abs(a) * 0.05, 1e-12);
                yAxis.setRange(a - pad, b + pad);
            }
        }
        return plot;
    }

    /** A series from two columns of one corner's rows; scale maps the stored value to the plotted one. */
    static XYSeries series(String name, CsvTable t, String corner, String xCol, DoubleUnaryOperator xScale,
                           String yCol, DoubleUnaryOperator yScale) {
        XYSeries s = new XYSeries(name, false, true);
        boolean byCorner = corner != null && t.has("corner");
        for (int r = 0; r < t.size(); r++) {
            if (byCorner && !t.text(r, "corner").equals(corner)) {
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
