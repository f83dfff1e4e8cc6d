package org.exhale.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Paint;
import java.awt.geom.Rectangle2D;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYLineAnnotation;
import org.jfree.chart.annotations.XYShapeAnnotation;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.AxisLocation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.SymbolAxis;
import org.jfree.chart.plot.IntervalMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.PaintScale;
import org.jfree.chart.renderer.xy.XYBlockRenderer;
import org.jfree.chart.title.PaintScaleLegend;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.DefaultXYZDataset;
import org.jfree.data.xy.XYSeries;

import com.fasterxml.jackson.databind.JsonNode;

/**
 * Charts of a comparison of options (exhale compare): duration against the smallest margin with
 * the Pareto front, and the planned duration over the varied values (a map of cells for two
 * varied keys, a line for one).
 */
final class CompareCharts {
    /** A map with more cells than this on a side is drawn without the text in its cells. */
    static final int MAX_LABELLED_SIDE = 14;
    /** Pareto points are named (#N) when there are no more groups of them than this. */
    static final int MAX_NAMED_POINTS = 16;

    /**
     * One compared option as options.csv (or compare.json) gives it.
     *
     * @param values the varied values, in the order of {@link CompareData#columns()}
     */
    record Option(int rank, int number, double[] values, boolean feasible, boolean pareto, double durationS,
                  double lowerBoundS, double smallestMargin, String marginLimit, String infeasibleLimit) {
        String name() {
            return "#" + number;
        }
    }

    /**
     * The options of a comparison and what was varied.
     *
     * @param columns the varied columns (as named in options.csv, e.g. {@code limits.ceiling_C})
     * @param labels  axis labels of the varied columns, with units
     */
    record CompareData(List<String> columns, List<String> labels, List<Option> options) {
        boolean isEmpty() {
            return options.isEmpty();
        }
    }

    private final RunFolder f;
    private final CompareData d;
    private final String subtitle;

    CompareCharts(RunFolder f) {
        this.f = f;
        this.d = data(f);
        this.subtitle = ReportText.label(f.caseName());
    }

    List<Figure> all() {
        List<Figure> out = new ArrayList<>();
        if (d.isEmpty()) {
            return out;
        }
        out.add(pareto());
        if (d.columns().size() == 2) {
            out.add(map());
        } else if (d.columns().size() == 1) {
            out.add(line());
        }
        return out;
    }

    // ---------------------------------------------------------------- reading

    /** The options from options.csv, else from compare.json; empty when neither has any. */
    static CompareData data(RunFolder f) {
        JsonNode vary = f.compare().map(c -> c.path("vary")).orElse(null);
        if (f.options().isPresent() && f.options().get().has("option") && f.options().get().has("feasible")) {
            CsvTable t = f.options().get();
            List<String> h = t.header();
            List<String> cols = new ArrayList<>(h.subList(h.indexOf("option") + 1, Math.max(h.indexOf("option") + 1,
                    h.indexOf("feasible"))));
            List<Option> opts = new ArrayList<>();
            for (int r = 0; r < t.size(); r++) {
                double[] v = new double[cols.size()];
                for (int k = 0; k < v.length; k++) {
                    v[k] = t.number(r, cols.get(k));
                }
                opts.add(new Option(intOr(t, r, "rank", r + 1), intOr(t, r, "option", r + 1), v,
                        "true".equalsIgnoreCase(t.text(r, "feasible")),
                        t.has("pareto") && "true".equalsIgnoreCase(t.text(r, "pareto")),
                        num(t, r, "duration_s"), num(t, r, "lower_bound_s"), num(t, r, "smallest_margin"),
                        t.has("smallest_margin_limit") ? t.text(r, "smallest_margin_limit") : "",
                        t.has("infeasible_limit") ? t.text(r, "infeasible_limit") : ""));
            }
            return new CompareData(cols, cols.stream().map(c -> axisLabel(c, vary)).toList(), opts);
        }
        JsonNode arr = f.compare().map(c -> c.path("options")).orElse(null);
        if (arr == null || !arr.isArray() || arr.size() == 0) {
            return new CompareData(List.of(), List.of(), List.of());
        }
        List<String> cols = new ArrayList<>();
        arr.get(0).path("values").fieldNames().forEachRemaining(cols::add);
        List<Option> opts = new ArrayList<>();
        int i = 0;
        for (JsonNode o : arr) {
            i++;
            double[] v = new double[cols.size()];
            for (int k = 0; k < v.length; k++) {
                JsonNode x = o.path("values").path(cols.get(k));
                v[k] = x.isNumber() ? x.asDouble() : Double.NaN;
            }
            opts.add(new Option(o.path("rank").asInt(i), o.path("option").asInt(i), v, o.path("feasible").asBoolean(false),
                    o.path("pareto").asBoolean(false), jnum(o, "duration_s"), jnum(o, "lower_bound_s"),
                    jnum(o, "smallest_margin"), o.path("smallest_margin_limit").asText(""),
                    o.path("infeasible_limit").asText("")));
        }
        return new CompareData(cols, cols.stream().map(c -> axisLabel(c, vary)).toList(), opts);
    }

