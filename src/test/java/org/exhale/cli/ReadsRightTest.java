package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.exhale.io.SummaryJsonWriter;
import org.exhale.report.Readable;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import picocli.CommandLine;

/**
 * What a user reads: the recipe sheet first, one vocabulary, numbers with units and without binary
 * noise, the overshoot guard band, one setpoint per time, and help texts that wrap cleanly.
 */
class ReadsRightTest {
    @TempDir
    static Path dir;
    static Path plan;
    static String terminal;

    /** Plans the line template with a 2 K overshoot guard band, with the report, capturing the terminal. */
    @BeforeAll
    static void planTheTemplate() throws Exception {
        Path c = dir.resolve("line.yaml");
        assertEquals(Main.OK, Main.execute("new", "line", "-o", c.toString()));
        String text = Files.readString(c);
        assertTrue(text.contains("overshoot: 0 K"), "the template shows the guard band key");
        Files.writeString(c, text.replace("overshoot: 0 K", "overshoot: 2 K"));
        plan = dir.resolve("plan");
        PrintStream old = System.out;
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        System.setOut(new PrintStream(buf, true, StandardCharsets.UTF_8));
        try {
            assertEquals(Main.OK, Main.execute("plan", c.toString(), "-o", plan.toString(), "--report"));
        } finally {
            System.setOut(old);
        }
        terminal = buf.toString(StandardCharsets.UTF_8);
    }

    @Test
    void overshootGuardBandKeepsSetpointPlusOvershootPlusSpreadUnderTheCeiling() throws Exception {
        // template: ceiling 400 C, spread 3 K; with 2 K overshoot the setpoint may not exceed 395 C
        List<String> rows = Files.readAllLines(plan.resolve("recipe.csv"));
        double highest = rows.stream().skip(1).mapToDouble(r -> Double.parseDouble(r.split(",")[3])).max().orElseThrow();
        assertTrue(highest <= 395.0 + 1e-9, "highest setpoint " + highest + " C");
        String pj = Files.readString(plan.resolve("plan.json"));
        assertTrue(pj.contains("\"overshoot_K\" : 2.0"), pj);
        Matcher m = Pattern.compile("\"headroom_K\" : ([0-9.]+)").matcher(pj);
        assertTrue(m.find());
        assertTrue(Double.parseDouble(m.group(1)) >= 2.0 - 1e-9, "headroom " + m.group(1) + " K covers the overshoot");
        assertTrue(Files.readString(plan.resolve("recipe.txt")).contains("Overshoot guard band: 2.0 K"));
    }

    @Test
    void recipeSheetIsPrintableAndTheCsvStaysPlain() throws Exception {
        String sheet = Files.readString(plan.resolve("recipe.txt"));
        for (String want : List.of("Recipe sheet: demo air-gap line, porous cap P1", "Verified: yes", "Date: ",
                "Step  Action  From °C  To °C  Rate °C/min", "Ends at", "Time to target:", "Total with cool-down:",
                "Binding limits:", "Headroom:", "Lower bound:", "Tightest limit:", "Caution: ")) {
            assertTrue(sheet.contains(want), "sheet lacks '" + want + "':\n" + sheet);
        }
        assertTrue(sheet.matches("(?s).*\\s\\d+:\\d\\d\\s+\\d+:\\d\\d\\s.*"), "step times in mm:ss:\n" + sheet);
        for (String line : sheet.split("\n")) {
            assertTrue(line.length() <= 100, "printable width: " + line);
        }
        assertEquals("step,action,start_C,end_C,rate_C_per_min,duration_s,elapsed_s",
                Files.readAllLines(plan.resolve("recipe.csv")).get(0));
        // the terminal shows the same sheet, and the cautions once
        assertTrue(terminal.contains("Recipe sheet: demo air-gap line"), terminal);
        assertEquals(1, terminal.split("Caution: ", -1).length - 1, terminal);
        assertFalse(terminal.matches("(?s).*\\d C\\b.*"), "temperatures in °C:\n" + terminal);
    }

