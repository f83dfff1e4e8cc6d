package org.exhale.report;

import static org.exhale.report.ReportText.escape;
import static org.exhale.report.ReportText.sig;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import com.fasterxml.jackson.databind.JsonNode;

/**
 * The report page: one self-contained HTML file, charts inline as SVG, no script, no external
 * font, style sheet or address. Every text taken from the folder's files is escaped.
 */
final class HtmlReport {
    private static final String CSS = """
            :root{--ink:#22262b;--muted:#5b636b;--rule:#d5d9de;--band:#f3f5f7;--ok:#2f7a4b;--bad:#8f1a1a;--accent:#1d4f7c}
            *{box-sizing:border-box}
            body{margin:0;font-family:system-ui,"DejaVu Sans",Helvetica,Arial,sans-serif;color:var(--ink);background:#fff;line-height:1.45}
            main{max-width:1180px;margin:0 auto;padding:28px 28px 60px}
            h1{font-size:1.7rem;margin:0 0 4px}
            h2{font-size:1.25rem;margin:34px 0 10px;padding-bottom:4px;border-bottom:2px solid var(--accent)}
            h3{font-size:1.05rem;margin:22px 0 8px}
            .sub{color:var(--muted);margin:0 0 18px}
            .verdict{display:inline-block;padding:6px 12px;border:2px solid;font-weight:600;margin:6px 0 4px}
            .verdict.ok{color:var(--ok)} .verdict.bad{color:var(--bad)}
            table{border-collapse:collapse;margin:6px 0 12px;font-size:.92rem}
            th,td{border-bottom:1px solid var(--rule);padding:5px 10px;text-align:left;vertical-align:top}
            th{background:var(--band);font-weight:600}
            td.num{text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap}
            tr.binding td{font-weight:600;background:#fbf6e9}
            .bad{color:var(--bad);font-weight:600} .ok{color:var(--ok)}
            ul.warn li{margin:4px 0} ul.warn li::marker{content:"⚠ "}
            .cautions{border-left:4px solid var(--muted);background:var(--band);padding:8px 14px;margin:10px 0}
            .cautions p{margin:4px 0}
            figure{margin:18px 0 26px;border:1px solid var(--rule);padding:10px}
            figure svg{display:block;width:100%;height:auto}
            figcaption{color:var(--muted);font-size:.92rem;margin-top:6px}
            figcaption a{color:var(--accent)}
            .wide{overflow-x:auto} td.why{min-width:16em}
            pre{background:var(--band);padding:10px;overflow:auto;font-size:.85rem}
            nav a{color:var(--accent);margin-right:14px}
            .sheet{border:2px solid var(--accent);padding:2px 18px 8px;margin:10px 0 24px}
            .sheet h2{margin-top:14px}
            table.figures th{width:14em}

            footer{color:var(--muted);font-size:.85rem;margin-top:40px}
            @media print{figure{break-inside:avoid}}
            """;

    private final RunFolder f;
    private final StringBuilder b = new StringBuilder(1 << 16);

    private HtmlReport(RunFolder f) {
        this.f = f;
    }

    /**
     * @param figures    the charts, in page order
     * @param svg        each chart's SVG element, by figure id
     * @param chartsHref where the chart files lie, relative to the page ("charts/"), or null to give no links
     * @param binding    the binding limit to mark in the margins table, or null
     */
    static String render(RunFolder f, List<Figure> figures, Map<String, String> svg, String chartsHref, String binding) {
        return new HtmlReport(f).page(figures, svg, chartsHref, binding);
    }

    private String page(List<Figure> figures, Map<String, String> svg, String chartsHref, String binding) {
        String name = f.caseName();
        b.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(escape(name)).append(" — exhale report</title>\n<style>\n").append(CSS)
                .append("</style>\n</head>\n<body>\n<main>\n");
        b.append("<h1>").append(escape(name)).append("</h1>\n");
        b.append("<p class=\"sub\">exhale report of the folder <code>").append(escape(folderName()))
                .append("</code>: ").append(escape(kind())).append("</p>\n");
        RecipeSheet sheet = RecipeSheet.of(f);
        if (sheet != null) {
            b.append(sheet.html());
        } else if (f.plan().isPresent()) {
            f.plan().ifPresent(this::planOutcome);
        }
        f.summary().ifPresent(this::glance);
        f.compare().ifPresent(c -> {
            if (c.path("best").isTextual() && !c.path("best").asText().isBlank()) {
                boolean none = c.path("best").asText().startsWith("No option");
                b.append(none ? "<p class=\"verdict bad\">" : "<p class=\"verdict ok\">").append(escape(c.path("best").asText()))
                        .append("</p>\n");
            }
        });
        if (!figures.isEmpty()) {
            b.append("<h2 id=\"charts\">Charts</h2>\n");
            for (Figure fig : figures) {
                b.append("<figure id=\"fig-").append(fig.id()).append("\">\n").append(svg.get(fig.id())).append('\n')
                        .append("<figcaption><strong>").append(escape(fig.title())).append(".</strong> ")
                        .append(escape(fig.caption()));
                if (chartsHref != null) {
                    b.append(" Files: <a href=\"").append(escape(chartsHref + fig.id())).append(".svg\">SVG</a>, <a href=\"")
                            .append(escape(chartsHref + fig.id())).append(".png\">PNG</a>.");
                }
                b.append("</figcaption>\n</figure>\n");
            }
        }
        b.append("<h2 id=\"details\">Details</h2>\n");
        f.summary().ifPresent(s -> summary(s, binding));
        f.plan().ifPresent(this::plan);
        if (f.robust().isEmpty() && sheet == null) {
            f.recipe().ifPresent(this::recipe);
        }
        f.fit().ifPresent(this::fit);
        if (f.compare().isPresent() || f.options().isPresent()) {
            compare();
        }
        f.robust().ifPresent(this::robust);
        if (f.robust().isPresent()) {
            // the recipe the samples were run with, after the study
            f.recipe().ifPresent(this::recipe);
        }
        f.summary().ifPresent(this::corners);
        cautions();
        b.append("<footer>Written by <code>exhale report</code> from the files in this folder; ")
                .append("the charts are also in <code>charts/</code> as SVG and PNG.</footer>\n");
        b.append("</main>\n</body>\n</html>\n");
        return b.toString();
    }

