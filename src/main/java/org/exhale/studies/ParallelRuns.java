package org.exhale.studies;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.concurrent.atomic.AtomicReferenceArray;
import java.util.function.IntFunction;

/**
 * Runs {@code n} independent tasks on a fixed number of worker threads and keeps each result at
 * its index, so the outcome does not depend on the number of threads or on which finishes first.
 * A run can be cancelled from another thread (a shutdown hook on Ctrl-C); the results finished
 * so far stay readable.
 *
 * @param <T> the result of one task
 */
public final class ParallelRuns<T> {
    /** Told after every finished task (from a worker thread). */
    public interface Listener {
        void finished(int done, int total);
    }

    private final int n;
    private final int threads;
    private final IntFunction<T> task;
    private final AtomicReferenceArray<T> results;
    private final AtomicInteger next = new AtomicInteger();
    private final AtomicInteger done = new AtomicInteger();
    private final AtomicReference<Throwable> failure = new AtomicReference<>();
    private final List<Thread> workers = new ArrayList<>();
    private volatile boolean cancelled;

    public ParallelRuns(int n, int threads, IntFunction<T> task) {
        if (n < 0 || threads < 1) {
            throw new IllegalArgumentException("need n >= 0 tasks and at least one thread");
        }
        this.n = n;
        this.threads = Math.min(threads, Math.max(1, n));
        this.task = task;
        this.results = new AtomicReferenceArray<>(n);
    }

    /** Runs every task and waits; rethrows the first failure of a task (after stopping the rest). */
    public List<T> run(Listener listener) {
        for (int w = 0; w < threads; w++) {
            Thread t = new Thread(() -> work(listener), "exhale-study-" + w);
            t.setDaemon(true);
            workers.add(t);
        }
        workers.forEach(Thread::start);
        try {
            for (Thread t : workers) {
                t.join();
            }
        } catch (InterruptedException e) {
            cancel();
            Thread.currentThread().interrupt();
        }
        Throwable f = failure.get();
        if (f instanceof RuntimeException re) {
            throw re;
        }
        if (f instanceof Error er) {
            throw er;
        }
        return snapshot();
    }

    private void work(Listener listener) {
        int i;
        while (!cancelled && (i = next.getAndIncrement()) < n) {
            try {
                results.set(i, task.apply(i));
            } catch (Throwable e) {
                failure.compareAndSet(null, e);
                cancelled = true;
                return;
            }
            int d = done.incrementAndGet();
            if (listener != null) {
                listener.finished(d, n);
            }
        }
    }

    /** Stops handing out tasks; running ones finish. */
    public void cancel() {
        cancelled = true;
    }

    /** Waits up to {@code millis} for the running tasks to end (after {@link #cancel()}). */
    public void awaitWorkers(long millis) {
        long end = System.nanoTime() + TimeUnit.MILLISECONDS.toNanos(millis);
        for (Thread t : workers) {
            long left = TimeUnit.NANOSECONDS.toMillis(end - System.nanoTime());
            if (left <= 0) {
                return;
            }
            try {
                t.join(left);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return;
            }
        }
    }

    public boolean complete() {
        return done.get() == n;
    }

    public int done() {
        return done.get();
    }

    /** The results so far by index; null where a task has not finished. */
    public List<T> snapshot() {
        List<T> out = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            out.add(results.get(i));
        }
        return out;
    }

    public static int defaultThreads() {
        return Runtime.getRuntime().availableProcessors();
    }
}
