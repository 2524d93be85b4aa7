package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;

class CalibrationTest {
    // statsmodels' IRLS and scikit-learn's newton-cg were run to 1e-14 and agree to 1e-15 (generate.py asserts 1e-7);
    // ours stops at a relative step of 1e-10, so 1e-8 is comfortably above both solvers' error
    private static final double LIBRARY_TOL = 1e-8;

    @Test
    void givenTinyTable_whenOf_thenBrierIsTheHandComputedMeanSquare() {
        // hand computation: (0.1^2 + 0.2^2 + 0.4^2 + 0.5^2) / 4 = (0.01 + 0.04 + 0.16 + 0.25) / 4 = 0.115
        Calibration c = Calibration.of(new boolean[] {true, false, true, false}, new double[] {0.9, 0.2, 0.6, 0.5});
        assertEquals(4, c.n());
        assertEquals(0.115, c.brier(), 1e-15);
    }

    @Test
    void givenTheScikitLearnBrierExample_whenOf_thenItsValue() {
        // scikit-learn documentation, brier_score_loss example (from memory; checked by hand):
        // y = [0, 1, 1, 0], p = [0.1, 0.9, 0.8, 0.3] -> (0.01 + 0.01 + 0.04 + 0.09) / 4 = 0.0375
        Calibration c = Calibration.of(new boolean[] {false, true, true, false}, new double[] {0.1, 0.9, 0.8, 0.3});
        assertEquals(0.0375, c.brier(), 1e-15);
    }

    @Test
    void givenPerfectlyCalibratedGroups_whenOf_thenInterceptZeroAndSlopeOne() {
        // ten subjects at each p = k/10 (k = 1..9), exactly k of them positive: the score equations of both models,
        // sum(y - p) = 0 and sum((y - p) logit p) = 0, hold at intercept 0 and slope 1 (hand derivation, exact)
        Table t = table(p -> p);
        Calibration c = Calibration.of(t.positive, t.probability);
        assertEquals(90, c.n());
        assertEquals(0, c.intercept(), 1e-12);
        assertEquals(1, c.slope(), 1e-10);
        // Brier of a calibrated table = mean p(1 - p) = sum_k 0.1 k/10 (1 - k/10) / 0.9 = (4.5 - 2.85) / 9 (by hand)
        assertEquals((4.5 - 2.85) / 9, c.brier(), 1e-12);
    }

    @Test
    void givenCalibratedTableMadeTooExtreme_whenOf_thenSlopeIsTheKnownFactor() {
        // observed rates q = k/10 and predictions p with logit q = 0.3 + 0.5 logit p: the logistic model of y on
        // logit p fits the group rates exactly, so its MLE is (0.3, 0.5) (hand derivation); slope below 1 = too extreme
        Table t = table(q -> sigmoid((logit(q) - 0.3) / 0.5));
        Calibration c = Calibration.of(t.positive, t.probability);
        assertEquals(0.5, c.slope(), 1e-9);
        assertTrue(c.intercept() > 0, "rates at p = 0.5 are above 0.5, so the risks are too low on average");
    }

    @Test
    void givenConstantProbability_whenOf_thenInterceptInClosedFormAndSlopeNaN() {
        boolean[] y = {true, false, false, false, true};
        double[] p = {0.2, 0.2, 0.2, 0.2, 0.2};
        Calibration c = Calibration.of(y, p);
        // offset-only model with constant offset: a = logit(mean y) - logit(p) = logit(0.4) - logit(0.2) (by hand)
        assertEquals(logit(0.4) - logit(0.2), c.intercept(), 1e-12);
        assertTrue(Double.isNaN(c.slope()));
        // the same with p = 0: logit is taken at the clipped value EPSILON
        Calibration zero = Calibration.of(y, new double[5]);
        assertEquals(logit(0.4) - logit(Calibration.EPSILON), zero.intercept(), 1e-9);
        assertEquals(0.4, zero.brier(), 1e-15);
    }

    @Test
    void givenOneGroupOnly_whenOf_thenBrierDefinedAndLogisticValuesNaN() {
        Calibration c = Calibration.of(new boolean[] {false, false, false}, new double[] {0.1, 0.3, 0.2});
        assertEquals((0.01 + 0.09 + 0.04) / 3, c.brier(), 1e-15);
        assertTrue(Double.isNaN(c.intercept()));
        assertTrue(Double.isNaN(c.slope()));
    }

    @Test
    void givenSeparatedOrQuasiSeparatedProbabilities_whenOf_thenSlopeNaNAndInterceptFinite() {
        Calibration complete = Calibration.of(new boolean[] {false, false, true, true},
                new double[] {0.1, 0.3, 0.4, 0.8});
        assertTrue(Double.isNaN(complete.slope()));
        assertTrue(Double.isFinite(complete.intercept()));
        // quasi-complete: one negative and one positive share the boundary value (Albert & Anderson 1984)
        Calibration quasi = Calibration.of(new boolean[] {false, false, true, true},
                new double[] {0.1, 0.4, 0.4, 0.8});
        assertTrue(Double.isNaN(quasi.slope()));
        // reversed order (positives below negatives) separates as well
        Calibration reversed = Calibration.of(new boolean[] {true, true, false, false},
                new double[] {0.1, 0.3, 0.4, 0.8});
        assertTrue(Double.isNaN(reversed.slope()));
        // one overlapping pair is enough for a finite slope
        Calibration overlap = Calibration.of(new boolean[] {false, true, false, true},
                new double[] {0.1, 0.3, 0.4, 0.8});
        assertTrue(Double.isFinite(overlap.slope()));
    }

