package org.exhale.report;

import static org.exhale.report.ReportText.escape;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.exhale.PhysicalConstants;

import com.fasterxml.jackson.databind.JsonNode;

/**
 * The recipe sheet of a plan: what an operator and an approving engineer need on one page — the
 * ramp table with step times in mm:ss, whether the rounded recipe was verified, the time to target
 * and with cool-down, the limits that set each step, the ceiling's headroom with the spread and
 * overshoot guard band, the lower bound and the tightest limit. Built from the output folder's
 * plan.json, recipe.csv and summary.json, so {@code recipe.txt} (plain text, printable), the
 * terminal and the first section of report.html show the same sheet.
 */
public final class RecipeSheet {
    private final JsonNode plan;
    private final CsvTable recipe;
    private final JsonNode summary;

    private RecipeSheet(JsonNode plan, CsvTable recipe, JsonNode summary) {
        this.plan = plan;
        this.recipe = recipe;
        this.summary = summary;
    }

    /** The sheet of a folder holding a feasible plan, or null when there is none. */
    public static RecipeSheet of(RunFolder f) {
        if (f.plan().isEmpty() || f.recipe().isEmpty() || !f.plan().get().path("feasible").asBoolean(false)) {
            return null;
        }
        return new RecipeSheet(f.plan().get(), f.recipe().get(), f.summary().orElse(null));
    }

    /** The sheet from a plan's files as text (plan.json, recipe.csv, summary.json), before they are written. */
    public static RecipeSheet of(String planJson, String recipeCsv, String summaryJson) {
        try {
            com.fasterxml.jackson.databind.ObjectMapper m = new com.fasterxml.jackson.databind.ObjectMapper();
            return new RecipeSheet(m.readTree(planJson), CsvTable.parse("recipe.csv", recipeCsv),
                    summaryJson == null ? null : m.readTree(summaryJson));
        } catch (java.io.IOException e) {
            throw new IllegalStateException("the plan's own files cannot be read back", e);
        }
    }

    // ---------------------------------------------------------------- content

    String caseName() {
        return summary == null ? "" : summary.path("case").asText("");
    }

    boolean verified() {
        return plan.path("verified").asBoolean(false);
    }

    /** One row per step: step, action, from, to, rate, time (mm:ss), ends at (mm:ss), set by. */
    List<String[]> rows() {
        List<String[]> out = new ArrayList<>();
        JsonNode binding = plan.path("binding");
        for (int r = 0; r < recipe.size(); r++) {
            boolean ramp = "ramp".equals(recipe.text(r, "action"));
            String by = binding.isArray() && binding.size() > r ? binding.get(r).path("binding").asText("") : "";
            out.add(new String[]{recipe.text(r, "step"), recipe.text(r, "action"),
                    String.format(Locale.ROOT, "%.1f", recipe.number(r, "start_C")),
                    String.format(Locale.ROOT, "%.1f", recipe.number(r, "end_C")),
                    ramp ? Readable.number(recipe.number(r, "rate_C_per_min")) : "-",
                    Readable.mmss(recipe.number(r, "duration_s")), Readable.mmss(recipe.number(r, "elapsed_s")),
                    by.replace("; ", ", ")});
        }
        return out;
    }

    static final String[] HEADER = {"Step", "Action", "From °C", "To °C", "Rate °C/min", "Time", "Ends at", "Set by"};

