package org.exhale.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYPointerAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;

import com.fasterxml.jackson.databind.JsonNode;

/** Charts of a simulated (or planned) bake from history.csv and the limits in summary.json. */
final class BakeCharts {
    private static final String TIME = "Time [min]";
    private static final DoubleUnaryOperator MIN = s -> s / 60;
    private static final DoubleUnaryOperator SAME = v -> v;

    /** History column of each limit's actual value (the ceiling is handled on its own). */
    static final Map<String, String> LIMIT_COLUMNS = new LinkedHashMap<>();

    static {
        LIMIT_COLUMNS.put("residue", "unconverted");
        LIMIT_COLUMNS.put("pressure", "excess_pressure_Pa");
        LIMIT_COLUMNS.put("thermal_dose", "thermal_dose_s");
        LIMIT_COLUMNS.put("strength", "edge_stress_Pa");
        LIMIT_COLUMNS.put("cracking", "crack_release_J_m2");
        LIMIT_COLUMNS.put("delamination", "delamination_release_J_m2");
        LIMIT_COLUMNS.put("buckling", "compression_Pa");
        LIMIT_COLUMNS.put("deflection", "deflection_m");
    }

    private final CsvTable h;
    private final JsonNode margins;
    private final String subtitle;
    private final List<String> corners;
    /** The bake's time span [min]: every chart shows all of it. */
    private final double t0;
    private final double t1;

    /** Each corner's temperature offset from the setpoint [K] (summary.json), empty when unknown. */
    private final Map<String, Double> offsets = new java.util.HashMap<>();

    BakeCharts(CsvTable history, JsonNode margins, String caseName) {
        this(history, margins, null, caseName);
    }

    /** Component names as the user wrote them, by their CSV-safe form in history.csv. */
    private final Map<String, String> componentNames = new java.util.HashMap<>();

    /** Tells the charts the components' names as written in the case (summary.json "components"). */
    BakeCharts names(JsonNode components) {
        if (components != null) {
            for (JsonNode c : components) {
                componentNames.put(org.exhale.io.HistoryCsvWriter.header(c.asText()), c.asText());
            }
        }
        return this;
    }

    BakeCharts(CsvTable history, JsonNode margins, JsonNode summaryCorners, String caseName) {
        this.h = history;
        if (summaryCorners != null) {
            for (JsonNode c : summaryCorners) {
                if (c.path("offset_K").isNumber()) {
                    offsets.put(c.path("corner").asText(""), c.path("offset_K").asDouble());
                }
            }
        }
        this.margins = margins == null ? com.fasterxml.jackson.databind.node.MissingNode.getInstance() : margins;
        this.subtitle = ReportText.label(caseName);
        double t0 = Double.POSITIVE_INFINITY;
        double t1 = Double.NEGATIVE_INFINITY;
        for (int r = 0; r < history.size(); r++) {
            double t = history.number(r, "time_s") / 60;
            if (Double.isFinite(t)) {
                t0 = Math.min(t0, t);
                t1 = Math.max(t1, t);
            }
        }
        this.t0 = t0;
        this.t1 = t1 > t0 ? t1 : t0 + 1;
        List<String> cs = history.distinct("corner");
        this.corners = cs.isEmpty() ? java.util.Collections.singletonList(null) : cs;
    }

    List<Figure> all() {
        List<Figure> out = new ArrayList<>();
        add(out, temperature());
        add(out, unconverted());
        add(out, pressure());
        add(out, mechanics());
        add(out, margins());
        return out;
    }

    private static void add(List<Figure> out, Figure f) {
        if (f != null) {
            out.add(f);
        }
    }

    /** Allowed value of a limit from summary.json, NaN when absent. */
    double allowed(String limit) {
        JsonNode a = margins.path(limit).path("allowed");
        return a.isNumber() ? a.asDouble() : Double.NaN;
    }

    private String worstCorner(String limit) {
        String c = margins.path(limit).path("corner").asText("");
        return corners.contains(c) ? c : corners.get(0);
    }

    private static String name(String what, String corner) {
        return corner == null ? what : what + ", " + ReportText.label(corner);
    }

    /** Stable colour and marker per corner: hot, cold, nominal keep theirs across charts. */
    private int cornerIndex(String corner) {
        if (corner == null) {
            return 0;
        }
        return switch (corner) {
            case "nominal" -> 0;
            case "hot" -> 1;
            case "cold" -> 3;
            default -> 4 + corners.indexOf(corner);
        };
    }

