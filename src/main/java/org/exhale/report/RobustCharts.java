package org.exhale.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.CategoryAxis;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.labels.CategoryItemLabelGenerator;
import org.jfree.chart.labels.ItemLabelAnchor;
import org.jfree.chart.labels.ItemLabelPosition;
import org.jfree.chart.plot.CategoryPlot;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.category.BarRenderer;
import org.jfree.chart.renderer.category.StandardBarPainter;
import org.jfree.chart.renderer.category.StatisticalBarRenderer;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.category.CategoryDataset;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.statistics.DefaultStatisticalCategoryDataset;
import org.jfree.data.statistics.HistogramDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

import com.fasterxml.jackson.databind.JsonNode;

/**
 * Charts of a Monte Carlo robustness study (exhale robust): histograms of the time to target, of
 * the ceiling headroom and of every ratio margin, the violation probabilities with their standard
 * errors, the rank-correlation sensitivities and, for a robust plan, its cost against the nominal plan.
 */
final class RobustCharts {
    private static final String SAMPLES = "Samples [count]";
    /** Time columns of samples.csv and margin columns: the study's own names. */
    static final String TIME = "time_to_target_s";
    static final String HEADROOM = "ceiling_headroom_K";
    static final String MARGIN_SUFFIX = "_margin";

    /** The per-limit margin columns of samples.csv (its "smallest_margin" column is not a limit). */
    private List<String> limitMarginColumns() {
        return s.columns("", MARGIN_SUFFIX).stream().filter(c -> !c.equals("smallest_margin")).toList();
    }

    private final RunFolder f;
    private final JsonNode j;
    private final CsvTable s;
    private final String subtitle;

    RobustCharts(RunFolder f) {
        this.f = f;
        this.j = f.robust().orElse(null);
        this.s = f.samples().orElse(null);
        this.subtitle = ReportText.label(f.caseName());
    }

    List<Figure> all() {
        List<Figure> out = new ArrayList<>();
        if (s != null && s.has(TIME)) {
            time().ifPresent(out::add);
        }
        if (s != null && !limitMarginColumns().isEmpty()) {
            margins().ifPresent(out::add);
        }
        if (s != null && !limitMarginColumns().isEmpty()) {
            tightest().ifPresent(out::add);
        }
        if (s != null && s.has(HEADROOM)) {
            headroom().ifPresent(out::add);
        }
        if (j != null && j.path("violation").isArray() && j.path("violation").size() > 0) {
            out.add(violation());
        }
        if (j != null && j.path("sensitivity").isArray() && j.path("sensitivity").size() > 0) {
            out.add(sensitivity());
        }
        if (j != null && j.path("robust_plan").path("nominal_duration_s").isNumber()
                && j.path("robust_plan").path("robust_duration_s").isNumber()) {
            out.add(robustPlan());
        }
        return out;
    }

    private String samplesNote() {
        if (j == null) {
            return s == null ? null : s.size() + " samples";
        }
        return j.path("samples_done").asText(String.valueOf(s == null ? 0 : s.size())) + " samples, seed "
                + j.path("seed").asText("n/a") + (j.path("complete").asBoolean(true) ? "" : " (stopped early)");
    }

    private double[] finite(String col, java.util.function.DoubleUnaryOperator scale) {
        double[] v = new double[s.size()];
        int n = 0;
        for (int r = 0; r < s.size(); r++) {
            double x = s.number(r, col);
            if (Double.isFinite(x)) {
                v[n++] = scale.applyAsDouble(x);
            }
        }
        return Arrays.copyOf(v, n);
    }

    /** Bins for n values: about the square root of n, between 10 and 40. */
    static int bins(int n) {
        return Math.max(10, Math.min(40, (int) Math.round(Math.sqrt(n))));
    }

