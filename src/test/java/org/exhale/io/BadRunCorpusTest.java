package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Every file of the bad-run corpus gives its error kind, in one line naming the file. */
class BadRunCorpusTest {
    private static final Path DIR = Path.of("src/test/resources/bad-runs");

    static Stream<Arguments> corpus() throws IOException {
        return Files.readAllLines(DIR.resolve("expected.txt")).stream()
                .filter(l -> !l.isBlank() && !l.startsWith("#"))
                .map(l -> l.trim().split("\\s+"))
                .map(p -> Arguments.of(p[0], ErrorKind.valueOf(p[1])));
    }

    @Test
    void corpusHasAtLeastFifteenFiles() throws IOException {
        assertTrue(corpus().count() >= 15);
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @MethodSource("corpus")
    void givesItsKind(String file, ErrorKind kind) {
        Path p = DIR.resolve(file);
        InputException e = assertThrows(InputException.class, () -> new TgaCsvReader().read(p));
        assertEquals(kind, e.kind(), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
        assertTrue(e.getMessage().startsWith(p.toString()), "names the file: " + e.getMessage());
    }

    @Test
    void commandLineGivesExitTwoWithoutStackTrace() {
        java.io.ByteArrayOutputStream err = new java.io.ByteArrayOutputStream();
        java.io.PrintStream old = System.err;
        int code;
        try {
            System.setErr(new java.io.PrintStream(err, true));
            code = org.exhale.cli.Main.execute("fit", DIR.resolve("nan.csv").toString(), DIR.resolve("bad-number.csv").toString(),
                    "-o", System.getProperty("java.io.tmpdir") + "/exhale-badrun-" + ProcessHandle.current().pid(), "--force");
        } finally {
            System.setErr(old);
        }
        assertEquals(2, code);
        String text = err.toString();
        assertFalse(text.contains("\tat "), text);
        assertTrue(List.of(text.split("\n")).stream().anyMatch(l -> l.startsWith("error: ")), text);
    }
}
