package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.EnabledIfSystemProperty;
import org.viewgain.cohort.Rows;

/**
 * A manual measurement, off by default: fit + impute time of each imputer on random data of 400 subjects (320
 * training, 80 new) with 4,950 source and 4,950 target features (a 100-region network to another). Run with
 * {@code mvn -o test -Dtest=ImputerTimingTest -Dviewgain.timing=true}; times go to target/imputer-timing.txt.
 */
class ImputerTimingTest {

    @Test
    @EnabledIfSystemProperty(named = "viewgain.timing", matches = "true")
    void givenWideRandomViews_whenEachImputerFitsAndImputes_thenTimesRecordedAndMultiKernelUnderTwoSeconds()
            throws IOException {
        int p = 4950;
        Rows src = Fixtures.gaussian("s", 320, p, 1);
        Rows tgt = Fixtures.gaussian("s", 320, p, 2);
        Rows news = Fixtures.gaussian("n", 80, p, 3);
        // warm-up: load the native BLAS and JIT-compile once, so the figures below are steady-state
        for (String m : ImputerRegistry.methods()) {
            run(m, Fixtures.gaussian("w", 40, 50, 4), Fixtures.gaussian("w", 40, 30, 5), Fixtures.gaussian("v", 5, 50, 6));
        }
        StringBuilder out = new StringBuilder("method,seconds\n");
        double mkn = Double.NaN;
        for (String m : ImputerRegistry.methods()) {
            long t0 = System.nanoTime();
            double[][] y = run(m, src, tgt, news);
            double sec = (System.nanoTime() - t0) / 1e9;
            assertEquals(80, y.length);
            assertEquals(p, y[0].length);
            out.append(m).append(',').append(String.format(Locale.ROOT, "%.3f", sec)).append('\n');
            if (m.equals(MultiKernelNeighboursImputer.METHOD)) {
                mkn = sec;
            }
        }
        Files.writeString(Path.of("target", "imputer-timing.txt"), out, StandardCharsets.UTF_8);
        // the performance goal of the design brief (no published source): 2 s
        assertTrue(mkn < 2.0, "multi-kernel-neighbours took " + mkn + " s");
    }

    private static double[][] run(String method, Rows src, Rows tgt, Rows news) {
        ViewImputer m = ImputerRegistry.byMethod(method);
        return m.fit(Fixtures.CTX, src, tgt, m.resolve(Map.of())).impute(Fixtures.CTX, news);
    }
}
