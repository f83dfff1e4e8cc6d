package org.exhale.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.exhale.PhysicalConstants;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYTextAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;

import com.fasterxml.jackson.databind.JsonNode;

/** Charts of a kinetics fit from fit.csv, isoconversional.csv and fit.json. */
final class FitCharts {
    private static final double C0 = PhysicalConstants.ZERO_CELSIUS_K;
    /** Measured points drawn per run: enough to see the scatter, few enough for a light page. */
    private static final int MEASURED_POINTS = 70;

    private final RunFolder f;
    private final String subtitle;
    /** Run label → legend name with its heating rate. */
    private final Map<String, String> runNames = new LinkedHashMap<>();

    FitCharts(RunFolder folder) {
        this.f = folder;
        // A fit folder has no case: the subtitle names the runs, never the folder.
        this.subtitle = folder.fit().map(FitCharts::runsSubtitle).orElse(ReportText.label(folder.caseName()));
        f.fit().ifPresent(j -> {
            for (JsonNode r : j.path("runs")) {
                String label = r.path("label").asText("");
                double rate = r.path("heating_rate_K_min").asDouble(Double.NaN);
                runNames.put(label, ReportText.label(label)
                        + (Double.isFinite(rate) ? " (" + ReportText.sig(rate, 3) + " K/min)" : ""));
            }
        });
    }

    List<Figure> all() {
        List<Figure> out = new ArrayList<>();
        f.fitTable().ifPresent(t -> {
            Figure c = conversion(t);
            if (c != null) {
                out.add(c);
            }
        });
        f.isoconversional().ifPresent(t -> {
            Figure e = activationEnergy(t);
            if (e != null) {
                out.add(e);
            }
        });
        Figure k = kissinger();
        if (k != null) {
            out.add(k);
        }
        f.fitTable().ifPresent(t -> {
            Figure r = residuals(t);
            if (r != null) {
                out.add(r);
            }
        });
        return out;
    }

    /** "Kinetics from 4 runs: a, b, c, d", the names cut short when there are many. */
    static String runsSubtitle(JsonNode fit) {
        List<String> names = new ArrayList<>();
        for (JsonNode r : fit.path("runs")) {
            names.add(ReportText.label(r.path("label").asText("")));
        }
        String head = "Kinetics from " + names.size() + (names.size() == 1 ? " run" : " runs");
        if (names.isEmpty()) {
            return "Kinetics";
        }
        String list = String.join(", ", names);
        return list.length() <= 90 ? head + ": " + list : head;
    }

    private String runName(String label) {
        return runNames.getOrDefault(label, ReportText.label(label));
    }

    private List<String> runs(CsvTable t) {
        List<String> runs = t.distinct("run");
        return runs.isEmpty() ? java.util.Collections.singletonList(null) : runs;
    }

    private static XYSeries thin(XYSeries s, int max) {
        int step = Math.max(1, (int) Math.ceil(s.getItemCount() / (double) max));
        XYSeries out = new XYSeries(s.getKey(), false, true);
        for (int i = 0; i < s.getItemCount(); i += step) {
            out.add(s.getX(i), s.getY(i));
        }
        return out;
    }

    Figure conversion(CsvTable t) {
        if (!t.has("temperature_K") || !t.has("alpha_measured") || !t.has("alpha_model")) {
            return null;
        }
        PlotBuilder p = new PlotBuilder("Sample temperature [°C]", "Conversion α [–]", false);
        int i = 0;
        for (String run : runs(t)) {
            String n = run == null ? "" : runName(run) + " ";
            p.add(thin(PlotBuilder.series(n + "measured", t, "run", run, "temperature_K", k -> k - C0, "alpha_measured",
                    v -> v), MEASURED_POINTS), i, 0, i, 1f, true);
            p.add(PlotBuilder.series(n + "model", t, "run", run, "temperature_K", k -> k - C0, "alpha_model", v -> v), i, i,
                    i, 2.6f, false);
            i++;
        }
        p.range(-0.05, 1.05);
        JFreeChart c = ChartStyle.chart("Measured and model conversion", p.build(), subtitle);
        return new Figure("conversion", "Measured and model conversion",
                "Conversion measured in each thermogravimetric run (markers) and given by the fitted model (lines), "
                        + "per heating rate.", c);
    }

