package org.viewgain.prep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;

/** Standardize, SelectTopK and CovariateAdjust learn from training rows only and reuse that on test rows. */
class FittedOnTrainingTest {

    private static final FitContext CTX = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 1);

    private static Rows rows(double[][] x, String... names) {
        List<String> ids = new java.util.ArrayList<>();
        for (int i = 0; i < x.length; i++) {
            ids.add("s" + i + "-" + x[i][0]);
        }
        return new Rows(ids, x, List.of(names));
    }

    @Test
    void givenTrainingRows_whenStandardizingATestRow_thenTrainingMeanAndSdAreUsed() {
        // Training column 1: 1, 2, 3 -> mean 2, sd 1 (by hand); column 2 constant 7 -> 0 everywhere.
        Rows train = rows(new double[][] {{1, 7}, {2, 7}, {3, 7}}, "a", "b");
        Rows test = rows(new double[][] {{100, 9}}, "a", "b");
        Rows out = new Standardize().fit(CTX, train, new int[3]).apply(test);
        // Had the test row leaked in, the mean would be 26.5 and the value far from 98.
        assertArrayEquals(new double[] {98, 0}, out.x()[0], 1e-12);
    }

    @Test
    void givenPlantedInformativeColumn_whenSelectingTopOneByTTest_thenItIsKept() {
        // Column 3 differs by 2 sd between classes; the other 9 are noise (invented data, seed 5).
        Random random = new Random(5);
        double[][] x = new double[40][10];
        int[] y = new int[40];
        for (int i = 0; i < 40; i++) {
            y[i] = i % 2;
            for (int j = 0; j < 10; j++) {
                x[i][j] = random.nextGaussian() + (j == 3 ? 2.0 * y[i] : 0);
            }
        }
        String[] names = new String[10];
        for (int j = 0; j < 10; j++) {
            names[j] = "c" + j;
        }
        SelectTopK.Selection s = new SelectTopK("t-test", 1).fit(CTX, rows(x, names), y);
        assertArrayEquals(new int[] {3}, s.kept());
        assertEquals(List.of("c3"), s.keptNames());
        assertEquals(List.of("c3"), s.apply(rows(x, names)).featureNames());
    }

    @Test
    void givenTwoSamples_whenScoringByWelchT_thenMatchesHandValue() {
        // Class 0: 1, 2, 3 (mean 2, var 1); class 1: 4, 6, 8 (mean 6, var 4); t = 4 / sqrt(1/3 + 4/3) = 3.0984 (by hand).
        double[][] x = {{1}, {2}, {3}, {4}, {6}, {8}};
        assertEquals(4 / Math.sqrt(5.0 / 3), SelectTopK.welch(x, new int[] {0, 0, 0, 1, 1, 1}, 0), 1e-12);
        // One-way F: grand mean 4, SSB = 3*4 + 3*4 = 24 (df 1), SSW = 2 + 8 = 10 (df 4) -> F = 9.6 (by hand).
        assertEquals(9.6, SelectTopK.anova(x, new int[] {0, 0, 0, 1, 1, 1}, 2, 0), 1e-12);
    }

    @Test
    void givenTiedScores_whenSelecting_thenLowerColumnIndexWins_andLargeKKeepsAll() {
        double[][] x = {{1, 1, 0}, {2, 2, 0}, {3, 3, 0}};
        Rows r = rows(x, "a", "b", "c");
        assertArrayEquals(new int[] {0}, new SelectTopK("variance", 1).fit(CTX, r, new int[3]).kept());
        assertArrayEquals(new int[] {0, 1, 2}, new SelectTopK("variance", 10).fit(CTX, r, new int[3]).kept());
    }

    @Test
    void givenTestRowsWithOtherLabels_whenSelectionFitted_thenOnlyTrainingRowsDecide() {
        // Training: column b separates the classes, a does not. Applying to test rows must keep b regardless of them.
        Rows train = rows(new double[][] {{0, 0}, {1, 0.1}, {0, 5}, {1, 5.1}}, "a", "b");
        SelectTopK.Selection s = new SelectTopK("anova", 1).fit(CTX, train, new int[] {0, 0, 1, 1});
        Rows test = rows(new double[][] {{9, 1}}, "a", "b");
        assertEquals(List.of("b"), s.apply(test).featureNames());
        assertArrayEquals(new double[] {1}, s.apply(test).x()[0], 0.0);
    }

    @Test
    void givenUnknownSelectionMethod_whenCreating_thenMessageListsAllowed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new SelectTopK("chi2", 5));
        assertTrue(e.getMessage().contains("t-test, anova, variance"), e.getMessage());
    }

    @Test
    void givenFeatureLinearInAge_whenAdjustedOnTraining_thenTestRowUsesTrainingSlope() {
        // Training: feature = 10 + 2 * age exactly, so the slope is 2 (by hand); the test row (age 50, value 0)
        // becomes 0 - 2 * 50 = -100. A slope refitted with the test row included would differ.
        Map<String, double[]> age = new HashMap<>();
        double[][] train = new double[4][];
        for (int i = 0; i < 4; i++) {
            train[i] = new double[] {10 + 2 * (20 + i)};
        }
        Rows tr = new Rows(List.of("t0", "t1", "t2", "t3"), train, List.of("f"));
        for (int i = 0; i < 4; i++) {
            age.put("t" + i, new double[] {20 + i});
        }
        age.put("x", new double[] {50});
        Transform.Fitted fitted = new CovariateAdjust(age, List.of("age")).fit(CTX, tr, new int[4]);
        Rows test = new Rows(List.of("x"), new double[][] {{0}}, List.of("f"));
        assertEquals(-100, fitted.apply(test).x()[0][0], 1e-9);
        for (double[] r : fitted.apply(tr).x()) {
            assertEquals(10, r[0], 1e-9);
        }
    }

    @Test
    void givenSubjectWithoutCovariates_whenApplying_thenErrorNamesSubject() {
        Map<String, double[]> age = Map.of("t0", new double[] {1}, "t1", new double[] {2}, "t2", new double[] {4});
        Rows tr = new Rows(List.of("t0", "t1", "t2"), new double[][] {{1}, {2}, {3}}, List.of("f"));
        Transform.Fitted fitted = new CovariateAdjust(age, List.of("age")).fit(CTX, tr, new int[3]);
        Rows test = new Rows(List.of("nobody"), new double[][] {{0}}, List.of("f"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> fitted.apply(test));
        assertTrue(e.getMessage().contains("'nobody'"), e.getMessage());
    }

    /**
     * A frozen covariate adjustment read back applies the training slope to a new cohort's subjects with their own
     * covariates: the case above by hand (slope 2; age 50, value 0 becomes -100), and bit for bit as the fit in
     * memory given the same cohort.
     */
    @Test
    void givenAFrozenAdjustment_whenThawedAndGivenANewCohort_thenTheTrainingSlopeIsApplied() {
        Map<String, double[]> age = new HashMap<>();
        double[][] train = new double[4][];
        for (int i = 0; i < 4; i++) {
            train[i] = new double[] {10 + 2 * (20 + i), 3 - 0.5 * (20 + i)};
            age.put("t" + i, new double[] {20 + i});
        }
        Rows tr = new Rows(List.of("t0", "t1", "t2", "t3"), train, List.of("f", "g"));
        Transform.Fitted fitted = new CovariateAdjust(age, List.of("age")).fit(CTX, tr, new int[4]);
        Transform.Fitted thawed = FrozenSteps.thaw(new org.viewgain.frozen.FrozenIn("test",
                org.viewgain.frozen.FrozenOut.of((org.viewgain.frozen.Freezable) fitted)));
        assertTrue(FrozenSteps.readsCovariates(thawed, List.of("age")));
        assertTrue(!FrozenSteps.readsCovariates(thawed, List.of("sex")), "another covariate list does not fit");
        Map<String, double[]> newAges = Map.of("x", new double[] {50}, "y", new double[] {31.5});
        Rows test = new Rows(List.of("x", "y"), new double[][] {{0, 0}, {7.25, -1}}, List.of("f", "g"));
        Rows back = ((Transform.PerSubject) thawed).forCohort(Map.of(), newAges).apply(test);
        Rows live = ((Transform.PerSubject) fitted).forCohort(Map.of(), newAges).apply(test);
        assertEquals(-100, back.x()[0][0], 1e-9);
        assertEquals(25, back.x()[0][1], 1e-9);
        for (int i = 0; i < 2; i++) {
            for (int j = 0; j < 2; j++) {
                assertEquals(Double.doubleToRawLongBits(live.x()[i][j]), Double.doubleToRawLongBits(back.x()[i][j]));
            }
        }
        assertThrows(IllegalArgumentException.class, () -> thawed.apply(test),
                "a thawed adjustment knows no subject's covariates until it is given a cohort's");
    }
}