    private static XYPlot histogram(String name, double[] v, String xLabel, double lo, double hi) {
        HistogramDataset d = new HistogramDataset();
        double a = lo;
        double b = hi;
        if (!(b > a)) {
            double w = Math.max(Math.abs(a) * 1e-3, 1e-9);
            a -= w;
            b += w;
        }
        d.addSeries(name, v, bins(v.length), a, b);
        XYBarRenderer r = new XYBarRenderer(0.04);
        r.setBarPainter(new StandardXYBarPainter());
        r.setShadowVisible(false);
        r.setSeriesPaint(0, ChartStyle.translucent(ChartStyle.colour(0), 200));
        r.setDrawBarOutline(true);
        r.setSeriesOutlinePaint(0, ChartStyle.INK);
        r.setSeriesOutlineStroke(0, new BasicStroke(1f));
        NumberAxis x = new NumberAxis(xLabel);
        x.setAutoRangeIncludesZero(false);
        NumberAxis y = new NumberAxis(SAMPLES);
        y.setStandardTickUnits(NumberAxis.createIntegerTickUnits());
        y.setUpperMargin(0.18);
        XYPlot plot = new XYPlot(d, x, y, r);
        ChartStyle.style(plot);
        return plot;
    }

    /** A vertical line with a label at its top. */
    private static ValueMarker vline(double x, String label, java.awt.Paint paint, int dash, boolean right) {
        ValueMarker m = new ValueMarker(x, paint, ChartStyle.line(dash, 2.2f));
        m.setLabel(label);
        m.setLabelFont(ChartStyle.NOTE);
        m.setLabelPaint(paint);
        m.setLabelAnchor(right ? RectangleAnchor.TOP_RIGHT : RectangleAnchor.TOP_LEFT);
        m.setLabelTextAnchor(right ? TextAnchor.TOP_LEFT : TextAnchor.TOP_RIGHT);
        m.setLabelBackgroundColor(new Color(255, 255, 255, 210));
        m.setLabelOffset(new RectangleInsets(6, 4, 4, 4));
        return m;
    }

    private java.util.Optional<Figure> time() {
        double[] v = finite(TIME, x -> x / 60);
        if (v.length == 0) {
            return java.util.Optional.empty();
        }
        double lo = Arrays.stream(v).min().orElse(0);
        double hi = Arrays.stream(v).max().orElse(1);
        XYPlot plot = histogram("samples", v, "Time to the residue target [min]", lo, hi);
        JsonNode t = j == null ? null : j.path("time_to_target");
        List<String> quantiles = new ArrayList<>();
        if (t != null && t.isObject()) {
            int k = 0;
            for (var it = t.fields(); it.hasNext(); ) {
                var e = it.next();
                String key = e.getKey();
                if (key.matches("p[0-9.]+_s") && e.getValue().isNumber()) {
                    // p95_s and p95.00_s are one quantile (the second is the study's own, named with its digits)
                    String name = "P" + ReportText.plain(Double.parseDouble(key.substring(1, key.length() - 2)), 4);
                    if (quantiles.contains(name)) {
                        continue;
                    }
                    quantiles.add(name);
                    double x = e.getValue().asDouble() / 60;
                    // the median to the left of its line, the upper quantiles to the right
                    ValueMarker vm = vline(x, name + " " + ReportText.sig(x, 4) + " min",
                            k == 0 ? ChartStyle.INK : ChartStyle.LIMIT, k == 0 ? 1 : (k == 1 ? 3 : 2), k > 0);
                    // upper quantiles lie close together: their labels step down one line each
                    vm.setLabelOffset(new RectangleInsets(6 + 22 * Math.max(0, k - 1), 4, 4, 4));
                    plot.addDomainMarker(0, vm, Layer.FOREGROUND);
                    k++;
                }
            }
        }
        int notReached = s.size() - v.length;
        String note = samplesNote() + "; " + (notReached == 0 ? "every sample reached the target"
                : notReached + " never reached the target (not drawn)");
        JFreeChart c = ChartStyle.chart("Time to the residue target", plot, subtitle, note);
        c.removeLegend();
        return java.util.Optional.of(new Figure("robust-time", "Time to the residue target",
                "How long each Monte Carlo sample of the uncertain case takes to reach the residue target with the "
                        + "evaluated recipe, with the median and the upper quantiles marked.", c));
    }