    /** The figures below the table, as label and text. */
    Map<String, String> figures() {
        Map<String, String> f = new LinkedHashMap<>();
        double d = plan.path("duration_s").asDouble(Double.NaN);
        double total = plan.path("total_with_cooldown_s").asDouble(Double.NaN);
        f.put("Time to target", Readable.mmss(d) + " (" + Readable.time(d) + "), at the end of the last hold");
        if (Double.isFinite(total) && total > d) {
            f.put("Total with cool-down", Readable.mmss(total) + " (" + Readable.time(total) + ")");
        }
        List<String> bound = new ArrayList<>();
        JsonNode binding = plan.path("binding");
        for (JsonNode b : binding) {
            for (String part : b.path("binding").asText("").split(";\\s*")) {
                if (!part.isBlank() && !bound.contains(part)) {
                    bound.add(part);
                }
            }
        }
        if (!bound.isEmpty()) {
            f.put("Binding limits", String.join(", ", bound) + " (the limits that set the steps)");
        }
        JsonNode ceiling = summary == null ? plan.path("margins").path("ceiling") : summary.path("margins").path("ceiling");
        if (ceiling.path("headroom_K").isNumber()) {
            StringBuilder s = new StringBuilder();
            s.append(Readable.kelvin(ceiling.path("headroom_K").asDouble())).append(" below the ceiling ")
                    .append(Readable.celsius(ceiling.path("allowed").asDouble() + PhysicalConstants.ZERO_CELSIUS_K))
                    .append(" (peak ").append(Readable.celsius(ceiling.path("actual").asDouble() + PhysicalConstants.ZERO_CELSIUS_K))
                    .append(", ").append(ceiling.path("corner").asText("")).append(" corner)");
            f.put("Headroom", s.toString());
        }
        if (plan.has("overshoot_K")) {
            double o = plan.path("overshoot_K").asDouble(0);
            f.put("Overshoot guard band", Readable.kelvin(o) + (o > 0
                    ? ": setpoint + overshoot + spread stay at or below the ceiling"
                    : " (tool.overshoot not set: a controller overshoot would go above the ceiling by as much)"));
        }
        double lb = plan.path("lower_bound_s").asDouble(Double.NaN);
        if (Double.isFinite(lb) && lb > 0) {
            f.put("Lower bound", Readable.mmss(lb) + ": no recipe within the limits reaches the target sooner"
                    + (plan.path("lower_bound_rigorous").asBoolean(true) ? "" : " (an estimate here: the gas is not quasi-steady)")
                    + "; this plan takes " + String.format(Locale.ROOT, "%.3f", d / lb) + " × the bound");
        }
        if (plan.path("ride_s").isNumber()) {
            f.put("Closed-loop ride", Readable.mmss(plan.path("ride_s").asDouble())
                    + (plan.path("ride_admissible").asBoolean(true)
                    ? ": the time of the planner's closed-loop ride (bound ≤ ride ≤ plan)"
                    : ": the planner's closed-loop ride, which crossed a limit on the way: a reference only, not a time"
                            + " any recipe is known to reach"));
        }
        JsonNode margins = summary == null ? plan.path("margins") : summary.path("margins");
        String t = tightest(margins);
        if (t != null) {
            f.put("Tightest limit", t);
        }
        return f;
    }

    /**
     * The smallest margin among the limits the recipe can change (worst value after t = 0), and a
     * note when a limit set by the starting state is smaller; the ceiling is given as headroom.
     */
    /** The name of the tightest limit (the recipe can change it), or null. */
    static String tightestName(JsonNode margins) {
        String name = null;
        double min = Double.POSITIVE_INFINITY;
        for (Iterator<Map.Entry<String, JsonNode>> it = margins.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode m = e.getValue().path("margin");
            if (m.isNumber() && e.getValue().path("time_s").asDouble(1) > 1e-6 && m.asDouble() < min) {
                min = m.asDouble();
                name = e.getKey();
            }
        }
        return name;
    }

    static String tightest(JsonNode margins) {
        String name = null;
        double min = Double.POSITIVE_INFINITY;
        String startName = null;
        double startMin = Double.POSITIVE_INFINITY;
        for (Iterator<Map.Entry<String, JsonNode>> it = margins.fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            JsonNode m = e.getValue().path("margin");
            if (!m.isNumber()) {
                continue;
            }
            boolean atStart = e.getValue().path("time_s").asDouble(1) <= 1e-6;
            if (atStart && m.asDouble() < startMin) {
                startMin = m.asDouble();
                startName = e.getKey();
            } else if (!atStart && m.asDouble() < min) {
                min = m.asDouble();
                name = e.getKey();
            }
        }
        if (name == null && startName == null) {
            return null;
        }
        StringBuilder s = new StringBuilder();
        if (name != null) {
            s.append(name).append(", margin ").append(Readable.ratio(min)).append(" (allowed/actual)");
        }
        if (startName != null && startMin < min) {
            s.append(name == null ? "" : "; ").append(startName).append(" is smaller, margin ").append(Readable.ratio(startMin))
                    .append(", but it is set at the start of the bake and no recipe changes it");
        }
        return s.toString();
    }

    // ---------------------------------------------------------------- text