    private static int intOr(CsvTable t, int r, String col, int dflt) {
        if (!t.has(col)) {
            return dflt;
        }
        double v = t.number(r, col);
        return Double.isFinite(v) ? (int) Math.round(v) : dflt;
    }

    private static double num(CsvTable t, int r, String col) {
        return t.has(col) ? t.number(r, col) : Double.NaN;
    }

    private static double jnum(JsonNode o, String key) {
        return o.path(key).isNumber() ? o.path(key).asDouble() : Double.NaN;
    }

    /**
     * "limits.ceiling [°C]" from the column limits.ceiling_C: the unit from compare.json's vary list
     * when the column is there, else from the column's suffix.
     */
    static String axisLabel(String column, JsonNode vary) {
        String key = column;
        String unit = null;
        if (vary != null && vary.isArray()) {
            for (JsonNode v : vary) {
                String k = v.path("key").asText("");
                String u = v.path("unit").asText("");
                if (!k.isEmpty() && column.equals(u.isEmpty() ? k : k + "_" + u.replace("/", "_per_"))) {
                    key = k;
                    unit = u;
                }
            }
        }
        if (unit == null) {
            // the keys compare knows, longest first; an unknown column splits at its last underscore
            for (String k : org.exhale.studies.StudyKey.names().stream()
                    .sorted(Comparator.comparingInt(String::length).reversed()).toList()) {
                if (column.equals(k) || column.startsWith(k + "_")) {
                    key = k;
                    unit = column.length() > k.length() ? column.substring(k.length() + 1).replace("_per_", "/") : "";
                    break;
                }
            }
        }
        if (unit == null) {
            int us = column.lastIndexOf('_');
            if (us > Math.max(0, column.lastIndexOf('.'))) {
                key = column.substring(0, us);
                unit = column.substring(us + 1);
            } else {
                unit = "";
            }
        }
        return ReportText.label(key) + " [" + ReportText.label(displayUnit(unit)) + "]";
    }

    static String displayUnit(String unit) {
        return switch (unit) {
            case "" -> "–";
            case "C" -> "°C";
            default -> unit;
        };
    }

    // ---------------------------------------------------------------- duration against margin