    private java.util.Optional<Figure> headroom() {
        double[] v = finite(HEADROOM, x -> x);
        if (v.length == 0) {
            return java.util.Optional.empty();
        }
        double lo = Math.min(0, Arrays.stream(v).min().orElse(0));
        double hi = Arrays.stream(v).max().orElse(1);
        XYPlot plot = histogram("samples", v, "Ceiling headroom, ceiling − hottest wafer [K]", lo, hi);
        plot.getDomainAxis().setLowerBound(lo - 0.04 * Math.max(hi - lo, 1));
        plot.addDomainMarker(0, vline(0, "limit: headroom 0 K", ChartStyle.LIMIT, 3, true), Layer.FOREGROUND);
        long below = Arrays.stream(v).filter(x -> x < 0).count();
        JFreeChart c = ChartStyle.chart("Ceiling headroom", plot, subtitle,
                samplesNote() + "; " + below + " below 0 K (ceiling exceeded)");
        c.removeLegend();
        return java.util.Optional.of(new Figure("robust-headroom", "Ceiling headroom",
                "How far below the temperature ceiling the hottest wafer stays in each sample; the ceiling is "
                        + "exceeded left of the line at 0 K.", c));
    }

    /**
     * One row per ratio margin on a shared log axis, each row its own histogram (bins in log space
     * over that limit's own range) scaled to the row's height, and the limit line at margin 1.
     */
    private java.util.Optional<Figure> margins() {
        List<String> cols = limitMarginColumns();
        List<String> names = new ArrayList<>();
        List<double[]> values = new ArrayList<>();
        List<String> never = new ArrayList<>();
        double lo = 1;
        double hi = 1;
        for (String col : cols) {
            String name = col.substring(0, col.length() - MARGIN_SUFFIX.length());
            double[] v = finite(col, x -> x);
            double[] pos = Arrays.stream(v).filter(x -> x > 0).toArray();
            if (pos.length == 0) {
                never.add(name);
                continue;
            }
            names.add(name);
            values.add(pos);
            lo = Math.min(lo, Arrays.stream(pos).min().orElse(1));
            hi = Math.max(hi, Arrays.stream(pos).max().orElse(1));
        }
        if (names.isEmpty()) {
            return java.util.Optional.empty();
        }
        int rows = names.size();
        XYSeriesCollection data = new XYSeriesCollection();
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(true, false);
        XYPlot plot = new XYPlot(data, null, null, r);
        double axisLo = lo / 2;
        double axisHi = hi * 2;
        double span = Math.log10(axisHi) - Math.log10(axisLo);
        for (int i = 0; i < rows; i++) {
            double[] v = values.get(i);
            int row = rows - 1 - i;
            double a = Math.log10(Arrays.stream(v).min().orElse(1));
            double b = Math.log10(Arrays.stream(v).max().orElse(1));
            int nb = bins(v.length);
            if (b - a < 1e-12) {
                // one value: a single narrow bin
                a -= 0.002 * span;
                b += 0.002 * span;
                nb = 1;
            }
            int[] count = new int[nb];
            for (double x : v) {
                int k = (int) Math.floor((Math.log10(x) - a) / (b - a) * nb);
                count[Math.max(0, Math.min(nb - 1, k))]++;
            }
            int max = Arrays.stream(count).max().orElse(1);
            XYSeries ser = new XYSeries(names.get(i), false, true);
            ser.add(Math.pow(10, a), row);
            for (int k = 0; k < nb; k++) {
                double h = row + 0.78 * count[k] / max;
                ser.add(Math.pow(10, a + (b - a) * k / nb), h);
                ser.add(Math.pow(10, a + (b - a) * (k + 1) / nb), h);
            }
            ser.add(Math.pow(10, b), row);
            data.addSeries(ser);
            r.setSeriesPaint(i, ChartStyle.colour(i));
            r.setSeriesStroke(i, ChartStyle.line(0, 2.2f));
            double[] sorted = v.clone();
            Arrays.sort(sorted);
            double med = sorted[sorted.length / 2];
            String text = "min " + ReportText.sig(sorted[0], 4) + ", median " + ReportText.sig(med, 4)
                    + (sorted.length < s.size() ? " (" + (s.size() - sorted.length) + " never loaded)" : "");
            // the text on the side of the histogram with more room
            double leftRoom = (a - Math.log10(axisLo)) / span;
            double rightRoom = 1 - (b - Math.log10(axisLo)) / span;
            boolean rightHalf = leftRoom > rightRoom;
            XYTextAnnotation t = new XYTextAnnotation(text, rightHalf ? Math.pow(10, a) : Math.pow(10, b), row + 0.05);
            t.setFont(ChartStyle.NOTE);
            t.setPaint(ChartStyle.INK);
            t.setTextAnchor(rightHalf ? TextAnchor.BOTTOM_RIGHT : TextAnchor.BOTTOM_LEFT);
            t.setBackgroundPaint(new Color(255, 255, 255, 200));
            plot.addAnnotation(t);
        }
        LogAxis x = new LogAxis("Margin, allowed / actual [–, log scale]");
        x.setBase(10);
        x.setSmallestValue(1e-300);
        x.setMinorTickCount(9);
        x.setNumberFormatOverride(new DecadeFormat());
        x.setTickUnit(new NumberTickUnit(span > 8 ? 2 : 1));
        x.setRange(axisLo, axisHi);
        List<String> reversed = new ArrayList<>(names);
        java.util.Collections.reverse(reversed);
        SymbolAxis y = new SymbolAxis("Limit (one histogram per row) [–]", reversed.toArray(String[]::new));
        y.setGridBandsVisible(false);
        y.setRange(-0.3, rows - 0.1);
        plot.setDomainAxis(x);
        plot.setRangeAxis(y);
        ChartStyle.style(plot);
        plot.setDomainGridlinesVisible(true);
        IntervalMarker band = new IntervalMarker(axisLo, 1, ChartStyle.translucent(ChartStyle.LIMIT, 22));
        plot.addDomainMarker(0, band, Layer.BACKGROUND);
        plot.addDomainMarker(0, vline(1, "margin 1: the limit", ChartStyle.LIMIT, 3, true), Layer.FOREGROUND);
        String neverNote = never.isEmpty() ? null
                : String.join(", ", never) + ": never loaded in any sample (margin ∞, not drawn)";
        JFreeChart c = ChartStyle.chart("Margins to the limits over the samples", plot, subtitle, samplesNote(), neverNote);
        c.removeLegend();
        return java.util.Optional.of(new Figure("robust-margins", "Margins to the limits over the samples",
                "For each limit, the histogram of its ratio margin (allowed / actual) over the samples on a shared "
                        + "log scale; a sample violates the limit left of the line at 1. Each row is scaled to its own "
                        + "tallest bin; the text gives the smallest and the median margin.", c));
    }