    private String folderName() {
        java.nio.file.Path p = f.dir().toAbsolutePath().normalize().getFileName();
        return p == null ? f.dir().toString() : p.toString();
    }

    private String kind() {
        List<String> k = new ArrayList<>();
        if (f.compare().isPresent() || f.options().isPresent()) {
            k.add("comparison of options");
        }
        if (f.robust().isPresent() || f.samples().isPresent()) {
            k.add("Monte Carlo robustness of a recipe");
        } else if (f.plan().isPresent() || f.recipe().isPresent()) {
            k.add("planned recipe");
        } else if (f.summary().isPresent()) {
            k.add("simulated bake");
        }
        if (f.fit().isPresent()) {
            k.add("kinetics fitted from thermogravimetric runs");
        }
        return String.join(", ", k);
    }

    // ---------------------------------------------------------------- simulate / plan

    /** The verdict and the few figures a reader looks for first, before the charts. */
    private void glance(JsonNode s) {
        JsonNode met = s.path("all_limits_met");
        if (f.plan().isEmpty() && met.isBoolean()) {
            b.append(met.asBoolean() ? "<p class=\"verdict ok\">✓ All limits met</p>\n"
                    : "<p class=\"verdict bad\">✗ A limit is violated</p>\n");
        }
        b.append("<h2 id=\"headline\">At a glance</h2>\n<table class=\"figures\">\n");
        if (s.has("time_to_target_s")) {
            row("Time to the residue target", Readable.time(s.path("time_to_target_s").asDouble(Double.NaN)));
        }
        if (s.path("recipe_duration_s").isNumber()) {
            row("Recipe duration", Readable.time(s.path("recipe_duration_s").asDouble()));
        }
        if (s.path("final_unconverted").isNumber()) {
            row("Unconverted polymer at the end", Readable.percent(s.path("final_unconverted").asDouble()));
        }
        if (s.path("max_wafer_temperature_C").isNumber()) {
            JsonNode c = s.path("margins").path("ceiling");
            double c0 = org.exhale.PhysicalConstants.ZERO_CELSIUS_K;
            String text = Readable.celsius(s.path("max_wafer_temperature_C").asDouble() + c0);
            if (c.path("actual").isNumber() && c.path("actual").asDouble() - s.path("max_wafer_temperature_C").asDouble() > 0.05) {
                text += "; the ceiling is checked on the corner's setpoint (setpoint + spread), "
                        + Readable.celsius(c.path("actual").asDouble() + c0);
            }
            row("Highest wafer temperature", text);
        }
        if (s.path("peak_excess_pressure_Pa").isNumber()) {
            row("Peak excess pressure", Readable.value(s.path("peak_excess_pressure_Pa").asDouble(), "Pa") + " at "
                    + Readable.time(s.path("peak_excess_pressure_time_s").asDouble(Double.NaN)));
        }
        if (s.path("gas_regime").isTextual()) {
            row("Gas regime", s.path("gas_regime").asText());
        }
        if (s.path("peak_chamber_ppm").isNumber()) {
            row("Peak products in the exhaust", Readable.number(s.path("peak_chamber_ppm").asDouble()) + " ppm");
        }
        String t = RecipeSheet.tightest(s.path("margins"));
        if (t != null) {
            row("Tightest limit", t);
        }
        b.append("</table>\n");
        warnings(s.path("warnings"), "Warnings");
    }

    private void summary(JsonNode s, String binding) {
        if (s.path("margins").isObject() && s.path("margins").size() > 0) {
            b.append("<h3 id=\"margins\">Margins to the limits</h3>\n");
            b.append("<p>A limit's margin is allowed / actual, at the corner and time where it is worst: 1 or more "
                    + "holds; above 1000 it is shown as “&gt; 1000”. The ceiling's is the headroom in kelvin "
                    + "(0 or more holds). <em>Binding</em> limits set a step of the recipe; the <em>tightest</em> is "
                    + "the smallest margin among the limits the recipe can change.</p>\n");
            margins(s.path("margins"), binding);
        }
    }

    private void corners(JsonNode s) {
        if (s.path("corners").isArray() && s.path("corners").size() > 0) {
            b.append("<h3>Corners</h3>\n<div class=\"wide\"><table>\n<tr><th>Corner</th><th>Offset</th><th>Gas regime</th>"
                    + "<th>Time to target</th><th>Unconverted at the end</th><th>Peak pressure</th></tr>\n");
            for (JsonNode c : s.path("corners")) {
                b.append("<tr><td>").append(escape(c.path("corner").asText())).append("</td><td class=\"num\">")
                        .append(escape(Readable.kelvin(c.path("offset_K").asDouble(0)))).append("</td><td>")
                        .append(escape(c.path("gas_regime").asText(""))).append("</td><td class=\"num\">")
                        .append(escape(Readable.time(c.path("time_to_target_s").asDouble(Double.NaN)))).append("</td><td class=\"num\">")
                        .append(escape(Readable.percent(c.path("final_unconverted").asDouble(Double.NaN)))).append("</td><td class=\"num\">")
                        .append(escape(Readable.value(c.path("peak_excess_pressure_Pa").asDouble(Double.NaN), "Pa"))).append("</td></tr>\n");
            }
            b.append("</table></div>\n");
        }
    }

