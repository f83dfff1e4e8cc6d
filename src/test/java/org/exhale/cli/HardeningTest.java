package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Reproducers of the holes found by fuzzing the command line (resources, overwrites, terminal, stdout). */
class HardeningTest {
    @TempDir
    Path tmp;

    private static final Path BASE = LegalExtremesTest.resource("good-cases/base.yaml");

    private static void oneLine(CliErrorsTest.Run r, int code, String... mustContain) {
        assertEquals(code, r.code(), r.err());
        assertEquals(1, r.errLines().size(), r.err());
        assertTrue(r.err().startsWith("error: "), r.err());
        for (String s : mustContain) {
            assertTrue(r.err().contains(s), r.err());
        }
    }

    @Test
    void aSampleIntervalBelowTheMinimumIsRefusedBeforeAnythingRuns() {
        // formerly: OutOfMemoryError with a Java stack trace
        CliErrorsTest.Run r = CliErrorsTest.run("simulate", BASE.toString(), "--sample", "1e-9 s", "-o", tmp.resolve("o").toString());
        oneLine(r, Main.BAD_INPUT, "--sample", "0.1 s");
        assertFalse(Files.exists(tmp.resolve("o")));
    }

    @Test
    void optionErrorsAreOneLineNamingTheCommandLine() {
        oneLine(CliErrorsTest.run("simulate", "--bogus", BASE.toString()), Main.BAD_INPUT, "command line", "--bogus");
        oneLine(CliErrorsTest.run("simulate", BASE.toString(), "--sample"), Main.BAD_INPUT, "command line", "--sample");
    }