    /** The ratio margin with the smallest median: its histogram on a linear scale, with the limit at 1. */
    private java.util.Optional<Figure> tightest() {
        String best = null;
        double bestMedian = Double.POSITIVE_INFINITY;
        for (String col : limitMarginColumns()) {
            double[] v = finite(col, x -> x);
            if (v.length == 0) {
                continue;
            }
            Arrays.sort(v);
            if (v[v.length / 2] < bestMedian) {
                bestMedian = v[v.length / 2];
                best = col;
            }
        }
        if (best == null) {
            return java.util.Optional.empty();
        }
        String name = ReportText.label(best.substring(0, best.length() - MARGIN_SUFFIX.length()));
        double[] v = finite(best, x -> x);
        double lo = Arrays.stream(v).min().orElse(1);
        double hi = Arrays.stream(v).max().orElse(1);
        XYPlot plot = histogram(name, v, "Margin of " + name + ", allowed / actual [–]", lo, hi);
        // the line at 1 in view: to the left of the data when all samples hold, and some room to the right
        double a = Math.min(lo, 1);
        double b = Math.max(hi, 1);
        double pad = 0.05 * Math.max(b - a, 1e-6);
        plot.getDomainAxis().setRange(a - pad, b + pad);
        IntervalMarker band = new IntervalMarker(a - pad, 1, ChartStyle.translucent(ChartStyle.LIMIT, 22));
        plot.addDomainMarker(0, band, Layer.BACKGROUND);
        plot.addDomainMarker(0, vline(1, "margin 1: the limit", ChartStyle.LIMIT, 3, true), Layer.FOREGROUND);
        long below = Arrays.stream(v).filter(x -> x < 1).count();
        JFreeChart c = ChartStyle.chart("Tightest limit: " + name, plot, subtitle,
                samplesNote() + "; " + below + " below margin 1 (violated)");
        c.removeLegend();
        return java.util.Optional.of(new Figure("robust-tightest", "Tightest limit: " + name,
                "The histogram of the margin with the smallest median, " + name + ", on a linear scale; samples left "
                        + "of the line at 1 violate it.", c));
    }