    Figure residuals(CsvTable t) {
        if (!t.has("temperature_K") || !t.has("residual")) {
            return null;
        }
        PlotBuilder p = new PlotBuilder("Sample temperature [°C]", "Residual, measured − model α [–]", false);
        int i = 0;
        for (String run : runs(t)) {
            String n = run == null ? "residual" : runName(run);
            p.add(thin(PlotBuilder.series(n, t, "run", run, "temperature_K", k -> k - C0, "residual", v -> v), 150), i, i, i,
                    1f, true);
            i++;
        }
        p.limit(0, "no residual");
        JFreeChart c = ChartStyle.chart("Residuals of the model fit", p.build(), subtitle);
        return new Figure("residuals", "Residuals of the model fit",
                "Measured minus model conversion against temperature for each run; a pattern rather than scatter "
                        + "around zero means the model misses a feature of the data.", c);
    }

    Figure activationEnergy(CsvTable t) {
        if (!t.has("alpha")) {
            return null;
        }
        YIntervalSeriesCollection data = new YIntervalSeriesCollection();
        DeviationRenderer r = new DeviationRenderer(true, true) {
            private static final long serialVersionUID = 1L;

            @Override
            public boolean getItemShapeVisible(int series, int item) {
                return item == 0 || (item + 2 * series) % 8 == 0;
            }
        };
        r.setAlpha(0.14f);
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        List<Double> widths = new ArrayList<>();
        int i = 0;
        for (String col : t.columns("E_", "_kJ_mol")) {
            if (col.endsWith("_ci_kJ_mol") || col.endsWith("_bias_kJ_mol")) {
                continue;
            }
            String method = col.substring(2, col.length() - "_kJ_mol".length());
            String ci = "E_" + method + "_ci_kJ_mol";
            YIntervalSeries s = new YIntervalSeries(ReportText.label(methodName(method)) + (t.has(ci) ? " ± CI" : ""),
                    false, true);
            for (int row = 0; row < t.size(); row++) {
                double a = t.number(row, "alpha");
                double e = t.number(row, col);
                double w = t.has(ci) ? t.number(row, ci) : 0;
                if (!Double.isFinite(a) || !Double.isFinite(e)) {
                    continue;
                }
                if (!Double.isFinite(w)) {
                    w = 0;
                }
                s.add(a, e, e - w, e + w);
                lo = Math.min(lo, e);
                hi = Math.max(hi, e);
                widths.add(w);
            }
            if (s.getItemCount() == 0) {
                continue;
            }
            data.addSeries(s);
            r.setSeriesPaint(i, ChartStyle.colour(i));
            r.setSeriesFillPaint(i, ChartStyle.colour(i));
            r.setSeriesStroke(i, ChartStyle.line(i, 2.6f));
            r.setSeriesShape(i, ChartStyle.shape(i));
            i++;
        }
        if (data.getSeriesCount() == 0) {
            return null;
        }
        NumberAxis x = new NumberAxis("Conversion α [–]");
        x.setAutoRangeIncludesZero(false);
        NumberAxis y = new NumberAxis("Activation energy E [kJ/mol]");
        y.setAutoRangeIncludesZero(false);
        XYPlot plot = new XYPlot(data, x, y, r);
        // wide intervals at the ends of the range would flatten the curves: the axis follows the estimates
        widths.sort(null);
        double typical = widths.get(widths.size() / 2);
        double pad = Math.max(5, 3 * typical);
        double ylo = lo - pad;
        double yhi = hi + pad;
        JsonNode k = f.fit().map(j -> j.path("kissinger")).orElse(null);
        if (k != null && k.path("Ea_kJ_mol").isNumber()) {
            double ek = k.path("Ea_kJ_mol").asDouble();
            ChartStyle.addLimit(plot, ek, "Kissinger " + ReportText.sig(ek, 4) + " kJ/mol");
            ylo = Math.min(ylo, ek - 5);
            yhi = Math.max(yhi, ek + 5);
        }
        y.setRange(ylo, yhi);
        JFreeChart c = ChartStyle.chart("Activation energy against conversion", plot, subtitle,
                "shaded: confidence interval of each method; the axis follows the estimates, wide intervals at the ends "
                        + "may be cut");
        return new Figure("activation-energy", "Activation energy against conversion",
                "Isoconversional activation energy E(α) by each method with its confidence band, and the single "
                        + "Kissinger estimate; a flat E(α) suggests one step, a drifting one several.", c);
    }

