package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.frozen.FrozenIn;
import org.viewgain.frozen.FrozenOut;
import org.viewgain.spec.Params;
import org.viewgain.stats.SmileMatrices;

class RidgeImputerTest {

    private static final double ALPHA = 2.5;

    /**
     * Independent solution: ridge on centred data is least squares on the augmented system [Xc; sqrt(alpha) I]
     * b = [yc; 0] (Hoerl &amp; Kennard 1970; Hastie, Tibshirani &amp; Friedman, ESL 2nd ed., exercise 3.12),
     * solved by commons-math3 3.6.1 QR, one target column at a time.
     */
    private static double[][] augmentedQrPrediction(Rows src, Rows tgt, Rows news) {
        int n = src.n();
        int p = src.p();
        double[] mx = Centring.columnMeans(src.x(), p);
        double[] my = Centring.columnMeans(tgt.x(), tgt.p());
        RealMatrix aug = new Array2DRowRealMatrix(n + p, p);
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < p; j++) {
                aug.setEntry(i, j, src.x()[i][j] - mx[j]);
            }
        }
        for (int j = 0; j < p; j++) {
            aug.setEntry(n + j, j, Math.sqrt(ALPHA));
        }
        var solver = new QRDecomposition(aug).getSolver();
        double[][] out = new double[news.n()][tgt.p()];
        for (int t = 0; t < tgt.p(); t++) {
            RealVector rhs = new ArrayRealVector(n + p);
            for (int i = 0; i < n; i++) {
                rhs.setEntry(i, tgt.x()[i][t] - my[t]);
            }
            RealVector b = solver.solve(rhs);
            for (int r = 0; r < news.n(); r++) {
                double s = my[t];
                for (int j = 0; j < p; j++) {
                    s += (news.x()[r][j] - mx[j]) * b.getEntry(j);
                }
                out[r][t] = s;
            }
        }
        return out;
    }

    private static void assertClose(double[][] expected, double[][] actual, double tol) {
        assertEquals(expected.length, actual.length);
        for (int i = 0; i < expected.length; i++) {
            for (int j = 0; j < expected[i].length; j++) {
                assertEquals(expected[i][j], actual[i][j], tol, "row " + i + " col " + j);
            }
        }
    }

    @Test
    void givenSmallProblem_whenFitted_thenPredictionsMatchAugmentedQrSolution() {
        Rows src = Fixtures.gaussian("s", 30, 6, 1);
        Rows tgt = Fixtures.linearTarget(src, 3, 0.5, 2);
        Rows news = Fixtures.gaussian("n", 8, 6, 3);
        RidgeImputer ridge = new RidgeImputer();
        double[][] got = ridge.fit(Fixtures.CTX, src, tgt, Params.of("alpha", ALPHA)).impute(Fixtures.CTX, news);
        // tolerance 1e-9: two exact solvers, differences are rounding only
        assertClose(augmentedQrPrediction(src, tgt, news), got, 1e-9);
    }

    @Test
    void givenMoreFeaturesThanSubjects_whenFitted_thenMatchesAugmentedQrSolution() {
        Rows src = Fixtures.gaussian("s", 12, 40, 4);
        Rows tgt = Fixtures.linearTarget(src, 2, 0.5, 5);
        Rows news = Fixtures.gaussian("n", 5, 40, 6);
        double[][] got = new RidgeImputer().fit(Fixtures.CTX, src, tgt, Params.of("alpha", ALPHA))
                .impute(Fixtures.CTX, news);
        assertClose(augmentedQrPrediction(src, tgt, news), got, 1e-9);
    }

    @Test
    void givenEitherShape_whenDualAndPrimalFormsSolved_thenSameAnswerTo1e8() {
        for (int p : new int[] {5, 60}) {
            Rows src = Fixtures.gaussian("s", 25, p, 10 + p);
            Rows tgt = Fixtures.linearTarget(src, 4, 1.0, 20 + p);
            Rows news = Fixtures.gaussian("n", 7, p, 30 + p);
            RidgeImputer ridge = new RidgeImputer();
            double[][] primal = ridge.fit(src, tgt, ALPHA, RidgeImputer.Form.PRIMAL).impute(Fixtures.CTX, news);
            double[][] dual = ridge.fit(src, tgt, ALPHA, RidgeImputer.Form.DUAL).impute(Fixtures.CTX, news);
            assertClose(primal, dual, 1e-8);
        }
    }

    /**
     * A grid fitted together ({@code fitGrid}, then {@code imputeGrid} on the same new rows) gives each alpha the
     * model and the imputations that fitting and imputing it alone give, bit for bit, in both forms; in the dual form
     * the Gram matrix of the training rows is computed once for the whole grid (counted through the seam), and once
     * per fit when the points are fitted one at a time.
     */
    @Test
    void givenAGridOfAlphas_whenFittedTogether_thenEachEqualsItsOwnFitBitForBit_andOneGramMatrixServesThemAll() {
        for (int p : new int[] {5, 60}) {
            Rows src = Fixtures.gaussian("s", 25, p, 40 + p);
            Rows tgt = Fixtures.linearTarget(src, 4, 1.0, 50 + p);
            Rows news = Fixtures.gaussian("n", 7, p, 60 + p);
            AtomicInteger grams = new AtomicInteger();
            RidgeImputer ridge = new RidgeImputer(x -> {
                grams.incrementAndGet();
                return SmileMatrices.gram(x);
            });
            List<Params> grid = List.of(Params.of("alpha", 0.1), Params.of("alpha", ALPHA), Params.of("alpha", 1e3));
            List<FitContext> contexts = new ArrayList<>();
            grid.forEach(g -> contexts.add(Fixtures.CTX));
            List<ViewImputer.Fitted> together = ridge.fitGrid(contexts, src, tgt, grid, null);
            List<double[][]> imputed = ridge.imputeGrid(contexts, together, news);
            assertEquals(p > 25 ? 1 : 0, grams.get(), "p=" + p + ": Gram matrices for the grid");
            for (int g = 0; g < grid.size(); g++) {
                double[][] alone = ridge.fit(Fixtures.CTX, src, tgt, grid.get(g)).impute(Fixtures.CTX, news);
                for (int i = 0; i < alone.length; i++) {
                    assertArrayEquals(alone[i], imputed.get(g)[i], 0.0, "p=" + p + " " + grid.get(g) + " row " + i);
                    assertArrayEquals(alone[i], together.get(g).impute(Fixtures.CTX, news)[i], 0.0);
                }
            }
            assertEquals(p > 25 ? 4 : 0, grams.get(), "p=" + p + ": one Gram matrix per fit alone");
        }
    }

    /**
     * Bundles of earlier versions hold the dual form as {@code A = (K + alpha I)^-1 Yc} (kind {@code
     * imputer-ridge-dual}); such a part is still read and imputes what the augmented QR solution gives (to 1e-9, as
     * the fitted form), bit for bit before and after the round trip.
     */
    @Test
    void givenTheDualFormOfEarlierBundles_whenReadBack_thenItStillImputesTheRidgeSolution() {
        Rows src = Fixtures.gaussian("s", 12, 40, 4);
        Rows tgt = Fixtures.linearTarget(src, 2, 0.5, 5);
        Rows news = Fixtures.gaussian("n", 5, 40, 6);
        double[] mx = Centring.columnMeans(src.x(), src.p());
        double[] my = Centring.columnMeans(tgt.x(), tgt.p());
        double[][] xc = Centring.centre(src.x(), mx);
        double[][] k = SmileMatrices.gram(xc);
        for (int i = 0; i < k.length; i++) {
            k[i][i] += ALPHA;
        }
        FrozenImputers.RidgeDual old = new FrozenImputers.RidgeDual(mx, my, xc,
                SmileMatrices.solveSpd(k, Centring.centre(tgt.x(), my)));
        ViewImputer.Fitted back = FrozenImputers.thaw(new FrozenIn("ridge", FrozenOut.of(old)));
        assertTrue(back instanceof FrozenImputers.RidgeDual, "read as the earlier kind");
        double[][] before = old.impute(Fixtures.CTX, news);
        double[][] after = back.impute(Fixtures.CTX, news);
        for (int i = 0; i < before.length; i++) {
            assertArrayEquals(before[i], after[i], 0.0);
        }
        assertClose(augmentedQrPrediction(src, tgt, news), after, 1e-9);
    }

    /**
     * Ridge through the run's table of source products ({@link SourceGram}): the dual-form models of a grid impute
     * what the augmented QR solution gives (to 1e-9, as the fitted form) for rows in the table and for rows outside
     * it, what ridge without the table imputes (to 1e-9), the grid's imputations are each model's own bit for bit,
     * and a model frozen into a bundle reads back as the earlier dual kind with the same imputations. The views are
     * single precision, as a run stores them, and sit far from the origin (mean 30).
     */
    @Test
    void givenTheRunsTableOfSourceProducts_whenRidgeFitsAGrid_thenItImputesTheRidgeSolution() {
        Rows raw = Fixtures.gaussian("s", 30, 80, 70);
        java.util.Map<String, float[]> views = new java.util.HashMap<>();
        double[][] x = new double[raw.n()][raw.p()];
        for (int i = 0; i < raw.n(); i++) {
            float[] v = new float[raw.p()];
            for (int j = 0; j < raw.p(); j++) {
                v[j] = (float) (30 + raw.x()[i][j]);
                x[i][j] = v[j];
            }
            views.put(raw.ids().get(i), v);
        }
        Rows all = new Rows(raw.ids(), x, raw.featureNames());
        int[] trainAt = java.util.stream.IntStream.range(0, 30).filter(i -> i % 3 != 0).toArray();
        Rows src = all.select(trainAt);
        Rows tgt = Fixtures.linearTarget(src, 3, 0.5, 71);
        Rows held = all.select(new int[] {0, 3, 6, 9, 1});
        Rows news = Fixtures.gaussian("n", 4, 80, 72);
        SourceDistances shared = SourceDistances.of(all.ids(), src.ids(), views::get);
        RidgeImputer ridge = new RidgeImputer();
        List<Params> grid = List.of(Params.of("alpha", ALPHA), Params.of("alpha", 300.0));
        List<FitContext> contexts = List.of(Fixtures.CTX, Fixtures.CTX);
        List<ViewImputer.Fitted> viaTable = ridge.fitGrid(contexts, src, tgt, grid, shared);
        List<ViewImputer.Fitted> own = ridge.fitGrid(contexts, src, tgt, grid, null);
        assertTrue(viaTable.get(0) instanceof RidgeImputer.SharedDual, "fitted through the table");
        assertEquals(1, shared.products().computed(), "one table for the grid");
        for (Rows rows : List.of(held, news)) {
            List<double[][]> imputed = ridge.imputeGrid(contexts, viaTable, rows);
            for (int g = 0; g < grid.size(); g++) {
                double[][] alone = viaTable.get(g).impute(Fixtures.CTX, rows);
                for (int i = 0; i < alone.length; i++) {
                    assertArrayEquals(alone[i], imputed.get(g)[i], 0.0, grid.get(g) + " row " + i);
                }
                assertClose(own.get(g).impute(Fixtures.CTX, rows), alone, 1e-9);
            }
            assertClose(augmentedQrPrediction(src, tgt, rows), imputed.get(0), 1e-9);
        }
        ViewImputer.Fitted back = FrozenImputers.thaw(new FrozenIn("ridge", FrozenOut.of(
                (org.viewgain.frozen.Freezable) viaTable.get(0))));
        assertTrue(back instanceof FrozenImputers.RidgeDualInverse, "frozen as the dual kind it equals");
        assertClose(viaTable.get(0).impute(Fixtures.CTX, held), back.impute(Fixtures.CTX, held), 1e-9);
        assertEquals(1, shared.products().computed(), "still one table");
    }
}
