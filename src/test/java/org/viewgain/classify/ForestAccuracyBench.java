package org.viewgain.classify;

import java.util.Arrays;
import java.util.Locale;
import java.util.Map;
import org.viewgain.spec.Params;

/**
 * Accuracy of the three forests on shared folds (a benchmark main, not a test): the project's {@code random-forest},
 * Weka's RandomForest and {@code smile-random-forest}, 100 trees, sqrt(p) features per split, leaves of one row, on
 * iris (Fisher 1936) and breast-cancer-wisconsin (Wolberg, Street &amp; Mangasarian 1995), five repeats of 5-fold
 * cross-validation. Prints the mean and the repeat-to-repeat standard deviation of each.
 *
 * <p>Usage: {@code bench/test-main.sh 2g org.viewgain.classify.ForestAccuracyBench [REPEATS]}
 */
public final class ForestAccuracyBench {
    private ForestAccuracyBench() {
    }

    public static void main(String[] args) {
        int repeats = args.length > 0 ? Integer.parseInt(args[0]) : 5;
        for (String name : new String[] {"iris.csv", "breast-cancer-wisconsin.csv"}) {
            ReferenceTable table = ReferenceTable.load(name);
            int mtry = (int) Math.floor(Math.sqrt(table.rows().p()));
            ClassifierMethod ours = ClassifierRegistry.create("random-forest");
            ClassifierMethod smile = ClassifierRegistry.create("smile-random-forest");
            ClassifierMethod weka = ClassifierRegistry.create("weka", WekaClassifier.settings("weka.classifiers.trees.RandomForest", "-I 100 -K " + mtry));
            Map<String, Object> settings = Map.of("trees", 100, "min-node-size", 1, "max-depth", 1000);
            print(name, "random-forest", ours, ours.resolve(settings), table, repeats);
            print(name, "weka RandomForest", weka, weka.resolve(Map.of()), table, repeats);
            print(name, "smile-random-forest", smile, smile.resolve(settings), table, repeats);
        }
    }

    private static void print(String data, String label, ClassifierMethod m, Params params, ReferenceTable table,
                              int repeats) {
        double[] acc = new double[repeats];
        long start = System.nanoTime();
        for (int r = 0; r < repeats; r++) {
            acc[r] = Crossval.accuracy(m, params, table, 5, 100 + r);
        }
        double secs = (System.nanoTime() - start) / 1e9;
        double mean = Arrays.stream(acc).average().orElseThrow();
        double sd = Math.sqrt(Arrays.stream(acc).map(v -> (v - mean) * (v - mean)).sum() / (repeats - 1));
        System.out.printf(Locale.ROOT, "%s | %s | accuracy %.4f (sd over repeats %.4f) | %.1f s%n", data, label, mean,
                sd, secs);
    }
}
