package org.viewgain.classify;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.Params;

/**
 * CPU time of classifier fits on one invented training block shaped like a nested run's inner fit (a benchmark main,
 * not a test): rows x features of standard normal values, two balanced classes with a weak shift on the first tenth
 * of the features. Measures the calling thread's CPU time (ThreadMXBean), which a shared machine's load disturbs far
 * less than wall time; prints the median over rounds of each method's time per fit, after warm-up rounds.
 *
 * <p>Usage: {@code bench/test-main.sh 2g org.viewgain.classify.FitSpeedBench [ROWS FEATURES ROUNDS [forest|svm]]}.
 * To compare two builds, put the older jar before {@code target/classes} on the class path (bench/fit-speed.sh does).
 */
public final class FitSpeedBench {
    private FitSpeedBench() {
    }

    public static void main(String[] args) {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 128;
        int p = args.length > 1 ? Integer.parseInt(args[1]) : 1190;
        int rounds = args.length > 2 ? Integer.parseInt(args[2]) : 7;
        String only = args.length > 3 ? args[3] : "";
        SplittableRandom rng = new SplittableRandom(12);
        double[][] x = new double[n][p];
        int[] y = new int[n];
        List<String> ids = new ArrayList<>();
        List<String> names = new ArrayList<>();
        for (int j = 0; j < p; j++) {
            names.add("f" + j);
        }
        for (int i = 0; i < n; i++) {
            y[i] = i % 2;
            ids.add("s" + i);
            for (int j = 0; j < p; j++) {
                x[i][j] = gaussian(rng) + (j < p / 10 && y[i] == 1 ? 0.3 : 0);
            }
        }
        Rows rows = new Rows(ids, x, names);
        if ("forest".contains(only)) {
            time("random-forest 200 trees sqrt", "random-forest",
                    Map.of("trees", 200, "features-per-split", "sqrt"), rows, y, rounds);
            time("random-forest 200 trees 0.1", "random-forest",
                    Map.of("trees", 200, "features-per-split", 0.1), rows, y, rounds);
        }
        if ("svm".contains(only)) {
            time("svm-rbf C=1 gamma=scale", "svm-rbf", Map.of("C", 1.0), rows, y, rounds);
            time("svm-linear C=0.1", "svm-linear", Map.of("C", 0.1), rows, y, rounds);
        }
    }

    private static void time(String label, String method, Map<String, Object> raw, Rows rows, int[] y, int rounds) {
        ThreadMXBean bean = ManagementFactory.getThreadMXBean();
        ClassifierMethod m = ClassifierRegistry.create(method);
        Params params = m.resolve(raw);
        FitContext ctx = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 5L);
        int warm = 3;
        double[] ms = new double[rounds];
        double check = 0;
        for (int r = -warm; r < rounds; r++) {
            long start = bean.getCurrentThreadCpuTime();
            ClassifierMethod.Model model = m.fit(ctx, rows, y, 2, params);
            long used = bean.getCurrentThreadCpuTime() - start;
            check += model.predict(rows).labels()[0];
            if (r >= 0) {
                ms[r] = used / 1e6;
            }
        }
        Arrays.sort(ms);
        System.out.printf(Locale.ROOT, "%-32s %4d x %5d  median %8.1f ms CPU per fit  (min %.1f, max %.1f; %d rounds)"
                + "%s%n", label, rows.n(), rows.p(), ms[rounds / 2], ms[0], ms[rounds - 1], rounds,
                check < 0 ? "!" : "");
    }

    private static double gaussian(SplittableRandom rng) {
        double u = 1 - rng.nextDouble();
        double v = rng.nextDouble();
        return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    }
}
