package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Byte-level input: empty, blank and binary files are refused; a BOM and CRLF line ends are accepted. */
class CaseEncodingTest {
    @TempDir
    Path tmp;

    private Path write(String name, byte[] bytes) throws IOException {
        Path p = tmp.resolve(name);
        Files.write(p, bytes);
        return p;
    }

    private InputException refused(Path p) {
        InputException e = assertThrows(InputException.class, () -> CaseYamlReader.read(p));
        assertTrue(e.getMessage().startsWith(p.toString()), e.getMessage());
        assertTrue(!e.getMessage().contains("\n"), e.getMessage());
        return e;
    }

    private static byte[] demo(String name) throws IOException {
        return Files.readAllBytes(Path.of("data/demo", name));
    }

    private static byte[] concat(byte[] a, byte[] b) {
        byte[] out = new byte[a.length + b.length];
        System.arraycopy(a, 0, out, 0, a.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }

    private static final byte[] BOM = {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF};

    @Test
    void emptyFileIsRefused() throws IOException {
        assertEquals(ErrorKind.EMPTY_FILE, refused(write("empty.yaml", new byte[0])).kind());
    }

    @Test
    void whitespaceOnlyFileIsRefused() throws IOException {
        byte[] blank = " \n\t\n   \r\n\n".getBytes(StandardCharsets.US_ASCII);
        assertEquals(ErrorKind.EMPTY_FILE, refused(write("blank.yaml", blank)).kind());
    }

    @Test
    void bomOnlyFileIsRefusedAsEmpty() throws IOException {
        assertEquals(ErrorKind.EMPTY_FILE, refused(write("bom.yaml", BOM)).kind());
    }

    @Test
    void binaryFileWithNulBytesIsRefused() throws IOException {
        byte[] bin = new byte[4096];
        new java.util.Random(7).nextBytes(bin);
        bin[10] = 0;
        assertEquals(ErrorKind.SYNTAX, refused(write("wafer-map.bin", bin)).kind());
    }

    @Test
    void invalidUtf8IsRefused() throws IOException {
        // Latin-1 "°C": valid text in another encoding, not UTF-8.
        byte[] latin1 = "limits: {ceiling: 400 \u00B0C}\n".getBytes(StandardCharsets.ISO_8859_1);
        assertEquals(ErrorKind.SYNTAX, refused(write("latin1.yaml", latin1)).kind());
    }

    @Test
    void imageHeaderIsRefused() throws IOException {
        byte[] png = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1A, '\n', 0, 0, 0, 13, 'I', 'H', 'D', 'R'};
        assertEquals(ErrorKind.SYNTAX, refused(write("plot.png", png)).kind());
    }

    @ParameterizedTest
    @ValueSource(strings = {"porous-line.yaml", "dense-disc.yaml"})
    void utf8BomIsAccepted(String name) throws IOException {
        CaseFile plain = CaseYamlReader.read(write("plain-" + name, demo(name)));
        CaseFile bom = CaseYamlReader.read(write("bom-" + name, concat(BOM, demo(name))));
        assertEquals(plain.bake(), bom.bake());
        assertEquals(plain.warnings(), bom.warnings());
    }

    @ParameterizedTest
    @ValueSource(strings = {"porous-line.yaml", "dense-disc.yaml"})
    void windowsLineEndsAreAccepted(String name) throws IOException {
        String text = new String(demo(name), StandardCharsets.UTF_8);
        assertTrue(!text.contains("\r"), "the demo file has Unix line ends");
        byte[] crlf = text.replace("\n", "\r\n").getBytes(StandardCharsets.UTF_8);
        CaseFile plain = CaseYamlReader.read(write("plain-" + name, demo(name)));
        CaseFile windows = CaseYamlReader.read(write("crlf-" + name, crlf));
        assertEquals(plain.bake(), windows.bake());
        CaseFile both = CaseYamlReader.read(write("bom-crlf-" + name, concat(BOM, crlf)));
        assertEquals(plain.bake(), both.bake());
    }

    @Test
    void crlfErrorLinesAreCountedLikeUnixOnes() throws IOException {
        String text = new String(demo("porous-line.yaml"), StandardCharsets.UTF_8).replace("ceiling: 400 C", "ceiling: 400 nm");
        InputException unix = refused(write("unix.yaml", text.getBytes(StandardCharsets.UTF_8)));
        InputException dos = refused(write("dos.yaml", text.replace("\n", "\r\n").getBytes(StandardCharsets.UTF_8)));
        assertEquals(ErrorKind.BAD_UNIT, dos.kind());
        assertEquals(unix.line(), dos.line());
        assertTrue(unix.line() > 0);
    }

    @Test
    void missingFileIsUnreadable() {
        Path p = tmp.resolve("no-such-case.yaml");
        assertEquals(ErrorKind.FILE_UNREADABLE, refused(p).kind());
    }

    @Test
    void folderIsUnreadable() throws IOException {
        Path p = Files.createDirectory(tmp.resolve("case.yaml"));
        assertEquals(ErrorKind.FILE_UNREADABLE, refused(p).kind());
    }
}