    private static void bars(CategoryPlot plot, BarRenderer r) {
        r.setBarPainter(new StandardBarPainter());
        r.setShadowVisible(false);
        r.setDrawBarOutline(true);
        r.setItemMargin(0.05);
        plot.setOrientation(PlotOrientation.HORIZONTAL);
        plot.setRangeAxisLocation(AxisLocation.BOTTOM_OR_LEFT);
        plot.setBackgroundPaint(ChartStyle.BACKGROUND);
        plot.setOutlinePaint(ChartStyle.INK);
        plot.setRangeGridlinePaint(ChartStyle.GRID);
        ChartStyle.axis(plot.getDomainAxis());
        ChartStyle.axis(plot.getRangeAxis());
        for (int i = 0; i < 2; i++) {
            r.setSeriesOutlinePaint(i, ChartStyle.INK);
            r.setSeriesOutlineStroke(i, new BasicStroke(1f));
        }
        // dark and light: the two series tell apart in greyscale
        r.setSeriesPaint(0, ChartStyle.colour(0));
        r.setSeriesPaint(1, ChartStyle.translucent(ChartStyle.colour(7), 150));
        r.setDefaultItemLabelFont(new Font(ChartStyle.FAMILY, Font.PLAIN, 14));
        r.setDefaultItemLabelPaint(ChartStyle.INK);
        r.setDefaultItemLabelsVisible(true);
        r.setDefaultPositiveItemLabelPosition(new ItemLabelPosition(ItemLabelAnchor.OUTSIDE3, TextAnchor.CENTER_LEFT));
        r.setDefaultNegativeItemLabelPosition(new ItemLabelPosition(ItemLabelAnchor.OUTSIDE9, TextAnchor.CENTER_RIGHT));
        r.setItemLabelAnchorOffset(6);
    }

    /** Labels from a table of texts, by series and category. */
    private record Labels(String[][] text) implements CategoryItemLabelGenerator {
        @Override
        public String generateRowLabel(CategoryDataset d, int row) {
            return d.getRowKey(row).toString();
        }

        @Override
        public String generateColumnLabel(CategoryDataset d, int column) {
            return d.getColumnKey(column).toString();
        }

        @Override
        public String generateLabel(CategoryDataset d, int row, int column) {
            return row < text.length && column < text[row].length ? text[row][column] : null;
        }
    }

