package org.viewgain.engine;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Power of the paired comparisons on invented cohorts with a planted truth (a benchmark main: minutes). Each cohort
 * ({@link TestCohorts#synthetic}: 60 subjects, 45 source and 45 target features, every target observed) has a group
 * shift of {@code EFFECT} in three target features and none in the source, so logistic regression on source+target
 * is truly better than on source, which is at chance. Reported per test: how often it rejects at 0.05 (in favour of
 * source+target) beside the exact 99% interval, and the mean fold-level gain in balanced accuracy.
 *
 * <p>Usage: {@code bench/test-main.sh 3g org.viewgain.engine.GainComparisonBench COHORTS [EFFECT [FOLDS
 * [REPEATS [FIRST_SEED]]]]}; defaults 200 0.8 5 2 1.
 */
public final class GainComparisonBench {
    private GainComparisonBench() {
    }

    public static void main(String[] args) throws Exception {
        int cohorts = Integer.parseInt(args[0]);
        double effect = args.length > 1 ? Double.parseDouble(args[1]) : 0.8;
        int folds = args.length > 2 ? Integer.parseInt(args[2]) : 5;
        int repeats = args.length > 3 ? Integer.parseInt(args[3]) : 2;
        long first = args.length > 4 ? Long.parseLong(args[4]) : 1;
        String body = """
                feature-sets: [source, source+target]
                classifiers: [ { name: lr, method: logistic, fixed: { lambda: 1.0 } } ]
                significance: { compare: ["source+target vs source"], adjust: none, bootstrap: 0 }
                validation: { outer: { folds: %d, repeats: %d }, inner: { folds: 3 } }
                """.formatted(folds, repeats);
        Path root = Files.createTempDirectory("viewgain-gain-cmp");
        ExecutorService pool = Executors.newFixedThreadPool(Runtime.getRuntime().availableProcessors());
        List<Future<List<Comparisons.Row>>> jobs = new ArrayList<>();
        long start = System.nanoTime();
        for (int c = 0; c < cohorts; c++) {
            long seed = first + c;
            Path dir = root.resolve("c" + seed);
            jobs.add(pool.submit(() -> {
                TestCohorts.synthetic(dir, 60, 45, 45, effect, 0.0, 0.0, seed);
                Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, body)));
                return Comparisons.of(new Runner(ex, 1, Progress.NONE).run());
            }));
        }
        List<List<Comparisons.Row>> all = new ArrayList<>();
        for (Future<List<Comparisons.Row>> f : jobs) {
            all.add(f.get());
        }
        pool.shutdown();
        double gain = all.stream().mapToDouble(rows -> rows.stream().filter(r -> r.test().equals("corrected-t"))
                .findFirst().orElseThrow().difference()).average().orElse(Double.NaN);
        System.out.printf(Locale.ROOT, "%d cohorts, target effect %.2f, %d x %d folds, seeds %d..%d, %.0f s; mean "
                + "gain in balanced accuracy (mean over folds) %+.3f%n", all.size(), effect, repeats, folds, first,
                first + cohorts - 1, (System.nanoTime() - start) / 1e9, gain);
        System.out.println("comparison | test | rejections | rate | 99% Clopper-Pearson interval | undefined p");
        NullComparisonBench.report("gain", all, folds * repeats, folds);
    }
}