    /** A table of the object's plain values (numbers, text, booleans); nested values are left to their own tables. */
    private void scalars(JsonNode o, Set<String> skip) {
        b.append("<table>\n");
        for (Iterator<Map.Entry<String, JsonNode>> it = o.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode v = e.getValue();
            if (skip.contains(e.getKey()) || v.isContainerNode()) {
                continue;
            }
            b.append("<tr><th>").append(escape(label(e.getKey()))).append("</th><td class=\"num\">")
                    .append(escape(value(e.getKey(), v))).append("</td></tr>\n");
        }
        b.append("</table>\n");
    }

    static String label(String key) {
        String k = key.replaceFirst("_(s|Pa|C|K|m|J_m2|kJ_mol|K_min|1_s|mol_m2|mol_m2_s)$", "");
        k = k.replace("1pct", "1 %").replace('_', ' ');
        return k.isEmpty() ? key : Character.toUpperCase(k.charAt(0)) + k.substring(1);
    }

    /** A value with the unit its key ends in. */
    static String value(String key, JsonNode v) {
        if (v == null || v.isNull() || v.isMissingNode()) {
            return key.startsWith("time_to") ? "not reached" : "n/a";
        }
        if (v.isBoolean()) {
            return v.asBoolean() ? "yes" : "no";
        }
        if (!v.isNumber()) {
            return v.asText();
        }
        double d = v.asDouble();
        if (key.endsWith("_s")) {
            return Math.abs(d) >= 120 ? sig(d / 60, 4) + " min" : sig(d, 4) + " s";
        }
        if (key.endsWith("_Pa")) {
            return SiScale.of(Math.abs(d), "Pa").format(d);
        }
        if (key.endsWith("_m")) {
            return SiScale.of(Math.abs(d), "m").format(d);
        }
        if (key.endsWith("_C")) {
            return sig(d, 5) + " °C";
        }
        if (key.endsWith("_K")) {
            return sig(d, 4) + " K";
        }
        if (key.endsWith("_J_m2")) {
            return sig(d, 4) + " J/m²";
        }
        if (key.endsWith("_kJ_mol")) {
            return sig(d, 5) + " kJ/mol";
        }
        if (key.endsWith("_K_min")) {
            return sig(d, 4) + " K/min";
        }
        if (key.endsWith("_1_s")) {
            return sig(d, 4) + " 1/s";
        }
        if (v.isIntegralNumber()) {
            return v.asText();
        }
        return sig(d, 4);
    }

    private static String withUnit(double v, String unit) {
        if (!Double.isFinite(v)) {
            return sig(v, 4);
        }
        return switch (unit) {
            case "Pa", "m" -> SiScale.of(Math.abs(v), unit).format(v);
            case "C" -> ReportText.plain(v, 5) + " °C";
            case "s" -> Math.abs(v) >= 120 ? ReportText.plain(v / 60, 4) + " min" : ReportText.plain(v, 4) + " s";
            case "J/m2" -> ReportText.plain(v, 4) + " J/m²";
            case "" -> ReportText.plain(v, 4);
            default -> ReportText.plain(v, 4) + " " + unit;
        };
    }

    /** The limits that set a step of the plan (plan.json), empty without a plan. */
    private Set<String> bindingLimits() {
        Set<String> out = new LinkedHashSet<>();
        f.plan().ifPresent(p -> p.path("binding").forEach(x -> {
            for (String part : bindingText(x).split(";\\s*")) {
                if (!part.isBlank()) {
                    out.add(part.trim());
                }
            }
        }));
        return out;
    }

    private void margins(JsonNode m, String tightest) {
        Set<String> binding = bindingLimits();
        b.append("<table>\n<tr><th>Limit</th><th>Status</th><th>Margin</th><th>Allowed</th><th>Worst actual</th>"
                + "<th>When</th><th>Corner</th><th>Dominant term or where read</th></tr>\n");
        for (Iterator<Map.Entry<String, JsonNode>> it = m.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode g = e.getValue();
            String unit = g.path("unit").asText("");
            String siUnit = unit.equals("C") ? "K" : unit;
            double off = unit.equals("C") ? org.exhale.PhysicalConstants.ZERO_CELSIUS_K : 0;
            boolean holds = g.path("holds").asBoolean(true);
            boolean isBinding = binding.contains(e.getKey());
            boolean isTightest = e.getKey().equals(tightest);
            String margin;
            if (g.has("headroom_K")) {
                margin = g.path("headroom_K").isNumber() ? "headroom " + Readable.kelvin(g.path("headroom_K").asDouble()) : "n/a";
            } else {
                JsonNode mv = g.path("margin");
                margin = mv.isNumber() ? Readable.ratio(mv.asDouble()) : "not loaded";
            }
            double actual = g.path("actual").asDouble(Double.NaN);
            String actualText = g.path("margin").isNumber() && g.path("margin").asDouble() > 1e6 ? "negligible"
                    : Readable.value(actual + off, siUnit);
            String tag = isBinding ? " (binding)" : isTightest ? " (tightest)" : "";
            b.append(isBinding || isTightest ? "<tr class=\"binding\">" : "<tr>")
                    .append("<td>").append(escape(e.getKey())).append(escape(tag)).append("</td>")
                    .append("<td class=\"").append(holds ? "ok\">holds" : "bad\">VIOLATED").append("</td>")
                    .append("<td class=\"num\">").append(escape(margin)).append("</td>")
                    .append("<td class=\"num\">").append(escape(Readable.value(g.path("allowed").asDouble(Double.NaN) + off, siUnit))).append("</td>")
                    .append("<td class=\"num\">").append(escape(actualText)).append("</td>")
                    .append("<td class=\"num\">").append(escape(Readable.time(g.path("time_s").asDouble(Double.NaN)))).append("</td>")
                    .append("<td>").append(escape(g.path("corner").asText(""))).append("</td>")
                    .append("<td>").append(escape(g.path("dominant").asText(g.path("evaluated_at").asText("")))).append("</td></tr>\n");
        }
        b.append("</table>\n");
    }

