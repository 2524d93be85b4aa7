package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;

/** The run's queue: which waiting task starts first, and how a failure reaches the caller. */
class UnitPoolTest {

    @Test
    void givenTasksWaitingBehindABusyThread_whenFreed_thenTheyStartByRankThenInTheOrderTheyWereMade() throws Exception {
        UnitPool pool = new UnitPool(1);
        try {
            CountDownLatch release = new CountDownLatch(1);
            Future<Boolean> busy = pool.submit(() -> release.await(10, java.util.concurrent.TimeUnit.SECONDS));
            List<String> started = Collections.synchronizedList(new ArrayList<>());
            List<Future<?>> all = new ArrayList<>();
            String[] names = {"plain-1", "first", "plain-2", "last", "second"};
            double[] ranks = {0, Double.POSITIVE_INFINITY, 0, Double.NEGATIVE_INFINITY, 5};
            for (int t = 0; t < names.length; t++) {
                String name = names[t];
                UnitPool.Ranked<Void> task = pool.ranked(ranks[t], () -> {
                    started.add(name);
                    return null;
                });
                pool.execute(task);
                all.add(task);
            }
            all.add(pool.submit(() -> started.add("submitted")));
            release.countDown();
            assertTrue(busy.get());
            for (Future<?> f : all) {
                f.get();
            }
            assertEquals(List.of("first", "second", "plain-1", "plain-2", "submitted", "last"), started);
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void givenAFailingTask_whenAwaited_thenItsExceptionIsThrownAsItWasAndTheRestAreCancelled() {
        UnitPool pool = new UnitPool(1);
        try {
            IllegalArgumentException mistake = new IllegalArgumentException("subject s-7: no source view");
            CountDownLatch never = new CountDownLatch(1);
            List<Future<Void>> futures = new ArrayList<>();
            futures.add(pool.submit(() -> {
                throw mistake;
            }));
            UnitPool.Ranked<Void> notQueued = pool.ranked(0, () -> {
                never.await();
                return null;
            });
            futures.add(notQueued);
            assertSame(mistake, assertThrows(IllegalArgumentException.class, () -> UnitPool.await(futures)));
            assertTrue(notQueued.isCancelled(), "a task still waiting is cancelled");
        } finally {
            pool.shutdownNow();
        }
    }
}
