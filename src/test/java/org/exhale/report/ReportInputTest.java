package org.exhale.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;

import org.exhale.io.ErrorKind;
import org.exhale.io.InputException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Bad folders and files give an input error of the right kind, naming the file. */
class ReportInputTest {
    private static ErrorKind kind(Path dir) {
        return assertThrows(InputException.class, () -> RunFolder.read(dir)).kind();
    }

    @Test
    void missingFolder(@TempDir Path dir) {
        assertEquals(ErrorKind.FILE_UNREADABLE, kind(dir.resolve("nope")));
    }

    @Test
    void folderWithoutSummaryOrFit(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("history.csv"), "time_s\n0\n");
        assertEquals(ErrorKind.MISSING_KEY, kind(dir));
    }

    @Test
    void brokenJsonNamesItsLine(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("summary.json"), "{\n  \"case\" : \"x\",\n  oops\n}\n");
        InputException e = assertThrows(InputException.class, () -> RunFolder.read(dir));
        assertEquals(ErrorKind.SYNTAX, e.kind());
        assertEquals(3, e.line());
        assertTrue(e.file().endsWith("summary.json"));
    }

    @Test
    void badNumberInHistoryNamesRowAndColumn(@TempDir Path dir) throws Exception {
        ReportFixtures.bake(dir, "x", "b", false);
        String h = Files.readString(dir.resolve("history.csv"));
        Files.writeString(dir.resolve("history.csv"), h.replaceFirst("\nhot,60.0,", "\nhot,sixty,"));
        InputException e = assertThrows(InputException.class, () -> Report.of(RunFolder.read(dir), "charts/"));
        assertEquals(ErrorKind.BAD_NUMBER, e.kind());
        assertEquals(3, e.line());
        assertTrue(e.where().contains("time_s"), e.where());
    }

    @Test
    void rowOfWrongWidth(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("summary.json"), "{}");
        Files.writeString(dir.resolve("history.csv"), "time_s,wafer_C\n0,1\n1\n");
        InputException e = assertThrows(InputException.class, () -> RunFolder.read(dir));
        assertEquals(ErrorKind.SYNTAX, e.kind());
        assertEquals(3, e.line());
    }

    @Test
    void historyWithoutTime(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("summary.json"), "{}");
        Files.writeString(dir.resolve("history.csv"), "wafer_C\n1\n");
        assertEquals(ErrorKind.MISSING_KEY, kind(dir));
    }

    @Test
    void quotedCellsAreRead() {
        CsvTable t = CsvTable.parse("t.csv", "run,x\n\"a,\"\"b\"\"\",1\n");
        assertEquals("a,\"b\"", t.text(0, "run"));
        assertEquals(1.0, t.number(0, "x"));
    }

    @Test
    void summaryAloneGivesAPageWithoutCharts(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("summary.json"), "{\"case\" : \"only a summary\", \"margins\" : {}}");
        Report r = Report.of(RunFolder.read(dir), "charts/");
        assertTrue(r.figures().isEmpty());
        assertTrue(r.html().contains("only a summary"));
    }
}