    Figure temperature() {
        if (!h.has("wafer_C")) {
            return null;
        }
        PlotBuilder p = new PlotBuilder(TIME, "Temperature [°C]", false);
        p.xRange(t0, t1);
        if (h.has("setpoint_C")) {
            // one setpoint for the whole wafer: the same in every corner's rows
            p.add(PlotBuilder.series("setpoint", h, corners.get(0), "time_s", MIN, "setpoint_C", SAME), 5, 2, 6, 2f, false);
        }
        for (String c : corners) {
            int k = cornerIndex(c);
            p.add(PlotBuilder.series(name("wafer", c), h, c, "time_s", MIN, "wafer_C", SAME), k, 0, k, 3f, false);
        }
        double ceiling = allowed("ceiling");
        if (Double.isFinite(ceiling)) {
            p.limit(ceiling, "ceiling " + ReportText.plain(ceiling, 4) + " °C");
        }
        JFreeChart c = ChartStyle.chart("Setpoint and wafer temperature", p.build(), subtitle);
        return new Figure("temperature", "Setpoint and wafer temperature",
                "The tool's setpoint (dotted) and the wafer temperature (solid) at each corner against time, with "
                        + "the temperature ceiling.", c);
    }

    Figure unconverted() {
        if (!h.has("unconverted")) {
            return null;
        }
        double target = allowed("residue");
        double floor = Double.isFinite(target) ? target * 1e-3 : 1e-6;
        PlotBuilder p = new PlotBuilder(TIME, "Unconverted polymer [fraction, log scale]", true);
        p.xRange(t0, t1);
        for (String c : corners) {
            int k = cornerIndex(c);
            XYSeries s = PlotBuilder.series(name("unconverted", c), h, c, "time_s", MIN, "unconverted", SAME);
            p.add(clipBelow(s, floor), k, k == 1 ? 0 : 1, k, 3f, false);
        }
        if (Double.isFinite(target)) {
            p.limit(target, "residue target " + ReportText.plain(target * 100, 3) + " %");
        }
        p.range(floor, 1.5);
        JsonNode res = margins.path("residue");
        XYPlot plot = p.build();
        if (res.path("actual").isNumber() && res.path("time_s").isNumber() && res.path("actual").asDouble() >= floor) {
            // the residue limit applies at the end of the hold: its value there against the target
            double y = res.path("actual").asDouble();
            XYPointerAnnotation a = new XYPointerAnnotation("end: " + Readable.percent(y) + ", margin "
                    + Readable.ratio(res.path("margin").asDouble(Double.NaN)), res.path("time_s").asDouble() / 60, y,
                    -Math.PI * 3 / 4);
            a.setFont(ChartStyle.NOTE);
            a.setPaint(ChartStyle.INK);
            a.setArrowPaint(ChartStyle.INK);
            a.setTextAnchor(TextAnchor.BOTTOM_RIGHT);
            a.setLabelOffset(6);
            plot.addAnnotation(a);
        }
        String note = "values below " + ReportText.sig(floor, 2) + " are not drawn";
        // the target applies at the end of the final hold (the cool-down after it does not count)
        JsonNode at = margins.path("residue").path("time_s");
        if (at.isNumber()) {
            org.jfree.chart.plot.ValueMarker m = new org.jfree.chart.plot.ValueMarker(at.asDouble() / 60, ChartStyle.LIMIT,
                    ChartStyle.line(2, 2.2f));
            m.setLabel("residue read here: " + margins.path("residue").path("evaluated_at").asText("end of the final hold"));
            m.setLabelFont(ChartStyle.NOTE);
            m.setLabelPaint(ChartStyle.LIMIT);
            m.setLabelAnchor(org.jfree.chart.ui.RectangleAnchor.TOP_LEFT);
            m.setLabelTextAnchor(TextAnchor.TOP_RIGHT);
            m.setLabelOffset(new org.jfree.chart.ui.RectangleInsets(6, 4, 4, 4));
            plot.addDomainMarker(0, m, org.jfree.chart.ui.Layer.FOREGROUND);
        }
        JFreeChart c = ChartStyle.chart("Unconverted polymer", plot, subtitle, note);
        return new Figure("unconverted", "Unconverted polymer",
                "Fraction of the polymer not yet decomposed, on a log axis, with the residue target the bake must "
                        + "reach by the end of its final hold (the dashed line; the cool-down after it does not count); "
                        + "the arrow marks the worst corner's residue there.", c);
    }

