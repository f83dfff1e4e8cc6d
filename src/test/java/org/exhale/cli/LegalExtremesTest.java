package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.regex.Pattern;
import java.util.stream.Stream;

import org.exhale.io.CaseYamlReader;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Legal inputs at the extremes of their ranges (src/test/resources/legal-extremes/) each either
 * complete with finite outputs or stop with a clean exit-2/3/4 message: never an internal error,
 * never a stack trace, never inf or NaN in a file. Each file's header says the command, the exit
 * codes allowed, and for exit 2 the error kind:
 * <pre>
 * # command: simulate | plan | check
 * # exit: 0|3
 * # kind: OUT_OF_RANGE
 * # rows: N            most history rows allowed
 * </pre>
 * The documented range ends of src/test/resources/range-ends/ must all be read without error (the
 * ranges are inclusive where docs/case-file.md gives them as A–B).
 */
class LegalExtremesTest {
    @TempDir
    Path tmp;

    private static final Pattern NON_FINITE = Pattern.compile("(?i)(?<![A-Za-z_])(nan|-?inf|-?infinity)(?![A-Za-z_])");

    static Path resource(String name) {
        try {
            return Path.of(LegalExtremesTest.class.getResource("/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    static List<Path> files(String folder) throws IOException {
        try (Stream<Path> s = Files.list(resource(folder))) {
            return s.filter(p -> p.toString().endsWith(".yaml")).sorted().toList();
        }
    }

    static List<Path> extremes() throws IOException {
        return files("legal-extremes");
    }

    static List<Path> rangeEnds() throws IOException {
        return files("range-ends");
    }

    private static String header(Path p, String key) throws IOException {
        for (String line : Files.readAllLines(p, StandardCharsets.UTF_8)) {
            if (line.startsWith("# " + key + ":")) {
                return line.substring(key.length() + 3).trim();
            }
        }
        return null;
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("extremes")
    void legalExtremeCompletesFinitelyOrStopsCleanly(Path file) throws IOException {
        String command = header(file, "command");
        List<Integer> allowed = Arrays.stream(header(file, "exit").split("\\|")).map(String::trim).map(Integer::valueOf).toList();
        Path out = tmp.resolve("out");
        CliErrorsTest.Run r = CliErrorsTest.run(command, file.toString(), "-o", out.toString(), "-q");
        assertTrue(allowed.contains(r.code()), file.getFileName() + ": exit " + r.code() + ", expected " + allowed + "; " + r.err());
        assertFalse(r.err().contains("internal error"), r.err());
        assertFalse(r.err().contains("\tat "), "no stack trace: " + r.err());
        assertTrue(r.errLines().size() <= 1, "at most one line on stderr: " + r.err());
        String kind = header(file, "kind");
        if (r.code() == Main.BAD_INPUT && kind != null) {
            org.exhale.io.InputException e = org.junit.jupiter.api.Assertions.assertThrows(org.exhale.io.InputException.class,
                    () -> CaseYamlReader.read(file));
            assertEquals(kind, e.kind().name(), e.getMessage());
        }
        if (Files.isDirectory(out)) {
            try (Stream<Path> s = Files.walk(out)) {
                for (Path p : s.filter(Files::isRegularFile).filter(p -> p.toString().endsWith(".csv")
                        || p.toString().endsWith(".json")).toList()) {
                    String text = Files.readString(p);
                    assertFalse(NON_FINITE.matcher(text).find(), file.getFileName() + ": non-finite value in " + p.getFileName());
                }
            }
            String rows = header(file, "rows");
            if (rows != null) {
                long n = Files.readString(out.resolve("history.csv")).lines().count() - 1;
                assertTrue(n <= Long.parseLong(rows), "history rows " + n + " > " + rows);
                assertTrue(n >= 10_000, "the history still covers the run: " + n + " rows");
            }
        } else {
            assertTrue(r.code() == Main.BAD_INPUT, "no output folder although the command did not stop on bad input");
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("rangeEnds")
    void documentedRangeEndIsAccepted(Path file) {
        // throws (and fails the test) if a second, stricter check refuses the documented end
        CaseYamlReader.read(file);
    }
}
