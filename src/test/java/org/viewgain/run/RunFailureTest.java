package org.viewgain.run;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.concurrent.ExecutionException;
import org.junit.jupiter.api.Test;

/** Out of memory and a full disk are named as such, however deeply the worker threads wrapped them. */
class RunFailureTest {
    @Test
    void givenFullDiskInsideWrappers_whenDescribed_thenSaysDiskFull() {
        String what = RunFailure.describe(new IllegalStateException(new ExecutionException(
                new UncheckedIOException("cannot write the journal", new IOException("No space left on device")))));
        assertTrue(what.startsWith("disk full"), what);
    }

    @Test
    void givenOutOfMemory_whenDescribed_thenSaysOutOfMemoryAndHowToGiveMoreHeap() {
        String what = RunFailure.describe(new OutOfMemoryError("Java heap space"));
        assertTrue(what.startsWith("out of memory") && what.contains("-Xmx"), what);
    }

    @Test
    void givenOtherWriteError_whenDescribed_thenNamesTheRootCause() {
        String what = RunFailure.describe(new UncheckedIOException("x", new IOException("Read-only file system")));
        assertTrue(what.contains("cannot write") && what.contains("Read-only file system"), what);
    }
}
