package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import weka.classifiers.evaluation.Evaluation;
import weka.core.Attribute;
import weka.core.DenseInstance;
import weka.core.Instance;
import weka.core.Instances;

/**
 * Our metrics against Weka 3.8.6's {@code Evaluation} fed the same predicted class distributions (reference
 * library). Weka predicts the arg-max of each distribution, so our predicted labels are the arg-max as well.
 */
class WekaAgreementTest {
    private static final double TOL = 1e-12;

    @Test
    void givenAsahScorePredictions_whenBinaryMetrics_thenAgreeWithWekaEvaluation() throws Exception {
        List<CSVRecord> rows = ReferenceData.read("asah.csv");
        boolean[] poor = ReferenceData.asahPoor(rows);
        double[] s100b = ReferenceData.column(rows, "s100b");
        int n = rows.size();
        int[] truth = new int[n];
        int[] pred = new int[n];
        double[] score = new double[n];
        double[][] dist = new double[n][];
        for (int i = 0; i < n; i++) {
            truth[i] = poor[i] ? 1 : 0;
            // s100b has two decimals, so the threshold 0.205 is never hit exactly (no arg-max ties); ties in the
            // score remain, which exercises the half-credit rule
            score[i] = 1 / (1 + Math.exp(-10 * (s100b[i] - 0.205)));
            dist[i] = new double[] {1 - score[i], score[i]};
            pred[i] = score[i] > 0.5 ? 1 : 0;
        }
        Evaluation weka = evaluate(truth, dist, List.of("Good", "Poor"));
        Map<String, Double> ours = ClassificationMetrics.binary(truth, pred, score, 1);
        assertEquals(weka.pctCorrect() / 100, ours.get("accuracy"), TOL);
        assertEquals(weka.truePositiveRate(1), ours.get("sensitivity"), TOL);
        assertEquals(weka.trueNegativeRate(1), ours.get("specificity"), TOL);
        assertEquals(weka.fMeasure(1), ours.get("f1"), TOL);
        assertEquals(weka.matthewsCorrelationCoefficient(1), ours.get("mcc"), TOL);
        assertEquals(weka.areaUnderROC(1), ours.get("auc"), TOL);
    }

    @Test
    void givenIrisNearestMeanPredictions_whenMulticlassMetrics_thenMacroValuesAgreeWithWekaPerClassValues()
            throws Exception {
        List<CSVRecord> rows = ReferenceData.read("iris.csv");
        List<String> species = List.of("setosa", "versicolor", "virginica");
        double[] length = ReferenceData.column(rows, "petal_length");
        double[] width = ReferenceData.column(rows, "sepal_width");
        int n = rows.size();
        int[] truth = new int[n];
        double[][] mean = new double[3][2];
        for (int i = 0; i < n; i++) {
            truth[i] = species.indexOf(rows.get(i).get("species"));
            mean[truth[i]][0] += length[i] / 50;
            mean[truth[i]][1] += width[i] / 50;
        }
        // a deliberately imperfect scorer (petal length and sepal width), softmax of minus squared distance
        int[] pred = new int[n];
        double[][] dist = new double[n][3];
        for (int i = 0; i < n; i++) {
            double total = 0;
            for (int k = 0; k < 3; k++) {
                double dx = length[i] - mean[k][0];
                double dy = width[i] - mean[k][1];
                dist[i][k] = Math.exp(-(dx * dx + dy * dy));
                total += dist[i][k];
            }
            for (int k = 0; k < 3; k++) {
                dist[i][k] /= total;
                if (dist[i][k] > dist[i][pred[i]]) {
                    pred[i] = k;
                }
            }
        }
        Evaluation weka = evaluate(truth, dist, species);
        Map<String, Double> ours = ClassificationMetrics.multiclass(truth, pred, dist, 3);
        double tpr = 0;
        double tnr = 0;
        double f = 0;
        double auc = 0;
        for (int k = 0; k < 3; k++) {
            tpr += weka.truePositiveRate(k) / 3;
            tnr += weka.trueNegativeRate(k) / 3;
            f += weka.fMeasure(k) / 3;
            auc += weka.areaUnderROC(k) / 3;
        }
        assertEquals(weka.pctCorrect() / 100, ours.get("accuracy"), TOL);
        assertEquals(tpr, ours.get("sensitivity"), TOL);
        assertEquals(tpr, ours.get("balanced_accuracy"), TOL);
        assertEquals(tnr, ours.get("specificity"), TOL);
        assertEquals(f, ours.get("f1"), TOL);
        assertEquals(auc, ours.get("auc"), TOL);
        // guard: the scorer must make some errors, or the comparison would be trivial
        assertTrue(weka.pctCorrect() < 100 && weka.pctCorrect() > 60);
    }

    private static Evaluation evaluate(int[] truth, double[][] dist, List<String> classes) throws Exception {
        ArrayList<Attribute> attributes = new ArrayList<>();
        attributes.add(new Attribute("row"));
        attributes.add(new Attribute("class", new ArrayList<>(classes)));
        Instances data = new Instances("predictions", attributes, truth.length);
        data.setClassIndex(1);
        for (int i = 0; i < truth.length; i++) {
            Instance row = new DenseInstance(1.0, new double[] {i, truth[i]});
            row.setDataset(data);
            data.add(row);
        }
        Evaluation evaluation = new Evaluation(data);
        for (int i = 0; i < truth.length; i++) {
            evaluation.evaluateModelOnceAndRecordPrediction(dist[i], data.instance(i));
        }
        return evaluation;
    }
}