    private static String num(JsonNode v, String unit) {
        return v.isNumber() ? withUnit(v.asDouble(), unit) : "n/a";
    }

    /** A table of an array of objects, one column per plain key found in any of them. */
    private void objectTable(JsonNode arr) {
        Set<String> keys = new LinkedHashSet<>();
        for (JsonNode o : arr) {
            for (Iterator<Map.Entry<String, JsonNode>> it = o.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                if (!e.getValue().isContainerNode()) {
                    keys.add(e.getKey());
                }
            }
        }
        b.append("<table>\n<tr>");
        for (String k : keys) {
            b.append("<th>").append(escape(label(k))).append("</th>");
        }
        b.append("</tr>\n");
        for (JsonNode o : arr) {
            b.append("<tr>");
            for (String k : keys) {
                JsonNode v = o.get(k);
                boolean number = v != null && v.isNumber();
                b.append(number ? "<td class=\"num\">" : "<td>")
                        .append(escape(v == null ? "" : value(k, v))).append("</td>");
            }
            b.append("</tr>\n");
        }
        b.append("</table>\n");
    }

    private void warnings(JsonNode list, String heading) {
        if (!list.isArray() || list.size() == 0) {
            return;
        }
        b.append("<h3>").append(escape(heading)).append("</h3>\n<ul class=\"warn\">\n");
        for (JsonNode w : list) {
            b.append("<li>").append(escape(w.isTextual() ? w.asText() : w.toString())).append("</li>\n");
        }
        b.append("</ul>\n");
    }

    private void notes(JsonNode list, String heading) {
        if (!list.isArray() || list.size() == 0) {
            return;
        }
        b.append("<h3>").append(escape(heading)).append("</h3>\n<ul>\n");
        for (JsonNode w : list) {
            b.append("<li>").append(escape(w.isTextual() ? w.asText() : w.toString())).append("</li>\n");
        }
        b.append("</ul>\n");
    }

    /** An infeasible plan: what stopped it and what would help. */
    private void planOutcome(JsonNode p) {
        b.append("<section class=\"sheet\" id=\"recipe-sheet\">\n<h2>Plan</h2>\n");
        JsonNode inf = p.path("infeasible");
        b.append("<p class=\"verdict bad\">✗ No feasible recipe").append(inf.path("limit").isTextual()
                ? escape(": the " + inf.path("limit").asText() + " limit") : "").append("</p>\n");
        if (inf.path("reason").isTextual()) {
            b.append("<p>").append(escape(capital(inf.path("reason").asText()))).append(".</p>\n");
        }
        if (inf.path("suggestion").isTextual()) {
            b.append("<p>What would help: ").append(escape(inf.path("suggestion").asText())).append(".</p>\n");
        }
        b.append("</section>\n");
    }

    private static String capital(String s) {
        return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
    }

    private void plan(JsonNode p) {
        b.append("<h3 id=\"plan\">How the plan was found</h3>\n<p>");
        if (p.path("simulations").isNumber()) {
            b.append(escape("The planner ran " + p.path("simulations").asText() + " simulations"
                    + (p.path("planning_time_s").isNumber() ? " in " + Readable.time(p.path("planning_time_s").asDouble()) : "")
                    + ". "));
        }
        if (p.path("duration_s").isNumber() && p.path("lower_bound_s").isNumber() && p.path("lower_bound_s").asDouble() > 0) {
            double d = p.path("duration_s").asDouble();
            double lb = p.path("lower_bound_s").asDouble();
            boolean rigorous = p.path("lower_bound_rigorous").asBoolean(false);
            String ratio = Readable.time(d) + ", " + String.format(java.util.Locale.ROOT, "%.3f", d / lb) + " × that bound. ";
            if (rigorous) {
                b.append(escape("No recipe within the limits can reach the target sooner than " + Readable.time(lb)
                        + "; the plan takes " + ratio));
            } else {
                double ceilingOnly = p.path("ceiling_only_lower_bound_s").asDouble(Double.NaN);
                b.append(escape("The lower bound is an estimate here, not a guarantee: " + Readable.time(lb)
                        + "; the plan takes " + ratio
                        + (Double.isFinite(ceilingOnly) ? "The bound from the ceiling alone, " + Readable.time(ceilingOnly)
                        + ", is rigorous." : "")));
            }
        }
        b.append("</p>\n");
        if (p.path("margins").isObject() && f.summary().map(s -> !s.has("margins")).orElse(true)) {
            b.append("<h3>Margins of the plan</h3>\n");
            margins(p.path("margins"), null);
        }
        warnings(p.path("warnings"), "Plan warnings");
        notes(p.path("notes"), "Planner notes");
    }

    /** A step's binding limit: plain text, or the "binding" field of an object. */
    private static String bindingText(JsonNode x) {
        if (x == null || x.isNull()) {
            return "";
        }
        if (x.isObject() && x.has("binding")) {
            return x.path("binding").asText();
        }
        return x.isTextual() ? x.asText() : x.toString();
    }

