package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.ByteArrayOutputStream;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Ctrl-C typed on a terminal while the progress bar runs keeps the finished samples, as it does
 * without a terminal. The study runs in a child JVM under a pseudo-terminal made by util-linux
 * {@code script}; Ctrl-C is the byte 0x03 written to the terminal, which the terminal turns into
 * SIGINT for the child, exactly as a keyboard does.
 */
class InterruptKeepsWorkTest {

    @Test
    void ctrlCUnderATerminalKeepsTheSamplesDone(@TempDir Path tmp) throws Exception {
        assumeTrue(Files.isExecutable(Path.of("/usr/bin/script")), "util-linux script is needed for a pseudo-terminal");
        Path out = tmp.resolve("robust");
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String cmd = String.join(" ", List.of(quote(java), "-Djava.awt.headless=true", "-cp",
                quote(System.getProperty("java.class.path")), "org.exhale.cli.Main", "robust",
                quote(Path.of("data/demo/porous-line-uncertain.yaml").toAbsolutePath().toString()),
                "--samples", "2000", "-o", quote(out.toString())));
        Process p = new ProcessBuilder("/usr/bin/script", "-qec", cmd, "/dev/null").redirectErrorStream(true).start();
        ByteArrayOutputStream seen = new ByteArrayOutputStream();
        Thread reader = new Thread(() -> copy(p.getInputStream(), seen));
        reader.start();
        // Wait for the progress bar to show samples done (the bar is only drawn on a terminal).
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
        while (!text(seen).matches("(?s).*\\s[1-9][0-9]*/2000.*") && System.nanoTime() < deadline && p.isAlive()) {
            Thread.sleep(100);
        }
        assertTrue(text(seen).contains("/2000"), "the progress bar is drawn on a terminal: " + text(seen));
        OutputStream keys = p.getOutputStream();
        keys.write(3); // Ctrl-C
        keys.flush();
        // (once in a full test run the first key was echoed but the study ran on to the end; a user presses again, and
        // a second SIGINT while the JVM already shuts down changes nothing)
        if (!p.waitFor(1, TimeUnit.SECONDS) && !text(seen).contains("Interrupted")) {
            keys.write(3);
            keys.flush();
        }
        assertTrue(p.waitFor(90, TimeUnit.SECONDS), "stopped after Ctrl-C: " + text(seen));
        reader.join(5000);
        assertEquals(130, p.exitValue(), "exit code 130 after Ctrl-C (docs/errors.md): " + text(seen));
        assertTrue(text(seen).contains("Interrupted: kept"), text(seen));
        String json = Files.readString(out.resolve("robust.json"));
        assertTrue(json.matches("(?s).*\"complete\"\\s*:\\s*false.*"), json);
        long rows = Files.readAllLines(out.resolve("samples.csv")).size() - 1;
        assertTrue(rows >= 1 && rows < 2000, "samples kept: " + rows);
    }

    private static String quote(String s) {
        return "'" + s.replace("'", "'\\''") + "'";
    }

    private static String text(ByteArrayOutputStream b) {
        synchronized (b) {
            return b.toString(StandardCharsets.UTF_8);
        }
    }

    private static void copy(InputStream in, ByteArrayOutputStream to) {
        byte[] buf = new byte[4096];
        try {
            for (int n; (n = in.read(buf)) > 0; ) {
                synchronized (to) {
                    to.write(buf, 0, n);
                }
            }
        } catch (java.io.IOException e) {
            // the child ended
        }
    }
}