    private Figure pareto() {
        PlotBuilder p = new PlotBuilder("Planned duration to the residue target [min]",
                "Smallest margin, allowed / actual [–]", false);
        XYSeries all = new XYSeries("feasible option", false, true);
        XYSeries front = new XYSeries("Pareto front (shortest for its margin)", false, true);
        XYSeries bad = new XYSeries("infeasible: no plan (drawn at its lower bound, in the band below margin 1)",
                false, true);
        List<Option> frontOpts = new ArrayList<>();
        double hiMargin = 1;
        for (Option o : d.options()) {
            if (o.feasible() && Double.isFinite(o.durationS()) && Double.isFinite(o.smallestMargin())) {
                all.add(o.durationS() / 60, o.smallestMargin());
                hiMargin = Math.max(hiMargin, o.smallestMargin());
                if (o.pareto()) {
                    frontOpts.add(o);
                }
            }
        }
        frontOpts.sort(Comparator.comparingDouble(Option::durationS).thenComparingDouble(o -> -o.smallestMargin()));
        for (Option o : frontOpts) {
            front.add(o.durationS() / 60, o.smallestMargin());
        }
        double badY = 0.5;
        int badUnplaced = 0;
        int badCount = 0;
        for (Option o : d.options()) {
            if (!o.feasible()) {
                badCount++;
                if (Double.isFinite(o.lowerBoundS())) {
                    bad.add(o.lowerBoundS() / 60, badY);
                } else {
                    badUnplaced++;
                }
            }
        }
        p.add(all, 5, 0, 0, 2f, true);
        p.add(front, 0, 0, 1, 2.6f, false);
        p.add(bad, 1, 0, 5, 2f, true);
        p.limit(1, "margin 1: the limit");
        double xlo = Double.POSITIVE_INFINITY;
        double xhi = Double.NEGATIVE_INFINITY;
        for (XYSeries ser : List.of(all, bad)) {
            for (int k = 0; k < ser.getItemCount(); k++) {
                xlo = Math.min(xlo, ser.getX(k).doubleValue());
                xhi = Math.max(xhi, ser.getX(k).doubleValue());
            }
        }
        if (Double.isFinite(xlo)) {
            // room on both sides: markers at the ends are not cut, the labels fit
            // never magnify differences below the resolution: the axis spans at least 5 % of the duration
            // and 1 min, whatever the spread of the options
            double span = Math.max(xhi - xlo, Math.max(0.05 * Math.abs(xhi), 1.0));
            double mid = (xlo + xhi) / 2;
            double pad = 0.08 * span;
            p.xRange(mid - span / 2 - pad, mid + span / 2 + 2 * pad);
        }
        p.range(0, Math.max(1.25, hiMargin * 1.12));
        XYPlot plot = p.build();
        IntervalMarker band = new IntervalMarker(0, 1, ChartStyle.translucent(ChartStyle.LIMIT, 22));
        band.setLabel("below the limit");
        band.setLabelFont(ChartStyle.NOTE);
        band.setLabelPaint(ChartStyle.LIMIT);
        band.setLabelAnchor(RectangleAnchor.BOTTOM_LEFT);
        band.setLabelTextAnchor(TextAnchor.BOTTOM_LEFT);
        band.setLabelOffset(new RectangleInsets(4, 8, 4, 4));
        plot.addRangeMarker(0, band, Layer.BACKGROUND);
        // the options on the front are named; options at the same point share one label
        Map<String, List<Option>> groups = new LinkedHashMap<>();
        for (Option o : frontOpts) {
            groups.computeIfAbsent(Math.round(o.durationS()) + "/" + org.exhale.studies.Compare.resolved(o.smallestMargin()),
                    k -> new ArrayList<>()).add(o);
        }
        if (groups.size() <= MAX_NAMED_POINTS) {
            for (List<Option> g : groups.values()) {
                g.sort(Comparator.comparingInt(Option::number));
                StringBuilder s = new StringBuilder();
                for (int i = 0; i < g.size() && i < 4; i++) {
                    s.append(i > 0 ? ", " : "").append(g.get(i).name());
                }
                if (g.size() > 4) {
                    s.append(" and ").append(g.size() - 4).append(" more");
                }
                boolean first = g.stream().anyMatch(o -> o.rank() == 1);
                if (g.size() > 1) {
                    s.append(first ? " (tied first)" : " (tied)");
                } else if (first) {
                    s.append(" (first)");
                }
                XYTextAnnotation a = new XYTextAnnotation(s.toString(), g.get(0).durationS() / 60, g.get(0).smallestMargin());
                a.setFont(ChartStyle.NOTE);
                a.setPaint(ChartStyle.INK);
                a.setTextAnchor(TextAnchor.BOTTOM_LEFT);
                a.setBackgroundPaint(new Color(255, 255, 255, 200));
                plot.addAnnotation(new OffsetText(a, 8, -6));
            }
        }
        int feasible = all.getItemCount();
        String counts = feasible + " feasible, " + groups.size() + " point" + (groups.size() == 1 ? "" : "s")
                + " on the Pareto front (" + frontOpts.size() + " option" + (frontOpts.size() == 1 ? "" : "s") + "), "
                + badCount + " infeasible"
                + (badUnplaced > 0 ? " (" + badUnplaced + " without a lower bound, not drawn)" : "");
        JFreeChart c = ChartStyle.chart("Duration against the smallest margin", plot, subtitle, counts);
        return new Figure("compare-pareto", "Duration against the smallest margin",
                "Each compared option's planned duration against its smallest ratio margin (allowed / actual; the "
                        + "ceiling's headroom is apart). The Pareto front joins the options that no other option beats "
                        + "in both; up and to the left is better. Infeasible options have no plan: they sit in the band "
                        + "below margin 1, at their lower bound on the duration.", c);
    }

