package org.viewgain.engine;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.Predicate;
import org.apache.commons.math3.distribution.BetaDistribution;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.SpecLoader;

/**
 * Type-I error of the paired comparisons on invented null cohorts (a benchmark main, not a unit test: minutes).
 * The cohorts are those of {@link NullCalibrationBench} (60 subjects, 1 or 2 sites, 10 regions, 25% of targets
 * missing at random, no group signal in any view). Two null comparisons per cohort:
 * <ul>
 * <li>{@code seeds}: the same random forest (25 trees, on source) under two seeds, i.e. two classifier entries that
 * differ only in name;</li>
 * <li>{@code chance}: logistic regression (lambda 1) on ridge source+imputed against logistic on source, both at
 * chance.</li>
 * </ul>
 * Reported per test: rejections at 0.05 and the exact (Clopper-Pearson) 99% interval of the rejection rate, beside
 * the 99% acceptance band of Binomial(cohorts, 0.05).
 *
 * <p>Usage: {@code bench/test-main.sh 3g org.viewgain.engine.NullComparisonBench COHORTS [FIRST_SEED [FOLDS
 * [REPEATS [SITES]]]]}; defaults 400 1 5 2 0 (SITES 0 alternates 1 and 2).
 */
public final class NullComparisonBench {
    private NullComparisonBench() {
    }

    /** The rows of one cohort's two comparisons. */
    record Cohort(List<Comparisons.Row> seeds, List<Comparisons.Row> chance) {
    }

    public static void main(String[] args) throws Exception {
        int cohorts = Integer.parseInt(args[0]);
        long first = args.length > 1 ? Long.parseLong(args[1]) : 1;
        int folds = args.length > 2 ? Integer.parseInt(args[2]) : 5;
        int repeats = args.length > 3 ? Integer.parseInt(args[3]) : 2;
        int sites = args.length > 4 ? Integer.parseInt(args[4]) : 0;
        String validation = "validation: { outer: { folds: %d, repeats: %d }, inner: { folds: 3 } }\n"
                .formatted(folds, repeats);
        String chance = """
                imputers: [ { name: ridge, method: ridge, fixed: { alpha: 10 } } ]
                feature-sets: [source, source+imputed]
                classifiers: [ { name: lr, method: logistic, fixed: { lambda: 1.0 } } ]
                significance: { compare: ["source+imputed vs source"], adjust: none, bootstrap: 0 }
                """ + validation;
        String seeds = """
                feature-sets: [source]
                classifiers:
                  - { name: rf1, method: random-forest, fixed: { trees: 25 } }
                  - { name: rf2, method: random-forest, fixed: { trees: 25 } }
                significance: { compare: ["none/source/rf1 vs none/source/rf2"], adjust: none, bootstrap: 0 }
                """ + validation;
        Path root = Files.createTempDirectory("viewgain-null-cmp");
        ExecutorService pool = Executors.newFixedThreadPool(Runtime.getRuntime().availableProcessors());
        List<Future<Cohort>> jobs = new ArrayList<>();
        long start = System.nanoTime();
        for (int c = 0; c < cohorts; c++) {
            long seed = first + c;
            int s = sites > 0 ? sites : 1 + (c % 2);
            Path dir = root.resolve("c" + seed);
            jobs.add(pool.submit(() -> {
                NullCalibrationBench.write(dir, s, 0.0, seed);
                List<Comparisons.Row> a = run(dir, seeds, s > 1);
                List<Comparisons.Row> b = run(dir, chance, s > 1);
                return new Cohort(a, b);
            }));
        }
        List<Cohort> all = new ArrayList<>();
        int refused = 0;
        for (Future<Cohort> f : jobs) {
            try {
                all.add(f.get());
            } catch (ExecutionException e) {
                if (!(e.getCause() instanceof BadInputException)) {
                    throw e;
                }
                refused++;
            }
        }
        pool.shutdown();
        double secs = (System.nanoTime() - start) / 1e9;
        int n = all.size();
        System.out.printf(Locale.ROOT, "%d null cohorts (%d refused by the fold checks), %d x %d folds, sites %s,"
                + " seeds %d..%d, %.0f s%n", n, refused, repeats, folds, sites == 0 ? "1 and 2" : sites, first,
                first + cohorts - 1, secs);
        BinomialDistribution band = new BinomialDistribution(null, n, 0.05);
        System.out.printf(Locale.ROOT, "99%% acceptance band of Binomial(%d, 0.05): %d-%d rejections%n", n,
                band.inverseCumulativeProbability(0.005), band.inverseCumulativeProbability(0.995));
        System.out.println("comparison | test | rejections | rate | 99% Clopper-Pearson interval | undefined p");
        report("seeds", all.stream().map(Cohort::seeds).toList(), folds * repeats, folds);
        report("chance", all.stream().map(Cohort::chance).toList(), folds * repeats, folds);
    }

