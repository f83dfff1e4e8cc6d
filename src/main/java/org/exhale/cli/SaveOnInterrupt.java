package org.exhale.cli;

import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Keeps the results so far when a study is stopped with Ctrl-C: a shutdown hook that cancels the
 * runs, waits briefly for the running ones and writes what is done (flagged "complete": false).
 * Exactly one of the hook and the normal end writes the outputs.
 */
final class SaveOnInterrupt implements AutoCloseable {
    private final AtomicBoolean claimed = new AtomicBoolean();
    private final Thread hook;

    SaveOnInterrupt(Runnable stop, Runnable savePartial) {
        hook = new Thread(() -> {
            stop.run();
            if (claimed.compareAndSet(false, true)) {
                savePartial.run();
            }
        }, "exhale-save-on-interrupt");
        Runtime.getRuntime().addShutdownHook(hook);
    }

    /** True if the caller may write the complete outputs (the hook has not started writing). */
    boolean claim() {
        return claimed.compareAndSet(false, true);
    }

    @Override
    public void close() {
        try {
            Runtime.getRuntime().removeShutdownHook(hook);
        } catch (IllegalStateException e) {
            // The JVM is shutting down: the hook is running or has run.
        }
    }
}
