package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;

/** Checks every learned imputer of the registry must pass, run on each with default parameters. */
class LearnedImputersTest {

    private static double[][] fitImpute(String method, FitContext ctx, Rows src, Rows tgt, Rows news) {
        ViewImputer m = ImputerRegistry.byMethod(method);
        return m.fit(ctx, src, tgt, m.resolve(Map.of())).impute(ctx, news);
    }

    @ParameterizedTest
    @ValueSource(strings = {"nearest-neighbours", "ridge", "pls", "multi-kernel-neighbours"})
    void givenBreastCancerViews_whenImputed_thenMaeBelowMeanImputer(String method) {
        // Breast Cancer Wisconsin (Wolberg et al. 1995): mean_* -> worst_*, seeded 70% training, raw units.
        // The worst values are strongly tied to the means, so any working learner must beat the training mean.
        Fixtures.Split split = Fixtures.breastCancer(2026);
        double maeMean = Fixtures.meanMae(split.testTarget().x(),
                fitImpute("mean", Fixtures.CTX, split.trainSource(), split.trainTarget(), split.testSource()));
        double mae = Fixtures.meanMae(split.testTarget().x(),
                fitImpute(method, Fixtures.CTX, split.trainSource(), split.trainTarget(), split.testSource()));
        assertTrue(mae < maeMean, method + " MAE " + mae + " vs mean " + maeMean);
        assertTrue(ImputationQuality.skill(mae, maeMean) > 0.3, method + " skill");
    }

    @ParameterizedTest
    @ValueSource(strings = {"mean", "nearest-neighbours", "ridge", "pls", "multi-kernel-neighbours"})
    void givenSameRowsAndSeed_whenFittedTwice_thenIdenticalOutput_andSeedDoesNotMatter(String method) {
        // all five methods are deterministic: no random choice, so another seed must not change anything either
        Rows src = Fixtures.gaussian("s", 40, 12, 1);
        Rows tgt = Fixtures.linearTarget(src, 5, 0.5, 2);
        Rows news = Fixtures.gaussian("n", 7, 12, 3);
        double[][] a = fitImpute(method, Fixtures.CTX, src, tgt, news);
        double[][] b = fitImpute(method, Fixtures.CTX, src, tgt, news);
        FitContext other = Fixtures.CTX.at(2, FitContext.Role.TUNE, 99L);
        double[][] c = fitImpute(method, other, src, tgt, news);
        for (int i = 0; i < a.length; i++) {
            assertArrayEquals(a[i], b[i], 0.0);
            assertArrayEquals(a[i], c[i], 0.0);
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"mean", "nearest-neighbours", "ridge", "pls", "multi-kernel-neighbours"})
    void givenTrainingRows_whenFittedAndImputed_thenOnlyTheRowsGivenMatter(String method) {
        Rows src = Fixtures.gaussian("s", 40, 12, 4);
        Rows tgt = Fixtures.linearTarget(src, 5, 0.5, 5);
        Rows news = Fixtures.gaussian("n", 6, 12, 6);
        double[][] srcCopy = deepCopy(src.x());
        double[][] tgtCopy = deepCopy(tgt.x());
        double[][] newsCopy = deepCopy(news.x());
        double[][] batch = fitImpute(method, Fixtures.CTX, src, tgt, news);
        // inputs are not modified
        assertTrue(java.util.Arrays.deepEquals(srcCopy, src.x()));
        assertTrue(java.util.Arrays.deepEquals(tgtCopy, tgt.x()));
        assertTrue(java.util.Arrays.deepEquals(newsCopy, news.x()));
        // a subject's imputation does not depend on the other subjects imputed with it (tolerance: BLAS blocking)
        for (int i = 0; i < news.n(); i++) {
            double[][] alone = fitImpute(method, Fixtures.CTX, src, tgt, news.select(new int[] {i}));
            assertArrayEquals(batch[i], alone[0], 1e-9, "subject " + i);
        }
        // subject ids are never features: renaming every subject changes nothing
        List<String> renamed = new ArrayList<>();
        src.ids().forEach(id -> renamed.add("x-" + id));
        Rows src2 = new Rows(renamed, src.x(), src.featureNames());
        Rows tgt2 = new Rows(renamed, tgt.x(), tgt.featureNames());
        double[][] again = fitImpute(method, Fixtures.CTX, src2, tgt2, news);
        for (int i = 0; i < batch.length; i++) {
            assertArrayEquals(batch[i], again[i], 0.0);
        }
        // a fit sees only its rows: fitting on subjects 0-29 is unaffected by what subjects 30-39 hold
        int[] first = java.util.stream.IntStream.range(0, 30).toArray();
        double[][] sub = fitImpute(method, Fixtures.CTX, src.select(first), tgt.select(first), news);
        double[][] otherSrc = deepCopy(src.x());
        double[][] otherTgt = deepCopy(tgt.x());
        for (int i = 30; i < 40; i++) {
            java.util.Arrays.fill(otherSrc[i], 1e6);
            java.util.Arrays.fill(otherTgt[i], -1e6);
        }
        Rows src3 = src.withValues(otherSrc, src.featureNames());
        Rows tgt3 = tgt.withValues(otherTgt, tgt.featureNames());
        double[][] subAgain = fitImpute(method, Fixtures.CTX, src3.select(first), tgt3.select(first), news);
        for (int i = 0; i < sub.length; i++) {
            assertArrayEquals(sub[i], subAgain[i], 0.0);
        }
    }

    private static double[][] deepCopy(double[][] x) {
        double[][] c = new double[x.length][];
        for (int i = 0; i < x.length; i++) {
            c[i] = x[i].clone();
        }
        return c;
    }

    /**
     * Every imputer but {@code external} can be frozen into a bundle, and the one read back imputes new subjects bit
     * for bit as the fitted one (Breast Cancer Wisconsin, Wolberg et al. 1995, as above; ridge with a small and a
     * large training set, so that both its primal and its dual form are frozen).
     */
    @ParameterizedTest
    @ValueSource(strings = {"mean", "nearest-neighbours", "ridge", "pls", "multi-kernel-neighbours"})
    void givenAFittedImputer_whenFrozenAndReadBack_thenItImputesBitForBitTheSame(String method) {
        ViewImputer m = ImputerRegistry.byMethod(method);
        assertTrue(m.freezable(), method);
        assertTrue(!ImputerRegistry.byMethod(ExternalImputer.METHOD).freezable());
        Fixtures.Split split = Fixtures.breastCancer(2026);
        for (int n : new int[] {8, split.trainSource().n()}) {
            Rows src = head(split.trainSource(), n);
            Rows tgt = head(split.trainTarget(), n);
            ViewImputer.Fitted fitted = m.fit(Fixtures.CTX, src, tgt, m.resolve(Map.of()));
            byte[] part = org.viewgain.frozen.FrozenOut.of((org.viewgain.frozen.Freezable) fitted);
            ViewImputer.Fitted back = FrozenImputers.thaw(new org.viewgain.frozen.FrozenIn(method, part));
            double[][] a = fitted.impute(Fixtures.CTX, split.testSource());
            double[][] b = back.impute(Fixtures.CTX, split.testSource());
            for (int i = 0; i < a.length; i++) {
                assertArrayEquals(a[i], b[i], 0.0, method + " n=" + n + " subject " + i);
            }
        }
    }

    private static Rows head(Rows r, int n) {
        return new Rows(r.ids().subList(0, n), java.util.Arrays.copyOf(r.x(), n), r.featureNames());
    }
}
