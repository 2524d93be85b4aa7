package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.Params;

class SmileLinearAndNeighbourTest {

    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv");
    private static final ReferenceTable CANCER = ReferenceTable.load("breast-cancer-wisconsin.csv").standardized();
    private static final FitContext CTX = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 1);

    private static int errors(Predictions p, int[] truth) {
        int wrong = 0;
        for (int i = 0; i < truth.length; i++) {
            if (p.labels()[i] != truth[i]) {
                wrong++;
            }
        }
        return wrong;
    }

    @Test
    void givenIris_whenPlainLdaFittedOnAllRows_thenThreeResubstitutionErrors() {
        // Fisher's discriminant on all 150 iris flowers misclassifies 3 (2 versicolor, 1 virginica); from memory
        // (R MASS::lda resubstitution table), exact count, no tolerance.
        ClassifierMethod lda = ClassifierRegistry.create("lda");
        Predictions p = lda.fit(CTX, IRIS.rows(), IRIS.y(), 3, lda.resolve(Map.of("shrinkage", 0.0)))
                .predict(IRIS.rows());
        assertEquals(3, errors(p, IRIS.y()));
        for (double[] s : p.scores()) {
            assertEquals(1.0, s[0] + s[1] + s[2], 1e-12);
        }
    }

    @Test
    void givenConstantColumn_whenLdaWithoutShrinkage_thenFiniteScores() {
        double[][] x = {{0, 5}, {1, 5}, {2, 5}, {8, 5}, {9, 5}, {10, 5}};
        Rows rows = new Rows(List.of("a", "b", "c", "d", "e", "f"), x, List.of("v", "constant"));
        ClassifierMethod lda = ClassifierRegistry.create("lda");
        Predictions p = lda.fit(CTX, rows, new int[] {0, 0, 0, 1, 1, 1}, 2, lda.resolve(Map.of("shrinkage", 0.0)))
                .predict(rows);
        assertArrayEquals(new int[] {0, 0, 0, 1, 1, 1}, p.labels());
        for (double[] s : p.scores()) {
            assertTrue(Double.isFinite(s[0]) && Double.isFinite(s[1]));
        }
    }

    @Test
    void givenBreastCancer_whenLogisticAndShrunkLdaCrossValidated_thenAccuracyAbove93Percent() {
        // Linear models reach about 0.95-0.97 on standardized WDBC (common practice, no source).
        for (String method : List.of("logistic", "lda")) {
            ClassifierMethod m = ClassifierRegistry.create(method);
            double accuracy = Crossval.accuracy(m, m.resolve(Map.of()), CANCER, 5, 6);
            assertTrue(accuracy > 0.93, method + " accuracy " + accuracy);
        }
    }

    @Test
    void givenIris_whenMultinomialLogisticCrossValidated_thenAccuracyAbove90Percent() {
        // Multinomial logistic regression reaches about 0.95 on iris (common practice, no source).
        ClassifierMethod m = ClassifierRegistry.create("logistic");
        double accuracy = Crossval.accuracy(m, m.resolve(Map.of("lambda", 0.01)), IRIS, 5, 6);
        assertTrue(accuracy > 0.9, "accuracy " + accuracy);
    }

    @Test
    void givenPointsOnALine_whenThreeNearestNeighboursVote_thenScoresAreVoteFractions() {
        // Hand example: class 0 at 0, 1, 2 and class 1 at 10, 11. Query 1.5 -> neighbours 1, 2, 0 (all class 0);
        // query 9 -> neighbours 10, 11, 2 -> fractions 1/3 and 2/3.
        Rows train = new Rows(List.of("a", "b", "c", "d", "e"), new double[][] {{0}, {1}, {2}, {10}, {11}},
                List.of("v"));
        Rows query = new Rows(List.of("q", "r"), new double[][] {{1.5}, {9}}, List.of("v"));
        ClassifierMethod knn = ClassifierRegistry.create("knn");
        Predictions p = knn.fit(CTX, train, new int[] {0, 0, 0, 1, 1}, 2, knn.resolve(Map.of("k", 3)))
                .predict(query);
        assertArrayEquals(new double[] {1.0, 0.0}, p.scores()[0], 1e-15);
        assertArrayEquals(new double[] {1.0 / 3, 2.0 / 3}, p.scores()[1], 1e-15);
        assertArrayEquals(new int[] {0, 1}, p.labels());
    }

    @Test
    void givenKLargerThanTrainingRows_whenFitting_thenClearError() {
        Rows train = new Rows(List.of("a", "b"), new double[][] {{0}, {1}}, List.of("v"));
        ClassifierMethod knn = ClassifierRegistry.create("knn");
        Params params = knn.resolve(Map.of("k", 5));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> knn.fit(CTX, train, new int[] {0, 1}, 2, params));
        assertTrue(e.getMessage().contains("k = 5"), e.getMessage());
    }
}
