package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import de.bwaldvogel.liblinear.Feature;
import de.bwaldvogel.liblinear.FeatureNode;
import de.bwaldvogel.liblinear.Linear;
import de.bwaldvogel.liblinear.Parameter;
import de.bwaldvogel.liblinear.Problem;
import de.bwaldvogel.liblinear.SolverType;
import java.util.Random;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.viewgain.folds.FitContext;

/**
 * The {@code svm-linear} solver against LIBLINEAR 2.44 (Fan et al. 2008, JMLR 9:1871-1874; the Java port by
 * B. Waldvogel), solver {@code L2R_L1LOSS_SVC_DUAL} with bias input 1: the same problem, whose weight vector is
 * unique, so both must land on the same weights. And the failure that replaced Smile's LASVM for this method: on wide,
 * low-rank standardized inputs a converged linear SVM must rank its own training subjects correctly.
 */
class LinearSvmTest {

    static double[] liblinear(double[][] x, int[] signs, double c, double eps) {
        Linear.disableDebugOutput();
        Problem prob = new Problem();
        prob.l = x.length;
        prob.n = x[0].length + 1;
        prob.bias = 1;
        prob.y = new double[x.length];
        prob.x = new Feature[x.length][];
        for (int i = 0; i < x.length; i++) {
            prob.y[i] = signs[i];
            Feature[] row = new Feature[x[i].length + 1];
            for (int j = 0; j < x[i].length; j++) {
                row[j] = new FeatureNode(j + 1, x[i][j]);
            }
            row[x[i].length] = new FeatureNode(x[i].length + 1, 1.0);
            prob.x[i] = row;
        }
        Parameter param = new Parameter(SolverType.L2R_L1LOSS_SVC_DUAL, c, eps);
        param.setRandom(new Random(0));
        param.setMaxIters(100_000);
        de.bwaldvogel.liblinear.Model m = Linear.train(prob, param);
        double[] w = m.getFeatureWeights(); // inputs, then the bias input; for label m.getLabels()[0]
        double sign = m.getLabels()[0] == 1 ? 1 : -1;
        double[] out = new double[w.length];
        for (int j = 0; j < w.length; j++) {
            out[j] = sign * w[j];
        }
        return out;
    }

    /** The primal objective {@code 1/2 |w|^2 + C sum max(0, 1 - y (w.x + b))} with the intercept last in {@code w}. */
    static double objective(double[][] x, int[] signs, double c, double[] w) {
        double o = 0;
        for (double v : w) {
            o += v * v / 2;
        }
        int p = x[0].length;
        for (int i = 0; i < x.length; i++) {
            double f = w[p];
            for (int j = 0; j < p; j++) {
                f += w[j] * x[i][j];
            }
            o += c * Math.max(0, 1 - signs[i] * f);
        }
        return o;
    }

    /**
     * Both solvers at tolerance 1e-6: ours must reach LIBLINEAR's primal objective to 0.1% (or go below it) and the
     * same weights to 1% of the largest (the dual criterion bounds neither exactly). LIBLINEAR's shrinking stops a little early on some problems: on WDBC at C = 1 its objective
     * is 26.5523 against 26.5346 here (measured), with weights 0.6% apart; on the others the two agree to 1e-4.
     */
    static void assertSameWeights(double[][] x, int[] signs, double c) {
        LinearSvm.Machine ours = LinearSvm.solve(x, signs, c, 1e-6, 100_000, 11);
        double[] ref = liblinear(x, signs, c, 1e-6);
        int p = x[0].length;
        double[] w = java.util.Arrays.copyOf(ours.w(), p + 1);
        w[p] = ours.b();
        double mine = objective(x, signs, c, w);
        double theirs = objective(x, signs, c, ref);
        assertTrue(mine <= theirs * (1 + 1e-3), "objective " + mine + " vs LIBLINEAR " + theirs + " at C " + c);
        double scale = 0;
        for (double v : ref) {
            scale = Math.max(scale, Math.abs(v));
        }
        for (int j = 0; j <= p; j++) {
            assertEquals(ref[j], w[j], 1e-2 * scale, (j < p ? "weight " + j : "intercept") + " at C " + c);
        }
    }

    @Test
    void givenBreastCancer_whenSolved_thenLiblinearsWeights() {
        ReferenceTable cancer = ReferenceTable.load("breast-cancer-wisconsin.csv").standardized();
        int[] signs = new int[cancer.y().length];
        for (int i = 0; i < signs.length; i++) {
            signs[i] = cancer.y()[i] == 1 ? 1 : -1;
        }
        for (double c : new double[] {0.01, 1.0}) {
            assertSameWeights(cancer.rows().x(), signs, c);
        }
    }

