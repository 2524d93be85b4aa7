package org.viewgain.engine;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.viewgain.spec.SpecLoader;

/**
 * Calibration of the permutation test on invented null cohorts (a benchmark main, not a unit test: a few minutes).
 * Every cohort has no group signal in any view; the observed statistic must then be exchangeable with the permuted
 * ones, so (a) their means agree within Monte Carlo error and (b) the rejection rate at alpha = 0.05 lies in the 99%
 * binomial band. Settings after the issue that measured a liberal lean: 60 subjects, 1 or 2 sites with site effects,
 * 10 regions (45 edges per view), 25% missing targets, logistic regression (lambda 1), ridge imputer, 5 x 2 outer and
 * 3 inner folds, 19 permutations within sites, balanced accuracy.
 *
 * <p>Usage: {@code bench/test-main.sh 3g org.viewgain.engine.NullCalibrationBench COHORTS [FIRST_SEED [PERMS
 * [SITES [MISSING_BY_GROUP [tuned]]]]]}; SITES 0 alternates 1 and 2; {@code tuned} tunes the classifier; MISSING_BY_GROUP is the extra missing rate of patients
 * (targets missing not at random, which must not matter to a test that permutes within each pipeline's population).
 */
public final class NullCalibrationBench {
    private NullCalibrationBench() {
    }

    static final int N = 60;
    static final int REGIONS = 10;

    public static void main(String[] args) throws Exception {
        int cohorts = Integer.parseInt(args[0]);
        long first = args.length > 1 ? Long.parseLong(args[1]) : 1;
        int perms = args.length > 2 ? Integer.parseInt(args[2]) : 19;
        int sites = args.length > 3 ? Integer.parseInt(args[3]) : 0;
        double missingByGroup = args.length > 4 ? Double.parseDouble(args[4]) : 0.0;
        // "tuned": logistic regression tuned over lambda in the inner folds, which then exercises the classifier's
        // inner folds and the nested imputations under permutation too
        boolean tuned = args.length > 5 && args[5].equals("tuned");
        // "svm-forest" instead: the linear SVM tuned over C (its grid shares the Gram matrix of each inner fold's
        // rows) and the project's forest, so that their code paths are exercised under permutation too
        boolean svmForest = args.length > 6 && args[6].equals("svm-forest");
        String body = """
                imputers: [ { name: ridge, method: ridge, fixed: { alpha: 10 } } ]
                feature-sets: [source, source+imputed, target]
                classifiers: %s
                validation: { outer: { folds: 5, repeats: 2 }, inner: { folds: 3 }, tune-by: balanced-accuracy }
                significance: { permutations: %d, metric: balanced-accuracy, bootstrap: 0, compare: [] }
                """.formatted(svmForest ? "[ { name: svm, method: svm-linear, grid: { C: [0.01, 1] } },"
                + " { name: forest, method: random-forest, fixed: { trees: 50 } } ]"
                : "[ { name: lr, method: logistic, " + (tuned ? "grid: { lambda: [0.1, 10] }" : "fixed: { lambda: 1.0 }")
                + " } ]", perms);
        Path root = Files.createTempDirectory("viewgain-null");
        int workers = Runtime.getRuntime().availableProcessors();
        ExecutorService pool = Executors.newFixedThreadPool(workers);
        List<Future<List<PermutationResult>>> jobs = new ArrayList<>();
        long start = System.nanoTime();
        for (int c = 0; c < cohorts; c++) {
            long seed = first + c;
            int s = sites > 0 ? sites : 1 + (c % 2);
            Path dir = root.resolve("c" + seed);
            jobs.add(pool.submit(() -> {
                write(dir, s, missingByGroup, seed);
                Experiment ex = Setup.prepare(SpecLoader.load(spec(dir, body, s > 1)));
                return new Runner(ex, 1, Progress.NONE).run().permutations();
            }));
        }
        List<List<PermutationResult>> all = new ArrayList<>();
        int refused = 0;
        for (Future<List<PermutationResult>> f : jobs) {
            try {
                all.add(f.get());
            } catch (java.util.concurrent.ExecutionException e) {
                if (!(e.getCause() instanceof org.viewgain.spec.BadInputException)) {
                    throw e;
                }
                refused++; // e.g. too few patients with a target for the folds: check refuses such a cohort
            }
        }
        if (refused > 0) {
            System.out.println(refused + " cohorts refused by the fold checks, " + all.size() + " used");
        }
        cohorts = all.size();
        pool.shutdown();
        double secs = (System.nanoTime() - start) / 1e9;
        System.out.printf(Locale.ROOT, "%d null cohorts, %d permutations, sites %s, extra missing in patients %.2f,"
                + " logistic %s, seeds %d..%d, %.0f s%n", cohorts, perms, sites == 0 ? "1 and 2" : sites,
                missingByGroup, svmForest ? "replaced by svm-linear (C 0.01, 1) and random-forest (50 trees)"
                        : tuned ? "tuned over lambda 0.1, 10" : "lambda 1", first, first + cohorts - 1, secs);
        BinomialDistribution b = new BinomialDistribution(cohorts, 0.05);
        int lo = b.inverseCumulativeProbability(0.005);
        int hi = b.inverseCumulativeProbability(0.995);
        System.out.println("pipeline | observed mean | permuted mean | observed - permuted (SE, z) | mean p"
                + " (exchangeable: " + String.format(Locale.ROOT, "%.3f", (perms / 2.0 + 1) / (perms + 1))
                + ") | rejections at 0.05 (99% band " + lo + "-" + hi + ")");
        for (int p = 0; p < all.get(0).size(); p++) {
            double[] diff = new double[cohorts];
            double obs = 0;
            double nul = 0;
            double pSum = 0;
            int reject = 0;
            for (int c = 0; c < cohorts; c++) {
                PermutationResult r = all.get(c).get(p);
                double m = java.util.Arrays.stream(r.null_()).average().orElse(Double.NaN);
                obs += r.observed();
                nul += m;
                diff[c] = r.observed() - m;
                pSum += r.pValue();
                reject += r.pValue() <= 0.05 ? 1 : 0;
            }
            double mean = java.util.Arrays.stream(diff).average().orElse(Double.NaN);
            double sd = Math.sqrt(java.util.Arrays.stream(diff).map(d -> (d - mean) * (d - mean)).sum()
                    / (cohorts - 1));
            double se = sd / Math.sqrt(cohorts);
            System.out.printf(Locale.ROOT, "%s | %.4f | %.4f | %+.4f (%.4f, z = %+.2f) | %.3f | %d/%d = %.3f %s%n",
                    all.get(0).get(p).pipeline().label(), obs / cohorts, nul / cohorts, mean, se, mean / se,
                    pSum / cohorts, reject, cohorts, reject / (double) cohorts,
                    reject >= lo && reject <= hi ? "inside" : "OUTSIDE");
        }
    }

