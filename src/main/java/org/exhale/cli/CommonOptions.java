package org.exhale.cli;

import picocli.CommandLine.Option;

/** Options every command shares. */
public final class CommonOptions {
    @Option(names = "--debug", description = "Print stack traces of errors.")
    boolean debug;

    @Option(names = "--force", description = "Write into an existing, non-empty output folder.")
    boolean force;

    @Option(names = {"-q", "--quiet"}, description = "Print nothing but errors.")
    boolean quiet;
}
