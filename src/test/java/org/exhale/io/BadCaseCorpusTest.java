package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every file of {@code bad-cases/} is the valid {@code good-cases/base.yaml} with one thing broken.
 * Its header says what the reader must report:
 * <pre>
 * # expect: KIND        the ErrorKind (required, first line)
 * # where: key.path     the key path the message must name (absent for syntax-level errors;
 *                       empty for a section missing at the top level)
 * # line: N             the line the error must point at, where it is one line of the file
 * </pre>
 */
public class BadCaseCorpusTest {

    public record Expectation(Path file, ErrorKind kind, String where, int line) {
        @Override
        public String toString() {
            return file.getFileName().toString();
        }
    }

    static Path resource(String name) {
        try {
            return Path.of(BadCaseCorpusTest.class.getResource("/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    public static List<Expectation> corpus() throws IOException {
        try (Stream<Path> files = Files.list(resource("bad-cases"))) {
            return files.filter(p -> p.toString().endsWith(".yaml")).sorted().map(BadCaseCorpusTest::expectation).toList();
        }
    }

    private static Expectation expectation(Path p) {
        List<String> lines;
        try {
            lines = Files.readAllLines(p, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
        String first = lines.get(0);
        if (!first.startsWith("# expect: ")) {
            throw new IllegalStateException(p + ": first line must be '# expect: KIND'");
        }
        ErrorKind kind = ErrorKind.valueOf(first.substring("# expect: ".length()).trim());
        String where = null;
        int line = 0;
        for (String l : lines) {
            if (!l.startsWith("#")) {
                break;
            }
            if (l.startsWith("# where:")) {
                where = l.substring("# where:".length()).trim();
            } else if (l.startsWith("# line:")) {
                line = Integer.parseInt(l.substring("# line:".length()).trim());
            }
        }
        return new Expectation(p, kind, where, line);
    }

    @Test
    void baseCaseIsValid() {
        CaseFile cf = CaseYamlReader.read(resource("good-cases/base.yaml"));
        assertNotNull(cf.bake().recipe());
        assertEquals(2, cf.bake().polymer().components().size());
    }

    @Test
    void corpusIsLargeAndCoversTheKinds() throws IOException {
        List<Expectation> all = corpus();
        assertTrue(all.size() >= 40, "corpus has " + all.size() + " files");
        Set<ErrorKind> kinds = EnumSet.noneOf(ErrorKind.class);
        all.forEach(e -> kinds.add(e.kind()));
        Set<ErrorKind> needed = EnumSet.of(ErrorKind.EMPTY_FILE, ErrorKind.SYNTAX, ErrorKind.MISSING_KEY,
                ErrorKind.UNKNOWN_KEY, ErrorKind.DUPLICATE_KEY, ErrorKind.WRONG_TYPE, ErrorKind.BAD_NUMBER,
                ErrorKind.BAD_UNIT, ErrorKind.OUT_OF_RANGE, ErrorKind.INCONSISTENT, ErrorKind.UNKNOWN_NAME,
                ErrorKind.TOO_LARGE);
        assertTrue(kinds.containsAll(needed), "kinds covered: " + kinds);
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("corpus")
    void badCaseIsRefusedWithItsKind(Expectation x) {
        String name = x.file().toString();
        InputException e = assertThrows(InputException.class, () -> CaseYamlReader.read(x.file()));
        String msg = e.getMessage();
        assertEquals(x.kind(), e.kind(), msg);
        assertFalse(msg.contains("\n") || msg.contains("\r"), "message is one line: " + msg);
        assertEquals(name, e.file());
        assertTrue(msg.startsWith(name), "message names the file: " + msg);
        if (x.where() != null) {
            assertTrue(e.line() > 0, "message has a line: " + msg);
            assertTrue(msg.startsWith(name + ":" + e.line() + ":"), "line follows the file name: " + msg);
            assertTrue(e.where().startsWith(x.where()), "key path '" + x.where() + "' expected: " + msg);
            assertTrue(msg.contains(e.where()), msg);
        }
        if (x.line() > 0) {
            assertEquals(x.line(), e.line(), msg);
        }
    }
}