    private void recipe(CsvTable t) {
        b.append("<h2 id=\"recipe\">Ramp table</h2>\n<table>\n<tr>");
        for (String h : t.header()) {
            b.append("<th>").append(escape(recipeHeader(h))).append("</th>");
        }
        JsonNode binding = f.plan().map(p -> p.path("binding")).orElse(null);
        boolean perStep = binding != null && binding.isArray() && binding.size() == t.size();
        if (perStep) {
            b.append("<th>Binding limit</th>");
        }
        b.append("</tr>\n");
        for (int r = 0; r < t.size(); r++) {
            b.append("<tr>");
            for (String h : t.header()) {
                String v = t.text(r, h);
                boolean number = v.matches("[-+0-9.eE]+");
                b.append(number ? "<td class=\"num\">" : "<td>").append(escape(number ? tidy(v) : v)).append("</td>");
            }
            if (perStep) {
                b.append("<td>").append(escape(bindingText(binding.get(r)))).append("</td>");
            }
            b.append("</tr>\n");
        }
        b.append("</table>\n");
    }

    private static String tidy(String v) {
        if (v.matches("[-+]?[0-9]+")) {
            return v.replace('-', '−');
        }
        try {
            return ReportText.plain(Double.parseDouble(v), 6);
        } catch (NumberFormatException e) {
            return v;
        }
    }

    private static String recipeHeader(String h) {
        return switch (h) {
            case "start_C" -> "Start [°C]";
            case "end_C" -> "End [°C]";
            case "rate_C_per_min" -> "Rate [°C/min]";
            case "duration_s" -> "Duration [s]";
            case "elapsed_s" -> "Elapsed [s]";
            default -> label(h);
        };
    }

    // ---------------------------------------------------------------- compare

    /** Rows of the ranked table shown in the page; the rest are in options.csv. */
    static final int MAX_OPTION_ROWS = 300;

    private void compare() {
        b.append("<h2 id=\"compare\">Options compared</h2>\n");
        JsonNode c = f.compare().orElse(null);
        CompareCharts.CompareData d = CompareCharts.data(f);
        if (!d.isEmpty()) {
            long feasible = d.options().stream().filter(CompareCharts.Option::feasible).count();
            long front = d.options().stream().filter(CompareCharts.Option::pareto).count();
            if (feasible == 0) {
                b.append("<p class=\"verdict bad\">✗ No option is feasible</p>\n");
            }
            long points = d.options().stream().filter(CompareCharts.Option::pareto)
                    .map(o -> Math.round(o.durationS()) + "/" + org.exhale.studies.Compare.resolved(o.smallestMargin()))
                    .distinct().count();
            b.append("<p>").append(feasible).append(" of ").append(d.options().size()).append(" options are feasible; the ")
                    .append("Pareto front of duration against the smallest margin has ").append(points)
                    .append(points == 1 ? " point" : " points").append(" (").append(front).append(front == 1 ? " option" : " options")
                    .append("). Varied: ").append(escape(String.join(", ", d.labels()))).append(".</p>\n");
        }
        if (c != null) {
            if (!c.path("complete").asBoolean(true)) {
                b.append("<p class=\"bad\">Stopped early: ").append(escape(c.path("options_done").asText("?")))
                        .append(" of ").append(escape(c.path("options_total").asText("?")))
                        .append(" options were planned.</p>\n");
            }
            b.append("<p>").append(escape(c.path("options_done").asText("?") + " of " + c.path("options_total").asText("?")
                    + " options planned" + (c.path("wall_time_s").isNumber() ? " in " + Readable.time(c.path("wall_time_s").asDouble()) : "")
                    + (c.path("threads").isNumber() ? " on " + c.path("threads").asText() + " threads" : "")
                    + (c.path("case").isTextual() ? ", from the case file " + c.path("case").asText() : "") + ".")).append("</p>\n");
            if (c.path("smallest_margin_note").isTextual()) {
                b.append("<p>Smallest margin: ").append(escape(c.path("smallest_margin_note").asText())).append(".</p>\n");
            }
            warnings(c.path("warnings"), "Warnings");
        }
        f.options().ifPresent(this::optionsTable);
    }

    /** Columns of options.csv left out of the page's table (they stay in the file); the reason joins the failing limit. */
    private static final Set<String> OPTION_COLUMNS_LEFT_OUT = Set.of("total_with_cooldown_s", "bound_rigorous", "steps",
            "infeasible_reason", "lower_bound_s", "peak_pressure_Pa");

    private void optionsTable(CsvTable t) {
        // the page keeps the columns a reader compares; the per-limit margins and the rest stay in options.csv
        List<String> cols = t.header().stream().filter(h -> !OPTION_COLUMNS_LEFT_OUT.contains(h) && !h.startsWith("margin_"))
                .toList();
        String rule = f.compare().map(c -> c.path("ranking").asText("")).orElse("");
        b.append("<h3>Ranked options</h3>\n<p>Ranked by ").append(escape(rule.isEmpty()
                        ? "planned duration, infeasible options last" : rule + "; infeasible options last"))
                .append(". Every column, with a margin per limit, is in <code>options.csv</code>.</p>\n"
                        + "<div class=\"wide\"><table>\n<tr>");
        for (String h : cols) {
            b.append("<th>").append(escape(optionHeader(h))).append("</th>");
        }
        b.append("</tr>\n");
        int shown = Math.min(t.size(), MAX_OPTION_ROWS);
        for (int r = 0; r < shown; r++) {
            boolean feasible = !t.has("feasible") || "true".equalsIgnoreCase(t.text(r, "feasible"));
            b.append(r == 0 && feasible ? "<tr class=\"binding\">" : "<tr>");
            for (String h : cols) {
                String v = t.text(r, h);
                if (h.equals("infeasible_limit") && t.has("infeasible_reason") && !t.text(r, "infeasible_reason").isEmpty()) {
                    v = (v.isEmpty() ? "" : v + ": ") + t.text(r, "infeasible_reason");
                }
                boolean number = v.matches("[-+0-9.eE]+");
                String shownText = number ? optionValue(h, v) : ("true".equals(v) ? "yes" : "false".equals(v) ? "no" : v);
                String cls = h.equals("feasible") && !feasible ? "bad" : number ? "num" : h.equals("infeasible_limit") ? "why" : null;
                b.append(cls == null ? "<td>" : "<td class=\"" + cls + "\">").append(escape(shownText)).append("</td>");
            }
            b.append("</tr>\n");
        }
        b.append("</table></div>\n");
        if (shown < t.size()) {
            b.append("<p>").append(t.size() - shown).append(" more options in <code>options.csv</code>.</p>\n");
        }
    }