    /** A text annotation moved by a few pixels from its anchor point, so that it does not cover the marker. */
    private static final class OffsetText extends XYTextAnnotation {
        private static final long serialVersionUID = 1L;
        private final double dx;
        private final double dy;

        OffsetText(XYTextAnnotation a, double dx, double dy) {
            super(a.getText(), a.getX(), a.getY());
            setFont(a.getFont());
            setPaint(a.getPaint());
            setTextAnchor(a.getTextAnchor());
            setBackgroundPaint(a.getBackgroundPaint());
            this.dx = dx;
            this.dy = dy;
        }

        @Override
        public void draw(java.awt.Graphics2D g2, XYPlot plot, Rectangle2D dataArea,
                         org.jfree.chart.axis.ValueAxis domainAxis, org.jfree.chart.axis.ValueAxis rangeAxis,
                         int rendererIndex, org.jfree.chart.plot.PlotRenderingInfo info) {
            java.awt.geom.AffineTransform saved = g2.getTransform();
            g2.translate(dx, dy);
            try {
                super.draw(g2, plot, dataArea, domainAxis, rangeAxis, rendererIndex, info);
            } finally {
                g2.setTransform(saved);
            }
        }
    }

    // ---------------------------------------------------------------- over the varied values

    /** Distinct values of one varied column, ascending (equal to nine significant digits counts as one). */
    static List<Double> levels(List<Option> opts, int k) {
        List<Double> out = new ArrayList<>();
        for (Option o : opts) {
            double v = o.values()[k];
            if (Double.isFinite(v) && out.stream().noneMatch(x -> same(x, v))) {
                out.add(v);
            }
        }
        out.sort(Double::compare);
        return out;
    }

