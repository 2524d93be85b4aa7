package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.FutureTask;
import java.util.concurrent.PriorityBlockingQueue;
import java.util.concurrent.RunnableFuture;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;

/**
 * The run's worker threads. Waiting tasks are taken by rank (higher first), then in the order they were made: tasks
 * submitted the usual way have rank 0, so a batch of them runs in its listing order. A rank decides only when a task
 * starts, never what it computes (every unit derives its own seeds, and results are gathered in unit order), so no
 * result depends on it.
 */
final class UnitPool extends ThreadPoolExecutor {
    private final AtomicLong made = new AtomicLong();

    UnitPool(int threads) {
        super(threads, threads, 0L, TimeUnit.MILLISECONDS, new PriorityBlockingQueue<>(), r -> {
            Thread t = new Thread(r, "viewgain-worker");
            t.setDaemon(true);
            return t;
        });
        // every task goes through the queue (an idle pool would otherwise hand a new thread the task at hand)
        prestartAllCoreThreads();
    }

    /** A task with its place in the queue: by rank, then by when it was made. */
    static final class Ranked<T> extends FutureTask<T> implements Comparable<Ranked<?>> {
        private final double rank;
        private final long made;

        private Ranked(Callable<T> task, double rank, long made) {
            super(task);
            this.rank = rank;
            this.made = made;
        }

        @Override
        public int compareTo(Ranked<?> o) {
            int c = Double.compare(o.rank, rank);
            return c != 0 ? c : Long.compare(made, o.made);
        }
    }

    /** A task of the given rank, not yet queued ({@link #execute} queues it). */
    <T> Ranked<T> ranked(double rank, Callable<T> task) {
        return new Ranked<>(task, rank, made.getAndIncrement());
    }

    @Override
    protected <T> RunnableFuture<T> newTaskFor(Callable<T> task) {
        return ranked(0, task);
    }

    @Override
    protected <T> RunnableFuture<T> newTaskFor(Runnable task, T value) {
        return ranked(0, Executors.callable(task, value));
    }

    /** Runs the tasks (rank 0, in order) and returns their results in order; see {@link #await}. */
    <T> List<T> invokeInOrder(List<Callable<T>> tasks) {
        List<Future<T>> futures = new ArrayList<>();
        for (Callable<T> t : tasks) {
            futures.add(submit(t));
        }
        return await(futures);
    }

    /**
     * Waits for every future in order and returns their results. The first failure cancels the rest and is thrown
     * as it was (a runtime exception or error), so a user's mistake found by a unit reaches the caller unchanged.
     */
    static <T> List<T> await(List<? extends Future<T>> futures) {
        List<T> out = new ArrayList<>(futures.size());
        try {
            for (Future<T> f : futures) {
                out.add(f.get());
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            futures.forEach(f -> f.cancel(true));
            Throwable c = e.getCause();
            if (c instanceof RuntimeException re) {
                throw re;
            }
            if (c instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(c);
        }
        return out;
    }
}
