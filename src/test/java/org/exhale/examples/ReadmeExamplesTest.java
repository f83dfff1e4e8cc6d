package org.exhale.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.exhale.Exhale;
import org.exhale.cli.Main;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The READMEs' examples run as written, so they cannot drift from what exhale does. */
class ReadmeExamplesTest {

    /** The "First steps" lines of README.md, each run with its files in a temporary folder. */
    @Test
    void firstStepsRunAsWritten(@TempDir Path tmp) throws Exception {
        String readme = Files.readString(Path.of("README.md"));
        int start = readme.indexOf("## First steps");
        assertTrue(start > 0);
        String block = readme.substring(start, readme.indexOf("\n## ", start + 5));
        List<String> commands = new ArrayList<>();
        for (String line : block.split("\n")) {
            String t = line.strip();
            if (line.startsWith("    exhale ")) {
                commands.add(t.replaceFirst("\\s+#.*$", ""));
            }
        }
        assertTrue(commands.size() >= 5, "First steps lists the commands: " + commands);
        for (String c : commands) {
            List<String> args = new ArrayList<>();
            for (String a : c.substring("exhale ".length()).split("\\s+")) {
                if (a.contains("*")) {
                    Path folder = Path.of(a).getParent();
                    try (DirectoryStream<Path> ds = Files.newDirectoryStream(folder, a.substring(a.lastIndexOf('/') + 1))) {
                        ds.forEach(p -> args.add(p.toString()));
                    }
                } else if (a.startsWith("my-") || a.startsWith("out/")) {
                    args.add(tmp.resolve(a).toString()); // files the user makes go to the temporary folder
                } else {
                    args.add(a);
                }
            }
            if (List.of("simulate", "plan", "compare", "robust", "fit", "report").contains(args.get(0))) {
                args.add("-q"); // keep the test log short; the commands are as written otherwise
            }
            assertEquals(Main.OK, Main.execute(args.toArray(String[]::new)), "README: " + c);
        }
        assertTrue(Files.exists(tmp.resolve("out/my-line-plan/recipe.txt")));
    }

    /** The jshell lines of notebooks-free-examples/README.md give the printed answers. */
    @Test
    void jshellLinesGiveTheirPrintedAnswers() throws Exception {
        String page = Files.readString(Path.of("notebooks-free-examples/README.md"));
        var c = Exhale.loadCase(Path.of("data/demo/porous-line.yaml"));
        var r = Exhale.simulate(c.bake());
        Matcher feasible = Pattern.compile("jshell> r.feasible\\(\\)\\s+\\$\\d+ ==> (\\S+)").matcher(page);
        assertTrue(feasible.find(), page);
        assertEquals(feasible.group(1), String.valueOf(r.feasible()));
        Matcher time = Pattern.compile("jshell> Math.round\\(r.timeTo1pctS\\(\\) / 60 \\* 10\\) / 10.0\\s+\\$\\d+ ==> (\\S+)")
                .matcher(page);
        assertTrue(time.find(), page);
        assertEquals(time.group(1), String.valueOf(Math.round(r.timeTo1pctS() / 60 * 10) / 10.0));
    }
}