    static List<Comparisons.Row> run(Path dir, String body, boolean site) throws Exception {
        Experiment ex = Setup.prepare(SpecLoader.load(NullCalibrationBench.spec(dir, body, site)));
        return Comparisons.of(new Runner(ex, 1, Progress.NONE).run());
    }

    static void report(String name, List<List<Comparisons.Row>> rows, int k, int folds) {
        // the uncorrected paired t-test on the same k fold differences: its statistic is the corrected one times
        // sqrt(1 + k * n_test / n_train) (Nadeau & Bengio 2003, the variance factor), n_test / n_train = 1/(folds-1)
        double inflate = Math.sqrt(1 + k / (folds - 1.0));
        TDistribution t = new TDistribution(null, k - 1);
        line(name, "corrected-t", rows, r -> r.test().equals("corrected-t"), r -> r.pValue() <= 0.05);
        line(name, "plain paired t (uncorrected, for contrast)", rows, r -> r.test().equals("corrected-t"),
                r -> 2 * t.cumulativeProbability(-Math.abs(r.statistic()) * inflate) <= 0.05);
        line(name, "bayes-correlated-t P(A better) > 0.95", rows, r -> r.test().equals("bayes-correlated-t"),
                r -> r.probABetter() > 0.95);
        line(name, "bayes-correlated-t P(A or B better) > 0.975", rows, r -> r.test().equals("bayes-correlated-t"),
                r -> r.probABetter() > 0.975 || r.probBBetter() > 0.975);
        line(name, "mcnemar-exact", rows, r -> r.test().equals("mcnemar-exact"), r -> r.pValue() <= 0.05);
        line(name, "mcnemar-mid-p", rows, r -> r.test().equals("mcnemar-mid-p"), r -> r.pValue() <= 0.05);
        line(name, "delong", rows, r -> r.test().equals("delong"), r -> r.pValue() <= 0.05);
    }

    private static void line(String name, String label, List<List<Comparisons.Row>> cohorts,
                             Predicate<Comparisons.Row> which, Predicate<Comparisons.Row> rejects) {
        int n = 0;
        int x = 0;
        int undefined = 0;
        for (List<Comparisons.Row> rows : cohorts) {
            Comparisons.Row r = rows.stream().filter(which).findFirst().orElse(null);
            if (r == null) {
                undefined++; // e.g. the t-tests need two differences with some spread
                continue;
            }
            boolean nanP = !r.test().startsWith("bayes") && Double.isNaN(r.pValue());
            if (nanP) {
                undefined++;
                continue;
            }
            n++;
            x += rejects.test(r) ? 1 : 0;
        }
        // exact (Clopper-Pearson) interval from Beta quantiles
        double lo = x == 0 ? 0 : new BetaDistribution(null, x, n - x + 1).inverseCumulativeProbability(0.005);
        double hi = x == n ? 1 : new BetaDistribution(null, x + 1, n - x).inverseCumulativeProbability(0.995);
        System.out.printf(Locale.ROOT, "%s | %s | %d/%d | %.3f | %.3f-%.3f | %d%n", name, label, x, n,
                n == 0 ? Double.NaN : x / (double) n, lo, hi, undefined);
    }
}