    @Test
    void reportOpensWithTheSheetThenChartsThenDetails() throws Exception {
        String html = Files.readString(plan.resolve("report.html"));
        int sheet = html.indexOf("id=\"recipe-sheet\"");
        int charts = html.indexOf("id=\"charts\"");
        int details = html.indexOf("id=\"details\"");
        int margins = html.indexOf("Margins to the limits");
        assertTrue(sheet > 0 && sheet < charts && charts < details && details < margins, "order of the page");
        assertTrue(html.contains("✓ Verified"));
        assertFalse(html.contains("Lower bound note") || html.contains("Ceiling only lower bound")
                || html.contains("Rhs evaluations"), "no raw dump of keys");
        // binding = a limit that set a step (plan.json); strength, set at t = 0, is never called binding
        assertFalse(html.contains("strength (binding)"));
        assertTrue(html.contains("(binding)"));
    }

    @Test
    void jsonCarriesNoBinaryNoise() throws Exception {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("a", 0.1 + 0.2);
        m.put("b", 1749.9999999999998);
        m.put("c", -0.0);
        String j = SummaryJsonWriter.toJson(m);
        assertTrue(j.contains("\"a\" : 0.3,") && j.contains("\"b\" : 1750.0,") && j.contains("\"c\" : 0.0"), j);
        for (String f : List.of("plan.json", "summary.json")) {
            String text = Files.readString(plan.resolve(f));
            Matcher n = Pattern.compile(" : (-?[0-9.]+)(E-?[0-9]+)?[,\\n]").matcher(text);
            while (n.find()) {
                String digits = n.group(1).replace("-", "").replace(".", "").replaceFirst("^0+", "").replaceFirst("0+$", "");
                assertTrue(digits.length() <= 9, f + ": " + n.group(1) + " has more than nine significant digits");
            }
        }
    }

    @Test
    void historyHasOneSetpointPerTimeAndAWaferTemperaturePerCorner() throws Exception {
        List<String> lines = Files.readAllLines(plan.resolve("history.csv"));
        List<String> head = List.of(lines.get(0).split(","));
        int t = head.indexOf("time_s");
        int sp = head.indexOf("setpoint_C");
        int w = head.indexOf("wafer_C");
        Map<String, String> setpoint = new HashMap<>();
        Map<String, String> wafer = new HashMap<>();
        int compared = 0;
        for (String l : lines.subList(1, lines.size())) {
            String[] c = l.split(",");
            String prev = setpoint.putIfAbsent(c[t], c[sp]);
            if (prev != null) {
                assertEquals(prev, c[sp], "one setpoint at t = " + c[t] + " s");
                assertFalse(c[w].equals(wafer.get(c[t])) && !c[t].equals("0"), "corners differ in wafer temperature");
                compared++;
            }
            wafer.putIfAbsent(c[t], c[w]);
        }
        assertTrue(compared > 10);
    }

    @Test
    void numbersReadAsFigures() {
        assertEquals("> 1000", Readable.ratio(3.67e5));
        assertEquals("not loaded", Readable.ratio(Double.POSITIVE_INFINITY));
        assertEquals("1.24", Readable.ratio(1.2426655));
        assertEquals("0", Readable.number(-0.0));
        assertEquals("0.0 K", Readable.kelvin(-0.0001));
        assertEquals("400.0 °C", Readable.celsius(673.15));
        assertEquals("0.0537 %", Readable.percent(5.373e-4));
        assertEquals("96.4 mPa", Readable.value(0.0964, "Pa"));
        assertEquals("24:42", Readable.mmss(1482));
    }

    @Test
    void chartsNameComponentsAsTheUserWroteThem() throws Exception {
        // the template names a component "side groups"; history.csv has the CSV-safe p_side_groups_Pa
        String svg = Files.readString(plan.resolve("charts/pressure.svg"));
        assertTrue(svg.contains(">side groups, "), "legend as typed");
        assertFalse(svg.contains("side_groups"));
    }

