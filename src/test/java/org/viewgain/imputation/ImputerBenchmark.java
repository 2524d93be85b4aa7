package org.viewgain.imputation;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.viewgain.cohort.Rows;

/**
 * Benchmark, not a test (run by {@code bench/imputers.sh}): fit and impute seconds of each built-in imputer with its
 * default parameters on random data shaped like a 400-subject cohort of 100-region networks: 320 training subjects,
 * 80 new ones, 4,950 source and 4,950 target features. Prints one CSV line per imputer (median of the timed rounds).
 * The goal of issue 4 is under 2 s per fold for each imputer.
 */
public final class ImputerBenchmark {
    private ImputerBenchmark() {
    }

    /** {@code args[0]}: timed rounds per imputer (default 3). */
    public static void main(String[] args) {
        int rounds = args.length > 0 ? Integer.parseInt(args[0]) : 3;
        PrintStream out = System.out;
        int p = 4950;
        Rows src = Fixtures.gaussian("s", 320, p, 1);
        Rows tgt = Fixtures.gaussian("s", 320, p, 2);
        Rows news = Fixtures.gaussian("n", 80, p, 3);
        List<String> methods = new ArrayList<>(ImputerRegistry.methods());
        methods.remove(ExternalImputer.METHOD);
        // warm-up: load the native BLAS and JIT-compile once, so the figures are steady-state
        for (String m : methods) {
            time(m, Fixtures.gaussian("w", 40, 50, 4), Fixtures.gaussian("w", 40, 30, 5),
                    Fixtures.gaussian("v", 5, 50, 6));
        }
        out.println("method,fit_seconds,impute_seconds,total_seconds,rounds");
        for (String m : methods) {
            double[] fit = new double[rounds];
            double[] imp = new double[rounds];
            for (int r = 0; r < rounds; r++) {
                double[] t = time(m, src, tgt, news);
                fit[r] = t[0];
                imp[r] = t[1];
            }
            out.println(String.format(Locale.ROOT, "%s,%.3f,%.3f,%.3f,%d", m, median(fit), median(imp),
                    median(fit) + median(imp), rounds));
        }
    }

    /** Seconds of the fit and of the imputation. */
    private static double[] time(String method, Rows src, Rows tgt, Rows news) {
        ViewImputer m = ImputerRegistry.byMethod(method);
        long t0 = System.nanoTime();
        ViewImputer.Fitted f = m.fit(Fixtures.CTX, src, tgt, m.resolve(Map.of()));
        long t1 = System.nanoTime();
        double[][] y = f.impute(Fixtures.CTX, news);
        long t2 = System.nanoTime();
        if (y.length != news.n() || y[0].length != tgt.p()) {
            throw new IllegalStateException(method + " imputed the wrong shape");
        }
        return new double[] {(t1 - t0) / 1e9, (t2 - t1) / 1e9};
    }

    private static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        return s.length % 2 == 1 ? s[s.length / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
    }
}
