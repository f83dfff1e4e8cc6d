package org.exhale.cli;

import org.exhale.studies.ParallelRuns;

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
        ProgressBar bar = new ProgressBarBuilder().setTaskName(task).setInitialMax(total)
                .setStyle(ProgressBarStyle.ASCII).setUpdateIntervalMillis(500).build();
        return new Progress(bar);
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
