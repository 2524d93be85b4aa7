package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.viewgain.spec.Params;

/** Same seed: identical output; another seed: different output (randomised methods); threads change nothing. */
class ClassifierReproducibilityTest {

    private static final ReferenceTable CANCER = ReferenceTable.load("breast-cancer-wisconsin.csv").standardized();
    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv").standardized();

    static Stream<Arguments> methods() {
        return Stream.of(
                Arguments.of("svm-linear", null, Map.of(), true),
                Arguments.of("svm-rbf", null, Map.of(), false),
                Arguments.of("smile-svm-rbf", null, Map.of(), true),
                Arguments.of("logistic", null, Map.of(), false),
                Arguments.of("lda", null, Map.of(), false),
                Arguments.of("knn", null, Map.of(), false),
                Arguments.of("weka", "weka.classifiers.trees.RandomForest", Map.of("-I", 30), true),
                Arguments.of("weka", "weka.classifiers.functions.Logistic", Map.of("-R", 0.01), false));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("methods")
    void givenSameSeed_whenFittedTwice_thenIdenticalPredictions_andAnotherSeedDiffersWhenRandomised(
            String method, String wekaClass, Map<String, Object> raw, boolean randomised) {
        ClassifierMethod m = ClassifierRegistry.create(method, WekaClassifier.settings(wekaClass, null));
        Params params = m.resolve(raw);
        for (ReferenceTable table : List.of(CANCER, IRIS)) {
            int[] fold = table.folds(5, 4);
            int[] train = ReferenceTable.positions(fold, 2, false);
            int[] test = ReferenceTable.positions(fold, 2, true);
            Predictions a = Reproducibility.fitAndPredict(m, params, table, train, test, 100);
            Predictions b = Reproducibility.fitAndPredict(m, params, table, train, test, 100);
            assertArrayEquals(a.labels(), b.labels());
            assertTrue(Arrays.deepEquals(a.scores(), b.scores()));
            if (randomised && table == CANCER) {
                Predictions c = Reproducibility.fitAndPredict(m, params, table, train, test, 101);
                assertFalse(Arrays.deepEquals(a.scores(), c.scores()), "another seed gave the same scores");
            }
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("methods")
    void givenFourThreadsAtOnce_whenFittingTheSameSeed_thenPredictionsEqualTheSingleThreadOnes(
            String method, String wekaClass, Map<String, Object> raw, boolean randomised) throws Exception {
        ClassifierMethod m = ClassifierRegistry.create(method, WekaClassifier.settings(wekaClass, null));
        Params params = m.resolve(raw);
        for (ReferenceTable table : List.of(CANCER, IRIS)) {
            int[] fold = table.folds(5, 8);
            int[] train = ReferenceTable.positions(fold, 3, false);
            int[] test = ReferenceTable.positions(fold, 3, true);
            Predictions alone = Reproducibility.fitAndPredict(m, params, table, train, test, 55);
            for (Predictions p : Reproducibility.concurrently(m, params, table, train, test, 55, 4)) {
                assertArrayEquals(alone.labels(), p.labels());
                assertTrue(Arrays.deepEquals(alone.scores(), p.scores()));
            }
        }
    }
}