    @Test
    void givenTooFewPasses_whenSolved_thenTheFitSaysItDidNotConverge() {
        // WDBC at C = 1 needs many passes to reach tolerance 1e-6 (measured: hundreds); one pass cannot
        ReferenceTable cancer = ReferenceTable.load("breast-cancer-wisconsin.csv").standardized();
        int[] signs = new int[cancer.y().length];
        for (int i = 0; i < signs.length; i++) {
            signs[i] = cancer.y()[i] == 1 ? 1 : -1;
        }
        LinearSvm.Machine cut = LinearSvm.solve(cancer.rows().x(), signs, 1.0, 1e-6, 1, 11);
        assertEquals(1, cut.passes());
        assertTrue(!cut.converged());
        LinearSvm.Machine full = LinearSvm.solve(cancer.rows().x(), signs, 1.0, 1e-6, 100_000, 11);
        assertTrue(full.converged() && full.passes() > 1 && full.passes() < 100_000, full.passes() + " passes");
        // the model a pipeline sees reports the same
        org.viewgain.folds.FitContext ctx = new org.viewgain.folds.FitContext(0, 0, 0, org.viewgain.folds.FitContext.WHOLE,
                org.viewgain.folds.FitContext.Role.FINAL, 3L);
        LinearSvm svm = new LinearSvm();
        assertTrue(!svm.fit(ctx, cancer.rows(), cancer.y(), 2, svm.resolve(java.util.Map.of("C", 1.0,
                "tolerance", 1e-6, "iterations", 1))).converged());
        assertTrue(svm.fit(ctx, cancer.rows(), cancer.y(), 2, svm.resolve(java.util.Map.of("C", 1.0))).converged());
    }

    @Test
    void givenWideRandomData_whenSolved_thenLiblinearsWeights() {
        SplittableRandom rnd = new SplittableRandom(3);
        int n = 60;
        double[][] x = new double[n][400];
        int[] signs = new int[n];
        for (int i = 0; i < n; i++) {
            signs[i] = i % 3 == 0 ? 1 : -1;
            for (int j = 0; j < x[i].length; j++) {
                x[i][j] = rnd.nextGaussian() + (j < 10 ? 0.5 * signs[i] : 0);
            }
        }
        for (double c : new double[] {0.001, 0.1, 10}) {
            assertSameWeights(x, signs, c);
        }
    }

    @Test
    void givenWideLowRankStandardizedInputs_whenFitted_thenTrainingSubjectsRankedCorrectly() {
        // Shaped like the scale cohorts (org.viewgain.demo.ScaleCohort): 35,778 edges driven by 4 latent factors, the
        // group shifting the first. Smile's LASVM gave a training AUC of 0.29 on such a view (docs/benchmarks.md).
        SplittableRandom rnd = new SplittableRandom(5);
        int n = 120;
        int p = 35_778;
        double[][] load = new double[4][p];
        for (double[] l : load) {
            for (int j = 0; j < p; j++) {
                l[j] = rnd.nextGaussian();
            }
        }
        double[][] x = new double[n][p];
        int[] signs = new int[n];
        for (int i = 0; i < n; i++) {
            signs[i] = i % 2 == 0 ? 1 : -1;
            double[] z = {rnd.nextGaussian() + 0.5 * signs[i], rnd.nextGaussian(), rnd.nextGaussian(),
                    rnd.nextGaussian()};
            for (int j = 0; j < p; j++) {
                x[i][j] = 0.3 * (z[0] * load[0][j] + z[1] * load[1][j] + z[2] * load[2][j] + z[3] * load[3][j])
                        + 0.12 * rnd.nextGaussian();
            }
        }
        for (int j = 0; j < p; j++) {
            double m = 0;
            for (double[] r : x) {
                m += r[j] / n;
            }
            double s = 0;
            for (double[] r : x) {
                s += (r[j] - m) * (r[j] - m);
            }
            s = Math.sqrt(s / (n - 1));
            for (double[] r : x) {
                r[j] = (r[j] - m) / s;
            }
        }
        for (double c : new double[] {0.001, 0.1}) {
            LinearSvm.Machine m = LinearSvm.solve(x, signs, c, 0.1, 1000, 1);
            long right = 0;
            long pairs = 0;
            for (int i = 0; i < n; i++) {
                for (int k = 0; k < n; k++) {
                    if (signs[i] == 1 && signs[k] == -1) {
                        pairs++;
                        right += m.decision(x[i]) > m.decision(x[k]) ? 1 : 0;
                    }
                }
            }
            assertTrue(right > 0.99 * pairs, "training AUC " + (double) right / pairs + " at C " + c);
            assertTrue(m.passes() < 1000, "converged in " + m.passes() + " passes");
        }
    }