    private String optionHeader(String h) {
        return switch (h) {
            case "duration_s" -> "Duration";
            case "total_with_cooldown_s" -> "With cool-down";
            case "lower_bound_s" -> "Lower bound";
            case "bound_ratio" -> "Plan / bound";
            case "smallest_margin_limit" -> "Limit with the smallest margin";
            case "infeasible_limit" -> "Why infeasible";
            case "ceiling_headroom_K" -> "Ceiling headroom";
            case "peak_pressure_Pa" -> "Peak pressure";
            default -> h.contains(".") ? CompareCharts.axisLabel(h, f.compare().map(c -> c.path("vary")).orElse(null)) : label(h);
        };
    }

    private static String optionValue(String h, String v) {
        double x;
        try {
            x = Double.parseDouble(v);
        } catch (NumberFormatException e) {
            return v;
        }
        if (h.endsWith("_s")) {
            return ReportText.minutes(x);
        }
        if (h.endsWith("_Pa")) {
            return SiScale.of(Math.abs(x), "Pa").format(x);
        }
        if (h.endsWith("_K")) {
            return Readable.kelvin(x);
        }
        if (h.equals("bound_ratio")) {
            return String.format(java.util.Locale.ROOT, "%.3f", x);
        }
        if (h.equals("smallest_margin") || h.startsWith("margin_")) {
            return Readable.ratio(x);
        }
        return tidy(v);
    }

    // ---------------------------------------------------------------- robust

