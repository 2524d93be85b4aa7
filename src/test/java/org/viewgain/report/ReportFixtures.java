package org.viewgain.report;

import org.viewgain.testing.CliRunner;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.stream.Stream;
import org.viewgain.testing.TestCohorts;

/**
 * A small real run made through the command line on an invented cohort, and hand-written optional tables
 * (comparisons, permutations, separation, ...) in the schemas other parts of viewgain write.
 */
final class ReportFixtures {
    private ReportFixtures() {
    }

    record Outcome(int code, String out, String err) {
    }

    /** Runs the command line with captured output. */
    static Outcome cli(String... args) {
        CliRunner.Outcome o = CliRunner.run(args);
        return new Outcome(o.code(), o.out(), o.err());
    }

    /** A finished run of a 40-subject invented cohort (two classifiers, one imputer); returns its run folder. */
    static Path run(Path dir) throws IOException {
        TestCohorts.synthetic(dir, 40, 6, 5, 1.5, 0.3, 23);
        Path spec = TestCohorts.spec(dir, """
                imputers:
                  - { name: ridge, method: ridge, grid: { alpha: [1, 10] } }
                feature-sets: [source, target, source+imputed]
                classifiers:
                  - { name: forest, method: random-forest, fixed: { trees: 15 } }
                  - { name: svm, method: svm-linear, grid: { C: [0.1, 1] } }
                validation: { outer: { folds: 3, repeats: 2 }, inner: { folds: 2 } }
                """);
        Outcome o = cli("run", spec.toString(), "--out", dir.resolve("results").toString(), "--threads", "1",
                "--quiet");
        if (o.code() != 0) {
            throw new IllegalStateException("fixture run failed: " + o.err());
        }
        try (Stream<Path> s = Files.list(dir.resolve("results").resolve("synthetic"))) {
            return s.findFirst().orElseThrow();
        }
    }

    /** Copies a run folder (so each test can add or remove tables on its own copy). */
    static Path copy(Path run, Path to) throws IOException {
        Files.createDirectories(to);
        try (Stream<Path> s = Files.list(run)) {
            for (Path f : s.toList()) {
                Files.copy(f, to.resolve(f.getFileName()));
            }
        }
        return to;
    }

    /** Subject ids of a run in folds.csv order. */
    static List<String> ids(Path run) throws IOException {
        Set<String> ids = new LinkedHashSet<>();
        CsvRows.readIfPresent(run, "folds.csv").rows().forEach(r -> ids.add(r.s("subject")));
        return new ArrayList<>(ids);
    }

    /**
     * Writes comparisons.csv for source+imputed vs source per classifier with B's estimates from metrics.csv, A's
     * 0.05 above them, and invented test results, one row per test; p-values span both display formats (decimals and e-notation).
     */
    static void comparisons(Path run) throws IOException {
        CsvRows m = CsvRows.readIfPresent(run, "metrics.csv");
        StringBuilder b = new StringBuilder("comparison,imputer_a,feature_set_a,classifier_a,imputer_b,feature_set_b,"
                + "classifier_b,n,test,metric,quantity,estimate_a,estimate_b,difference,ci_low,ci_high,statistic,p_value,"
                + "p_adjusted,adjust_method,prob_a_better,prob_equivalent,prob_b_better,rope\n");
        int k = 0;
        for (String c : List.of("forest", "svm")) {
            for (String[] t : new String[][] {{"corrected-t", "balanced_accuracy"}, {"delong", "auc"},
                {"mcnemar-exact", "accuracy"}, {"bayes-correlated-t", "balanced_accuracy"}}) {
                double s = estimate(m, "none", "source", c, t[1]);
                // A is planted 0.05 above B's real estimate, so that every invented verdict has a direction
                double a = s + 0.05;
                double p = k == 0 ? 0.00042 : 0.0371 * (k + 1);
                String quantity = t[0].equals("delong") ? "repeat-averaged-scores" : t[0].equals("mcnemar-exact")
                        ? "first-repeat-pooled" : "mean-over-folds";
                String pre = String.format(Locale.ROOT, "source+imputed vs source,ridge,source+imputed,%s,none,"
                        + "source,%s,40,%s,%s,%s,%s,%s,%s,", c, c, t[0], t[1], quantity, CsvTable.formatNumber(a),
                        CsvTable.formatNumber(s), CsvTable.formatNumber(a - s));
                if (t[0].equals("bayes-correlated-t")) {
                    b.append(pre).append(",,,,,,0.61,0.27,0.12,0.01\n");
                } else {
                    b.append(pre).append(CsvTable.formatNumber(a - s - 0.081)).append(',')
                            .append(CsvTable.formatNumber(a - s + 0.0794)).append(",1.234,")
                            .append(CsvTable.formatNumber(p)).append(',')
                            .append(CsvTable.formatNumber(Math.min(1, 2 * p))).append(",holm,,,,\n");
                }
                k++;
            }
        }
        Files.writeString(run.resolve("comparisons.csv"), b);
    }

    static double estimate(CsvRows m, String imputer, String fs, String classifier, String metric) {
        return m.where(r -> r.s("imputer").equals(imputer) && r.s("feature_set").equals(fs)
                && r.s("classifier").equals(classifier) && r.s("metric").equals(metric)).get(0).d("estimate");
    }

    /** Writes every other optional table with invented values. */
    static void optionalTables(Path run) throws IOException {
        Files.writeString(run.resolve("permutations.csv"), """
                imputer,feature_set,classifier,metric,observed,permutations_run,exceedances,p_value,stopped_early,exchangeability
                ridge,source+imputed,forest,balanced_accuracy,0.81,99,0,0.01,false,site
                none,source,forest,balanced_accuracy,0.62,40,12,0.3170731707317073,true,site
                """);
        StringBuilder nul = new StringBuilder("imputer,feature_set,classifier,metric,permutation,value\n");
        for (int i = 1; i <= 99; i++) {
            nul.append("ridge,source+imputed,forest,balanced_accuracy,").append(i).append(',')
                    .append(String.format(Locale.ROOT, "%.4f", 0.35 + 0.3 * ((i * 37) % 99) / 99.0)).append('\n');
        }
        Files.writeString(run.resolve("permutation_null.csv"), nul);
        Files.writeString(run.resolve("separation.csv"), """
                imputer,feature_set,n,pseudo_f,p_value,permutations
                none,source,40,2.0,0.0421,999
                ridge,source+imputed,40,4.4,0.001,999
                """);
        StringBuilder imp = new StringBuilder("imputer,feature_set,classifier,feature,view,kind,value\n");
        for (int i = 1; i <= 6; i++) {
            imp.append("ridge,source+imputed,forest,s").append(i).append(",source,gain,").append(0.1 * i).append('\n');
            imp.append("ridge,source+imputed,forest,t").append(i).append(",imputed,gain,").append(0.07 * i)
                    .append('\n');
        }
        Files.writeString(run.resolve("importance.csv"), imp);
        StringBuilder edges = new StringBuilder("imputer,feature,mae\n");
        for (int i = 1; i <= 5; i++) {
            for (int j = i + 1; j <= 5; j++) {
                edges.append("ridge,R").append(i).append("~R").append(j).append(',').append(0.01 * (i + j))
                        .append('\n');
            }
        }
        Files.writeString(run.resolve("imputation_edges.csv"), edges);
        Files.writeString(run.resolve("cohort_flow.csv"), """
                feature_set,imputer,group,included,excluded,reason
                target,none,control,14,6,no observed target view
                source,none,control,20,0,
                """);
    }
}