    @Test
    void chartsHaveAtMostAboutEightTicksPerAxis() throws Exception {
        // every numeric label of a single-panel chart belongs to one of its two axes
        for (String id : List.of("temperature", "pressure", "unconverted")) {
            String svg = Files.readString(plan.resolve("charts").resolve(id + ".svg"));
            Matcher m = Pattern.compile(">(−?[0-9][0-9.]*)</text>").matcher(svg);
            int n = 0;
            while (m.find()) {
                n++;
            }
            assertTrue(n <= 2 * 9, id + ": " + n + " tick labels");
        }
    }

    // ---------------------------------------------------------------- help

    static String usage(CommandLine cl) {
        StringWriter w = new StringWriter();
        cl.usage(new PrintWriter(w));
        return w.toString();
    }

    @Test
    void bareExhalePrintsUsageAndExitsTwo() {
        PrintStream old = System.err;
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        System.setErr(new PrintStream(buf, true, StandardCharsets.UTF_8));
        int code;
        try {
            code = Main.execute();
        } finally {
            System.setErr(old);
        }
        assertEquals(Main.BAD_INPUT, code);
        assertTrue(buf.toString(StandardCharsets.UTF_8).contains("Usage: exhale"));
    }

    @Test
    void helpNeverSplitsATokenAndEveryCommandHasExamples() {
        CommandLine root = Main.commandLine();
        StringWriter err = new StringWriter();
        for (CommandLine cl : root.getSubcommands().values()) {
            if (cl.getCommandName().equals("help")) {
                continue;
            }
            cl.setErr(new PrintWriter(err));
            String text = usage(cl);
            assertTrue(text.contains("Examples:"), cl.getCommandName() + " has an Examples section:\n" + text);
            List<String> words = new java.util.ArrayList<>();
            for (String p : cl.getCommandSpec().usageMessage().description()) {
                words.addAll(List.of(p.trim().split("\\s+")));
            }
            for (CommandLine.Model.OptionSpec o : cl.getCommandSpec().options()) {
                for (String d : o.description()) {
                    words.addAll(List.of(d.trim().split("\\s+")));
                }
            }
            String flat = " " + text.replaceAll("\\s+", " ") + " ";
            for (String word : words) {
                if (word.contains("${") || word.contains("%")) {
                    continue; // picocli fills these in
                }
                assertTrue(flat.contains(" " + word + " ") || flat.contains(" " + word) && flat.contains(word + " "),
                        cl.getCommandName() + ": the token '" + word + "' is split in\n" + text);
            }
            for (String line : text.split("\n")) {
                assertTrue(line.length() <= 80, cl.getCommandName() + ": line wider than 80: " + line);
            }
        }
        assertFalse(err.toString().contains("WARN"), err.toString());
        // every example parses as written (the shell glob stands for the demo runs)
        for (List<String> lines : HelpText.EXAMPLES.values()) {
            for (String line : lines) {
                if (!line.startsWith("exhale")) {
                    continue;
                }
                String cmd = line.split("\\s{2,}")[0].replace("data/demo/tga/*.csv", "data/demo/tga/demo_02Kmin.csv");
                String[] args = cmd.substring("exhale".length()).trim().split(" ");
                if (args.length == 1 && args[0].isEmpty()) {
                    continue;
                }
                Main.commandLine().parseArgs(args);
                assertTrue(line.length() + 2 <= 80, "an example fits one line: " + line);
            }
        }
        // --force means one thing everywhere
        for (CommandLine cl : root.getSubcommands().values()) {
            CommandLine.Model.OptionSpec f = cl.getCommandSpec().findOption("--force");
            if (f != null) {
                assertEquals(CommonOptions.FORCE, f.description()[0], cl.getCommandName());
            }
        }
    }
}
