package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Direct tests of the comparison wiring on hand-made predictions ({@link PairedRuns}): 16 invented subjects (8
 * controls, 8 patients), 4 stratified folds of 2 + 2, so every expected value below is worked out by hand from the
 * cited formula.
 */
class ComparisonsTest {
    @TempDir
    Path dir;

    private static Comparisons.Row row(List<Comparisons.Row> rows, String comparison, String test) {
        return rows.stream().filter(r -> r.comparison().equals(comparison) && r.test().equals(test)).findFirst()
                .orElseThrow(() -> new AssertionError("no " + test + " row for " + comparison + " in " + rows));
    }

    private static void assertFoldsOfTwoAndTwo(Experiment ex) {
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                int patients = 0;
                for (int i : ex.plan().test(r, f)) {
                    patients += ex.data().y()[i];
                }
                assertEquals(4, ex.plan().test(r, f).length, "fold size");
                assertEquals(2, patients, "patients in the fold");
            }
        }
    }

    @Test
    void givenABetterInThreeFolds_whenCompared_thenSignRatioAndFirstRepeatAsComputedByHand() {
        String ab = "none/source/c1 vs none/source/c2";
        String ba = "none/source/c2 vs none/source/c1";
        Experiment ex = PairedRuns.experiment(dir, 16, 2, 4, 2,
                "{ compare: [\"" + ab + "\", \"" + ba + "\"], adjust: none, bootstrap: 0 }");
        assertFoldsOfTwoAndTwo(ex);
        // A (c1) is always right; B (c2) misses the first patient of folds 1 and 2 of repeat 1 and of fold 1 of
        // repeat 2 (0-based below), so B's balanced accuracy is (1/2 + 1)/2 = 0.75 in those folds and 1 elsewhere
        Set<String> missed = Set.of("0/0", "0/1", "1/0");
        List<RunResults.Prediction> ps = new ArrayList<>(PairedRuns.predictions(ex, PairedRuns.pipeline(1),
                (r, f, i, t) -> PairedRuns.right(t)));
        ps.addAll(PairedRuns.predictions(ex, PairedRuns.pipeline(2), (r, f, i, t) ->
                missed.contains(r + "/" + f) && i == PairedRuns.patient(ex, r, f, 0) ? PairedRuns.wrong(t)
                        : PairedRuns.right(t)));
        List<Comparisons.Row> rows = Comparisons.of(PairedRuns.results(ex, ps));

        // Corrected t-test (Nadeau & Bengio 2003; Bouckaert & Frank 2004), by hand: d = A - B per fold =
        // 0.25, 0.25, 0, 0 | 0.25, 0, 0, 0; mean 0.09375; s^2 = (3 * 0.15625^2 + 5 * 0.09375^2) / 7 = 0.1171875 / 7;
        // n_test / n_train = 4 / 12; se = sqrt((1/8 + 1/3) s^2) = 0.0875956110; t = 1.0702591020 on 7 df;
        // two-sided p = 0.320011882388631 (scipy 1.17.1, reference library)
        Comparisons.Row t = row(rows, ab, "corrected-t");
        double s2 = 0.1171875 / 7;
        double se = Math.sqrt((1.0 / 8 + 1.0 / 3) * s2);
        assertEquals(16, t.n());
        assertEquals(Comparisons.MEAN_OVER_FOLDS, t.quantity());
        assertEquals(1.0, t.estimateA(), 1e-12);
        assertEquals((5 + 3 * 0.75) / 8, t.estimateB(), 1e-12);
        assertEquals(0.09375, t.difference(), 1e-12);
        assertEquals(t.estimateA() - t.estimateB(), t.difference(), 1e-12);
        assertEquals(1.0702591020190138, t.statistic(), 1e-9);
        assertEquals(0.320011882388631, t.pValue(), 1e-9);
        // the ratio the test used, solved back from t: t^2 (1/k + ratio) s^2 = mean^2, so ratio = 4/12 = 1/3, not
        // n_test / n = 1/4 (Nadeau & Bengio 2003: the correction is n_test / n_train)
        double ratio = 0.09375 * 0.09375 / (t.statistic() * t.statistic() * s2) - 1.0 / 8;
        assertEquals(1.0 / 3, ratio, 1e-9);
        // the interval is centred on the difference the test is about: mean +/- t_{0.975, 7} se, t_{0.975, 7} =
        // 2.364624251592784 (scipy 1.17.1)
        assertEquals(0.09375 - 2.364624251592784 * se, t.ciLow(), 1e-9);
        assertEquals(0.09375 + 2.364624251592784 * se, t.ciHigh(), 1e-9);

        // Bayesian correlated t-test (Corani & Benavoli 2015): rho = n_test / (n_test + n_train) = 4/16, so the
        // scale sqrt((1/8 + rho/(1-rho)) s^2) equals the se above; P(A better) = P(T_7 > (0.01 - 0.09375) / se) =
        // 0.814565908972849 (scipy 1.17.1)
        Comparisons.Row bayes = row(rows, ab, "bayes-correlated-t");
        assertEquals(0.814565908972849, bayes.probABetter(), 1e-9);
        assertEquals(0.09375, bayes.difference(), 1e-12);
        assertEquals(1.0, bayes.probABetter() + bayes.probEquivalent() + bayes.probBBetter(), 1e-12);

        // swapping A and B flips every sign and swaps the probabilities, and leaves p alone
        Comparisons.Row tr = row(rows, ba, "corrected-t");
        assertEquals(-0.09375, tr.difference(), 1e-12);
        assertEquals(-t.statistic(), tr.statistic(), 1e-12);
        assertEquals(t.pValue(), tr.pValue(), 1e-12);
        assertEquals(-t.ciHigh(), tr.ciLow(), 1e-12);
        assertEquals(bayes.probABetter(), row(rows, ba, "bayes-correlated-t").probBBetter(), 1e-12);

        // McNemar reads repeat 1 only (0-based repeat 0): B misses 2 subjects there and A none, so b = 2, c = 0,
        // exact p = 2 * 0.5^2 = 0.5 and mid-p = 0.5 - 0.25 = 0.25 (McNemar 1947; Fagerland et al. 2013). Repeat 2
        // alone (b = 1) would give p = 1, and both repeats pooled (b = 3) 0.25.
        Comparisons.Row mc = row(rows, ab, "mcnemar-exact");
        assertEquals(Comparisons.FIRST_REPEAT_POOLED, mc.quantity());
        assertEquals(2.0, mc.statistic(), 0);
        assertEquals(0.5, mc.pValue(), 1e-12);
        assertEquals(0.25, row(rows, ab, "mcnemar-mid-p").pValue(), 1e-12);
        assertEquals(1.0, mc.estimateA(), 0);
        assertEquals(14 / 16.0, mc.estimateB(), 1e-12);
        assertEquals(0.125, mc.difference(), 1e-12);
        assertEquals(-2.0, row(rows, ba, "mcnemar-exact").statistic(), 0);
        assertEquals(-0.125, row(rows, ba, "mcnemar-exact").difference(), 1e-12);
    }

    @Test
    void givenScoresThatDifferByRepeat_whenCompared_thenDeLongUsesEachSubjectsMeanScore() {
        String ab = "none/source/c1 vs none/source/c2";
        Experiment ex = PairedRuns.experiment(dir, 16, 2, 4, 2,
                "{ compare: [\"" + ab + "\"], adjust: none, bootstrap: 0 }");
        // A: patients 0.6, controls 0.4, except patient p02 (index 1): 0.1 in repeat 1 and 0.9 in repeat 2, mean 0.5.
        // B: patients 0.6, controls 0.4, except control p01 (index 0) at 0.8 in both repeats.
        List<RunResults.Prediction> ps = new ArrayList<>(PairedRuns.predictions(ex, PairedRuns.pipeline(1),
                (r, f, i, t) -> {
                    double s = i == 1 ? (r == 0 ? 0.1 : 0.9) : t == 1 ? 0.6 : 0.4;
                    return new double[] {s > 0.5 ? 1 : 0, s};
                }));
        ps.addAll(PairedRuns.predictions(ex, PairedRuns.pipeline(2), (r, f, i, t) -> {
            double s = i == 0 ? 0.8 : t == 1 ? 0.6 : 0.4;
            return new double[] {s > 0.5 ? 1 : 0, s};
        }));
        Comparisons.Row d = row(Comparisons.of(PairedRuns.results(ex, ps)), ab, "delong");
        // DeLong et al. 1988, by hand. Mean scores: A ranks every patient above every control (p02 at 0.5 > 0.4), so
        // AUC(A) = 1 (repeat 1 alone would give 56/64 = 0.875, the mean of the repeats' AUCs 0.9375). B: each
        // patient is above 7 of 8 controls, so AUC(B) = 0.875. Placements: A's are all 1 (no variance, no
        // covariance); B's positives all 7/8 (S10 = 0), B's negatives 0 once and 1 seven times (S01 = 0.125), so
        // var(A - B) = 0.125 / 8 = 0.015625, se = 0.125, z = 1, two-sided p = 0.31731050786291415 (scipy 1.17.1).
        assertEquals(Comparisons.REPEAT_AVERAGED_SCORES, d.quantity());
        assertEquals(16, d.n());
        assertEquals(1.0, d.estimateA(), 1e-12);
        assertEquals(0.875, d.estimateB(), 1e-12);
        assertEquals(0.125, d.difference(), 1e-12);
        assertEquals(1.0, d.statistic(), 1e-12);
        assertEquals(0.31731050786291415, d.pValue(), 1e-9);
        // 95% interval 0.125 +/- 1.959963984540054 * 0.125 (normal quantile, scipy 1.17.1)
        assertEquals(0.125 - 1.959963984540054 * 0.125, d.ciLow(), 1e-9);
        assertEquals(0.125 + 1.959963984540054 * 0.125, d.ciHigh(), 1e-9);
    }

    @Test
    void givenTwoComparisons_whenHolm_thenEachTestAdjustedAcrossComparisonsOnly() {
        String ab = "none/source/c1 vs none/source/c2";
        String ac = "none/source/c1 vs none/source/c3";
        Experiment ex = PairedRuns.experiment(dir, 16, 3, 4, 2,
                "{ compare: [\"" + ab + "\", \"" + ac + "\"], adjust: holm, bootstrap: 0 }");
        assertFoldsOfTwoAndTwo(ex);
        // c1 always right. Repeat 1 (0-based 0): c2 misses the first patient of folds 0-2 (3 subjects); c3 misses
        // both patients of folds 0 and 1 and the first of fold 2 (5 subjects). Repeat 2: c2 misses every patient
        // (which McNemar must not read), c3 is right.
        List<RunResults.Prediction> ps = new ArrayList<>(PairedRuns.predictions(ex, PairedRuns.pipeline(1),
                (r, f, i, t) -> PairedRuns.right(t)));
        ps.addAll(PairedRuns.predictions(ex, PairedRuns.pipeline(2), (r, f, i, t) ->
                r == 1 && t == 1 || r == 0 && f < 3 && i == PairedRuns.patient(ex, r, f, 0) ? PairedRuns.wrong(t)
                        : PairedRuns.right(t)));
        ps.addAll(PairedRuns.predictions(ex, PairedRuns.pipeline(3), (r, f, i, t) ->
                r == 0 && (f < 2 && t == 1 || f == 2 && i == PairedRuns.patient(ex, r, f, 0)) ? PairedRuns.wrong(t)
                        : PairedRuns.right(t)));
        List<Comparisons.Row> rows = Comparisons.of(PairedRuns.results(ex, ps));
        // exact McNemar (McNemar 1947; Fagerland et al. 2013): b = 3 -> 2 * 0.5^3 = 0.25; b = 5 -> 2 * 0.5^5 =
        // 0.0625. Holm (1979): the smaller times 2 = 0.125, the larger times 1 = 0.25 (not below 0.125).
        assertEquals(0.25, row(rows, ab, "mcnemar-exact").pValue(), 1e-12);
        assertEquals(0.0625, row(rows, ac, "mcnemar-exact").pValue(), 1e-12);
        assertEquals(0.25, row(rows, ab, "mcnemar-exact").pAdjusted(), 1e-12);
        assertEquals(0.125, row(rows, ac, "mcnemar-exact").pAdjusted(), 1e-12);
        assertEquals("holm", row(rows, ab, "mcnemar-exact").adjustMethod());
        // mid-p, adjusted among the mid-p rows only: 0.25 - 0.125 = 0.125 and 0.0625 - 0.03125 = 0.03125;
        // Holm: 2 * 0.03125 = 0.0625, then max(0.0625, 0.125) = 0.125
        assertEquals(0.125, row(rows, ab, "mcnemar-mid-p").pAdjusted(), 1e-12);
        assertEquals(0.0625, row(rows, ac, "mcnemar-mid-p").pAdjusted(), 1e-12);
        // the corrected t-test rows are adjusted among themselves (Holm 1979 for two p-values, by hand)
        double p1 = row(rows, ab, "corrected-t").pValue();
        double p2 = row(rows, ac, "corrected-t").pValue();
        double lo = Math.min(1, 2 * Math.min(p1, p2));
        double hi = Math.max(lo, Math.max(p1, p2));
        assertEquals(p1 <= p2 ? lo : hi, row(rows, ab, "corrected-t").pAdjusted(), 1e-12);
        assertEquals(p1 <= p2 ? hi : lo, row(rows, ac, "corrected-t").pAdjusted(), 1e-12);
        // the Bayesian test has no p-value and is not adjusted
        assertTrue(Double.isNaN(row(rows, ab, "bayes-correlated-t").pAdjusted()));
    }
}