    private static XYSeries clipBelow(XYSeries s, double floor) {
        XYSeries out = new XYSeries(s.getKey(), false, true);
        for (int i = 0; i < s.getItemCount(); i++) {
            if (s.getY(i).doubleValue() >= floor) {
                out.add(s.getX(i), s.getY(i));
            }
        }
        return out;
    }

    Figure pressure() {
        if (!h.has("excess_pressure_Pa")) {
            return null;
        }
        double peak = max("excess_pressure_Pa");
        double allowed = allowed("pressure");
        double shown = Double.isFinite(allowed) && allowed <= PlotBuilder.OFF_SCALE * peak ? Math.max(peak, allowed) : peak;
        SiScale u = SiScale.of(shown, "Pa");
        PlotBuilder p = new PlotBuilder(TIME, "Excess pressure in the cavity [" + u.unit() + "]", false);
        p.xRange(t0, t1);
        for (String c : corners) {
            int k = cornerIndex(c);
            p.add(PlotBuilder.series(name("total", c), h, c, "time_s", MIN, "excess_pressure_Pa", u::apply), k,
                    k == 1 ? 0 : 1, k, 3f, false);
        }
        // the partial pressure of each product at the corner where the total peaks
        String pc = worstCorner("pressure");
        List<String> parts = h.columns("p_", "_Pa");
        if (parts.size() > 1) {
            int j = 0;
            for (String col : parts) {
                String comp = col.substring(2, col.length() - 3);
                comp = componentNames.getOrDefault(comp, comp);
                p.add(PlotBuilder.series(name(ReportText.label(comp), pc), h, pc, "time_s", MIN, col, u::apply),
                        5 + j, 2 + j, 3 + j, 1.8f, false);
                j++;
            }
        }
        if (Double.isFinite(allowed)) {
            p.limit(u.apply(allowed), "max pressure " + u.format(allowed));
        }
        XYPlot plot = p.build();
        String note = p.offScale().isEmpty() ? null
                : "max pressure " + SiScale.of(allowed, "Pa").format(allowed) + " is "
                        + ReportText.sig(allowed / peak, 2) + "× the peak: off scale";
        JFreeChart c = ChartStyle.chart("Excess pressure", plot, subtitle, note);
        return new Figure("pressure", "Excess pressure",
                "Gas pressure in the cavity above the ambient at each corner, the partial pressure of each product "
                        + "at the corner where it peaks, and the allowed maximum.", c);
    }

    private double max(String col) {
        double m = Double.NEGATIVE_INFINITY;
        for (int r = 0; r < h.size(); r++) {
            double v = h.number(r, col);
            if (Double.isFinite(v)) {
                m = Math.max(m, v);
            }
        }
        return m;
    }

    Figure mechanics() {
        if (!h.has("edge_stress_Pa") && !h.has("deflection_m")) {
            return null;
        }
        CombinedDomainXYPlot combined = new CombinedDomainXYPlot(new NumberAxis(TIME));
        combined.setGap(14);
        List<String> notes = new ArrayList<>();
        // one panel per quantity, each with its own colour and marker, against its own allowed value;
        // a quantity that stays below a millionth of its allowed value is left out and named in the note
        String[][] panels = {
                {"edge_stress_Pa", "edge stress", "strength", "strength", "Pa", "Stress"},
                {"deflection_m", "deflection", "deflection", "max deflection", "m", "Deflection"},
                {"crack_release_J_m2", "cracking G", "cracking", "cracking Gc", "J/m²", "Cracking G"},
                {"delamination_release_J_m2", "delamination G", "delamination", "delamination Gc", "J/m²", "Delamination G"}};
        List<String> negligible = new ArrayList<>();
        int base = 0;
        for (String[] q : panels) {
            base += 2;
            if (!h.has(q[0])) {
                continue;
            }
            double a = allowed(q[2]);
            double peak = max(q[0]);
            if (!(peak > 0) || Double.isFinite(a) && peak < 1e-6 * a) {
                negligible.add(q[1]);
                continue;
            }
            combined.add(panel(new String[]{q[0]}, new String[]{q[1]}, new String[]{q[2]}, new String[]{q[3]}, q[4], q[5],
                    notes, base), 1);
        }
        if (!negligible.isEmpty()) {
            notes.add("negligible (below a millionth of the allowed value), not drawn: " + String.join(", ", negligible));
        }
        if (combined.getSubplots().isEmpty()) {
            return null;
        }
        String note = notes.isEmpty() ? null : String.join("; ", notes);
        JFreeChart c = ChartStyle.chart("Cap stress, deflection and energy release", combined, subtitle, note);
        combined.getDomainAxis().setRange(t0, t1);
        return new Figure("cap-mechanics", "Cap stress, deflection and energy release",
                "Edge stress of the cap, its deflection, and the energy release rates of channel cracking and "
                        + "delamination at each corner, each in its own panel against its own allowed value; "
                        + "quantities that stay negligible are named in the note, not drawn.", c);
    }

