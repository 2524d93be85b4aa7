package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** svm-rbf's kernel matrix is flagged by check and run when it would be large (8 n^2 bytes per concurrent fit). */
class KernelWarningTest {
    @Test
    void givenRowCounts_whenWarned_thenOnlyAboveTheLimitWithTheMemoryItNeeds() {
        assertEquals("", CheckReport.kernelWarning(CheckReport.KERNEL_ROWS));
        String w = CheckReport.kernelWarning(10_000);
        // 8 x 10,000^2 bytes = 800,000,000 bytes = 762 MiB (by hand)
        assertTrue(w.contains("up to 10000 rows need up to 762 MB per concurrent fit"), w);
        assertTrue(w.startsWith("[viewgain] warning: ") && w.endsWith("\n"), w);
    }
}