    @Test
    void aFolderOrADeviceIsNotCalledMissing() throws Exception {
        oneLine(CliErrorsTest.run("check", tmp.toString()), Main.BAD_INPUT, "is a folder");
        if (Files.exists(Path.of("/dev/null"))) {
            CliErrorsTest.Run r = CliErrorsTest.run("check", "/dev/null");
            oneLine(r, Main.BAD_INPUT, "not a regular file");
            assertFalse(r.err().contains("no such file"), r.err());
        }
        Path fifo = tmp.resolve("pipe.yaml");
        boolean made;
        try {
            Process p = new ProcessBuilder("mkfifo", fifo.toString()).start();
            made = p.waitFor(10, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (java.io.IOException e) {
            made = false;
        }
        if (made) {
            oneLine(CliErrorsTest.run("check", fifo.toString()), Main.BAD_INPUT, "not a regular file");
        }
        oneLine(CliErrorsTest.run("check", tmp.resolve("absent.yaml").toString()), Main.BAD_INPUT, "no such file");
    }

    @Test
    void reportNeverOverwritesAFileWithoutForceAndLeavesNothingWhenThePageFails() throws Exception {
        Path dir = tmp.resolve("run");
        assertTrue(List.of(Main.OK, Main.VIOLATED).contains(
                CliErrorsTest.run("simulate", BASE.toString(), "-o", dir.toString(), "-q").code()));
        Path caseCopy = tmp.resolve("case.yaml");
        Files.copy(BASE, caseCopy);
        byte[] before = Files.readAllBytes(caseCopy);
        // formerly: the user's case file was replaced by the page
        oneLine(CliErrorsTest.run("report", dir.toString(), "-o", caseCopy.toString()), Main.BAD_INPUT, "--force");
        assertEquals(new String(before, StandardCharsets.UTF_8), Files.readString(caseCopy));
        // a page that cannot be written: no chart is left behind (formerly the charts stayed)
        CliErrorsTest.Run r = CliErrorsTest.run("report", dir.toString(), "-o", caseCopy.resolve("x.html").toString());
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertFalse(Files.exists(dir.resolve("charts")), "charts left behind");
        assertEquals(Main.OK, CliErrorsTest.run("report", dir.toString(), "-o", caseCopy.toString(), "--force", "-q").code());
        assertTrue(Files.readString(caseCopy).contains("<html"));
    }

    @Test
    void studiesWriteNoWallClockAndNoInfinity() throws Exception {
        Path demo = Path.of("data/demo/porous-line-uncertain.yaml");
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        for (Path p : List.of(a, b)) {
            assertEquals(Main.OK, CliErrorsTest.run("robust", demo.toString(), "--samples", "3", "--seed", "7", "--threads", "1",
                    "-o", p.toString(), "-q").code());
        }
        for (String f : List.of("robust.json", "samples.csv", "recipe.csv")) {
            assertEquals(Files.readString(a.resolve(f)), Files.readString(b.resolve(f)), f + " differs between identical runs");
        }
        String json = Files.readString(a.resolve("robust.json"));
        assertFalse(json.contains("wall_time"), json);
        // formerly: buckling_margin = inf in every sample whose cap is never compressed
        String samples = Files.readString(a.resolve("samples.csv"));
        assertFalse(samples.matches("(?s).*(?<![A-Za-z_])(inf|nan|NaN|Infinity)(?![A-Za-z_]).*"), samples);
    }

    @Test
    void controlCharactersNeverReachTheTerminal() throws Exception {
        String hostile = "cap \u001b]0;pwned\u0007 \u001b[31mred\u001b[0m \u009b2J\u0008 tab\tend\n";
        String clean = Terminal.clean(hostile);
        assertEquals("cap ?]0;pwned? ?[31mred?[0m ?2J? tab\tend\n", clean);
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (PrintStream ps = Terminal.cleaning(bytes)) {
            ps.print(hostile);
            ps.print("é µm °C");
        }
        assertEquals(clean + "é µm °C", bytes.toString(StandardCharsets.UTF_8));
        // a case name with escapes, echoed by check, arrives clean (the filter sits on stdout and stderr in main)
        Path c = tmp.resolve("esc.yaml");
        Files.writeString(c, Files.readString(BASE).replace("name: corpus base", "name: \"evil \\e]0;title\\a \\e[31m\""));
        assertEquals(Main.OK, CliErrorsTest.run("check", c.toString()).code());
    }

    @Test
    void aFullStandardOutputExitsOneWithAMessage() throws Exception {
        // formerly: `schema > /dev/full` exited 0
        Path full = Path.of("/dev/full");
        assumeTrue(Files.exists(full), "no /dev/full on this system");
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        for (List<String> args : List.of(List.of("schema"), List.of("new", "line", "-o", "-"))) {
            List<String> cmd = new java.util.ArrayList<>(List.of(java.toString(), "-cp", cp, "org.exhale.cli.Main"));
            cmd.addAll(args);
            Process p = new ProcessBuilder(cmd).redirectOutput(full.toFile()).redirectError(ProcessBuilder.Redirect.PIPE).start();
            String err = new String(p.getErrorStream().readAllBytes(), StandardCharsets.UTF_8);
            assertTrue(p.waitFor(60, TimeUnit.SECONDS));
            assertEquals(Main.INTERNAL, p.exitValue(), args + ": " + err);
            assertTrue(err.contains("standard output"), err);
        }
    }

    @Test
    void fitRefusesARunGivenTwiceAndRunsWithoutPositiveMass() throws Exception {
        Path d = Path.of("data/demo/tga");
        Path a = d.resolve("demo_02Kmin.csv");
        Path b = d.resolve("demo_05Kmin.csv");
        oneLine(CliErrorsTest.run("fit", a.toString(), b.toString(), a.toString(), "-o", tmp.resolve("f1").toString()),
                Main.BAD_INPUT, "given twice");
        Path copy = tmp.resolve("copy.csv");
        Files.copy(b, copy);
        oneLine(CliErrorsTest.run("fit", a.toString(), b.toString(), copy.toString(), "-o", tmp.resolve("f2").toString()),
                Main.BAD_INPUT, "same data");
        Path negative = tmp.resolve("negative.csv");
        StringBuilder sb = new StringBuilder();
        for (String line : Files.readAllLines(d.resolve("demo_10Kmin.csv"))) {
            String[] f = line.split(",");
            boolean data = f.length == 3 && !line.startsWith("#") && Character.isDigit(f[0].charAt(0));
            sb.append(data ? f[0] + "," + f[1] + "," + (-Math.abs(Double.parseDouble(f[2])) - 1e-3) : line).append('\n');
        }
        Files.writeString(negative, sb.toString());
        oneLine(CliErrorsTest.run("fit", a.toString(), b.toString(), negative.toString(), "-o", tmp.resolve("f3").toString()),
                Main.BAD_INPUT, "negative");
    }

    @Test
    void fitOnTwoHeatingRatesPrintsNoNaN() {
        // formerly: "± NaN" for every isoconversional interval (two rates leave no degrees of freedom)
        Path d = Path.of("data/demo/tga");
        CliErrorsTest.Run r = CliErrorsTest.run("fit", d.resolve("demo_02Kmin.csv").toString(), d.resolve("demo_05Kmin.csv").toString(),
                "-o", tmp.resolve("fit").toString());
        assertEquals(Main.OK, r.code(), r.err());
        assertFalse(r.out().contains("NaN"), r.out());
    }
}