    private Figure violation() {
        DefaultStatisticalCategoryDataset d = new DefaultStatisticalCategoryDataset();
        String p0 = "P(violate) ± 1 standard error";
        String p1 = "95 % upper bound when none was seen (rule of three)";
        List<JsonNode> rows = new ArrayList<>();
        j.path("violation").forEach(rows::add);
        JsonNode any = j.path("any_limit");
        double top = 0;
        int samples = j.path("samples_done").asInt(s == null ? 0 : s.size());
        boolean none = any.path("probability").isNumber() && any.path("probability").asDouble() == 0
                && rows.stream().allMatch(v -> v.path("violations").asInt(0) == 0);
        if (none) {
            rows.clear(); // one bar says it: the same bound for every limit would only repeat it
        }
        for (JsonNode v : rows) {
            double p = v.path("probability").asDouble(0) * 100;
            double se = v.path("standard_error").asDouble(0) * 100;
            int k = v.path("violations").asInt(-1);
            double up = v.path("upper_95_rule_of_three").isNumber() && k == 0
                    ? v.path("upper_95_rule_of_three").asDouble() * 100 : Double.NaN;
            // the figures go with the limit's name: a label at the bar's end would sit on the error bar
            String limit = ReportText.label(v.path("limit").asText("?")) + ": " + (k == 0 && !Double.isNaN(up)
                    ? "none of " + samples + ", < " + ReportText.sig(up, 2) + " %"
                    : ReportText.sig(p, 3) + " ± " + ReportText.sig(se, 2) + " %" + (k >= 0 ? " (" + k + " of "
                    + samples + ")" : ""));
            d.add(p, se, p0, limit);
            d.add(Double.isNaN(up) ? null : (Number) up, (Number) 0.0, p1, limit);
            top = Math.max(top, Math.max(p + se, Double.isNaN(up) ? 0 : up));
        }
        if (any.path("probability").isNumber()) {
            double p = any.path("probability").asDouble() * 100;
            double se = any.path("standard_error").asDouble(0) * 100;
            double up = p == 0 && samples > 0 ? Math.min(100, 300.0 / samples) : Double.NaN;
            String name = "any limit: " + (Double.isNaN(up) ? ReportText.sig(p, 3) + " ± " + ReportText.sig(se, 2) + " %"
                    : "none of " + samples + ", < " + ReportText.sig(up, 2) + " %");
            d.add(p, se, p0, name);
            d.add(Double.isNaN(up) ? null : (Number) up, (Number) 0.0, p1, name);
            top = Math.max(top, Math.max(p + se, Double.isNaN(up) ? 0 : up));
        }
        StatisticalBarRenderer r = new StatisticalBarRenderer();
        r.setErrorIndicatorPaint(ChartStyle.INK);
        r.setErrorIndicatorStroke(new BasicStroke(1.6f));
        CategoryAxis x = new CategoryAxis("Limit");
        NumberAxis y = new NumberAxis("Probability of violating the limit [%]");
        y.setRange(0, top > 0 ? top * 1.15 : 1);
        CategoryPlot plot = new CategoryPlot(d, x, y, r);
        bars(plot, r);
        r.setDefaultItemLabelsVisible(false);
        String title = none ? "No violations in " + samples + " samples" : "Probability of violating each limit";
        JFreeChart chart = ChartStyle.chart(title, plot, subtitle, samplesNote());
        return new Figure("robust-violation", title,
                "The share of samples that violate each limit, with its binomial standard error as an error bar; "
                        + "where no sample violated a limit the light bar gives the 95 % upper bound (three over the "
                        + "number of samples).", chart);
    }