    @Test
    void givenNoSubjectsOrInvalidProbability_whenOf_thenAllNaNWithoutException() {
        Calibration empty = Calibration.of(new boolean[0], new double[0]);
        assertEquals(0, empty.n());
        assertTrue(Double.isNaN(empty.brier()));
        Calibration missing = Calibration.of(new boolean[] {true, false}, new double[] {Double.NaN, 0.5});
        assertTrue(Double.isNaN(missing.brier()) && Double.isNaN(missing.intercept()) && Double.isNaN(missing.slope()));
        Calibration outside = Calibration.of(new boolean[] {true, false}, new double[] {1.5, 0.5});
        assertTrue(Double.isNaN(outside.brier()));
        assertThrows(IllegalArgumentException.class, () -> Calibration.of(new boolean[2], new double[3]));
    }

    @Test
    void givenAsahWfnsAsProbability_whenOf_thenMatchesScikitLearnAndStatsmodels() {
        // aSAH (Turck et al. 2010, Intensive Care Med 36:107-115, via pROC 1.18.0), Poor outcome, p = (wfns - 0.5)/5;
        // reference values: scikit-learn 1.9.1 brier_score_loss, statsmodels 0.15.0 GLM Binomial (slope; intercept
        // with logit p as offset), scikit-learn LogisticRegression(C=inf); src/test/resources/calibration/generate.py
        List<CSVRecord> rows = ReferenceData.read("asah.csv");
        double[] p = ReferenceData.column(rows, "wfns");
        for (int i = 0; i < p.length; i++) {
            p[i] = (p[i] - 0.5) / 5;
        }
        checkAgainstReference("asah", ReferenceData.asahPoor(rows), p);
    }

    @Test
    void givenWdbcHeldOutLogisticProbabilities_whenOf_thenMatchesScikitLearnAndStatsmodels() {
        // WDBC (Wolberg, Street & Mangasarian 1995, UCI, CC BY 4.0): probabilities of an over-regularised scikit-learn
        // logistic model on 469 held-out rows (generate.py), so the slope is far above 1 (predictions too modest)
        List<CSVRecord> rows = resourceCsv("wdbc-probabilities.csv");
        boolean[] y = new boolean[rows.size()];
        double[] p = new double[rows.size()];
        for (int i = 0; i < y.length; i++) {
            y[i] = Boolean.parseBoolean(rows.get(i).get("malignant"));
            p[i] = Double.parseDouble(rows.get(i).get("probability"));
        }
        checkAgainstReference("wdbc", y, p);
    }

    @Test
    void givenProbabilitiesOfExactlyZeroAndOneInBothGroups_whenOf_thenClippedFitMatchesStatsmodels() {
        // generate.py's "clipped" table: p = 0 and p = 1 on a positive and a negative each, so the logit is taken at
        // the clipped 1e-6 and 1 - 1e-6 (about -13.8 and 13.8); statsmodels 0.15.0 / scikit-learn 1.9.1 on the same
        // clipped logits give a slope near 0 (0.0065): the confident mistakes dominate
        boolean[] y = {true, false, true, false, true, false, true, false, true, false};
        double[] p = {1.0, 1.0, 0.9, 0.6, 0.7, 0.3, 0.2, 0.4, 0.0, 0.0};
        checkAgainstReference("clipped", y, p);
        // the Brier score uses p unclipped (by hand): (0 + 1 + 0.01 + 0.36 + 0.09 + 0.09 + 0.64 + 0.16 + 1 + 0) / 10
        assertEquals(0.335, Calibration.of(y, p).brier(), 1e-15);
    }

    @Test
    void givenReliabilityBins_whenComparedWithScikitLearnCalibrationCurve_thenNonEmptyBinsAgree() {
        List<CSVRecord> rows = resourceCsv("wdbc-probabilities.csv");
        boolean[] y = new boolean[rows.size()];
        double[] p = new double[rows.size()];
        for (int i = 0; i < y.length; i++) {
            y[i] = Boolean.parseBoolean(rows.get(i).get("malignant"));
            p[i] = Double.parseDouble(rows.get(i).get("probability"));
        }
        List<Calibration.ReliabilityBin> bins = Calibration.reliability(y, p, 10);
        assertEquals(10, bins.size());
        // scikit-learn 1.9.1 calibration_curve(strategy="uniform", n_bins=10) lists the non-empty bins only
        Map<String, Double> ref = reference("wdbc");
        int k = 0;
        int total = 0;
        for (Calibration.ReliabilityBin b : bins) {
            total += b.n();
            if (b.n() == 0) {
                assertTrue(Double.isNaN(b.meanPredicted()) && Double.isNaN(b.observedRate()));
                continue;
            }
            assertEquals(ref.get("reliability_" + k + "_observed"), b.observedRate(), 1e-12);
            assertEquals(ref.get("reliability_" + k + "_predicted"), b.meanPredicted(), 1e-12);
            k++;
        }
        assertEquals(total, y.length);
        assertEquals(k, ref.keySet().stream().filter(q -> q.endsWith("_observed")).count());
    }

