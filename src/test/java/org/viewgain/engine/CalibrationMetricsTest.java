package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The calibration rows of metrics.csv ({@link CalibrationMetrics} through {@link Evaluation#metrics}) on hand-made
 * predictions of invented subjects ({@link PairedRuns}), with every expected value worked out by hand.
 */
class CalibrationMetricsTest {
    @TempDir
    Path dir;

    /**
     * 40 subjects, 20 patients (odd positions). Low stratum: the 5 patients and the 15 controls at positions below 30
     * (patients below 10); high stratum: the other 15 patients and 5 controls. Repeat 1 predicts 0.25 / 0.75, the
     * strata's observed rates (calibrated); repeat 2 predicts 0.1 / 0.9 (too extreme).
     */
    private static double[] stratified(int repeat, int subject, int truth) {
        boolean low = truth == 1 ? subject < 10 : subject < 30;
        double p = repeat == 0 ? (low ? 0.25 : 0.75) : (low ? 0.1 : 0.9);
        return new double[] {p > 0.5 ? 1 : 0, p};
    }

    @Test
    void givenCalibratedThenTooExtremeRepeat_whenMetrics_thenRepeatMeansOfHandComputedValues() {
        Experiment ex = PairedRuns.experiment(dir, 40, 1, 5, 2, "{ compare: [], bootstrap: 200 }");
        Pipeline p = PairedRuns.pipeline(1);
        Map<String, Evaluation.MetricRow> rows = calibrationRows(ex, PairedRuns.predictions(ex, p,
                (r, f, i, t) -> stratified(r, i, t)), p);
        assertEquals(Evaluation.CALIBRATION, List.copyOf(rows.keySet()));
        // by hand: repeat 1 Brier (5 * 0.75^2 + 15 * 0.25^2) * 2 / 40 = 0.1875; repeat 2 (5 * 0.9^2 + 15 * 0.1^2) * 2
        // / 40 = 0.21; mean 0.19875, SD over the two repeats 0.0225 / sqrt 2
        Evaluation.MetricRow brier = rows.get("brier");
        assertEquals(0.19875, brier.estimate(), 1e-12);
        assertEquals(0.0225 / Math.sqrt(2), brier.sdOverRepeats(), 1e-12);
        assertEquals(2, brier.repeats());
        assertEquals(40, brier.n());
        // repeat 1 is calibrated: intercept 0, slope 1 (the score equations hold there); repeat 2: the two strata's
        // rates satisfy logit q = b logit p with b = ln 3 / ln 9 = 0.5 exactly, and by symmetry both intercepts are 0
        assertEquals(0, rows.get("calibration_intercept").estimate(), 1e-9);
        assertEquals(0.75, rows.get("calibration_slope").estimate(), 1e-9);
        assertEquals(0.5 / Math.sqrt(2), rows.get("calibration_slope").sdOverRepeats(), 1e-9);
        for (String m : List.of("brier", "calibration_intercept")) {
            Evaluation.MetricRow r = rows.get(m);
            assertEquals("bootstrap", r.ciMethod(), r.metric());
            assertTrue(r.ciLow() <= r.estimate() && r.estimate() <= r.ciHigh(), r.toString());
            assertTrue(r.ciLow() < r.ciHigh(), "a resampled cohort varies: " + r);
        }
        // with two predicted values, a resample that draws no low-stratum patient (chance 0.75^20 = 0.3% per repeat)
        // puts every patient at or above every control: quasi-complete separation, an infinite slope. Such resamples
        // occur among 200 (about 1% each), so the slope gets no interval rather than one that leaves them out.
        assertTrue(Double.isNaN(rows.get("calibration_slope").ciLow()));
        assertEquals("", rows.get("calibration_slope").ciMethod());
    }

    @Test
    void givenScoresThatSeparateTheGroups_whenMetrics_thenSlopeBlankWithoutIntervalAndBrierDefined() {
        Experiment ex = PairedRuns.experiment(dir, 20, 1, 4, 1, "{ compare: [], bootstrap: 100 }");
        Pipeline p = PairedRuns.pipeline(1);
        Map<String, Evaluation.MetricRow> rows = calibrationRows(ex, PairedRuns.predictions(ex, p,
                (r, f, i, t) -> PairedRuns.right(t)), p);
        // every patient 0.9, every control 0.1: Brier 0.01 by hand; the slope's estimate is infinite (separation)
        assertEquals(0.01, rows.get("brier").estimate(), 1e-15);
        assertTrue(Double.isNaN(rows.get("calibration_slope").estimate()));
        assertTrue(Double.isNaN(rows.get("calibration_slope").ciLow()));
        assertEquals("", rows.get("calibration_slope").ciMethod());
        // the intercept stays defined: with logit p as offset, 10 patients at 0.9 and 10 controls at 0.1, the score
        // equation sum(y - sigmoid(a + logit p)) = 10 * 0.1 - 10 * 0.1 = 0 holds at a = 0 (by hand)
        assertEquals(0, rows.get("calibration_intercept").estimate(), 1e-9);
    }

    @Test
    void givenDecisionValueAndProbabilityClassifiers_whenMetrics_thenOnlyProbabilitiesGetCalibrationRowsFilled() {
        Experiment ex = PairedRuns.experiment(dir, 40, List.of("knn, fixed: { k: 3 }", "svm-linear"), 4, 1,
                "{ compare: [], bootstrap: 0 }");
        Pipeline knn = PairedRuns.pipeline(1);
        Pipeline svm = PairedRuns.pipeline(2);
        List<RunResults.Prediction> all = new ArrayList<>(PairedRuns.predictions(ex, knn,
                (r, f, i, t) -> stratified(r, i, t)));
        // a margin, as svm-linear gives: not a probability, so calibration is not computed from it
        all.addAll(PairedRuns.predictions(ex, svm, (r, f, i, t) -> new double[] {t, t == 1 ? 1.3 : -0.7}));
        List<Evaluation.MetricRow> rows = Evaluation.metrics(PairedRuns.results(ex, all));
        for (String m : Evaluation.CALIBRATION) {
            Evaluation.MetricRow k = find(rows, knn, m);
            Evaluation.MetricRow s = find(rows, svm, m);
            assertFalse(Double.isNaN(k.estimate()), m);
            assertTrue(Double.isNaN(s.estimate()) && Double.isNaN(s.sdOverRepeats()) && Double.isNaN(s.ciLow()), m);
            assertEquals(40, s.n());
            // no bootstrap replicates: no interval, as for the other bootstrapped metrics
            assertTrue(Double.isNaN(k.ciLow()) && k.ciMethod().isEmpty(), m);
        }
        assertTrue(CalibrationMetrics.applies(ex, knn));
        assertFalse(CalibrationMetrics.applies(ex, svm));
        // the calibration rows follow the classification metrics of each pipeline
        List<String> knnOrder = rows.stream().filter(r -> r.pipeline().equals(knn)).map(Evaluation.MetricRow::metric)
                .toList();
        assertEquals(List.of("accuracy", "balanced_accuracy", "sensitivity", "specificity", "auc", "f1", "mcc",
                "brier", "calibration_intercept", "calibration_slope"), knnOrder);
    }

    private static Map<String, Evaluation.MetricRow> calibrationRows(Experiment ex,
                                                                     List<RunResults.Prediction> predictions,
                                                                     Pipeline p) {
        return Evaluation.metrics(PairedRuns.results(ex, predictions)).stream()
                .filter(r -> r.pipeline().equals(p) && Evaluation.CALIBRATION.contains(r.metric()))
                .collect(Collectors.toMap(Evaluation.MetricRow::metric, r -> r, (a, b) -> a,
                        java.util.LinkedHashMap::new));
    }

    private static Evaluation.MetricRow find(List<Evaluation.MetricRow> rows, Pipeline p, String metric) {
        return rows.stream().filter(r -> r.pipeline().equals(p) && r.metric().equals(metric)).findFirst()
                .orElseThrow();
    }

    @Test
    void givenOneTestSet_whenExternalRows_thenHandBrierAndStatsmodelsRecalibration() {
        // an independent cohort is one test set: the values on its predictions, not a mean over repeats. Brier by
        // hand: 0.1475. Intercept (outcome on logit(p) as offset) and slope (outcome on logit(p)): statsmodels 0.15.0
        // GLM Binomial fitted to tol 1e-12 on these 12 predictions gave -0.316486312348 and 1.712488455111
        double[] prob = {0.9, 0.8, 0.7, 0.65, 0.4, 0.35, 0.3, 0.2, 0.15, 0.6, 0.55, 0.1};
        int[] truth = {1, 1, 0, 1, 1, 0, 0, 0, 0, 1, 0, 0};
        Pipeline p = new Pipeline("ridge", org.viewgain.spec.FeatureSet.SOURCE_IMPUTED, "forest");
        IndependentResults.Settings s = new IndependentResults.Settings(List.of("control", "patient"), "patient",
                new org.viewgain.spec.Specs.Significance(0, 0, org.viewgain.spec.Specs.Metric.BALANCED_ACCURACY, 0.05, List.of(), org.viewgain.spec.Specs.Adjustment.NONE, 0.01,
                        300, 0.95), 7L, java.util.Set.of("forest"));
        List<IndependentResults.Metric> rows = CalibrationMetrics.external(p, truth, prob, s, 12);
        assertEquals(CalibrationMetrics.NAMES, rows.stream().map(IndependentResults.Metric::metric).toList());
        assertEquals(0.1475, rows.get(0).estimate(), 1e-12);
        assertEquals(-0.316486312348, rows.get(1).estimate(), 1e-8);
        assertEquals(1.712488455111, rows.get(2).estimate(), 1e-8);
        IndependentResults.Metric brier = rows.get(0);
        assertEquals("bootstrap", brier.method());
        assertTrue(brier.low() < 0.1475 && 0.1475 < brier.high(), brier.toString());
        // the same bootstrap seed gives the same interval
        assertEquals(brier, CalibrationMetrics.external(p, truth, prob, s, 12).get(0));
        // decision values (or labels only): the rows are there, blank
        for (IndependentResults.Metric m : CalibrationMetrics.external(p, truth, null, s, 12)) {
            assertTrue(Double.isNaN(m.estimate()) && m.method().isEmpty(), m.toString());
        }
    }
}
