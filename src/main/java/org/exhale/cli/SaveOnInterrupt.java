package org.exhale.cli;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;

/**
 * Keeps the results so far when a study is stopped with Ctrl-C: a shutdown hook that cancels the
 * runs, waits briefly for the running ones and writes what is done (flagged "complete": false).
 * Exactly one of the hook and the normal end writes the outputs: the normal end calls
 * {@link #claim()} before writing and {@link #close()} after; a hook that finds the outputs
 * claimed waits for them to be written before the JVM stops.
 */
final class SaveOnInterrupt implements AutoCloseable {
    /** Longest the hook waits for the normal end to finish writing [s]. */
    static final long WAIT_FOR_WRITE_S = 60;
    private final AtomicBoolean claimed = new AtomicBoolean();
    private final CountDownLatch written = new CountDownLatch(1);
    private volatile boolean triggered;
    private final Thread hook;

    SaveOnInterrupt(Runnable stop, Runnable savePartial) {
        hook = new Thread(() -> {
            triggered = true;
            try {
                stop.run();
                if (claimed.compareAndSet(false, true)) {
                    savePartial.run();
                } else {
                    written.await(WAIT_FOR_WRITE_S, TimeUnit.SECONDS);
                }
            } catch (RuntimeException | Error e) {
                System.err.println("Interrupted: could not keep the results so far: " + e);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }, "exhale-save-on-interrupt");
        Runtime.getRuntime().addShutdownHook(hook);
    }

    /**
     * True if the caller may write the complete outputs: the study was not stopped and the hook
     * has not started writing. Call only once the runs are complete.
     */
    boolean claim() {
        return !triggered && claimed.compareAndSet(false, true);
    }

    /** The outputs are written (or will not be): lets a waiting hook end, and removes the hook. */
    @Override
    public void close() {
        written.countDown();
        try {
            Runtime.getRuntime().removeShutdownHook(hook);
        } catch (IllegalStateException e) {
            // The JVM is shutting down: the hook is running or has run.
        }
    }
}
