package org.viewgain.engine;

import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Benchmark, not a test (run by {@code bench/duplicates.sh}): seconds taken by the near-duplicate scan on random
 * rows. Prints CSV {@code subjects,features,seconds,pairs_found} (median of the timed rounds). Issue 5's guard: a
 * 2,000-subject x 35,778-edge cohort (268 regions) should be scanned in about a minute on 2 cores.
 */
public final class DuplicatesBenchmark {
    private DuplicatesBenchmark() {
    }

    /** {@code args}: subjects (2000), features (35778), rounds (1). */
    public static void main(String[] args) {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 2000;
        int p = args.length > 1 ? Integer.parseInt(args[1]) : 35778;
        int rounds = args.length > 2 ? Integer.parseInt(args[2]) : 1;
        SplittableRandom rng = new SplittableRandom(10);
        double[][] x = new double[n][p];
        for (double[] r : x) {
            for (int j = 0; j < p; j++) {
                r[j] = rng.nextGaussian();
            }
        }
        Duplicates.find(new double[][] {x[0].clone(), x[1].clone(), x[2].clone()}, 0.999); // warm-up
        double[] seconds = new double[rounds];
        int pairs = 0;
        for (int r = 0; r < rounds; r++) {
            long t0 = System.nanoTime();
            List<Duplicates.Pair> found = Duplicates.find(x, 0.999);
            seconds[r] = (System.nanoTime() - t0) / 1e9;
            pairs = found.size();
        }
        java.util.Arrays.sort(seconds);
        System.out.println("subjects,features,seconds,pairs_found");
        System.out.println(String.format(Locale.ROOT, "%d,%d,%.2f,%d", n, p, seconds[rounds / 2], pairs));
    }
}
