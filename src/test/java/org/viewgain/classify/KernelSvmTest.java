package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import libsvm.svm;
import libsvm.svm_model;
import libsvm.svm_node;
import libsvm.svm_parameter;
import libsvm.svm_problem;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.Params;

/**
 * {@code svm-rbf} ({@link KernelSvm}, {@link Smo}) against LIBSVM 3.31's own Java port (Chang &amp; Lin 2011, ACM TIST
 * 2:27; C-SVC with its RBF kernel, shrinking on, its kernel cache in single precision): the same problem, so the dual
 * objective, rho and every held-out decision value must agree to the solvers' tolerance, on breast-cancer-wisconsin
 * (Wolberg, Street &amp; Mangasarian 1995) and on iris's two overlapping species (Fisher 1936). Plus a two-point case
 * solved by hand and the kernel matrix shared across a grid.
 */
class KernelSvmTest {

    private static final ReferenceTable CANCER = ReferenceTable.load("breast-cancer-wisconsin.csv").standardized();
    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv").standardized();
    private static final Pattern OBJ = Pattern.compile("obj = (\\S+), rho = (\\S+)");

    /** LIBSVM's solution: objective and rho from its log, and decision values for +1 on the test rows. */
    record Libsvm(double objective, double rho, double[] decisions, int supportVectors) {
    }

    static Libsvm libsvm(double[][] x, int[] signs, double c, double gamma, double eps, double[][] test) {
        StringBuilder log = new StringBuilder();
        svm.svm_set_print_string_function(log::append);
        svm_problem prob = new svm_problem();
        prob.l = x.length;
        prob.y = new double[x.length];
        prob.x = new svm_node[x.length][];
        for (int i = 0; i < x.length; i++) {
            prob.y[i] = signs[i];
            prob.x[i] = nodes(x[i]);
        }
        svm_parameter param = new svm_parameter();
        param.svm_type = svm_parameter.C_SVC;
        param.kernel_type = svm_parameter.RBF;
        param.gamma = gamma;
        param.C = c;
        param.eps = eps;
        param.cache_size = 100;
        param.shrinking = 1;
        param.probability = 0;
        param.nr_weight = 0;
        param.weight_label = new int[0];
        param.weight = new double[0];
        svm_model model = svm.svm_train(prob, param);
        Matcher m = OBJ.matcher(log);
        assertTrue(m.find(), "LIBSVM printed no objective: " + log);
        // LIBSVM's first label is the positive side of its decision value
        double sign = model.label[0] == 1 ? 1 : -1;
        double[] dec = new double[test.length];
        double[] one = new double[1];
        for (int i = 0; i < test.length; i++) {
            svm.svm_predict_values(model, nodes(test[i]), one);
            dec[i] = sign * one[0];
        }
        return new Libsvm(Double.parseDouble(m.group(1)), sign * Double.parseDouble(m.group(2)), dec, model.l);
    }

    private static svm_node[] nodes(double[] row) {
        svm_node[] out = new svm_node[row.length];
        for (int j = 0; j < row.length; j++) {
            out[j] = new svm_node();
            out[j].index = j + 1;
            out[j].value = row[j];
        }
        return out;
    }

    /** Trains on every row whose position is not in fold 0 of 5 and compares on fold 0. */
    private static void assertAgreesWithLibsvm(double[][] x, int[] signs, double c, double gamma, double eps,
                                               double objTol, double decTol) {
        int[] fold = new int[x.length];
        for (int i = 0; i < x.length; i++) {
            fold[i] = i % 5;
        }
        int[] train = ReferenceTable.positions(fold, 0, false);
        int[] test = ReferenceTable.positions(fold, 0, true);
        double[][] xt = pickRows(x, train);
        int[] yt = ReferenceTable.pick(signs, train);
        double[][] xs = pickRows(x, test);
        Libsvm ref = libsvm(xt, yt, c, gamma, eps, xs);
        Smo.Solution ours = Smo.solve(RbfKernel.matrix(xt, gamma), yt, c, eps, 10_000_000);
        assertTrue(ours.converged());
        assertEquals(ref.objective(), ours.objective(), objTol * Math.abs(ref.objective()), "dual objective");
        KernelSvm.Machine machine = KernelSvm.Machine.of(ours, yt, xt, gamma);
        int agree = 0;
        for (int i = 0; i < xs.length; i++) {
            double d = machine.decision(xs[i]);
            assertEquals(ref.decisions()[i], d, decTol, "decision value of test row " + i);
            agree += Math.signum(d) == Math.signum(ref.decisions()[i]) ? 1 : 0;
        }
        assertEquals(xs.length, agree, "predicted classes");
    }

