package org.viewgain.engine;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * What the models used, per pipeline: how often each feature was selected over the outer folds and repeats, and the
 * importance the final model of each outer fold gave each feature, averaged over all outer folds and repeats (a
 * feature a fold did not select counts 0 there). Features are named as in the data, with the view they come from.
 */
public final class Importance {
    /** Kind of the selection-frequency rows. */
    public static final String SELECTION_FREQUENCY = "selection_frequency";

    private Importance() {
    }

    /**
     * What the final model of one outer fold (observed labels) used.
     *
     * @param selected   whether a selection step chose {@code inputNames}; otherwise they are all features
     * @param inputNames the classifier's input features (prefixed names such as {@code source:R1~R2})
     * @param values     the model's importance per input feature, or null when the method gives none
     * @param kind       what {@code values} measure (e.g. {@code impurity}, {@code abs_weight}), or null
     */
    public record Fold(Pipeline pipeline, int repeat, int fold, boolean selected, List<String> inputNames,
                       double[] values, String kind) {
        public Fold {
            inputNames = List.copyOf(inputNames);
            if (values != null && values.length != inputNames.size()) {
                throw new IllegalArgumentException(values.length + " importance values for " + inputNames.size()
                        + " features");
            }
        }
    }

    /** One row of importance.csv. */
    public record Row(Pipeline pipeline, String feature, String view, String kind, double value) {
    }

    /**
     * The rows of every pipeline, in pipeline order, selection frequency first, features in column order. Features
     * never selected are left out (their frequency and importance are 0).
     */
    public static List<Row> rows(Experiment ex, List<Fold> folds) {
        List<Row> out = new ArrayList<>();
        for (Pipeline p : ex.pipelines()) {
            List<Fold> mine = folds.stream().filter(f -> f != null && f.pipeline().equals(p)).toList();
            if (mine.isEmpty()) {
                continue;
            }
            List<String> names = ex.data().featureNames(p.featureSet());
            Map<String, Integer> column = new HashMap<>();
            for (int j = 0; j < names.size(); j++) {
                column.put(names.get(j), j);
            }
            int[] chosen = new int[names.size()];
            double[] sum = new double[names.size()];
            String kind = mine.get(0).kind();
            boolean model = kind != null;
            boolean selects = false;
            for (Fold f : mine) {
                selects |= f.selected();
                model &= f.values() != null && Objects.equals(kind, f.kind());
                for (int k = 0; k < f.inputNames().size(); k++) {
                    int j = column.get(f.inputNames().get(k));
                    chosen[j]++;
                    if (f.values() != null) {
                        sum[j] += f.values()[k];
                    }
                }
            }
            if (selects) {
                add(out, p, names, chosen, SELECTION_FREQUENCY,
                        java.util.Arrays.stream(chosen).asDoubleStream().toArray(), mine.size());
            }
            if (model) {
                add(out, p, names, chosen, kind, sum, mine.size());
            }
        }
        return out;
    }

    private static void add(List<Row> out, Pipeline p, List<String> names, int[] chosen, String kind, double[] sum,
                            int folds) {
        for (int j = 0; j < names.size(); j++) {
            if (chosen[j] > 0) {
                out.add(row(p, names.get(j), kind, sum[j] / folds));
            }
        }
    }

    private static Row row(Pipeline p, String prefixed, String kind, double value) {
        int colon = prefixed.indexOf(':');
        return new Row(p, prefixed.substring(colon + 1), prefixed.substring(0, colon), kind, value);
    }
}