    static Path spec(Path dir, String body, boolean site) throws IOException {
        String text = """
                experiment: null-calibration
                seed: 7
                cohort: { subjects: subjects.csv, groups: [control, patient], positive: patient%s }
                views:
                  source: { table: source.csv }
                  target: { table: target.csv, missing: allowed }
                """.formatted(site ? ", site: site" : "") + body;
        return Files.writeString(dir.resolve("spec.yaml"), text);
    }

    /**
     * A null cohort: half patients; source edges Gaussian plus a site shift; the target a noisy linear map of the
     * source plus its own site shift; targets missing at random (25%), plus {@code missingByGroup} for patients.
     */
    static void write(Path dir, int sites, double missingByGroup, long seed) {
        try {
            Files.createDirectories(dir);
            SplittableRandom rng = new SplittableRandom(seed);
            int p = REGIONS * (REGIONS - 1) / 2;
            double[][] w = new double[p][p];
            for (double[] r : w) {
                for (int c = 0; c < p; c++) {
                    r[c] = rng.nextGaussian() / Math.sqrt(p);
                }
            }
            double[][] siteShift = new double[sites][p];
            for (double[] s : siteShift) {
                for (int c = 0; c < p; c++) {
                    s[c] = 0.8 * rng.nextGaussian();
                }
            }
            StringBuilder subjects = new StringBuilder("subject,group,site\n");
            StringBuilder src = new StringBuilder("subject");
            StringBuilder tgt = new StringBuilder("subject");
            for (int j = 0; j < p; j++) {
                src.append(",s").append(j + 1);
                tgt.append(",t").append(j + 1);
            }
            src.append('\n');
            tgt.append('\n');
            for (int i = 0; i < N; i++) {
                String id = String.format(Locale.ROOT, "n%03d", i + 1);
                int g = i % 2;
                int site = rng.nextInt(sites);
                subjects.append(id).append(',').append(g == 1 ? "patient" : "control").append(",site")
                        .append(site + 1).append('\n');
                double[] x = new double[p];
                src.append(id);
                for (int j = 0; j < p; j++) {
                    x[j] = rng.nextGaussian() + siteShift[site][j];
                    src.append(',').append(String.format(Locale.ROOT, "%.5f", x[j]));
                }
                src.append('\n');
                double missing = 0.25 + (g == 1 ? missingByGroup : 0);
                if (rng.nextDouble() >= missing) {
                    tgt.append(id);
                    for (int c = 0; c < p; c++) {
                        double v = 0.5 * siteShift[site][c];
                        for (int j = 0; j < p; j++) {
                            v += x[j] * w[j][c];
                        }
                        v += 0.5 * rng.nextGaussian();
                        tgt.append(',').append(String.format(Locale.ROOT, "%.5f", v));
                    }
                    tgt.append('\n');
                }
            }
            Files.writeString(dir.resolve("subjects.csv"), subjects);
            Files.writeString(dir.resolve("source.csv"), src);
            Files.writeString(dir.resolve("target.csv"), tgt);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
