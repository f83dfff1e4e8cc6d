package org.exhale.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The launcher script (src/main/sh/exhale, copied to target/exhale by the build) runs, in a scratch copy, with a
 * stand-in {@code java} that prints its arguments: the options it passes per command, the override, the jar beside it
 * (also through a symbolic link), and its error when the jar is missing.
 */
class LauncherScriptTest {

    private static final Path SCRIPT = Path.of("src/main/sh/exhale");

    /** Runs the script copy {@code launcher} with the environment additions; returns exit code and output. */
    private static Object[] run(Path launcher, Path fakeJava, Map<String, String> env, String... args) throws Exception {
        List<String> command = new java.util.ArrayList<>(List.of("/bin/sh", launcher.toString()));
        command.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(command).redirectErrorStream(true);
        pb.environment().remove("EXHALE_JAVA_OPTS");
        pb.environment().remove("JAVA_HOME");
        pb.environment().put("JAVA", fakeJava.toString());
        pb.environment().putAll(env);
        Process p = pb.start();
        String out = new String(p.getInputStream().readAllBytes()).strip();
        assertTrue(p.waitFor(30, TimeUnit.SECONDS));
        return new Object[]{p.exitValue(), out};
    }

    private static Path fakeJava(Path dir) throws Exception {
        Path java = dir.resolve("fake-java");
        Files.writeString(java, "#!/bin/sh\necho \"$@\"\nexit 7\n");
        Files.setPosixFilePermissions(java, PosixFilePermissions.fromString("rwxr-xr-x"));
        return java;
    }

    @Test
    void passesTheQuickCompilerToShortRunsAndTheDefaultsToLongOnes(@TempDir Path tmp) throws Exception {
        Path launcher = tmp.resolve("exhale");
        Files.copy(SCRIPT, launcher);
        Files.createFile(tmp.resolve("exhale.jar"));
        Path java = fakeJava(tmp);
        String jar = tmp.toRealPath().resolve("exhale.jar").toString();
        String quick = String.join(" ", BenchCommand.LAUNCHER_OPTIONS);

        Object[] plan = run(launcher, java, Map.of(), "plan", "case.yaml", "-o", "out dir");
        assertEquals(7, plan[0], "the launcher hands java's exit code on");
        assertEquals(quick + " -jar " + jar + " plan case.yaml -o out dir", plan[1]);
        for (String cmd : List.of("robust", "bench")) {
            assertEquals("-jar " + jar + " " + cmd, run(launcher, java, Map.of(), cmd)[1], cmd + " keeps the JVM's defaults");
        }
        assertEquals(quick + " -jar " + jar, run(launcher, java, Map.of())[1], "no command: the help");
        assertEquals("-Xmx1g -Xss4m -jar " + jar + " plan",
                run(launcher, java, Map.of("EXHALE_JAVA_OPTS", "-Xmx1g -Xss4m"), "plan")[1]);
        assertEquals("-jar " + jar + " plan", run(launcher, java, Map.of("EXHALE_JAVA_OPTS", ""), "plan")[1],
                "set empty: the JVM's defaults");

        // through a link from elsewhere, the jar beside the script itself
        Path bin = Files.createDirectory(tmp.resolve("bin"));
        Path link = Files.createSymbolicLink(bin.resolve("exhale"), launcher);
        assertEquals(quick + " -jar " + jar + " check c.yaml", run(link, java, Map.of(), "check", "c.yaml")[1]);
    }

    @Test
    void saysHowToBuildWhenTheJarIsMissing(@TempDir Path tmp) throws Exception {
        Path launcher = tmp.resolve("exhale");
        Files.copy(SCRIPT, launcher);
        Object[] r = run(launcher, fakeJava(tmp), Map.of(), "demo");
        assertEquals(1, r[0]);
        String out = (String) r[1];
        assertTrue(out.startsWith("error: ") && out.contains("exhale.jar not found") && out.contains("mvn -q -B package")
                && !out.contains("\n"), out);
    }
}