    private XYPlot panel(String[] cols, String[] names, String[] limits, String[] limitNames, String siUnit,
                         String quantity, List<String> notes, int base) {
        double peak = 0;
        for (String col : cols) {
            if (h.has(col)) {
                peak = Math.max(peak, max(col));
            }
        }
        double shown = peak;
        for (String l : limits) {
            double a = allowed(l);
            if (Double.isFinite(a) && a <= PlotBuilder.OFF_SCALE * peak) {
                shown = Math.max(shown, a);
            }
        }
        boolean joule = siUnit.startsWith("J");
        SiScale u = joule ? new SiScale(1, siUnit) : SiScale.of(shown, siUnit);
        PlotBuilder p = new PlotBuilder(TIME, quantity + " [" + u.unit() + "]", false);
        p.xRange(t0, t1);
        for (int i = 0; i < cols.length; i++) {
            if (!h.has(cols[i])) {
                continue;
            }
            for (String c : corners) {
                int k = cornerIndex(c);
                // colour and marker say the quantity, the dash the corner
                p.add(PlotBuilder.series(name(names[i], c), h, c, "time_s", MIN, cols[i], u::apply), base + i,
                        k == 1 ? 0 : 1, base + i, 2.6f, false);
            }
        }
        for (int i = 0; i < limits.length; i++) {
            double a = allowed(limits[i]);
            if (Double.isFinite(a)) {
                p.limit(u.apply(a), limitNames[i] + " " + u.format(a));
            }
        }
        XYPlot plot = p.build();
        if (!p.offScale().isEmpty()) {
            notes.add(p.offScale());
        }
        return plot;
    }

    /** The limit with the smallest ratio margin in summary.json, or null. */
    static String binding(JsonNode margins) {
        String best = null;
        double m = Double.POSITIVE_INFINITY;
        if (margins == null) {
            return null;
        }
        var it = margins.fields();
        while (it.hasNext()) {
            var e = it.next();
            JsonNode v = e.getValue().path("margin");
            if (v.isNumber() && v.asDouble() < m) {
                m = v.asDouble();
                best = e.getKey();
            }
        }
        return best;
    }

