package org.viewgain.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.testing.TestCohorts;

/** The same spec, data and seed give byte-identical tables on 1 and 4 threads. */
class DeterminismTest {
    @TempDir
    Path dir;

    static Path onlyRun(Path root) throws IOException {
        try (Stream<Path> s = Files.list(root.resolve("synthetic"))) {
            List<Path> runs = s.toList();
            assertEquals(1, runs.size());
            return runs.get(0);
        }
    }

    @Test
    void givenOneAndFourThreads_whenRun_thenTablesAreByteIdentical() throws IOException {
        TestCohorts.synthetic(dir, 60, 12, 8, 1.0, 0.3, 17);
        Path spec = TestCohorts.spec(dir, """
                imputers:
                  - { name: nn, method: nearest-neighbours, grid: { k: [3, 6] } }
                  - { name: ridge, method: ridge, grid: { alpha: [1, 10] } }
                feature-sets: [source, target, source+imputed]
                classifiers:
                  - { name: forest, method: random-forest, fixed: { trees: 30 }, grid: { features-per-split: [sqrt, 0.5] } }
                  - { name: svm, method: svm-rbf, grid: { C: [0.5, 2] } }
                validation: { outer: { folds: 3, repeats: 2 }, inner: { folds: 3 } }
                """);
        Path r1 = dir.resolve("r1");
        Path r4 = dir.resolve("r4");
        assertEquals(0, CliTest.run("run", spec.toString(), "--out", r1.toString(), "--threads", "1", "--quiet").code());
        assertEquals(0, CliTest.run("run", spec.toString(), "--out", r4.toString(), "--threads", "4", "--quiet").code());
        for (String table : List.of("predictions.csv", "metrics.csv", "fold_metrics.csv", "hyperparameters.csv",
                "imputation.csv", "folds.csv")) {
            assertArrayEquals(Files.readAllBytes(onlyRun(r1).resolve(table)), Files.readAllBytes(onlyRun(r4).resolve(table)),
                    table);
        }
    }
}
