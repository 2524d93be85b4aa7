package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.viewgain.spec.Params;

class SmileForestTest {

    private static final ReferenceTable CANCER = ReferenceTable.load("breast-cancer-wisconsin.csv");
    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv");
    private final ClassifierMethod forest = ClassifierRegistry.create("smile-random-forest", null, null);
    private final Params small = forest.resolve(Map.of("trees", 60));

    @Test
    void givenIris_whenFiveFoldCrossValidated_thenAccuracyAbove90Percent() {
        // Iris is close to separable; forests reach about 0.95 (common practice, no source).
        double accuracy = Crossval.accuracy(forest, forest.resolve(Map.of("trees", 100)), IRIS, 5, 11);
        assertTrue(accuracy > 0.9, "accuracy " + accuracy);
    }

    @Test
    void givenSameSeed_whenFittedTwice_thenIdenticalScores_andAnotherSeedDiffers() {
        int[] fold = CANCER.folds(5, 3);
        int[] train = ReferenceTable.positions(fold, 0, false);
        int[] test = ReferenceTable.positions(fold, 0, true);
        Predictions a = Reproducibility.fitAndPredict(forest, small, CANCER, train, test, 42);
        Predictions b = Reproducibility.fitAndPredict(forest, small, CANCER, train, test, 42);
        Predictions c = Reproducibility.fitAndPredict(forest, small, CANCER, train, test, 43);
        assertArrayEquals(a.labels(), b.labels());
        assertTrue(Arrays.deepEquals(a.scores(), b.scores()));
        assertFalse(Arrays.deepEquals(a.scores(), c.scores()));
    }

    @Test
    void givenFourThreadsAtOnce_whenFittingTheSameSeed_thenEveryResultEqualsTheSingleThreadOne() throws Exception {
        int[] fold = CANCER.folds(5, 3);
        int[] train = ReferenceTable.positions(fold, 1, false);
        int[] test = ReferenceTable.positions(fold, 1, true);
        Predictions alone = Reproducibility.fitAndPredict(forest, small, CANCER, train, test, 7);
        List<Predictions> together = Reproducibility.concurrently(forest, small, CANCER, train, test, 7, 4);
        for (Predictions p : together) {
            assertTrue(Arrays.deepEquals(alone.scores(), p.scores()));
        }
    }

    @Test
    void givenFeatureSettings_whenCountingFeaturesPerSplit_thenRoundedWithinOneToP() {
        assertEquals(5, SmileForest.featuresPerSplit("sqrt", 30));
        assertEquals(4, SmileForest.featuresPerSplit("log2", 30));
        assertEquals(6, SmileForest.featuresPerSplit(0.2, 30));
        assertEquals(1, SmileForest.featuresPerSplit(0.001, 30));
        assertEquals(30, SmileForest.featuresPerSplit(1.0, 30));
    }

    @Test
    void givenScores_whenPredicting_thenVoteFractionsSumToOne() {
        int[] fold = IRIS.folds(5, 1);
        Predictions p = Reproducibility.fitAndPredict(forest, small, IRIS, ReferenceTable.positions(fold, 0, false),
                ReferenceTable.positions(fold, 0, true), 5);
        for (double[] s : p.scores()) {
            assertEquals(1.0, Arrays.stream(s).sum(), 1e-12);
        }
    }

    @Test
    void givenUnknownParameter_whenResolving_thenMessageListsAllowed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> forest.resolve(Map.of("mtry", 3)));
        assertTrue(e.getMessage().contains("features-per-split"), e.getMessage());
    }

    @Test
    void givenUnknownMethod_whenCreating_thenOneLineMessageListsMethods() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ClassifierRegistry.create("forest", null, null));
        assertTrue(e.getMessage().contains("random-forest") && !e.getMessage().contains("\n"), e.getMessage());
    }
}