    Figure margins() {
        if (margins.isMissingNode() || margins.size() == 0) {
            return null;
        }
        String binding = RecipeSheet.tightestName(margins);
        double top = 1e3;
        PlotBuilder ratio = new PlotBuilder(TIME, "Margin, allowed / actual [–, log]", true);
        ratio.xRange(t0, t1);
        int i = 0;
        double low = 0.5;
        double[] bindingPoint = null;
        List<String> skipped = new ArrayList<>();
        List<String> idle = new ArrayList<>();
        for (Map.Entry<String, String> e : LIMIT_COLUMNS.entrySet()) {
            String limit = e.getKey();
            double a = allowed(limit);
            if (!Double.isFinite(a) || !margins.has(limit)) {
                continue;
            }
            if (!h.has(e.getValue())) {
                skipped.add(limit);
                continue;
            }
            if (limit.equals("residue")) {
                continue; // applies only at the end of the hold: shown there on the unconverted-polymer chart
            }
            String c = worstCorner(limit);
            String label = limit;
            boolean isBinding = limit.equals(binding);
            if (isBinding) {
                label += " — tightest";
            }
            XYSeries s = PlotBuilder.series(name(label, c), h, c, "time_s", MIN, e.getValue(),
                    v -> v > 0 ? a / v : Double.NaN);
            List<double[]> pts = new ArrayList<>();
            double least = Double.POSITIVE_INFINITY;
            for (int k = 0; k < s.getItemCount(); k++) {
                double y = s.getY(k).doubleValue();
                if (Double.isFinite(y) && y > 0) {
                    pts.add(new double[]{s.getX(k).doubleValue(), y});
                    low = Math.min(low, y / 1.5);
                    least = Math.min(least, y);
                }
            }
            String key = (String) s.getKey();
            if (least > top && Double.isFinite(least)) {
                key += " (above " + ReportText.sig(top, 1) + ": least ×" + ReportText.sig(least, 2) + ")";
            } else if (pts.isEmpty()) {
                idle.add(limit);
            }
            XYSeries kept = new XYSeries(key, false, true);
            for (double[] pt : pts) {
                kept.add(pt[0], pt[1]);
            }
            if (ratio.add(kept, i, i, i, isBinding ? 4.5f : 2.2f, false) >= 0 && isBinding) {
                JsonNode m = margins.path(limit);
                bindingPoint = new double[]{m.path("time_s").asDouble(Double.NaN) / 60, m.path("margin").asDouble()};
            }
            i++;
        }
        for (var it = margins.fieldNames(); it.hasNext(); ) {
            String limit = it.next();
            if (!limit.equals("ceiling") && !LIMIT_COLUMNS.containsKey(limit)) {
                skipped.add(limit);
            }
        }
        if (ratio.isEmpty()) {
            return null;
        }
        ratio.limit(1, "margin 1: the limit");
        ratio.range(Math.max(low, 1e-6), top);
        XYPlot rp = ratio.build();
        if (bindingPoint != null && Double.isFinite(bindingPoint[0]) && bindingPoint[1] > 0) {
            XYPointerAnnotation a = new XYPointerAnnotation(
                    "tightest: " + ReportText.label(binding) + " " + Readable.ratio(bindingPoint[1]),
                    bindingPoint[0], Math.min(bindingPoint[1], top), -Math.PI / 4);
            a.setFont(ChartStyle.NOTE);
            a.setPaint(ChartStyle.INK);
            a.setArrowPaint(ChartStyle.INK);
            a.setTextAnchor(TextAnchor.BOTTOM_LEFT);
            a.setLabelOffset(6);
            rp.addAnnotation(a);
        }
        CombinedDomainXYPlot combined = new CombinedDomainXYPlot(new NumberAxis(TIME));
        combined.setGap(14);
        combined.add(rp, 3);
        double ceiling = allowed("ceiling");
        if (Double.isFinite(ceiling) && h.has("wafer_C")) {
            String c = worstCorner("ceiling");
            PlotBuilder head = new PlotBuilder(TIME, "Ceiling headroom [K]", false);
        head.xRange(t0, t1);
            XYSeries s = new XYSeries(name("ceiling headroom", c), false, true);
            boolean byCorner = c != null && h.has("corner");
            for (int r = 0; r < h.size(); r++) {
                if (byCorner && !h.text(r, "corner").equals(c)) {
                    continue;
                }
                double t = h.number(r, "wafer_C");
                if (h.has("setpoint_C")) {
                    // the ceiling is checked on the corner's setpoint, the tool's setpoint plus the corner's offset
                    t = Math.max(t, h.number(r, "setpoint_C") + offsets.getOrDefault(c == null ? "" : c, 0.0));
                }
                if (Double.isFinite(t)) {
                    s.add(h.number(r, "time_s") / 60, ceiling - t);
                }
            }
            head.add(s, 5, 0, 6, 2.6f, false);
            head.limit(0, "headroom 0: the ceiling");
            XYPlot hp = head.build();
            hp.getRenderer().setSeriesPaint(0, ChartStyle.INK);
            combined.add(hp, 1);
        }
        String note = "margins above " + ReportText.sig(top, 1) + " run off the top"
                + (idle.isEmpty() ? "" : "; never loaded: " + String.join(", ", idle))
                + (skipped.isEmpty() ? "" : "; not drawn (no history column): " + String.join(", ", skipped));
        JFreeChart c = ChartStyle.chart("Every margin against time", combined, subtitle, ReportText.label(note));
        combined.getDomainAxis().setRange(t0, t1);
        return new Figure("margins", "Every margin against time",
                "For each limit, the margin allowed / actual at the corner where it is worst (below 1 the limit is "
                        + "broken); the tightest limit the recipe can change is drawn thick. The residue applies only "
                        + "at the end of the hold and is shown there on the unconverted-polymer chart. Below: headroom "
                        + "to the temperature ceiling in K.", c);
    }
}