    private void robust(JsonNode j) {
        b.append("<h2 id=\"robust\">Robustness over the uncertain values</h2>\n");
        JsonNode any = j.path("any_limit");
        if (any.path("probability").isNumber()) {
            double p = any.path("probability").asDouble();
            int n = j.path("samples_done").asInt(0);
            b.append(p == 0 ? "<p class=\"verdict ok\">" : "<p class=\"verdict bad\">")
                    .append(escape(p == 0 && n > 0
                            ? "✓ No limit violated in " + n + " samples (95 % upper bound " + sig(Math.min(100, 300.0 / n), 2) + " %)"
                            : "Some limit violated in " + sig(p * 100, 3) + " ± "
                            + sig(any.path("standard_error").asDouble(0) * 100, 2) + " % of samples")).append("</p>\n");
        }
        if (!j.path("complete").asBoolean(true)) {
            b.append("<p class=\"bad\">Stopped early: ").append(escape(j.path("samples_done").asText("?")))
                    .append(" of ").append(escape(j.path("samples").asText("?"))).append(" samples were run.</p>\n");
        }
        b.append("<table>\n");
        row("Seed", j.path("seed").asText("n/a"));
        row("Samples", j.path("samples_done").asText("?") + " of " + j.path("samples").asText("?"));
        if (j.path("quantile").isNumber()) {
            row("Quantile", sig(j.path("quantile").asDouble(), 4));
        }
        row("Recipe", j.path("recipe").asText(""));
        if (j.path("threads").isNumber()) {
            row("Threads", j.path("threads").asText());
        }
        if (j.path("wall_time_s").isNumber()) {
            row("Wall time", value("wall_time_s", j.path("wall_time_s")));
        }
        b.append("</table>\n");
        JsonNode t = j.path("time_to_target");
        if (t.isObject()) {
            b.append("<h3>Time to the residue target</h3>\n<table>\n");
            for (Iterator<Map.Entry<String, JsonNode>> it = t.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                if (e.getKey().equals("note")) {
                    continue;
                }
                String k = e.getKey().matches("p[0-9.]+_s") ? "P" + e.getKey().substring(1, e.getKey().length() - 2)
                        : label(e.getKey());
                b.append("<tr><th>").append(escape(k)).append("</th><td class=\"num\">")
                        .append(escape(value(e.getKey(), e.getValue()))).append("</td></tr>\n");
            }
            b.append("</table>\n");
            if (t.path("note").isTextual()) {
                b.append("<p>").append(escape(t.path("note").asText())).append(".</p>\n");
            }
        }
        JsonNode v = j.path("violation");
        if (v.isArray() && v.size() > 0) {
            b.append("<h3>Probability of violating each limit</h3>\n<table>\n<tr><th>Limit</th><th>P(violate)</th>"
                    + "<th>± s.e.</th><th>Violations</th><th>95 % upper bound if none</th><th>Median margin</th>"
                    + "<th>Margin at 1 − quantile</th></tr>\n");
            for (JsonNode x : v) {
                boolean head = x.has("headroom_K_median");
                String med = head ? num(x.path("headroom_K_median"), "K") + " headroom" : ratio(x.path("margin_median"));
                String low = head ? num(x.path("headroom_K_at_1_minus_quantile"), "K") + " headroom"
                        : ratio(x.path("margin_at_1_minus_quantile"));
                int k = x.path("violations").asInt(0);
                b.append("<tr><td>").append(escape(x.path("limit").asText())).append("</td>")
                        .append(k > 0 ? "<td class=\"num bad\">" : "<td class=\"num\">")
                        .append(escape(numText(x.path("probability"), 3))).append("</td><td class=\"num\">")
                        .append(escape(numText(x.path("standard_error"), 2))).append("</td><td class=\"num\">")
                        .append(escape(x.path("violations").asText(""))).append("</td><td class=\"num\">")
                        .append(escape(x.path("upper_95_rule_of_three").isNumber() && k == 0
                                ? "< " + sig(x.path("upper_95_rule_of_three").asDouble(), 2) : "")).append("</td><td class=\"num\">")
                        .append(escape(med)).append("</td><td class=\"num\">").append(escape(low)).append("</td></tr>\n");
            }
            b.append("</table>\n");
        }
        JsonNode sens = j.path("sensitivity");
        if (sens.isArray() && sens.size() > 0) {
            b.append("<h3>Sensitivity ranking</h3>\n<table>\n<tr><th>Rank</th><th>Uncertain value</th>"
                    + "<th>ρ with the smallest margin</th><th>ρ with the time to target</th></tr>\n");
            for (JsonNode x : sens) {
                b.append("<tr><td class=\"num\">").append(escape(x.path("rank").asText())).append("</td><td>")
                        .append(escape(x.path("parameter").asText())).append("</td><td class=\"num\">")
                        .append(escape(numText(x.path("spearman_smallest_margin"), 3))).append("</td><td class=\"num\">")
                        .append(escape(numText(x.path("spearman_time_to_target"), 3))).append("</td></tr>\n");
            }
            b.append("</table>\n");
        }
        if (j.path("parameters").isArray() && j.path("parameters").size() > 0) {
            b.append("<h3>Uncertain values</h3>\n");
            objectTable(j.path("parameters"));
        }
        JsonNode rp = j.path("robust_plan");
        if (rp.isObject()) {
            b.append("<h3>Robust plan</h3>\n");
            b.append(rp.path("met").asBoolean(true) ? "<p>" : "<p class=\"bad\">");
            if (rp.path("nominal_duration_s").isNumber() && rp.path("robust_duration_s").isNumber()) {
                b.append(escape("The robust plan takes " + value("robust_duration_s", rp.path("robust_duration_s"))
                        + " against " + value("nominal_duration_s", rp.path("nominal_duration_s"))
                        + " for the nominal plan" + (rp.path("cost_s").isNumber() ? ", a cost of "
                        + value("cost_s", rp.path("cost_s")) + (rp.path("cost_percent").isNumber()
                        ? " (" + sig(rp.path("cost_percent").asDouble(), 3) + " %)" : "") : "") + "."));
            }
            if (!rp.path("met").asBoolean(true)) {
                b.append(" The quantile was not met.");
            }
            if (rp.path("note").isTextual()) {
                String note = rp.path("note").asText();
                b.append(" ").append(escape(note.isEmpty() ? note : Character.toUpperCase(note.charAt(0)) + note.substring(1)))
                        .append('.');
            }
            b.append("</p>\n");
            JsonNode rounds = rp.path("rounds");
            if (rounds.isArray() && rounds.size() > 0) {
                b.append("<table>\n<tr><th>Round</th><th>Tightened</th><th>Feasible</th><th>Duration</th>"
                        + "<th>Plan / bound</th></tr>\n");
                for (JsonNode r : rounds) {
                    List<String> tight = new ArrayList<>();
                    r.path("tightened").forEach(x -> tight.add(x.isTextual() ? x.asText() : x.toString()));
                    b.append("<tr><td class=\"num\">").append(escape(r.path("round").asText())).append("</td><td>")
                            .append(escape(tight.isEmpty() ? "none" : String.join(", ", tight))).append("</td><td>")
                            .append(escape(value("feasible", r.path("feasible")))).append("</td><td class=\"num\">")
                            .append(escape(value("duration_s", r.path("duration_s")))).append("</td><td class=\"num\">")
                            .append(escape(numText(r.path("bound_ratio"), 4))).append("</td></tr>\n");
                }
                b.append("</table>\n");
            }
        }
        warnings(j.path("warnings"), "Warnings");
        notes(j.path("notes"), "How the samples were drawn and read");
    }

    private static String ratio(JsonNode v) {
        return v.isNumber() ? "×" + sig(v.asDouble(), 4) : "never loaded";
    }

    // ---------------------------------------------------------------- fit

