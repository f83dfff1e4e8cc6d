package org.exhale.cli;

import picocli.CommandLine.Option;

/** Options every command shares. */
public final class CommonOptions {
    @Option(names = "--debug", description = "Print stack traces of errors.")
    boolean debug;

    /** One meaning everywhere: see {@link #FORCE}. */
    static final String FORCE = "Replace what an earlier run wrote at the output path; without --force an existing "
            + "result is kept and the command stops.";

    @Option(names = "--force", description = FORCE)
    boolean force;

    @Option(names = {"-q", "--quiet"}, description = "Print nothing but errors.")
    boolean quiet;
}