    @Test
    void givenScoresInTwoBins_whenReliability_thenHandComputedMeansAndFractions() {
        // by hand: bin [0.1, 0.2) holds 0.1 and 0.15 (one positive), bin [0.9, 1] holds 0.9 and 1.0 (both positive)
        List<Calibration.ReliabilityBin> bins = Calibration.reliability(new boolean[] {false, true, true, true},
                new double[] {0.1, 0.15, 0.9, 1.0}, 10);
        assertEquals(2, bins.get(1).n());
        assertEquals(0.125, bins.get(1).meanPredicted(), 1e-15);
        assertEquals(0.5, bins.get(1).observedRate(), 0);
        assertEquals(0.95, bins.get(9).meanPredicted(), 1e-15);
        assertEquals(1.0, bins.get(9).observedRate(), 0);
        assertEquals(4, bins.stream().mapToInt(Calibration.ReliabilityBin::n).sum());
    }

    @Test
    void givenProbabilitiesOnEdges_whenReliability_thenLowerEdgeInclusiveAndOneInLastBin() {
        List<Calibration.ReliabilityBin> bins = Calibration.reliability(new boolean[] {true, false, true, false},
                new double[] {0.0, 0.3, 1.0, 0.99}, 10);
        assertEquals(1, bins.get(0).n());
        assertEquals(0, bins.get(2).n());
        assertEquals(1, bins.get(3).n());
        assertEquals(0.3, bins.get(3).lower(), 0);
        assertEquals(2, bins.get(9).n());
        assertEquals(0.995, bins.get(9).meanPredicted(), 1e-15);
        assertEquals(0.5, bins.get(9).observedRate(), 0);
        assertEquals(1.0, bins.get(9).upper(), 0);
        assertThrows(IllegalArgumentException.class,
                () -> Calibration.reliability(new boolean[1], new double[] {Double.NaN}, 10));
        assertThrows(IllegalArgumentException.class, () -> Calibration.reliability(new boolean[1], new double[1], 0));
    }

    private static void checkAgainstReference(String name, boolean[] y, double[] p) {
        Map<String, Double> ref = reference(name);
        Calibration c = Calibration.of(y, p);
        assertEquals(ref.get("n").intValue(), c.n());
        // the Brier score is a plain mean: agreement to rounding
        assertEquals(ref.get("brier"), c.brier(), 1e-14);
        assertEquals(ref.get("slope"), c.slope(), LIBRARY_TOL);
        assertEquals(ref.get("slope_sklearn"), c.slope(), LIBRARY_TOL);
        assertEquals(ref.get("intercept"), c.intercept(), LIBRARY_TOL);
    }

    private static Map<String, Double> reference(String name) {
        Map<String, Double> out = new LinkedHashMap<>();
        for (CSVRecord r : resourceCsv("reference-values.csv")) {
            if (r.get("case").equals(name)) {
                out.put(r.get("quantity"), Double.parseDouble(r.get("value")));
            }
        }
        assertTrue(out.containsKey("brier"), "reference values of " + name);
        return out;
    }

    private static List<CSVRecord> resourceCsv(String file) {
        try (InputStream in = CalibrationTest.class.getResourceAsStream("/calibration/" + file)) {
            String text = new String(in.readAllBytes(), StandardCharsets.UTF_8);
            StringBuilder body = new StringBuilder();
            for (String line : text.split("\n")) {
                if (!line.startsWith("#")) {
                    body.append(line).append('\n');
                }
            }
            return new ArrayList<>(org.apache.commons.csv.CSVFormat.DEFAULT.builder().setHeader()
                    .setSkipHeaderRecord(true).get().parse(new java.io.StringReader(body.toString())).getRecords());
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    /** Ten subjects at each rate q = k/10 (k = 1..9), k of them positive, predicted {@code f(q)}. */
    private static Table table(java.util.function.DoubleUnaryOperator f) {
        boolean[] y = new boolean[90];
        double[] p = new double[90];
        for (int k = 1; k <= 9; k++) {
            for (int j = 0; j < 10; j++) {
                int i = (k - 1) * 10 + j;
                y[i] = j < k;
                p[i] = f.applyAsDouble(k / 10.0);
            }
        }
        return new Table(y, p);
    }

    private record Table(boolean[] positive, double[] probability) {
    }

    private static double logit(double p) {
        return Math.log(p / (1 - p));
    }

    private static double sigmoid(double x) {
        return 1 / (1 + Math.exp(-x));
    }
}