    /**
     * From {@link LinearSvm#BLAS_FROM} features the Gram matrix comes from native BLAS: each entry is the rows' dot
     * product plus one (the constant input) to 1e-12 of the largest entry, the matrix exactly symmetric, and the same
     * on a second call. Invented rows (the definition is the reference); 60 rows cover one block edge of 2,048.
     */
    @Test
    void givenRowsWiderThanTheBlasThreshold_whenTheGramMatrixIsComputed_thenItIsTheRowsDotProductsPlusOne() {
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(12);
        int n = 60;
        int p = LinearSvm.BLAS_FROM + 2048 + 7;
        double[][] x = new double[n][p];
        for (double[] row : x) {
            for (int j = 0; j < p; j++) {
                row[j] = rnd.nextGaussian();
            }
        }
        double[][] k = LinearSvm.gram(x);
        double largest = 0;
        double worst = 0;
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                double dot = 1;
                for (int j = 0; j < p; j++) {
                    dot += x[a][j] * x[b][j];
                }
                largest = Math.max(largest, Math.abs(dot));
                worst = Math.max(worst, Math.abs(dot - k[a][b]));
                assertEquals(k[a][b], k[b][a], 0.0, "symmetric");
            }
        }
        assertTrue(worst <= 1e-12 * largest, "largest difference " + worst + " of " + largest);
        double[][] again = LinearSvm.gram(x);
        for (int a = 0; a < n; a++) {
            assertArrayEquals(k[a], again[a], 0.0);
        }
    }

    /**
     * The Gram-matrix solver takes the same steps as the primal one (same seeded order, same updates), so both end
     * with the same passes and the same weights up to rounding (1e-9 of the largest weight), on breast-cancer-wisconsin
     * (Wolberg et al. 1995) and on wide invented data at the C values of the demo's grid; at tolerance 1e-6 it also
     * reaches LIBLINEAR's weights (the reference of {@link #assertSameWeights}).
     */
    @Test
    void givenTheGramSolver_whenSolved_thenThePrimalSolversStepsAndLiblinearsWeights() {
        for (Object[] c : wdbcAndWide(5)) {
            double[][] x = (double[][]) c[0];
            int[] signs = (int[]) c[1];
            double[][] gram = LinearSvm.gram(x);
            for (double cost : new double[] {0.001, 0.1, 1.0}) {
                LinearSvm.Machine primal = LinearSvm.solve(x, signs, cost, 0.1, 1000, 11);
                LinearSvm.Machine dual = LinearSvm.solveGram(gram, x, signs, cost, 0.1, 1000, 11);
                assertEquals(primal.passes(), dual.passes(), "passes at C " + cost);
                double scale = java.util.Arrays.stream(primal.w()).map(Math::abs).max().orElse(1);
                for (int j = 0; j < primal.w().length; j++) {
                    assertEquals(primal.w()[j], dual.w()[j], 1e-9 * scale, "weight " + j + " at C " + cost);
                }
                assertEquals(primal.b(), dual.b(), 1e-9 * Math.max(1, Math.abs(primal.b())), "intercept at C " + cost);
                // and against LIBLINEAR at a tight tolerance, as the primal solver is checked
                LinearSvm.Machine tight = LinearSvm.solveGram(gram, x, signs, cost, 1e-6, 100_000, 11);
                double[] ref = liblinear(x, signs, cost, 1e-6);
                double[] w = java.util.Arrays.copyOf(tight.w(), x[0].length + 1);
                w[x[0].length] = tight.b();
                assertTrue(objective(x, signs, cost, w) <= objective(x, signs, cost, ref) * (1 + 1e-3),
                        "objective against LIBLINEAR at C " + cost);
            }
        }
    }

    /**
     * A grid fitted together on wide rows goes through the Gram matrix, and its models decide as the points fitted
     * one by one (the primal solver) to 1e-9, for two classes and for three (iris, Fisher 1936, with invented noise
     * columns to make it wide).
     */
    @Test
    void givenAGridOnWideRows_whenFittedTogether_thenTheSameDecisionsAsOneByOne() {
        ReferenceTable iris = ReferenceTable.load("iris.csv").standardized();
        SplittableRandom rnd = new SplittableRandom(9);
        int n = iris.y().length / 2; // every other flower (25 per species), so the grid takes the Gram path
        double[][] x = new double[n][4 + 300];
        int[] y = new int[n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(iris.rows().x()[2 * i], 0, x[i], 0, 4);
            y[i] = iris.y()[2 * i];
            for (int j = 4; j < x[i].length; j++) {
                x[i][j] = rnd.nextGaussian();
            }
        }
        org.viewgain.cohort.Rows rows = named(x);
        int[] grams = {0};
        LinearSvm svm = counting(grams);
        FitContext ctx = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 3L);
        java.util.List<org.viewgain.spec.Params> grid = java.util.List.of(svm.resolve(java.util.Map.of("C", 0.001)),
                svm.resolve(java.util.Map.of("C", 0.1)));
        java.util.List<ClassifierMethod.Model> together = svm.fitGrid(java.util.List.of(ctx, ctx), rows, y, 3, grid);
        // three machines per point, six fits, at least one running past the switch: one Gram matrix for them all
        assertEquals(1, grams[0], "Gram matrices computed for the grid");
        for (int g = 0; g < grid.size(); g++) {
            Predictions a = together.get(g).predict(rows);
            Predictions b = svm.fit(ctx, rows, y, 3, grid.get(g)).predict(rows);
            for (int i = 0; i < n; i++) {
                assertArrayEquals(b.scores()[i], a.scores()[i], 1e-9, "subject " + i + " point " + g);
            }
        }
    }

    /**
     * A fit that runs past {@link LinearSvm#switchAfter} passes moves to the Gram matrix and goes on with the same
     * steps: the same passes and the same weights to 1e-9 as the primal solver alone, on breast-cancer-wisconsin
     * (Wolberg et al. 1995; 120 rows) and on wide invented data; the matrix is computed once, and not at all for a fit
     * that converges first.
     */
    @Test
    void givenAFitPastTheSwitch_whenSolved_thenThePrimalSolversWeightsFromOneGramMatrix() {
        int switched = 0;
        int unswitched = 0;
        for (Object[] c : wdbcAndWide(8)) {
            double[][] x = (double[][]) c[0];
            int[] signs = (int[]) c[1];
            for (double cost : new double[] {0.0001, 0.1, 1.0, 10.0}) {
                int[] grams = {0};
                LinearSvm.SharedGram gram = new LinearSvm.SharedGram(x, rows -> {
                    grams[0]++;
                    return LinearSvm.gram(rows);
                });
                LinearSvm.Machine primal = LinearSvm.solve(x, signs, cost, 0.1, 1000, 11);
                LinearSvm.Machine moved = LinearSvm.solve(x, signs, cost, 0.1, 1000, 11, gram);
                boolean past = primal.passes() > LinearSvm.switchAfter(x.length);
                assertEquals(past ? 1 : 0, grams[0], "Gram matrices at C " + cost);
                switched += past ? 1 : 0;
                unswitched += past ? 0 : 1;
                assertEquals(primal.passes(), moved.passes(), "passes at C " + cost);
                double scale = java.util.Arrays.stream(primal.w()).map(Math::abs).max().orElse(1);
                for (int j = 0; j < primal.w().length; j++) {
                    assertEquals(primal.w()[j], moved.w()[j], 1e-9 * scale, "weight " + j + " at C " + cost);
                }
                assertEquals(primal.b(), moved.b(), 1e-9 * Math.max(1, Math.abs(primal.b())), "intercept at C " + cost);
                // a second fit on the same rows starts on the matrix already there
                LinearSvm.solve(x, signs, cost * 2, 0.1, 1000, 12, gram);
                assertTrue(grams[0] <= 1, "one Gram matrix per set of rows at C " + cost);
            }
        }
        assertTrue(switched >= 2 && unswitched >= 1, "both cases seen: " + switched + " switched, " + unswitched
                + " converged first");
    }

    /** Rows at least as many as their features never get a Gram matrix (a dual pass would cost more). */
    @Test
    void givenRowsNotFewerThanFeatures_whenFitted_thenNoGramMatrix() {
        ReferenceTable iris = ReferenceTable.load("iris.csv").standardized();
        int[] grams = {0};
        LinearSvm svm = counting(grams);
        FitContext ctx = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 3L);
        ClassifierMethod.Model m = svm.fit(ctx, iris.rows(), iris.y(), 3, svm.resolve(java.util.Map.of("C", 10.0)));
        assertTrue(m.predict(iris.rows()).labels().length == iris.y().length);
        assertEquals(0, grams[0], "Gram matrices for 150 rows of 4 features");
    }

    /**
     * Two training sets as {rows, signs}: the first 120 rows of breast-cancer-wisconsin (Wolberg et al. 1995),
     * standardized, and 64 x 441 invented Gaussian rows shifted by 0.3 on the first 20 columns by class.
     */
    /**
     * Hints from the earlier fits of a pipeline's training ({@link FitHints}): a grid point whose last fit needed at
     * least {@link LinearSvm#switchAfter} passes gets the Gram matrix before its first pass, and its model decides as
     * without hints (to 1e-9); a point without such a hint builds none before the switch, so a fit that converges
     * first builds none; each fit leaves its passes in the hints (wide invented rows; two classes).
     */
    @Test
    void givenHintsOfAFitPastTheSwitch_whenThePointIsFittedAgain_thenTheGramMatrixComesFirstAndTheModelIsTheSame() {
        double[][] x = (double[][]) wdbcAndWide(8)[1][0];
        int[] signs = (int[]) wdbcAndWide(8)[1][1];
        int[] y = new int[signs.length];
        for (int i = 0; i < y.length; i++) {
            y[i] = signs[i] > 0 ? 1 : 0;
        }
        org.viewgain.cohort.Rows rows = named(x);
        int[] grams = {0};
        LinearSvm svm = counting(grams);
        FitContext ctx = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 3L);
        org.viewgain.spec.Params quick = svm.resolve(java.util.Map.of("C", 0.0001));
        ClassifierMethod.Model plain = svm.fit(ctx, rows, y, 2, quick);
        int passes = LinearSvm.solve(x, signs, 0.0001, 0.1, 1000, 0).passes();
        assertTrue(passes < LinearSvm.switchAfter(x.length), "converges before the switch: " + passes);
        assertEquals(0, grams[0], "no hint, converged first: no Gram matrix");

        FitHints hints = new FitHints();
        hints.passes(quick, LinearSvm.switchAfter(x.length));
        ClassifierMethod.Model hinted = svm.fitOwned(ctx, rows, y, 2, quick, hints);
        assertEquals(1, grams[0], "the hint builds the Gram matrix before the first pass");
        Predictions a = plain.predict(rows);
        Predictions b = hinted.predict(rows);
        for (int i = 0; i < y.length; i++) {
            assertArrayEquals(a.scores()[i], b.scores()[i], 1e-9, "subject " + i);
        }
        assertTrue(hints.passes(quick) > 0 && hints.passes(quick) < LinearSvm.switchAfter(x.length),
                "the fit left its own passes: " + hints.passes(quick));
        svm.fitGrid(java.util.List.of(ctx), rows, y, 2, java.util.List.of(quick), hints);
        assertEquals(1, grams[0], "its hint now says it converges first: no Gram matrix");
    }

    /** The rows with invented subject ids s0.. and feature names c0... */
    private static org.viewgain.cohort.Rows named(double[][] x) {
        java.util.List<String> ids = new java.util.ArrayList<>();
        for (int i = 0; i < x.length; i++) {
            ids.add("s" + i);
        }
        java.util.List<String> names = new java.util.ArrayList<>();
        for (int j = 0; j < x[0].length; j++) {
            names.add("c" + j);
        }
        return new org.viewgain.cohort.Rows(ids, x, names);
    }

    /** The linear SVM with its Gram matrices counted in {@code grams[0]}. */
    private static LinearSvm counting(int[] grams) {
        return new LinearSvm(in -> {
            grams[0]++;
            return LinearSvm.gram(in);
        });
    }

    private static Object[][] wdbcAndWide(long seed) {
        ReferenceTable cancer = ReferenceTable.load("breast-cancer-wisconsin.csv").standardized();
        double[][] wdbc = java.util.Arrays.copyOf(cancer.rows().x(), 120);
        int[] wdbcSigns = new int[wdbc.length];
        for (int i = 0; i < wdbc.length; i++) {
            wdbcSigns[i] = cancer.y()[i] == 1 ? 1 : -1;
        }
        SplittableRandom rnd = new SplittableRandom(seed);
        double[][] wide = new double[64][441];
        int[] wideSigns = new int[wide.length];
        for (int i = 0; i < wide.length; i++) {
            wideSigns[i] = i % 2 == 0 ? 1 : -1;
            for (int j = 0; j < wide[i].length; j++) {
                wide[i][j] = rnd.nextGaussian() + (j < 20 ? 0.3 * wideSigns[i] : 0);
            }
        }
        return new Object[][] {{wdbc, wdbcSigns}, {wide, wideSigns}};
    }
}