    private static double[][] pickRows(double[][] x, int[] positions) {
        double[][] out = new double[positions.length][];
        for (int i = 0; i < positions.length; i++) {
            out[i] = x[positions[i]];
        }
        return out;
    }

    private static int[] signs(int[] y, int positive) {
        return Arrays.stream(y).map(v -> v == positive ? 1 : -1).toArray();
    }

    @Test
    void givenBreastCancer_whenSolvedTightly_thenObjectiveAndDecisionsEqualLibsvms() {
        double[][] x = CANCER.rows().x();
        int[] s = signs(CANCER.y(), 1);
        double gamma = RbfKernel.gamma("scale", x);
        // eps 1e-6 on both sides: what remains is LIBSVM's single-precision kernel cache (about 1e-7 relative)
        assertAgreesWithLibsvm(x, s, 1.0, gamma, 1e-6, 1e-6, 1e-4);
        assertAgreesWithLibsvm(x, s, 10.0, 0.01, 1e-6, 1e-6, 1e-4);
    }

    @Test
    void givenBreastCancer_whenSolvedAtTheDefaultTolerance_thenDecisionsAgreeToTheTolerance() {
        double[][] x = CANCER.rows().x();
        // LIBSVM's default eps 1e-3: both stop near the optimum, each at its own point; every class agrees
        assertAgreesWithLibsvm(x, signs(CANCER.y(), 1), 1.0, RbfKernel.gamma("scale", x), 1e-3, 1e-3, 2e-2);
    }

    @Test
    void givenIrisVersicolorAgainstVirginica_whenSolved_thenObjectiveAndDecisionsEqualLibsvms() {
        // the two species that overlap, so the margin has errors and bounded support vectors
        List<Integer> keep = new ArrayList<>();
        for (int i = 0; i < IRIS.y().length; i++) {
            if (IRIS.y()[i] > 0) {
                keep.add(i);
            }
        }
        int[] at = keep.stream().mapToInt(Integer::intValue).toArray();
        double[][] x = pickRows(IRIS.rows().x(), at);
        int[] s = signs(ReferenceTable.pick(IRIS.y(), at), 1);
        assertAgreesWithLibsvm(x, s, 1.0, 0.25, 1e-6, 1e-6, 1e-4);
        assertAgreesWithLibsvm(x, s, 100.0, 2.0, 1e-6, 1e-6, 1e-4);
    }

    @Test
    void givenTwoPoints_whenSolved_thenTheHandSolution() {
        // x = 0 (class -1) and x = 1 (class +1), K_12 = exp(-gamma) = k. By symmetry a_1 = a_2 = a and rho = 0; the
        // dual 2a - a^2 (1 - k) peaks at a = 1 / (1 - k), and then f(x_i) = y_i a (1 - k) = y_i (by hand).
        double gamma = 0.5;
        double k = Math.exp(-gamma);
        double[][] x = {{0}, {1}};
        Smo.Solution s = Smo.solve(RbfKernel.matrix(x, gamma), new int[] {-1, 1}, 100, 1e-9, 1000);
        assertEquals(1 / (1 - k), s.alpha()[0], 1e-9);
        assertEquals(1 / (1 - k), s.alpha()[1], 1e-9);
        assertEquals(0, s.rho(), 1e-9);
        assertEquals(-1 / (1 - k), s.objective(), 1e-9); // 1/2 a'Qa - e'a = a^2 (1 - k) - 2a = -1 / (1 - k)
        KernelSvm.Machine m = KernelSvm.Machine.of(s, new int[] {-1, 1}, x, gamma);
        assertEquals(1.0, m.decision(new double[] {1}), 1e-9);
        assertEquals(-1.0, m.decision(new double[] {0}), 1e-9);
        assertEquals(0.0, m.decision(new double[] {0.5}), 1e-9);
        // C below 1 / (1 - k): both at the bound C
        Smo.Solution bounded = Smo.solve(RbfKernel.matrix(x, gamma), new int[] {-1, 1}, 0.5, 1e-9, 1000);
        assertEquals(0.5, bounded.alpha()[0], 0.0);
        assertEquals(0.5, bounded.alpha()[1], 0.0);
    }