    /** The printable sheet (recipe.txt), lines under 100 characters. */
    public String text(String version) {
        StringBuilder b = new StringBuilder();
        String title = "Recipe sheet: " + (caseName().isEmpty() ? "(unnamed case)" : caseName());
        b.append(title).append('\n').append("=".repeat(Math.min(title.length(), 99))).append('\n');
        b.append(wrap("Planned by exhale " + version + ". Verified: " + (verified()
                ? "yes, the rounded recipe was simulated again and meets every limit at every corner."
                : "NO: the rounded recipe was not proven; do not run it."), 0, WIDTH));
        b.append("Date: ________________   Approved by: ________________\n\n");
        List<String[]> rows = rows();
        int[] w = new int[HEADER.length];
        for (int c = 0; c < w.length; c++) {
            w[c] = HEADER[c].length();
            for (String[] r : rows) {
                w[c] = Math.max(w[c], r[c].length());
            }
        }
        appendRow(b, HEADER, w);
        String[] rule = new String[w.length];
        for (int c = 0; c < w.length; c++) {
            rule[c] = "-".repeat(w[c]);
        }
        appendRow(b, rule, w);
        for (String[] r : rows) {
            appendRow(b, r, w);
        }
        b.append('\n');
        Map<String, String> f = figures();
        int lw = f.keySet().stream().mapToInt(String::length).max().orElse(0);
        for (Map.Entry<String, String> e : f.entrySet()) {
            b.append(wrap(String.format(Locale.ROOT, "%-" + (lw + 1) + "s %s", e.getKey() + ":", e.getValue()), lw + 2, WIDTH));
        }
        b.append('\n').append(wrap("Caution: " + Cautions.BAKE.get(0), 9, WIDTH));
        return b.toString();
    }

    /** Width of the printed sheet [characters]. */
    static final int WIDTH = 96;

    /** Wraps a line at spaces to the width, continuing lines indented; never splits a word. */
    static String wrap(String line, int indent, int width) {
        StringBuilder out = new StringBuilder();
        StringBuilder cur = new StringBuilder();
        for (String word : line.split(" ", -1)) {
            if (cur.length() > indent && cur.length() + 1 + word.length() > width) {
                out.append(cur.toString().stripTrailing()).append('\n');
                cur = new StringBuilder(" ".repeat(indent));
            } else if (!cur.isEmpty()) {
                cur.append(' ');
            }
            cur.append(word);
        }
        return out.append(cur.toString().stripTrailing()).append('\n').toString();
    }

    private static void appendRow(StringBuilder b, String[] cells, int[] w) {
        StringBuilder line = new StringBuilder();
        for (int c = 0; c < cells.length; c++) {
            boolean left = c == 1 || c == cells.length - 1;
            line.append(c == 0 ? "" : "  ").append(String.format(Locale.ROOT, "%" + (left ? "-" : "") + w[c] + "s", cells[c]));
        }
        b.append(line.toString().stripTrailing()).append('\n');
    }

    // ---------------------------------------------------------------- html

    /** The sheet as the report's first section. */
    String html() {
        StringBuilder b = new StringBuilder();
        b.append("<section class=\"sheet\" id=\"recipe-sheet\">\n<h2>Recipe sheet</h2>\n");
        b.append(verified() ? "<p class=\"verdict ok\">✓ Verified: the rounded recipe meets every limit at every corner</p>\n"
                : "<p class=\"verdict bad\">✗ Not verified: do not run this recipe</p>\n");
        b.append("<table class=\"ramp\">\n<tr>");
        for (String h : HEADER) {
            b.append("<th>").append(escape(h)).append("</th>");
        }
        b.append("</tr>\n");
        for (String[] r : rows()) {
            b.append("<tr>");
            for (int c = 0; c < r.length; c++) {
                boolean num = c != 1 && c != r.length - 1;
                b.append(num ? "<td class=\"num\">" : "<td>").append(escape(r[c])).append("</td>");
            }
            b.append("</tr>\n");
        }
        b.append("</table>\n<table class=\"figures\">\n");
        for (Map.Entry<String, String> e : figures().entrySet()) {
            b.append("<tr><th>").append(escape(e.getKey())).append("</th><td>").append(escape(e.getValue())).append("</td></tr>\n");
        }
        b.append("</table>\n<p class=\"sub\">The same sheet is in <code>recipe.txt</code> for printing; "
                + "<code>recipe.csv</code> holds the plain table.</p>\n</section>\n");
        return b.toString();
    }
}
