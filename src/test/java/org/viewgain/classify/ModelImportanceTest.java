package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.Params;

/** What trained models report in {@code importance()}: kinds, values against hand computations, invariances. */
class ModelImportanceTest {
    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv");
    private static final FitContext CTX = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 3);

    static ClassifierMethod.Model fit(String method, Rows x, int[] y, int classes, Map<String, Object> params) {
        ClassifierMethod m = ClassifierRegistry.create(method);
        return m.fit(CTX, x, y, classes, m.resolve(params));
    }

    /** Versicolor (0) against virginica (1), the two overlapping iris species. */
    static Rows twoSpecies(List<Integer> out) {
        List<String> ids = new ArrayList<>();
        List<double[]> x = new ArrayList<>();
        for (int i = 0; i < IRIS.y().length; i++) {
            if (IRIS.y()[i] > 0) {
                ids.add(IRIS.rows().ids().get(i));
                x.add(IRIS.rows().x()[i]);
                out.add(IRIS.y()[i] - 1);
            }
        }
        return new Rows(ids, x.toArray(double[][]::new), IRIS.rows().featureNames());
    }

    static double sd(double[][] x, int j) {
        double m = 0;
        for (double[] r : x) {
            m += r[j] / x.length;
        }
        double ss = 0;
        for (double[] r : x) {
            ss += (r[j] - m) * (r[j] - m);
        }
        return Math.sqrt(ss / (x.length - 1));
    }

    @Test
    void givenPlainLdaOnTwoIrisSpecies_whenAsked_thenAbsoluteFisherDirectionTimesSd() {
        List<Integer> labels = new ArrayList<>();
        Rows x = twoSpecies(labels);
        int[] y = labels.stream().mapToInt(Integer::intValue).toArray();
        ClassifierMethod.Model m = fit("lda", x, y, 2, Map.of("shrinkage", 0.0));
        assertEquals("abs_weight", m.importanceKind());
        // recomputed from Fisher's formula (ESL 2nd ed., 4.3): w = S^-1 (mu1 - mu0), S pooled with divisor n - 2
        int p = x.p();
        double[][] mu = new double[2][p];
        int[] count = new int[2];
        for (int i = 0; i < x.n(); i++) {
            count[y[i]]++;
            for (int j = 0; j < p; j++) {
                mu[y[i]][j] += x.x()[i][j];
            }
        }
        for (int c = 0; c < 2; c++) {
            for (int j = 0; j < p; j++) {
                mu[c][j] /= count[c];
            }
        }
        RealMatrix s = MatrixUtils.createRealMatrix(p, p);
        for (int i = 0; i < x.n(); i++) {
            for (int j = 0; j < p; j++) {
                for (int l = 0; l < p; l++) {
                    s.addToEntry(j, l, (x.x()[i][j] - mu[y[i]][j]) * (x.x()[i][l] - mu[y[i]][l]) / (x.n() - 2));
                }
            }
        }
        double[] d = new double[p];
        for (int j = 0; j < p; j++) {
            d[j] = mu[1][j] - mu[0][j];
        }
        double[] w = new LUDecomposition(s).getSolver().getInverse().operate(d);
        double[] got = m.importance();
        for (int j = 0; j < p; j++) {
            // tolerance 1e-8 relative: two routes through a well-conditioned 4 x 4 inverse
            double expected = Math.abs(w[j]) * sd(x.x(), j);
            assertEquals(expected, got[j], 1e-8 * expected, "feature " + j);
        }
    }

    @Test
    void givenLinearSvm_whenAsked_thenWeightsMatchTheDecisionFunctionSlopes() {
        SplittableRandom rng = new SplittableRandom(4);
        int n = 80;
        double[][] v = new double[n][3];
        int[] y = new int[n];
        for (int i = 0; i < n; i++) {
            y[i] = i % 2;
            v[i][0] = rng.nextGaussian() + 2.5 * y[i];
            v[i][1] = 3 * rng.nextGaussian();
            v[i][2] = 5.0;
        }
        Rows x = new Rows(ids(n), v, List.of("a", "b", "c"));
        ClassifierMethod.Model m = fit("svm-linear", x, y, 2, Map.of("C", 1.0));
        double[] imp = m.importance();
        // a linear decision function changes by w_j per unit of feature j: f(x + e_j) - f(x) = w_j
        double[][] probe = {{0, 0, 5}, {1, 0, 5}, {0, 1, 5}};
        double[][] f = m.predict(new Rows(ids(3), probe, List.of("a", "b", "c"))).scores();
        assertEquals(Math.abs(f[1][1] - f[0][1]) * sd(v, 0), imp[0], 1e-9);
        assertEquals(Math.abs(f[2][1] - f[0][1]) * sd(v, 1), imp[1], 1e-9);
        assertEquals(0.0, imp[2], 0.0);
        assertTrue(imp[0] > imp[1]);
    }

    @Test
    void givenLogisticWithLittlePenalty_whenAColumnIsRescaled_thenItsImportanceBarelyMoves() {
        List<Integer> labels = new ArrayList<>();
        Rows x = twoSpecies(labels);
        int[] y = labels.stream().mapToInt(Integer::intValue).toArray();
        double[][] scaled = new double[x.n()][];
        for (int i = 0; i < x.n(); i++) {
            scaled[i] = x.x()[i].clone();
            scaled[i][2] *= 10;
        }
        double[] a = fit("logistic", x, y, 2, Map.of("lambda", 1e-6)).importance();
        double[] b = fit("logistic", x.withValues(scaled, x.featureNames()), y, 2, Map.of("lambda", 1e-6))
                .importance();
        // weights on standardized inputs do not depend on units; 1% covers the optimizer's tolerance (from memory)
        for (int j = 0; j < a.length; j++) {
            assertEquals(a[j], b[j], 0.01 * a[j], "feature " + j);
        }
        double[] three = fit("logistic", IRIS.rows(), IRIS.y(), 3, Map.of()).importance();
        assertEquals(4, three.length);
    }

    @Test
    void givenForestOnIris_whenAsked_thenImpurityLargestForAPetalMeasurement() {
        ClassifierMethod.Model m = fit("random-forest", IRIS.rows(), IRIS.y(), 3, Map.of("trees", 100));
        assertEquals("impurity", m.importanceKind());
        double[] imp = m.importance();
        // petal length and width (columns 2, 3) separate the species far better than the sepal measurements
        // (Fisher 1936; common knowledge of this data set, no source for the forest's numbers)
        assertTrue(Math.max(imp[2], imp[3]) > Math.max(imp[0], imp[1]), java.util.Arrays.toString(imp));
    }

    @Test
    void givenMethodsWithoutImportance_whenAsked_thenNull() {
        assertNull(fit("svm-rbf", IRIS.rows(), IRIS.y(), 3, Map.of()).importance());
        assertNull(fit("knn", IRIS.rows(), IRIS.y(), 3, Map.of()).importance());
        ClassifierMethod weka = ClassifierRegistry.create("weka", WekaClassifier.settings("weka.classifiers.trees.J48", null));
        ClassifierMethod.Model j48 = weka.fit(CTX, IRIS.rows(), IRIS.y(), 3, Params.NONE);
        assertNull(j48.importance());
        assertNull(j48.importanceKind());
    }

    static List<String> ids(int n) {
        List<String> ids = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            ids.add("r" + i);
        }
        return ids;
    }
}
