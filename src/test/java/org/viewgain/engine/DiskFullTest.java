package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.report.CsvTable;
import org.viewgain.report.ResultTables;
import org.viewgain.report.SignificanceTables;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * A journal whose disk fills up part-way (an injected IOException after half a line) stops the run with the cause;
 * the journal keeps the finished units and a resumed run gives the same tables as a run that never failed.
 */
class DiskFullTest {
    @TempDir
    Path dir;

    static String csv(CsvTable t) throws IOException {
        StringWriter w = new StringWriter();
        t.write(w);
        return w.toString();
    }

    @Test
    void givenDiskFullAfterSomeUnits_whenResumed_thenSameTablesAsAnUninterruptedRun() throws IOException {
        TestCohorts.synthetic(dir, 40, 6, 4, 1.0, 0.2, 11);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, """
                imputers: [ { name: ridge, method: ridge, grid: { alpha: [1, 10] } } ]
                feature-sets: [source, source+imputed]
                classifiers: [ { name: lr, method: logistic, fixed: { lambda: 1.0 } } ]
                validation: { outer: { folds: 3, repeats: 1 }, inner: { folds: 2 } }
                significance: { permutations: 9, metric: auc }
                """)));
        RunResults whole = new Runner(ex, 2, Progress.NONE).run();
        Map<String, Object> id = Map.of("seed", 1, "shard", "all");
        Path file = dir.resolve(Journal.FILE);
        AtomicInteger written = new AtomicInteger();
        try (Journal j = Journal.create(file, id)) {
            j.sink(line -> {
                if (written.incrementAndGet() > 5) {
                    Files.write(file, Arrays.copyOf(line, line.length / 2), java.nio.file.StandardOpenOption.APPEND);
                    throw new IOException("No space left on device");
                }
                Files.write(file, line, java.nio.file.StandardOpenOption.APPEND);
            });
            UncheckedIOException e = assertThrows(UncheckedIOException.class,
                    () -> new Runner(ex, 2, Progress.NONE).journal(j).run());
            assertTrue(e.getMessage().contains("No space left on device"), e.getMessage());
        }
        RunResults resumed;
        try (Journal j = Journal.resume(file, id)) {
            assertEquals(5, j.size(), "the five units written before the disk filled are kept");
            resumed = new Runner(ex, 2, Progress.NONE).journal(j).run();
        }
        assertEquals(csv(ResultTables.predictions(whole)), csv(ResultTables.predictions(resumed)));
        assertEquals(csv(ResultTables.hyperparameters(whole)), csv(ResultTables.hyperparameters(resumed)));
        assertEquals(csv(ResultTables.imputation(whole)), csv(ResultTables.imputation(resumed)));
        assertEquals(csv(SignificanceTables.permutations(whole.permutations())),
                csv(SignificanceTables.permutations(resumed.permutations())));
        assertEquals(csv(SignificanceTables.permutationNull(whole.permutations())),
                csv(SignificanceTables.permutationNull(resumed.permutations())));
    }
}
