package org.exhale.cli;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import picocli.CommandLine;
import picocli.CommandLine.Model.UsageMessageSpec;

/**
 * Help texts as people read them. picocli wraps long lines where Java's line breaker allows,
 * which includes after a dot or a slash, so file and key names came out split ("recipe." /
 * "yaml"). Here every paragraph of a command's description and footer is wrapped beforehand at
 * spaces only, to lines picocli then leaves alone; and every command gets an Examples section.
 */
final class HelpText {
    /** Examples per command: each line is a runnable command (from the project folder) and what it does. */
    static final Map<String, List<String>> EXAMPLES = new LinkedHashMap<>();

    static {
        EXAMPLES.put("exhale", List.of(
                "exhale new line -o my-line.yaml      a commented case to start from",
                "exhale check my-line.yaml            the case as understood",
                "exhale plan my-line.yaml --report    the shortest safe recipe and its report"));
        EXAMPLES.put("check", List.of(
                "exhale check data/demo/porous-line.yaml",
                "exhale check data/demo/dense-disc.yaml --no-values   derived figures only"));
        EXAMPLES.put("simulate", List.of(
                "exhale simulate data/demo/porous-line.yaml",
                "exhale simulate data/demo/porous-line.yaml -o out/line --sample 10s --report"));
        EXAMPLES.put("plan", List.of(
                "exhale plan data/demo/porous-line.yaml --report   then print its recipe.txt",
                "exhale plan data/demo/dense-disc.yaml -o out/disc-plan"));
        EXAMPLES.put("compare", List.of(
                "exhale compare data/demo/porous-line.yaml --vary cap.porosity=0.2:0.4:0.1",
                "exhale compare data/demo/porous-line.yaml --vary cap.pore_radius=1nm,2nm"));
        EXAMPLES.put("robust", List.of(
                "exhale robust data/demo/porous-line-uncertain.yaml --samples 200",
                "exhale robust data/demo/porous-line-uncertain.yaml --samples 100 --plan"));
        EXAMPLES.put("fit", List.of(
                "exhale fit data/demo/tga/*.csv -o out/fit",
                "exhale fit data/demo/tga/*.csv --components 2 --model sestak-berggren"));
        EXAMPLES.put("report", List.of(
                "exhale report out/porous-line-plan",
                "exhale report out/fit -o fit-report.html"));
        EXAMPLES.put("demo", List.of("exhale demo        writes out/demo/<case>/report.html"));
        EXAMPLES.put("bench", List.of("exhale bench --repeats 10 --plan-repeats 3"));
        EXAMPLES.put("schema", List.of("exhale schema -o case-file.schema.json"));
        EXAMPLES.put("completion", List.of("source <(exhale completion)"));
    }

    private HelpText() {
    }

    /** Re-wraps the help of every command in the tree and adds the Examples sections. */
    static void apply(CommandLine cl) {
        UsageMessageSpec u = cl.getCommandSpec().usageMessage();
        int width = u.width();
        u.description(wrap(u.description(), width));
        List<String> footer = new ArrayList<>(Arrays.asList(u.footer()));
        List<String> ex = EXAMPLES.get(cl.getCommandName());
        if (ex != null && footer.stream().noneMatch(l -> l.startsWith("Examples:"))) {
            footer.add("");
            footer.add("Examples:");
            ex.forEach(e -> footer.add("  " + e));
        }
        u.footer(wrap(footer.toArray(String[]::new), width));
        for (CommandLine sub : cl.getSubcommands().values()) {
            apply(sub);
        }
    }

    /** Each paragraph wrapped at spaces to the width; lines that begin with spaces keep their indent. */
    static String[] wrap(String[] paragraphs, int width) {
        List<String> out = new ArrayList<>();
        for (String p : paragraphs) {
            if (p.length() <= width) {
                out.add(p);
                continue;
            }
            String indent = p.substring(0, p.length() - p.stripLeading().length());
            String cont = indent + (indent.isEmpty() ? "" : "    ");
            StringBuilder line = new StringBuilder(indent);
            boolean empty = true;
            for (String word : p.stripLeading().split(" ")) {
                if (!empty && visible(line) + 1 + visible(word) > width) {
                    out.add(line.toString());
                    line = new StringBuilder(cont);
                    empty = true;
                }
                line.append(empty ? "" : " ").append(word);
                empty = false;
            }
            out.add(line.toString());
        }
        return out.toArray(String[]::new);
    }

    /** Printed length: picocli turns "%%" into "%" and "%n" into a line end. */
    private static int visible(CharSequence s) {
        return s.toString().replace("%%", "%").length();
    }
}
