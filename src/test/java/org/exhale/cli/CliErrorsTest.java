package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/** The command line's error behaviour, through {@link Main#execute}, with stdout and stderr captured. */
class CliErrorsTest {
    @TempDir
    Path tmp;

    record Run(int code, String out, String err) {
        List<String> errLines() {
            return err.lines().toList();
        }
    }

    static Run run(String... args) {
        PrintStream oldOut = System.out;
        PrintStream oldErr = System.err;
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code;
        try {
            System.setOut(new PrintStream(out, true, StandardCharsets.UTF_8));
            System.setErr(new PrintStream(err, true, StandardCharsets.UTF_8));
            code = Main.execute(args);
        } finally {
            System.out.flush();
            System.err.flush();
            System.setOut(oldOut);
            System.setErr(oldErr);
        }
        return new Run(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    private static final Path DEMO = Path.of("data/demo/porous-line.yaml");

    private Path badCase() throws IOException {
        Path p = tmp.resolve("bad.yaml");
        Files.writeString(p, Files.readString(DEMO).replace("ceiling: 400 C", "ceiling: 5 nm"));
        return p;
    }

    private static void assertOneErrorLine(Run r, String mustContain) {
        assertEquals(1, r.errLines().size(), "one line on stderr:\n" + r.err());
        String line = r.errLines().get(0);
        assertTrue(line.startsWith("error: "), line);
        assertTrue(line.contains(mustContain), line);
        assertFalse(r.err().contains("\tat "), r.err());
        assertFalse(r.err().contains("Exception"), r.err());
    }

    @Test
    void badCaseGivesExit2AndOneLine() throws IOException {
        Path bad = badCase();
        Run r = run("simulate", bad.toString(), "-o", tmp.resolve("out").toString());
        assertEquals(Main.BAD_INPUT, r.code());
        assertOneErrorLine(r, bad.toString());
        assertTrue(r.errLines().get(0).contains("limits.ceiling"), r.err());
        assertFalse(Files.exists(tmp.resolve("out")), "nothing is written for a bad case");
    }

    static Stream<Path> corpus() throws IOException {
        return org.exhale.io.BadCaseCorpusTest.corpus().stream().map(e -> e.file());
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("corpus")
    void everyCorpusFileGivesExit2AndOneLine(Path bad) {
        Run r = run("simulate", bad.toString(), "-o", tmp.resolve("out").toString());
        assertEquals(Main.BAD_INPUT, r.code(), r.err());
        assertOneErrorLine(r, bad.toString());
    }

    @Test
    void debugAddsTheStackTrace() throws IOException {
        Run r = run("simulate", badCase().toString(), "-o", tmp.resolve("out").toString(), "--debug");
        assertEquals(Main.BAD_INPUT, r.code());
        assertTrue(r.errLines().get(0).startsWith("error: "), r.err());
        assertTrue(r.err().contains("\tat "), r.err());
        assertTrue(r.errLines().size() > 1, r.err());
    }

    @Test
    void unknownOptionGivesExit2() {
        Run r = run("simulate", DEMO.toString(), "--frobnicate");
        assertEquals(Main.BAD_INPUT, r.code());
        assertTrue(r.errLines().get(0).startsWith("error: "), r.err());
        assertTrue(r.err().contains("--frobnicate"), r.err());
        assertFalse(r.err().contains("\tat "), r.err());
    }

    @Test
    void unknownCommandGivesExit2() {
        Run r = run("simulat", DEMO.toString());
        assertEquals(Main.BAD_INPUT, r.code());
        assertTrue(r.errLines().get(0).startsWith("error: "), r.err());
    }

    @Test
    void missingCaseFileGivesExit2() {
        Path none = tmp.resolve("no-such-case.yaml");
        Run r = run("simulate", none.toString(), "-o", tmp.resolve("out").toString());
        assertEquals(Main.BAD_INPUT, r.code());
        assertOneErrorLine(r, none.toString());
    }

    @Test
    void badSampleIntervalGivesExit2() {
        Run r = run("simulate", DEMO.toString(), "-o", tmp.resolve("out").toString(), "--sample", "0 s");
        assertEquals(Main.BAD_INPUT, r.code());
        assertOneErrorLine(r, "--sample");
        Run r2 = run("simulate", DEMO.toString(), "-o", tmp.resolve("out").toString(), "--sample", "30 C");
        assertEquals(Main.BAD_INPUT, r2.code());
        assertOneErrorLine(r2, "--sample");
    }

    @Test
    void caseWithoutRecipeGivesExit2() throws IOException {
        String text = Files.readString(DEMO);
        Path p = tmp.resolve("no-recipe.yaml");
        Files.writeString(p, text.substring(0, text.indexOf("recipe:")));
        Run r = run("simulate", p.toString(), "-o", tmp.resolve("out").toString());
        assertEquals(Main.BAD_INPUT, r.code());
        assertOneErrorLine(r, "recipe");
    }

    @Test
    void outputThatIsAFileGivesExit2() throws IOException {
        Path file = Files.writeString(tmp.resolve("out"), "a file, not a folder");
        Run r = run("simulate", DEMO.toString(), "-o", file.toString(), "--force");
        assertEquals(Main.BAD_INPUT, r.code());
        assertOneErrorLine(r, file.toString());
        assertEquals("a file, not a folder", Files.readString(file));
    }

    @Test
    void nonEmptyOutputFolderIsLeftAloneWithoutForce() throws IOException {
        Path dir = Files.createDirectory(tmp.resolve("out"));
        byte[] oldHistory = "time_s,old\n0,1\n".getBytes(StandardCharsets.UTF_8);
        byte[] notes = "my notes\n".getBytes(StandardCharsets.UTF_8);
        Files.write(dir.resolve("history.csv"), oldHistory);
        Files.write(dir.resolve("notes.txt"), notes);
        Run r = run("simulate", DEMO.toString(), "-o", dir.toString());
        assertEquals(Main.BAD_INPUT, r.code());
        assertOneErrorLine(r, dir.toString());
        assertArrayEquals(oldHistory, Files.readAllBytes(dir.resolve("history.csv")));
        assertArrayEquals(notes, Files.readAllBytes(dir.resolve("notes.txt")));
        try (Stream<Path> s = Files.list(dir)) {
            assertEquals(2, s.count(), "no file added");
        }
    }

    @Test
    void forceOverwritesTheOutputs() throws IOException {
        Path dir = Files.createDirectory(tmp.resolve("out"));
        Files.writeString(dir.resolve("history.csv"), "old\n");
        Files.writeString(dir.resolve("notes.txt"), "my notes\n");
        Run r = run("simulate", DEMO.toString(), "-o", dir.toString(), "--force");
        assertEquals(Main.OK, r.code(), r.err());
        assertTrue(Files.readString(dir.resolve("history.csv")).length() > 100);
        assertTrue(Files.readString(dir.resolve("summary.json")).startsWith("{"));
        assertEquals("my notes\n", Files.readString(dir.resolve("notes.txt")), "files it does not write are kept");
        try (Stream<Path> s = Files.list(dir)) {
            assertTrue(s.noneMatch(p -> p.getFileName().toString().endsWith(".part")), "no temporary file left");
        }
    }

    @Test
    void sameInputGivesByteIdenticalOutputs() throws IOException {
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        assertEquals(Main.OK, run("simulate", DEMO.toString(), "-o", a.toString()).code());
        assertEquals(Main.OK, run("simulate", DEMO.toString(), "-o", b.toString()).code());
        for (String f : List.of("history.csv", "summary.json")) {
            byte[] x = Files.readAllBytes(a.resolve(f));
            assertTrue(x.length > 0, f);
            assertArrayEquals(x, Files.readAllBytes(b.resolve(f)), f + " differs between runs");
        }
    }

    @Test
    void violatedLimitGivesExit3() throws IOException {
        // The porous-line recipe goes to 390 C: a 380 C ceiling is violated.
        Path p = tmp.resolve("low-ceiling.yaml");
        Files.writeString(p, Files.readString(DEMO).replace("ceiling: 400 C", "ceiling: 380 C"));
        Run r = run("simulate", p.toString(), "-o", tmp.resolve("out").toString(), "-q");
        assertEquals(Main.VIOLATED, r.code(), r.err());
        assertEquals("", r.err());
        assertTrue(Files.exists(tmp.resolve("out/summary.json")), "results are written even when a limit fails");
    }
}
