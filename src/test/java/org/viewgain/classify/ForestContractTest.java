package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.viewgain.spec.Params;

/**
 * What every random forest method promises, on breast-cancer-wisconsin (Wolberg, Street &amp; Mangasarian 1995) and
 * iris (Fisher 1936): class fractions that sum to 1, the same scores for the same seed and other scores for another,
 * and the same scores from four fits at once as from one.
 */
class ForestContractTest {
    private static final ReferenceTable CANCER = ReferenceTable.load("breast-cancer-wisconsin.csv");
    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv");

    @ParameterizedTest
    @ValueSource(strings = {"random-forest", "smile-random-forest"})
    void givenScores_whenPredicting_thenClassFractionsSumToOne(String method) {
        ClassifierMethod forest = ClassifierRegistry.create(method);
        int[] fold = IRIS.folds(5, 1);
        Predictions p = Reproducibility.fitAndPredict(forest, small(forest), IRIS,
                ReferenceTable.positions(fold, 0, false), ReferenceTable.positions(fold, 0, true), 5);
        for (double[] s : p.scores()) {
            assertEquals(1.0, Arrays.stream(s).sum(), 1e-12);
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"random-forest", "smile-random-forest"})
    void givenSameSeed_whenFittedTwice_thenIdenticalScores_andAnotherSeedDiffers(String method) {
        ClassifierMethod forest = ClassifierRegistry.create(method);
        int[] fold = CANCER.folds(5, 3);
        int[] train = ReferenceTable.positions(fold, 0, false);
        int[] test = ReferenceTable.positions(fold, 0, true);
        Predictions a = Reproducibility.fitAndPredict(forest, small(forest), CANCER, train, test, 42);
        Predictions b = Reproducibility.fitAndPredict(forest, small(forest), CANCER, train, test, 42);
        Predictions c = Reproducibility.fitAndPredict(forest, small(forest), CANCER, train, test, 43);
        assertArrayEquals(a.labels(), b.labels());
        assertTrue(Arrays.deepEquals(a.scores(), b.scores()));
        assertFalse(Arrays.deepEquals(a.scores(), c.scores()));
    }

    @ParameterizedTest
    @ValueSource(strings = {"random-forest", "smile-random-forest"})
    void givenFourThreadsAtOnce_whenFittingTheSameSeed_thenEveryResultEqualsTheSingleThreadOne(String method)
            throws Exception {
        ClassifierMethod forest = ClassifierRegistry.create(method);
        int[] fold = CANCER.folds(5, 3);
        int[] train = ReferenceTable.positions(fold, 1, false);
        int[] test = ReferenceTable.positions(fold, 1, true);
        Predictions alone = Reproducibility.fitAndPredict(forest, small(forest), CANCER, train, test, 7);
        List<Predictions> together = Reproducibility.concurrently(forest, small(forest), CANCER, train, test, 7, 4);
        for (Predictions p : together) {
            assertTrue(Arrays.deepEquals(alone.scores(), p.scores()));
        }
    }

    private static Params small(ClassifierMethod forest) {
        return forest.resolve(Map.of("trees", 60));
    }
}
