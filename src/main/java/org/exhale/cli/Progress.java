package org.exhale.cli;

import org.exhale.studies.ParallelRuns;

import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;

/**
 * A progress bar with the time left, on stderr, only on a terminal: quiet when
 * {@code System.console()} is null (pipes, files, CI, tests) or with --quiet.
 */
final class Progress implements ParallelRuns.Listener, AutoCloseable {
    private final ProgressBar bar;
    private boolean closed;

    private Progress(ProgressBar bar) {
        this.bar = bar;
    }

    static Progress start(String task, int total, boolean quiet) {
        if (quiet || System.console() == null || total <= 0) {
            return new Progress(null);
        }
        // Our own console consumer with a fixed width: the library's default asks a terminal library
        // for the width, and that library sets Ctrl-C to kill the JVM at once (no shutdown hooks), so
        // an interrupted study would lose its finished work.
        ProgressBar bar = new ProgressBarBuilder().setTaskName(task).setInitialMax(total)
                .setStyle(ProgressBarStyle.ASCII).setUpdateIntervalMillis(500)
                .setConsumer(new ConsoleProgressBarConsumer(System.err, width())).build();
        return new Progress(bar);
    }

    /** The terminal width from COLUMNS when the shell exports it, else 80 characters. */
    private static int width() {
        try {
            int c = Integer.parseInt(System.getenv().getOrDefault("COLUMNS", "80").trim());
            return Math.max(40, Math.min(c, 200)) - 1;
        } catch (NumberFormatException e) {
            return 79;
        }
    }

    @Override
    public void finished(int done, int total) {
        if (bar != null) {
            synchronized (bar) {
                if (done > bar.getCurrent()) {
                    bar.stepTo(done);
                }
            }
        }
    }

    @Override
    public void close() {
        if (bar != null && !closed) {
            closed = true;
            bar.close();
        }
    }
}