    private Figure sensitivity() {
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        String m = "smallest margin";
        String t = "time to target";
        List<JsonNode> rows = new ArrayList<>();
        j.path("sensitivity").forEach(rows::add);
        String[][] labels = new String[2][rows.size()];
        int c = 0;
        for (JsonNode v : rows) {
            String p = ReportText.label(v.path("parameter").asText("?"));
            JsonNode a = v.path("spearman_smallest_margin");
            JsonNode b = v.path("spearman_time_to_target");
            d.addValue(a.isNumber() ? a.asDouble() : null, m, p);
            d.addValue(b.isNumber() ? b.asDouble() : null, t, p);
            labels[0][c] = a.isNumber() ? ReportText.sig(a.asDouble(), 2) : "n/a";
            labels[1][c] = b.isNumber() ? ReportText.sig(b.asDouble(), 2) : "n/a";
            c++;
        }
        BarRenderer r = new BarRenderer();
        r.setDefaultItemLabelGenerator(new Labels(labels));
        CategoryAxis x = new CategoryAxis("Uncertain value, most influential first");
        NumberAxis y = new NumberAxis("Spearman rank correlation with the outcome [–]");
        y.setRange(-1.25, 1.25);
        y.setTickUnit(new NumberTickUnit(0.25));
        CategoryPlot plot = new CategoryPlot(d, x, y, r);
        bars(plot, r);
        plot.addRangeMarker(new ValueMarker(0, ChartStyle.INK, new BasicStroke(1.2f)), Layer.FOREGROUND);
        int n = j.path("samples_done").asInt(s == null ? 0 : s.size());
        String noise = null;
        if (n > 1) {
            double band = 2 / Math.sqrt(n - 1);
            IntervalMarker im = new IntervalMarker(-band, band, new Color(0xe6, 0xe8, 0xeb));
            im.setLabel("|ρ| < " + ReportText.sig(band, 2) + ": not told apart from none");
            im.setLabelFont(ChartStyle.NOTE);
            im.setLabelPaint(ChartStyle.INK);
            im.setLabelAnchor(RectangleAnchor.BOTTOM);
            im.setLabelTextAnchor(TextAnchor.BOTTOM_CENTER);
            im.setLabelOffset(new RectangleInsets(2, 2, 4, 2));
            plot.addRangeMarker(0, im, Layer.BACKGROUND);
            noise = "shaded: |ρ| below 2/√(n − 1) = " + ReportText.sig(band, 2) + " is not distinguishable from none";
        }
        JFreeChart chart = ChartStyle.chart("Which uncertain values matter", plot, subtitle, samplesNote(), noise);
        return new Figure("robust-sensitivity", "Which uncertain values matter",
                "Spearman rank correlation of each uncertain value with the sample's smallest margin (negative: a "
                        + "larger value brings a limit closer) and with its time to target (positive: a larger value "
                        + "makes the bake longer), ranked by influence on the margin.", chart);
    }

    private Figure robustPlan() {
        JsonNode p = j.path("robust_plan");
        double nominal = p.path("nominal_duration_s").asDouble() / 60;
        double robust = p.path("robust_duration_s").asDouble() / 60;
        DefaultCategoryDataset d = new DefaultCategoryDataset();
        d.addValue(nominal, "nominal plan", "nominal plan");
        d.addValue(robust, "robust plan", "robust plan");
        BarRenderer r = new BarRenderer();
        String[][] labels = {{ReportText.sig(nominal, 4) + " min", null}, {null, ReportText.sig(robust, 4) + " min"}};
        r.setDefaultItemLabelGenerator(new Labels(labels));
        CategoryAxis x = new CategoryAxis("");
        NumberAxis y = new NumberAxis("Duration to the residue target [min]");
        y.setUpperMargin(0.2);
        CategoryPlot plot = new CategoryPlot(d, x, y, r);
        bars(plot, r);
        r.setItemMargin(-1);
        r.setMaximumBarWidth(0.3);
        String q = j.path("quantile").isNumber() ? "every limit holds in at least " + ReportText.plain(
                j.path("quantile").asDouble() * 100, 4) + " % of samples" : null;
        String cost = p.path("cost_s").isNumber() ? "cost " + (p.path("cost_s").asDouble() >= 0 ? "+" : "")
                + ReportText.sig(p.path("cost_s").asDouble() / 60, 3) + " min"
                + (p.path("cost_percent").isNumber() ? " (" + ReportText.sig(p.path("cost_percent").asDouble(), 3)
                + " %)" : "") + (p.path("met").asBoolean(true) ? "" : "; the quantile was NOT met") : null;
        JFreeChart chart = ChartStyle.chart("Robust plan against the nominal plan", plot, subtitle,
                q == null ? cost : q + (cost == null ? "" : "; " + cost));
        chart.removeLegend();
        return new Figure("robust-plan", "Robust plan against the nominal plan",
                "Duration of the plan for the nominal case beside the robust plan, whose limits are tightened until "
                        + "they hold at the quantile over the samples; the difference is the price of robustness.",
                chart);
    }
}
