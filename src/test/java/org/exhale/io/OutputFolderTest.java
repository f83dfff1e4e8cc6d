package org.exhale.io;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CyclicBarrier;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Output folders are written whole or not at all, never replaced without force, and two writers cannot both win. */
class OutputFolderTest {
    @TempDir
    Path tmp;

    private static OutputFolder folder(Path dir, boolean force, String writer) {
        OutputFolder f = new OutputFolder(dir, force).owns("report.html");
        f.put("summary.json", "{\"writer\": \"" + writer + "\"}\n");
        f.put("history.csv", "writer\n" + writer + "\n");
        f.put("charts/a.svg", "<svg>" + writer + "</svg>");
        return f;
    }

    private List<String> leftovers() throws Exception {
        try (Stream<Path> s = Files.list(tmp)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> n.startsWith(".")).toList();
        }
    }

    @Test
    void twoWritersOfANewFolderCannotBothWin() throws Exception {
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            for (int round = 0; round < 20; round++) {
                Path dir = tmp.resolve("race-" + round);
                CyclicBarrier start = new CyclicBarrier(2);
                List<Future<String>> results = new ArrayList<>();
                for (String writer : List.of("A", "B")) {
                    results.add(pool.submit(() -> {
                        OutputFolder f = folder(dir, false, writer);
                        f.checkWritable();
                        start.await();
                        try {
                            f.commit();
                            return writer;
                        } catch (InputException e) {
                            assertEquals(ErrorKind.OUTPUT, e.kind(), e.getMessage());
                            return "lost";
                        }
                    }));
                }
                List<String> outcome = new ArrayList<>();
                for (Future<String> r : results) {
                    outcome.add(r.get());
                }
                assertEquals(1, outcome.stream().filter(o -> o.equals("lost")).count(), "round " + round + ": " + outcome);
                String winner = outcome.stream().filter(o -> !o.equals("lost")).findFirst().orElseThrow();
                // the folder holds the winner's files only, all of them
                assertTrue(Files.readString(dir.resolve("summary.json")).contains(winner));
                assertTrue(Files.readString(dir.resolve("history.csv")).contains(winner));
                assertTrue(Files.readString(dir.resolve("charts/a.svg")).contains(winner));
            }
        } finally {
            pool.shutdownNow();
        }
        assertEquals(List.of(), leftovers(), "no staged folder is left behind");
    }

    @Test
    void existingFolderIsNotReplacedWithoutForce() throws Exception {
        Path dir = tmp.resolve("out");
        folder(dir, false, "first").commit();
        InputException e = assertThrows(InputException.class, () -> folder(dir, false, "second").commit());
        assertEquals(ErrorKind.OUTPUT, e.kind());
        assertTrue(Files.readString(dir.resolve("summary.json")).contains("first"));
    }

    @Test
    void forceReplacesOwnFilesKeepsOthersAndPrunesOwnedNamesNotWritten() throws Exception {
        Path dir = tmp.resolve("out");
        folder(dir, false, "first").commit();
        Files.writeString(dir.resolve("notes.txt"), "mine");
        Files.writeString(dir.resolve("report.html"), "old report");
        Files.writeString(dir.resolve("charts/old.svg"), "kept: charts is not owned here");
        folder(dir, true, "second").commit();
        assertTrue(Files.readString(dir.resolve("summary.json")).contains("second"));
        assertEquals("mine", Files.readString(dir.resolve("notes.txt")));
        assertFalse(Files.exists(dir.resolve("report.html")), "an owned name this run did not write is removed");
        assertTrue(Files.exists(dir.resolve("charts/old.svg")));
        assertEquals(List.of(), leftovers());
    }

    @Test
    void aFailedWriteLeavesTheOldFolderWhole() throws Exception {
        Path dir = tmp.resolve("out");
        folder(dir, false, "first").commit();
        OutputFolder bad = folder(dir, true, "second");
        bad.put("summary.json/x", "a file below a file cannot be made");
        InputException e = assertThrows(InputException.class, bad::commit);
        assertEquals(ErrorKind.OUTPUT, e.kind());
        assertTrue(Files.readString(dir.resolve("summary.json")).contains("first"));
        assertTrue(Files.readString(dir.resolve("history.csv")).contains("first"), "no file of the failed run replaced an old one");
        assertEquals(List.of(), leftovers());
    }

    @Test
    void aFileIsNeverReplacedWithoutReplaceAndOfTwoWritersOneWins() throws Exception {
        Path f = tmp.resolve("page.html");
        AtomicFiles.write(f, "first".getBytes(), false);
        InputException e = assertThrows(InputException.class, () -> AtomicFiles.write(f, "second".getBytes(), false));
        assertEquals(ErrorKind.OUTPUT, e.kind());
        assertEquals("first", Files.readString(f));
        AtomicFiles.write(f, "third".getBytes(), true);
        assertEquals("third", Files.readString(f));
        try (Stream<Path> s = Files.list(tmp)) {
            assertEquals(1, s.count(), "no temporary file is left");
        }
    }
}
