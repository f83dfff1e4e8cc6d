package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;
import java.util.concurrent.TimeUnit;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;

/**
 * Files built to exhaust the reader: each must be refused with an {@link InputException}, never an
 * OutOfMemoryError, a StackOverflowError or a hang. The timeouts are hang guards only, far above
 * the time these take; they are not speed targets.
 */
@Timeout(value = 60, unit = TimeUnit.SECONDS)
class HostileCaseTest {
    @TempDir
    Path tmp;

    private static InputException refused(String name, String text) {
        return refused(name, text.getBytes(StandardCharsets.UTF_8));
    }

    private static InputException refused(String name, byte[] bytes) {
        InputException e = assertThrows(InputException.class, () -> CaseYamlReader.parse(name, bytes));
        assertFalse(e.getMessage().contains("\n"), e.getMessage());
        assertTrue(e.getMessage().startsWith(name), e.getMessage());
        return e;
    }

    private static void assertKind(Set<ErrorKind> allowed, InputException e) {
        assertTrue(allowed.contains(e.kind()), e.kind() + ": " + e.getMessage());
    }

    @Test
    void billionLaughsIsRefused() {
        StringBuilder sb = new StringBuilder("a0: &a0 [lol, lol, lol, lol, lol, lol, lol, lol, lol, lol]\n");
        for (int i = 1; i <= 9; i++) {
            sb.append('a').append(i).append(": &a").append(i).append(" [");
            for (int j = 0; j < 10; j++) {
                sb.append(j == 0 ? "" : ", ").append("*a").append(i - 1);
            }
            sb.append("]\n");
        }
        sb.append("polymer: *a9\n");
        InputException e = refused("laughs.yaml", sb.toString());
        assertEquals(ErrorKind.TOO_LARGE, e.kind(), e.getMessage());
    }

    @Test
    void fewCollectionAliasesAreRefusedToo() {
        // Under the composer's alias cap, but the reader refuses any reuse of a mapping or list.
        String text = "ambient: &p {pressure: 0 Pa}\npolymer: *p\n";
        InputException e = refused("alias.yaml", text);
        assertEquals(ErrorKind.TOO_LARGE, e.kind(), e.getMessage());
    }

    @Test
    void deepBlockNestingIsRefused() {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < 10_000; i++) {
            sb.append(" ".repeat(i)).append("k").append(i).append(":\n");
        }
        sb.append(" ".repeat(10_000)).append("v\n");
        byte[] bytes = sb.toString().getBytes(StandardCharsets.UTF_8);
        // 10,000 levels in block style are ~50 MB of indentation: refused by size before parsing.
        InputException e = refused("deep-block.yaml", bytes);
        assertEquals(ErrorKind.TOO_LARGE, e.kind(), e.getMessage());
    }

    @Test
    void deepFlowNestingIsRefused() {
        String text = "polymer: " + "{a: ".repeat(10_000) + "1" + "}".repeat(10_000) + "\n";
        InputException e = refused("deep-flow.yaml", text);
        assertEquals(ErrorKind.TOO_LARGE, e.kind(), e.getMessage());
    }

    @Test
    void deepListNestingIsRefused() {
        String text = "polymer: " + "[".repeat(10_000) + "]".repeat(10_000) + "\n";
        InputException e = refused("deep-list.yaml", text);
        assertEquals(ErrorKind.TOO_LARGE, e.kind(), e.getMessage());
    }

    @Test
    void modestBlockNestingBeyondTheCapIsRefused() {
        StringBuilder sb = new StringBuilder("polymer:\n");
        for (int i = 1; i <= 200; i++) {
            sb.append("  ".repeat(i)).append("k").append(i).append(":\n");
        }
        InputException e = refused("nest-200.yaml", sb.toString());
        assertEquals(ErrorKind.TOO_LARGE, e.kind(), e.getMessage());
    }

    @Test
    void fileOverOneMebibyteIsRefusedByRead() throws IOException {
        Path big = tmp.resolve("big.yaml");
        StringBuilder sb = new StringBuilder();
        while (sb.length() <= CaseYamlReader.MAX_BYTES) {
            sb.append("# padding padding padding padding padding padding padding padding\n");
        }
        Files.writeString(big, sb);
        InputException e = assertThrows(InputException.class, () -> CaseYamlReader.read(big));
        assertEquals(ErrorKind.TOO_LARGE, e.kind(), e.getMessage());
        assertTrue(e.getMessage().startsWith(big.toString()), e.getMessage());
    }

    @Test
    void bytesOverOneMebibyteAreRefusedByParse() {
        byte[] bytes = new byte[(int) CaseYamlReader.MAX_BYTES + 1];
        java.util.Arrays.fill(bytes, (byte) 'a');
        InputException e = refused("big-bytes.yaml", bytes);
        assertEquals(ErrorKind.TOO_LARGE, e.kind(), e.getMessage());
    }

    @Test
    void valuePaddedWithAHugeRunOfBlanksIsRefusedPromptly() throws IOException {
        // A value of 900,000 characters with a long run of spaces inside it: the number parser
        // once took quadratic time on such a run.
        String base = Files.readString(BadCaseCorpusTest.resource("good-cases/base.yaml"));
        String padded = base.replace("  width: 100 nm", "  width: \"100 n" + " ".repeat(900_000) + "m\"");
        InputException e = refused("blanks.yaml", padded);
        assertEquals(ErrorKind.BAD_UNIT, e.kind(), e.getMessage());
        assertTrue(e.getMessage().length() < 2_000, "message is clipped, length " + e.getMessage().length());
    }

    @Test
    void hugeNumberOfDigitsIsRefused() throws IOException {
        String base = Files.readString(BadCaseCorpusTest.resource("good-cases/base.yaml"));
        String text = base.replace("  width: 100 nm", "  width: " + "9".repeat(500_000) + " nm");
        InputException e = refused("digits.yaml", text);
        assertEquals(ErrorKind.BAD_NUMBER, e.kind(), e.getMessage());
        assertTrue(e.getMessage().length() < 2_000, "message is clipped, length " + e.getMessage().length());
    }

    @Test
    void manyUnknownKeysAreRefused() {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < 50_000; i++) {
            sb.append("key").append(i).append(": ").append(i).append('\n');
        }
        InputException e = refused("keys.yaml", sb.toString());
        assertKind(Set.of(ErrorKind.MISSING_KEY, ErrorKind.UNKNOWN_KEY), e);
    }

    @Test
    void aVeryLongKeyIsRefused() {
        String text = "k".repeat(500_000) + ": 1\n";
        InputException e = refused("long-key.yaml", text);
        assertKind(Set.of(ErrorKind.SYNTAX, ErrorKind.MISSING_KEY, ErrorKind.UNKNOWN_KEY), e);
        assertTrue(e.getMessage().length() < 2_000, "message is clipped, length " + e.getMessage().length());
    }
}