    /** Counts the label-free distance work of a {@link KernelSvm}. */
    private static final class CountingWork implements KernelSvm.KernelWork {
        int blocks;
        int crosses;
        int vectors;

        @Override
        public double[][] squaredDistances(double[][] x) {
            blocks++;
            return RbfKernel.squaredDistances(x);
        }

        @Override
        public double[][] crossDistances(double[][] rows, double[][] v) {
            crosses++;
            vectors += v.length;
            return RbfKernel.crossDistances(rows, v);
        }
    }

    @Test
    void givenAGrid_whenFittedTogether_thenOneDistanceMatrixAndTheSameModelsAsSeparateFits() {
        CountingWork counting = new CountingWork();
        KernelSvm together = new KernelSvm(counting);
        Rows rows = CANCER.rows();
        List<Params> grid = new ArrayList<>();
        List<FitContext> contexts = new ArrayList<>();
        for (Object gamma : List.of("scale", 0.01)) {
            for (double c : new double[] {0.1, 1, 10}) {
                grid.add(together.resolve(Map.of("C", c, "gamma", gamma)));
                contexts.add(new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.TUNE, grid.size()));
            }
        }
        List<ClassifierMethod.Model> models = together.fitGrid(contexts, rows, CANCER.y(), 2, grid);
        assertEquals(1, counting.blocks, "one matrix of squared distances for 6 grid points over 2 gammas");
        ClassifierMethod plain = new KernelSvm();
        for (int g = 0; g < grid.size(); g++) {
            Predictions a = models.get(g).predict(rows);
            Predictions b = plain.fit(contexts.get(g), rows, CANCER.y(), 2, grid.get(g)).predict(rows);
            assertTrue(Arrays.deepEquals(a.scores(), b.scores()), "grid point " + g);
        }
    }

    @Test
    void givenAGridsModels_whenPredictedTogether_thenDistancesOnceAndTheSameScoresBitForBit() {
        // two-class (Breast Cancer Wisconsin) and three-class (iris, one machine per class) grids
        for (ReferenceTable data : List.of(CANCER, IRIS)) {
            CountingWork counting = new CountingWork();
            KernelSvm svm = new KernelSvm(counting);
            int classes = data.classes();
            int n = data.rows().n();
            int[] fit = java.util.stream.IntStream.range(0, n).filter(i -> i % 3 != 0).toArray();
            int[] held = java.util.stream.IntStream.range(0, n).filter(i -> i % 3 == 0).toArray();
            Rows train = data.rows().select(fit);
            Rows test = data.rows().select(held);
            int[] y = Arrays.stream(fit).map(i -> data.y()[i]).toArray();
            List<Params> grid = new ArrayList<>();
            List<FitContext> contexts = new ArrayList<>();
            for (Object gamma : List.of("scale", 0.05)) {
                for (double c : new double[] {0.1, 10}) {
                    grid.add(svm.resolve(Map.of("C", c, "gamma", gamma)));
                    contexts.add(new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.TUNE, grid.size()));
                }
            }
            List<ClassifierMethod.Model> models = svm.fitGrid(contexts, train, y, classes, grid);
            List<Predictions> together = svm.predictGrid(models, test);
            assertEquals(1, counting.crosses, "one distance computation for the grid's predictions");
            assertTrue(counting.vectors <= train.n(), "distinct support vectors " + counting.vectors);
            for (int g = 0; g < grid.size(); g++) {
                Predictions alone = models.get(g).predict(test);
                assertTrue(Arrays.deepEquals(alone.scores(), together.get(g).scores()), "grid point " + g);
                assertArrayEquals(alone.labels(), together.get(g).labels(), "grid point " + g);
            }
        }
    }

    @Test
    void givenIris_whenOneAgainstRest_thenAccuracyAbove90Percent() {
        // RBF SVMs reach about 0.95 on iris (common practice, no source).
        ClassifierMethod svm = ClassifierRegistry.create("svm-rbf");
        double accuracy = Crossval.accuracy(svm, svm.resolve(Map.of("C", 10.0)), IRIS, 5, 2);
        assertTrue(accuracy > 0.9, "accuracy " + accuracy);
    }
}
