package org.viewgain.engine;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.SpecLoader;

/**
 * Hand-made run results for direct tests of {@link Comparisons} and {@link MetricIntervals}: an invented cohort of
 * {@code n} subjects (groups alternate control, patient; no site), a checked experiment over it, and predictions
 * written by the test instead of by classifiers, so that every expected value can be worked out by hand.
 */
final class PairedRuns {
    private PairedRuns() {
    }

    /** An experiment of n subjects with knn classifiers {@code c1..c<classifiers>} on source; nothing is fitted. */
    static Experiment experiment(Path dir, int n, int classifiers, int folds, int repeats, String significance) {
        return experiment(dir, n, java.util.Collections.nCopies(classifiers, "knn, fixed: { k: 3 }"), folds, repeats,
                significance);
    }

    /**
     * The same with classifier {@code c<k>} of the k-th method and its settings, e.g. {@code svm-linear} or
     * {@code knn, fixed: { k: 3 }}.
     */
    static Experiment experiment(Path dir, int n, List<String> methods, int folds, int repeats, String significance) {
        try {
            Files.createDirectories(dir);
            StringBuilder subjects = new StringBuilder("subject,group\n");
            StringBuilder source = new StringBuilder("subject,x1,x2\n");
            for (int i = 0; i < n; i++) {
                String id = String.format(Locale.ROOT, "p%02d", i + 1);
                subjects.append(id).append(',').append(i % 2 == 1 ? "patient" : "control").append('\n');
                source.append(id).append(',').append(i % 7).append(',').append((i * 3) % 5).append('\n');
            }
            Files.writeString(dir.resolve("subjects.csv"), subjects);
            Files.writeString(dir.resolve("source.csv"), source);
            StringBuilder cl = new StringBuilder("classifiers:\n");
            for (int c = 1; c <= methods.size(); c++) {
                cl.append("  - { name: c").append(c).append(", method: ").append(methods.get(c - 1)).append(" }\n");
            }
            String text = """
                    experiment: paired
                    seed: 5
                    cohort: { subjects: subjects.csv, groups: [control, patient], positive: patient }
                    views:
                      source: { table: source.csv }
                    feature-sets: [source]
                    """ + cl + """
                    validation: { outer: { folds: %d, repeats: %d }, inner: { folds: 2 } }
                    significance: %s
                    """.formatted(folds, repeats, significance);
            return Setup.prepare(SpecLoader.load(Files.writeString(dir.resolve("spec.yaml"), text)));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    static Pipeline pipeline(int classifier) {
        return new Pipeline(Pipeline.NO_IMPUTER, FeatureSet.SOURCE, "c" + classifier);
    }

    /** Decides one prediction of a pipeline: the predicted group and the positive group's score. */
    interface Rule {
        double[] predict(int repeat, int fold, int subject, int truth);
    }

    /** Predictions of every subject in every repeat for the given pipeline, from the rule. */
    static List<RunResults.Prediction> predictions(Experiment ex, Pipeline p, Rule rule) {
        List<RunResults.Prediction> out = new ArrayList<>();
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                for (int i : ex.plan().test(r, f)) {
                    int truth = ex.data().y()[i];
                    double[] v = rule.predict(r, f, i, truth);
                    out.add(new RunResults.Prediction(p, r, f, i, truth, (int) v[0], v[1],
                            new double[] {1 - v[1], v[1]}));
                }
            }
        }
        return out;
    }

    /** Always right, with score 0.9 for patients and 0.1 for controls. */
    static double[] right(int truth) {
        return new double[] {truth, truth == 1 ? 0.9 : 0.1};
    }

    /** Always wrong, with score 0.1 for patients and 0.9 for controls. */
    static double[] wrong(int truth) {
        return new double[] {1 - truth, truth == 1 ? 0.1 : 0.9};
    }

    static RunResults results(Experiment ex, List<RunResults.Prediction> predictions) {
        return new RunResults(ex, ex.plan(), predictions, List.of(), List.of(), List.of(), List.of(), List.of(),
                Map.of());
    }

    /** The k-th patient (truth 1) of a test fold, in fold order; -1 when there is none. */
    static int patient(Experiment ex, int repeat, int fold, int k) {
        int seen = 0;
        for (int i : ex.plan().test(repeat, fold)) {
            if (ex.data().y()[i] == 1 && seen++ == k) {
                return i;
            }
        }
        return -1;
    }
}
