package org.exhale.cli;

import java.io.PrintWriter;
import java.io.StringWriter;

/** Runs the command line with its error lines captured, for tests that expect bad input: a passing run prints no "error:". */
public final class Quiet {
    private Quiet() {
    }

    public static int execute(String... args) {
        picocli.CommandLine cl = Main.commandLine();
        cl.setErr(new PrintWriter(new StringWriter(), true));
        return cl.execute(args);
    }
}
