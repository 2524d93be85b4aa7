package org.viewgain.report;

import java.util.Map;

/** The words the report uses for metrics, tests and pipelines. */
final class Names {
    private static final Map<String, String> METRICS = Map.of("balanced_accuracy", "balanced accuracy", "auc", "AUC",
            "accuracy", "accuracy", "sensitivity", "sensitivity", "specificity", "specificity", "f1", "F1", "mcc",
            "MCC", "brier", "Brier score");
    private static final Map<String, String> TESTS = Map.of("corrected-t", "corrected repeated-CV t-test",
            "mcnemar-exact", "McNemar exact test", "mcnemar-mid-p", "McNemar mid-p test", "delong", "DeLong test",
            "bayes-correlated-t", "Bayesian correlated t-test");

    private static final Map<String, String> QUANTITIES = Map.of("mean-over-folds", "mean over outer folds",
            "first-repeat-pooled", "repeat 1, pooled", "repeat-averaged-scores", "scores averaged over repeats");

    private Names() {
    }

    /** What a comparison row's estimates are of (the {@code quantity} column); empty for older run folders. */
    static String quantity(String q) {
        return QUANTITIES.getOrDefault(q, q);
    }

    static String metric(String m) {
        return METRICS.getOrDefault(m, m.replace('_', ' '));
    }

    static String test(String t) {
        return TESTS.getOrDefault(t, t);
    }

    /** "source+imputed (ridge)" or "source" when no imputer is involved. */
    static String features(String imputer, String featureSet) {
        return imputer == null || imputer.isEmpty() || imputer.equals("none") ? featureSet
                : featureSet + " (" + imputer + ")";
    }

    /** "source+imputed (ridge) · forest". */
    static String pipeline(String imputer, String featureSet, String classifier) {
        return features(imputer, featureSet) + " \u00b7 " + classifier;
    }

    /** A key for one pipeline. */
    static String key(String imputer, String featureSet, String classifier) {
        return imputer + "|" + featureSet + "|" + classifier;
    }

    static String key(CsvRows.Row r) {
        return key(r.s("imputer"), r.s("feature_set"), r.s("classifier"));
    }
}
