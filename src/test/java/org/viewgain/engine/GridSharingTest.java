package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * The engine hands every grid point that sees the same rows to one {@link
 * org.viewgain.classify.ClassifierMethod#fitGrid} call, so that a method's label-free work on those rows (the
 * forest's bins, the SVM's kernel matrix; counted in BinnedForestTest and KernelSvmTest) is done once per training
 * block rather than once per grid point. Counted here by the recording stand-ins ({@link Recording}); nothing is
 * timed.
 */
class GridSharingTest {
    @TempDir
    Path dir;

    @Test
    void givenAGridOfSixPoints_whenTuned_thenOneCallPerInnerFoldCarriesAllSix() {
        TestCohorts.synthetic(dir, 40, 5, 4, 1.0, 0.3, 3);
        String body = """
                imputers:
                  - { name: ridge, method: ridge, fixed: { alpha: 5 } }
                feature-sets: [source, source+imputed]
                classifiers:
                  - { name: svm, method: svm-rbf, grid: { C: [0.1, 1, 10], gamma: [scale, 0.01] } }
                validation: { outer: { folds: 4, repeats: 1 }, inner: { folds: 3 } }
                significance: { permutations: 0, bootstrap: 0 }
                """;
        Recording rec = new Recording();
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, body)), rec);
        new Runner(ex, 2, Progress.NONE).run();
        // 2 pipelines x 4 outer folds x 3 inner folds, each one call with all 6 points
        assertEquals(2 * 4 * 3, rec.grids.size());
        assertTrue(rec.grids.stream().allMatch(g -> g.points() == 6 && g.ctx().role() == FitContext.Role.TUNE),
                "every tuning call carries the whole grid");
        // the final fits: one point each, 2 pipelines x 4 outer folds
        assertEquals(2 * 4, rec.fits.stream().filter(f -> f.kind().equals("classifier")
                && f.ctx().role() == FitContext.Role.FINAL).count());
    }

    /**
     * The ridge imputer's table of source products ({@link org.viewgain.imputation.SourceGram}) is computed once per
     * run, although ridge is fitted in the dual form in every outer fold, its cross-fits, the nested fits behind the
     * classifier's tuning and every permutation's re-drawn plan (that those fits read it is checked in
     * RidgeImputerTest); counted, not timed.
     */
    @Test
    void givenRidgeInTheDualForm_whenRunWithTuningAndPermutations_thenTheSourceProductsAreComputedOnce() {
        TestCohorts.synthetic(dir, 40, 60, 6, 1.0, 0.3, 3); // 60 source columns, more than any training set
        String body = """
                imputers:
                  - { name: ridge, method: ridge, grid: { alpha: [1, 10] } }
                feature-sets: [source, source+imputed]
                classifiers:
                  - { name: lr, method: logistic, grid: { lambda: [0.1, 10] } }
                validation: { outer: { folds: 4, repeats: 1 }, inner: { folds: 3 } }
                significance: { permutations: 3, early-stop: 0, bootstrap: 0 }
                """;
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, body)));
        new Runner(ex, 2, Progress.NONE).run();
        org.viewgain.imputation.SourceGram products = ex.data().sourceDistances().products();
        assertEquals(1, products.computed(), "one table for the whole run");
        assertTrue(products.reads() >= 4 * (4 + 3 * 4), "read by the outer and nested fits: " + products.reads());
    }
}