    private static String methodName(String m) {
        return switch (m) {
            case "friedman" -> "Friedman";
            case "kas" -> "KAS";
            case "ofw" -> "OFW";
            case "starink" -> "Starink";
            case "vyazovkin" -> "Vyazovkin";
            default -> m;
        };
    }

    /** ln(β/Tp²) against 1000/Tp for each run, and the line that the Kissinger fit gives. */
    Figure kissinger() {
        if (f.fit().isEmpty()) {
            return null;
        }
        JsonNode j = f.fit().get();
        XYSeries pts = new XYSeries("runs: peak of the conversion rate", false, true);
        List<String> labels = new ArrayList<>();
        for (JsonNode r : j.path("runs")) {
            double rateKPerS = r.path("heating_rate_K_min").asDouble(Double.NaN) / 60;
            double tp = r.path("peak_temperature_K").asDouble(Double.NaN);
            if (rateKPerS > 0 && tp > 0) {
                pts.add(1000 / tp, Math.log(rateKPerS / (tp * tp)));
                labels.add(runName(r.path("label").asText("")));
            }
        }
        if (pts.getItemCount() < 2) {
            return null;
        }
        PlotBuilder p = new PlotBuilder("1000 / peak temperature Tp [1/K]", "ln(β / Tp²) [β in K/s, Tp in K]", false);
        p.add(pts, 0, 0, 1, 1f, true);
        JsonNode k = j.path("kissinger");
        String eNote = null;
        if (k.path("Ea_kJ_mol").isNumber() && k.path("A_1_s").isNumber()) {
            double e = k.path("Ea_kJ_mol").asDouble() * 1e3;
            double a = k.path("A_1_s").asDouble();
            double r = PhysicalConstants.GAS_CONSTANT;
            // Kissinger: ln(β/Tp²) = ln(A R / E) − E / (R Tp)
            XYSeries line = new XYSeries("Kissinger line, Ea " + ReportText.sig(e / 1e3, 4)
                    + (k.path("Ea_ci_kJ_mol").isNumber() ? " ± " + ReportText.sig(k.path("Ea_ci_kJ_mol").asDouble(), 3) : "")
                    + " kJ/mol" + (k.path("flagged").asBoolean(false) ? " (flagged: E(α) not constant)" : ""), false, true);
            double x0 = pts.getMinX() - 0.06 * (pts.getMaxX() - pts.getMinX());
            double x1 = pts.getMaxX() + 0.18 * (pts.getMaxX() - pts.getMinX());
            for (int s = 0; s <= 60; s++) {
                double x = x0 + (x1 - x0) * s / 60;
                line.add(x, Math.log(a * r / e) - e / (r * (1000 / x)));
            }
            p.add(line, 1, 1, 5, 2.6f, false);
            eNote = "line from the fitted Ea and A in fit.json";
        }
        double span = pts.getMaxX() - pts.getMinX();
        p.xRange(pts.getMinX() - 0.06 * span, pts.getMaxX() + 0.18 * span);
        XYPlot plot = p.build();
        double midX = (pts.getMinX() + pts.getMaxX()) / 2;
        for (int i = 0; i < labels.size(); i++) {
            // Points run from upper left (fast) to lower right (slow): a label reads to the right and
            // below on the left half, to the left and above on the right half, so it stays in the frame.
            boolean right = pts.getX(i).doubleValue() > midX;
            XYTextAnnotation t = new XYTextAnnotation(right ? labels.get(i) + "  " : "  " + labels.get(i),
                    pts.getX(i).doubleValue(), pts.getY(i).doubleValue());
            t.setFont(ChartStyle.NOTE);
            t.setPaint(ChartStyle.INK);
            t.setTextAnchor(right ? TextAnchor.BOTTOM_RIGHT : TextAnchor.TOP_LEFT);
            plot.addAnnotation(t);
        }
        JFreeChart c = ChartStyle.chart("Kissinger plot", plot, subtitle, eNote);
        return new Figure("kissinger", "Kissinger plot",
                "ln(β/Tp²) against 1000/Tp for the peak of each run's conversion rate; the slope of the line is "
                        + "−Ea/R.", c);
    }
}