    private static boolean same(double a, double b) {
        return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b)) || a == b;
    }

    private static int index(List<Double> levels, double v) {
        for (int i = 0; i < levels.size(); i++) {
            if (same(levels.get(i), v)) {
                return i;
            }
        }
        return -1;
    }

    private static String[] tickLabels(List<Double> levels) {
        return levels.stream().map(v -> ReportText.plain(v, 4)).toArray(String[]::new);
    }

    private Figure map() {
        List<Double> xs = levels(d.options(), 0);
        List<Double> ys = levels(d.options(), 1);
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (Option o : d.options()) {
            if (o.feasible() && Double.isFinite(o.durationS())) {
                lo = Math.min(lo, o.durationS() / 60);
                hi = Math.max(hi, o.durationS() / 60);
            }
        }
        if (!Double.isFinite(lo)) {
            lo = 0;
            hi = 1;
        }
        if (hi - lo < 1e-9) {
            // one duration only: a scale of one colour, centred on it
            lo -= 0.5;
            hi += 0.5;
        }
        DurationScale scale = new DurationScale(lo, hi);
        List<double[]> cells = new ArrayList<>();
        for (Option o : d.options()) {
            int i = index(xs, o.values()[0]);
            int j = index(ys, o.values()[1]);
            if (i >= 0 && j >= 0) {
                cells.add(new double[]{i, j, o.feasible() && Double.isFinite(o.durationS()) ? o.durationS() / 60 : Double.NaN});
            }
        }
        double[][] series = new double[3][cells.size()];
        for (int n = 0; n < cells.size(); n++) {
            for (int k = 0; k < 3; k++) {
                series[k][n] = cells.get(n)[k];
            }
        }
        DefaultXYZDataset data = new DefaultXYZDataset();
        data.addSeries("planned duration", series);
        XYBlockRenderer r = new XYBlockRenderer();
        r.setPaintScale(scale);
        r.setBlockWidth(1);
        r.setBlockHeight(1);
        SymbolAxis x = new SymbolAxis(d.labels().get(0), tickLabels(xs));
        SymbolAxis y = new SymbolAxis(d.labels().get(1), tickLabels(ys));
        x.setGridBandsVisible(false);
        y.setGridBandsVisible(false);
        x.setRange(-0.5, xs.size() - 0.5);
        y.setRange(-0.5, ys.size() - 0.5);
        XYPlot plot = new XYPlot(data, x, y, r);
        boolean text = xs.size() <= MAX_LABELLED_SIDE && ys.size() <= MAX_LABELLED_SIDE;
        Font big = new Font(ChartStyle.FAMILY, Font.BOLD, xs.size() > 8 ? 14 : 18);
        Font small = new Font(ChartStyle.FAMILY, Font.PLAIN, xs.size() > 8 ? 12 : 15);
        for (Option o : d.options()) {
            int i = index(xs, o.values()[0]);
            int j = index(ys, o.values()[1]);
            if (i < 0 || j < 0) {
                continue;
            }
            boolean ok = o.feasible() && Double.isFinite(o.durationS());
            if (!ok) {
                // a cross over the cell: infeasible reads without colour
                BasicStroke s = new BasicStroke(1.4f);
                double w = 0.38;
                plot.addAnnotation(new XYLineAnnotation(i - w, j - w, i + w, j + w, s, ChartStyle.LIMIT));
                plot.addAnnotation(new XYLineAnnotation(i - w, j + w, i + w, j - w, s, ChartStyle.LIMIT));
            }
            if (o.rank() == 1 && ok) {
                plot.addAnnotation(new XYShapeAnnotation(new Rectangle2D.Double(i - 0.46, j - 0.46, 0.92, 0.92),
                        new BasicStroke(4f), ChartStyle.colour(1)));
            }
            if (!text) {
                continue;
            }
            Paint ink = ok && scale.dark(o.durationS() / 60) ? Color.WHITE : ChartStyle.INK;
            String main = ok ? ReportText.sig(o.durationS() / 60, 3) + " min" : "infeasible";
            String sub = ok ? o.name() + (o.rank() == 1 ? " best" : "") + (o.pareto() ? ", Pareto" : "")
                    : o.name() + (o.infeasibleLimit().isEmpty() ? "" : ": " + o.infeasibleLimit());
            plot.addAnnotation(cellText(main, i, j + 0.1, big, ok ? ink : ChartStyle.LIMIT, !ok));
            plot.addAnnotation(cellText(ReportText.label(sub), i, j - 0.18, small, ok ? ink : ChartStyle.LIMIT, !ok));
        }
        ChartStyle.style(plot);
        plot.setDomainGridlinesVisible(false);
        plot.setRangeGridlinesVisible(false);
        plot.setBackgroundPaint(new Color(0xee, 0xee, 0xee));
        JFreeChart c = ChartStyle.chart("Planned duration over the varied values", plot, subtitle,
                "cells: planned duration to the residue target; crossed cells are infeasible (the failing limit named); "
                        + "the framed cell is the best option");
        c.removeLegend();
        NumberAxis za = new NumberAxis("Planned duration [min]");
        za.setRange(lo, hi);
        ChartStyle.axis(za);
        PaintScaleLegend legend = new PaintScaleLegend(scale, za);
        legend.setPosition(RectangleEdge.RIGHT);
        legend.setAxisLocation(AxisLocation.BOTTOM_OR_RIGHT);
        legend.setMargin(new RectangleInsets(10, 14, 40, 4));
        legend.setStripWidth(22);
        legend.setStripOutlineVisible(true);
        legend.setBackgroundPaint(ChartStyle.BACKGROUND);
        c.addSubtitle(legend);
        return new Figure("compare-map", "Planned duration over the varied values",
                "The planned duration of every option on a grid of the two varied values; darker is longer. "
                        + "Crossed cells are infeasible and name the limit that fails; the framed cell is the best "
                        + "option.", c);
    }

    private static XYTextAnnotation cellText(String s, double x, double y, Font font, Paint paint, boolean backed) {
        XYTextAnnotation a = new XYTextAnnotation(s, x, y);
        a.setFont(font);
        a.setPaint(paint);
        a.setTextAnchor(TextAnchor.CENTER);
        if (backed) {
            a.setBackgroundPaint(new Color(255, 255, 255, 220));
        }
        return a;
    }

    /** Light for short, dark for long, in one hue (reads in greyscale); infeasible cells are light grey. */
    static final class DurationScale implements PaintScale, java.io.Serializable {
        private static final long serialVersionUID = 1L;
        private static final Color LIGHT = new Color(0xe4, 0xec, 0xf3);
        private static final Color DARK = ChartStyle.PALETTE[0].darker();
        private static final Color NONE = new Color(0xf6, 0xf6, 0xf6);
        private final double lo;
        private final double hi;

        DurationScale(double lo, double hi) {
            this.lo = lo;
            this.hi = hi;
        }

        @Override
        public double getLowerBound() {
            return lo;
        }

        @Override
        public double getUpperBound() {
            return hi;
        }

        double fraction(double v) {
            return Math.max(0, Math.min(1, (v - lo) / (hi - lo)));
        }

        boolean dark(double v) {
            return fraction(v) > 0.5;
        }

        @Override
        public Paint getPaint(double v) {
            if (!Double.isFinite(v)) {
                return NONE;
            }
            double t = fraction(v);
            return new Color((int) Math.round(LIGHT.getRed() + t * (DARK.getRed() - LIGHT.getRed())),
                    (int) Math.round(LIGHT.getGreen() + t * (DARK.getGreen() - LIGHT.getGreen())),
                    (int) Math.round(LIGHT.getBlue() + t * (DARK.getBlue() - LIGHT.getBlue())));
        }
    }

    private Figure line() {
        List<Option> opts = new ArrayList<>(d.options());
        opts.sort(Comparator.comparingDouble(o -> o.values()[0]));
        XYSeries plan = new XYSeries("planned duration", false, true);
        XYSeries bound = new XYSeries("lower bound of the feasible options (no recipe within the limits is shorter)", false, true);
        XYSeries bad = new XYSeries("infeasible: no plan (its lower bound)", false, true);
        for (Option o : opts) {
            double v = o.values()[0];
            if (!Double.isFinite(v)) {
                continue;
            }
            if (o.feasible() && Double.isFinite(o.durationS())) {
                plan.add(v, o.durationS() / 60);
            }
            if (Double.isFinite(o.lowerBoundS())) {
                (o.feasible() ? bound : bad).add(v, o.lowerBoundS() / 60);
            }
        }
        PlotBuilder p = new PlotBuilder(d.labels().get(0), "Planned duration to the residue target [min]", false);
        p.add(plan, 0, 0, 1, 2.6f, false);
        p.add(bound, 7, 1, 2, 2f, false);
        p.add(bad, 1, 0, 5, 2f, true);
        List<Double> xs = levels(opts, 0);
        if (!xs.isEmpty()) {
            double pad = Math.max(0.04 * (xs.get(xs.size() - 1) - xs.get(0)), 1e-9 + 0.01 * Math.abs(xs.get(0)));
            p.xRange(xs.get(0) - pad, xs.get(xs.size() - 1) + pad);
        }
        // the duration axis spans at least 5 % of the longest duration and 1 min: differences below the
        // tool's resolution are not magnified into slopes
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (XYSeries ser : List.of(plan, bound, bad)) {
            for (int k = 0; k < ser.getItemCount(); k++) {
                lo = Math.min(lo, ser.getY(k).doubleValue());
                hi = Math.max(hi, ser.getY(k).doubleValue());
            }
        }
        if (Double.isFinite(lo)) {
            double span = Math.max(hi - lo, Math.max(0.05 * Math.abs(hi), 1.0));
            double mid = (lo + hi) / 2;
            p.range(Math.max(0, mid - 0.6 * span), mid + 0.6 * span);
        }
        XYPlot plot = p.build();
        JFreeChart c = ChartStyle.chart("Planned duration over the varied value", plot, subtitle);
        return new Figure("compare-line", "Planned duration over the varied value",
                "The planned duration of each option against the one varied value, with the lower bound no recipe "
                        + "within the limits can beat; infeasible options are marked at their lower bound.", c);
    }
}
