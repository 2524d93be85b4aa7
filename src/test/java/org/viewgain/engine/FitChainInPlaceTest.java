package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * The upstream steps write over a block only when the caller gives it up: inner folds pass rows that share arrays
 * with the outer training block (which later inner folds read again), so those must stay untouched; the final fit
 * gives its block up and gets the same numbers without a second copy.
 */
class FitChainInPlaceTest {
    @TempDir
    Path dir;

    @Test
    void givenScalingAlone_whenUpstreamFitted_thenOnlyOwnedRowsAreOverwrittenAndResultsAgree() {
        check("features: { extract: [edges], scale: standardize }\n", true);
    }

    @Test
    void givenHarmonizationThenScaling_whenUpstreamFitted_thenSharedRowsUntouchedAndResultsAgree() {
        // ComBat copies (it has no in-place form); scaling then works on that copy
        check("features: { extract: [edges], scale: standardize, harmonize: combat }\n", false);
    }

    void check(String features, boolean sameArrays) {
        TestCohorts.synthetic(dir, 30, 6, 3, 0.5, 0.0, 12);
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, features + """
                feature-sets: [source]
                classifiers: [ { name: k, method: knn, fixed: { k: 3 } } ]
                """)));
        int[] all = new int[ex.data().n()];
        for (int i = 0; i < all.length; i++) {
            all[i] = i;
        }
        int[] y = ex.data().y();
        FitContext ctx = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 3L);

        Rows shared = ClassifierStage.rows(ex, FeatureSet.SOURCE, all, null);
        double[][] before = new double[shared.n()][];
        for (int i = 0; i < before.length; i++) {
            before[i] = shared.x()[i].clone();
        }
        FitChain.Upstream copied = FitChain.upstream(ex, ctx, shared, y, false);
        for (int i = 0; i < before.length; i++) {
            assertArrayEquals(before[i], shared.x()[i], 0.0, "row " + i + " of a block the caller keeps");
            assertNotSame(shared.x()[i], copied.transformed().x()[i]);
        }

        Rows owned = ClassifierStage.rows(ex, FeatureSet.SOURCE, all, null);
        FitChain.Upstream inPlace = FitChain.upstream(ex, ctx, owned, y, true);
        for (int i = 0; i < before.length; i++) {
            assertArrayEquals(copied.transformed().x()[i], inPlace.transformed().x()[i], 0.0, "row " + i);
            // the applied steps give the same numbers on a fresh copy
            assertArrayEquals(copied.transformed().x()[i], inPlace.steps().apply(shared).x()[i], 0.0, "row " + i);
        }
        if (sameArrays) {
            assertSame(owned.x()[0], inPlace.transformed().x()[0], "the owned block was transformed where it was");
        }
    }
}