    private void fit(JsonNode j) {
        b.append("<h2 id=\"fit\">Kinetics fit</h2>\n");
        JsonNode fits = j.path("model_fits");
        int chosen = j.path("chosen_components").asInt(-1);
        JsonNode k = j.path("kissinger");
        b.append("<table>\n");
        row("Runs", String.valueOf(j.path("runs").size()));
        if (chosen > 0) {
            row("Components chosen", chosen + (j.has("criterion") ? " (" + j.path("criterion").asText() + ")" : ""));
        }
        if (k.path("Ea_kJ_mol").isNumber()) {
            row("Kissinger Ea", sig(k.path("Ea_kJ_mol").asDouble(), 5)
                    + (k.path("Ea_ci_kJ_mol").isNumber() ? " ± " + sig(k.path("Ea_ci_kJ_mol").asDouble(), 3) : "")
                    + " kJ/mol" + (k.path("confidence").isNumber() ? " (" + sig(k.path("confidence").asDouble() * 100, 3)
                    + " % interval)" : ""));
        }
        if (k.path("A_1_s").isNumber()) {
            row("Kissinger A", sig(k.path("A_1_s").asDouble(), 4) + " 1/s");
        }
        b.append("</table>\n");
        warnings(j.path("warnings"), "Warnings");
        JsonNode failures = j.path("failures");
        if (failures.isObject() && failures.size() > 0) {
            b.append("<h3>Fits that failed</h3>\n<ul class=\"warn\">\n");
            for (Iterator<Map.Entry<String, JsonNode>> it = failures.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                b.append("<li>").append(escape(e.getKey())).append(": ")
                        .append(escape(e.getValue().isTextual() ? e.getValue().asText() : e.getValue().toString()))
                        .append("</li>\n");
            }
            b.append("</ul>\n");
        }
        if (j.path("runs").isArray() && j.path("runs").size() > 0) {
            b.append("<h3>Runs</h3>\n");
            objectTable(j.path("runs"));
        }
        if (fits.isArray() && fits.size() > 0) {
            b.append("<h3>Model fits compared</h3>\n<table>\n<tr><th>Components</th><th>Model</th><th>rms of α</th>"
                    + "<th>AIC</th><th>BIC</th><th></th></tr>\n");
            for (JsonNode m : fits) {
                boolean isChosen = m.path("components").asInt() == chosen;
                b.append(isChosen ? "<tr class=\"binding\">" : "<tr>")
                        .append("<td class=\"num\">").append(escape(m.path("components").asText())).append("</td>")
                        .append("<td>").append(escape(m.path("model").asText())).append("</td>")
                        .append("<td class=\"num\">").append(escape(numText(m.path("rms_alpha"), 3))).append("</td>")
                        .append("<td class=\"num\">").append(escape(numText(m.path("aic"), 6))).append("</td>")
                        .append("<td class=\"num\">").append(escape(numText(m.path("bic"), 6))).append("</td>")
                        .append("<td>").append(isChosen ? "chosen" : "").append("</td></tr>\n");
            }
            b.append("</table>\n");
            for (JsonNode m : fits) {
                if (m.path("components").asInt() == chosen) {
                    parts(m.path("parts"), m.path("confidence"));
                }
            }
        }
        JsonNode notes = j.path("notes");
        if (notes.isArray() && notes.size() > 0) {
            b.append("<details><summary>How the files were read (").append(notes.size()).append(" notes)</summary>\n<ul>\n");
            for (JsonNode n : notes) {
                b.append("<li>").append(escape(n.asText())).append("</li>\n");
            }
            b.append("</ul>\n</details>\n");
        }
        f.kinetics().ifPresent(y -> b.append("<details><summary>kinetics.yaml</summary>\n<pre>").append(escape(y))
                .append("</pre>\n</details>\n"));
    }

    private void parts(JsonNode parts, JsonNode confidence) {
        if (!parts.isArray() || parts.size() == 0) {
            return;
        }
        String ci = confidence.isNumber() ? " (± " + sig(confidence.asDouble() * 100, 3) + " % interval)" : "";
        b.append("<h3>Fitted components").append(escape(ci)).append("</h3>\n<table>\n<tr><th>Name</th><th>Model</th>"
                + "<th>Fraction</th><th>Ea [kJ/mol]</th><th>A [1/s]</th><th>Shape</th></tr>\n");
        for (JsonNode p : parts) {
            StringBuilder shape = new StringBuilder();
            for (int i = 0; i < p.path("shape").size(); i++) {
                shape.append(i > 0 ? ", " : "").append(sig(p.path("shape").get(i).asDouble(), 4));
                JsonNode sc = p.path("shape_ci").path(i);
                if (sc.isNumber()) {
                    shape.append(" ± ").append(sig(sc.asDouble(), 2));
                }
            }
            b.append("<tr><td>").append(escape(p.path("name").asText())).append("</td><td>")
                    .append(escape(p.path("model").asText())).append("</td><td class=\"num\">")
                    .append(escape(pm(p.path("fraction"), p.path("fraction_ci"), 4))).append("</td><td class=\"num\">")
                    .append(escape(pm(p.path("Ea_kJ_mol"), p.path("Ea_ci_kJ_mol"), 5))).append("</td><td class=\"num\">")
                    .append(escape(numText(p.path("A_1_s"), 4)))
                    .append(p.path("lnA_ci").isNumber() ? escape(" (ln A ± " + sig(p.path("lnA_ci").asDouble(), 2) + ")") : "")
                    .append("</td><td class=\"num\">").append(escape(shape.toString())).append("</td></tr>\n");
        }
        b.append("</table>\n");
    }

    private static String pm(JsonNode v, JsonNode ci, int digits) {
        return numText(v, digits) + (ci.isNumber() ? " ± " + sig(ci.asDouble(), 2) : "");
    }

    private static String numText(JsonNode v, int digits) {
        return v.isNumber() ? sig(v.asDouble(), digits) : "n/a";
    }

    private void row(String k, String v) {
        b.append("<tr><th>").append(escape(k)).append("</th><td>").append(escape(v)).append("</td></tr>\n");
    }

    private void cautions() {
        List<String> list = new ArrayList<>();
        for (JsonNode src : new JsonNode[]{f.summary().orElse(null), f.plan().orElse(null), f.fit().orElse(null),
                f.compare().orElse(null), f.robust().orElse(null)}) {
            if (src != null) {
                for (JsonNode c : src.path("cautions")) {
                    if (!list.contains(c.asText())) {
                        list.add(c.asText());
                    }
                }
            }
        }
        if (list.isEmpty()) {
            list.addAll(Cautions.BAKE);
        }
        b.append("<h2 id=\"cautions\">Cautions</h2>\n<div class=\"cautions\">\n");
        for (String c : list) {
            b.append("<p>").append(escape(c)).append("</p>\n");
        }
        b.append("</div>\n");
    }
}
