package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.viewgain.spec.Params;

class SmileSvmTest {

    private static final ReferenceTable CANCER = ReferenceTable.load("breast-cancer-wisconsin.csv").standardized();
    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv").standardized();

    @Test
    void givenBreastCancer_whenLinearSvmCrossValidated_thenAccuracyAbove93Percent() {
        // Linear SVMs reach about 0.97 on standardized WDBC (common practice, no source).
        ClassifierMethod svm = ClassifierRegistry.create("svm-linear");
        double accuracy = Crossval.accuracy(svm, svm.resolve(Map.of()), CANCER, 5, 2);
        assertTrue(accuracy > 0.93, "accuracy " + accuracy);
    }

    @Test
    void givenIris_whenRbfSvmOneVersusRest_thenAccuracyAbove90Percent() {
        // RBF SVMs reach about 0.95 on iris (common practice, no source).
        ClassifierMethod svm = ClassifierRegistry.create("smile-svm-rbf");
        double accuracy = Crossval.accuracy(svm, svm.resolve(Map.of("C", 10.0)), IRIS, 5, 2);
        assertTrue(accuracy > 0.9, "accuracy " + accuracy);
    }

    @Test
    void givenTwoClasses_whenPredicting_thenClassOneScoreIsTheDecisionValueAndSignGivesTheLabel() {
        ClassifierMethod svm = ClassifierRegistry.create("smile-svm-rbf");
        Params params = svm.resolve(Map.of());
        int[] fold = CANCER.folds(5, 9);
        Predictions p = Reproducibility.fitAndPredict(svm, params, CANCER, ReferenceTable.positions(fold, 0, false),
                ReferenceTable.positions(fold, 0, true), 1);
        for (int i = 0; i < p.labels().length; i++) {
            double[] s = p.scores()[i];
            assertEquals(-s[0], s[1], 0.0);
            assertEquals(s[1] > 0 ? 1 : 0, p.labels()[i]);
        }
    }

    @Test
    void givenScaleSetting_whenResolvingGamma_thenOneOverFeaturesTimesVariance() {
        // values 0, 2, 4, 6 over p = 2 columns: mean 3, population variance 5, so gamma = 1 / (2 * 5) (by hand).
        double[][] x = {{0, 2}, {4, 6}};
        assertEquals(0.1, RbfKernel.gamma("scale", x), 1e-15);
        assertEquals(0.5, RbfKernel.gamma(0.5, x), 0.0);
    }
}
