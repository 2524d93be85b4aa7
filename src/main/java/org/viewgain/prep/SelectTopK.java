package org.viewgain.prep;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.stream.IntStream;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;

/**
 * Keeps the k columns scoring highest on the training rows: {@code t-test} (|Welch t| between two classes; Welch
 * 1947, Biometrika 34:28-35), {@code anova} (one-way F) or {@code variance} (label-free). Ties go to the lower column
 * index. A zero within-class spread scores +infinity if the class means differ and 0 if not. Kept columns stay in
 * their original order; k at least the column count keeps all.
 */
public final class SelectTopK implements Transform {

    private static final List<String> METHODS = List.of("t-test", "anova", "variance");

    private final String method;
    private final int keep;

    /**
     * @param method one of {@link #methods()}
     * @param keep   number of columns to keep, at least 1
     * @throws IllegalArgumentException naming what is allowed
     */
    public SelectTopK(String method, int keep) {
        if (!METHODS.contains(method)) {
            throw new IllegalArgumentException("unknown selection method '" + method + "'; allowed: "
                    + String.join(", ", METHODS));
        }
        if (!(keep >= 1)) {
            throw new IllegalArgumentException("selection keep must be at least 1, got " + keep);
        }
        this.method = method;
        this.keep = keep;
    }

    /** The selection methods. */
    public static List<String> methods() {
        return METHODS;
    }

    @Override
    public String name() {
        return "select-" + method;
    }

    @Override
    public Selection fit(FitContext ctx, Rows train, int[] y) {
        int p = train.p();
        double[] score = new double[p];
        int classes = Arrays.stream(y).max().orElse(0) + 1;
        if ("t-test".equals(method) && classes != 2) {
            throw new IllegalArgumentException("selection t-test needs exactly 2 classes, got " + classes
                    + "; use anova");
        }
        if ("t-test".equals(method) && !(Arrays.stream(y).anyMatch(c -> c == 0) && Arrays.stream(y).anyMatch(c -> c == 1))) {
            throw new IllegalArgumentException("selection t-test needs training rows of both classes");
        }
        for (int j = 0; j < p; j++) {
            score[j] = switch (method) {
                case "t-test" -> welch(train.x(), y, j);
                case "anova" -> anova(train.x(), y, classes, j);
                default -> variance(train.x(), j);
            };
        }
        int[] kept = IntStream.range(0, p).boxed()
                .sorted(Comparator.<Integer>comparingDouble(j -> score[j]).reversed()
                        .thenComparing(Comparator.naturalOrder()))
                .limit(Math.min(keep, p)).mapToInt(Integer::intValue).sorted().toArray();
        return new Selection(kept, train.featureNames(), score);
    }

    static double welch(double[][] x, int[] y, int j) {
        int n0 = 0;
        int n1 = 0;
        for (int c : y) {
            if (c == 0) {
                n0++;
            } else if (c == 1) {
                n1++;
            }
        }
        double m0 = ColumnStats.classMean(x, y, 0, j);
        double m1 = ColumnStats.classMean(x, y, 1, j);
        double v0 = n0 > 1 ? ColumnStats.classSumSquares(x, y, 0, j, m0) / (n0 - 1) : 0;
        double v1 = n1 > 1 ? ColumnStats.classSumSquares(x, y, 1, j, m1) / (n1 - 1) : 0;
        double se = Math.sqrt(v0 / n0 + v1 / n1);
        return ratio(Math.abs(m1 - m0), se);
    }

    static double anova(double[][] x, int[] y, int classes, int j) {
        int n = x.length;
        double grand = 0;
        for (double[] r : x) {
            grand += r[j] / n;
        }
        double between = 0;
        double within = 0;
        int groups = 0;
        for (int c = 0; c < classes; c++) {
            int nc = 0;
            for (int label : y) {
                nc += label == c ? 1 : 0;
            }
            if (nc == 0) {
                continue;
            }
            groups++;
            double m = ColumnStats.classMean(x, y, c, j);
            between += nc * (m - grand) * (m - grand);
            within += ColumnStats.classSumSquares(x, y, c, j, m);
        }
        if (groups < 2 || n <= groups) {
            return 0;
        }
        return ratio(between / (groups - 1), within / (n - groups));
    }

    static double variance(double[][] x, int j) {
        double mean = 0;
        for (double[] r : x) {
            mean += r[j] / x.length;
        }
        double ss = 0;
        for (double[] r : x) {
            ss += (r[j] - mean) * (r[j] - mean);
        }
        return x.length > 1 ? ss / (x.length - 1) : 0;
    }

    private static double ratio(double signal, double noise) {
        if (noise > 0) {
            return signal / noise;
        }
        return signal > 0 ? Double.POSITIVE_INFINITY : 0;
    }

    /** A fitted selection: which training columns are kept. */
    public static final class Selection implements Transform.Fitted, org.viewgain.frozen.Freezable {
        static final String KIND = "select-top-k";
        private final int[] kept;
        private final List<String> keptNames;
        private final double[] scores;

        Selection(int[] kept, List<String> names, double[] scores) {
            this.kept = kept;
            this.scores = scores;
            List<String> k = new ArrayList<>(kept.length);
            for (int j : kept) {
                k.add(names.get(j));
            }
            this.keptNames = List.copyOf(k);
        }

        /** Positions of the kept columns in the input, ascending. */
        public int[] kept() {
            return kept.clone();
        }

        /** Names of the kept columns, in output order. */
        public List<String> keptNames() {
            return keptNames;
        }

        /** The score of every input column (higher = more likely kept). */
        public double[] scores() {
            return scores.clone();
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(org.viewgain.frozen.FrozenOut out) {
            out.integers(kept).texts(keptNames).numbers(scores);
        }

        /** A selection read back from its part. */
        static Selection thaw(org.viewgain.frozen.FrozenIn in) {
            int[] kept = in.integers();
            List<String> names = in.texts();
            double[] scores = in.numbers();
            if (kept == null || scores == null || names.size() != kept.length) {
                throw in.bad("kept columns and their names disagree");
            }
            for (int j : kept) {
                if (j < 0 || j >= scores.length) {
                    throw in.bad("a kept column lies outside the input");
                }
            }
            return new Selection(kept, names, scores, true);
        }

        private Selection(int[] kept, List<String> keptNames, double[] scores, boolean named) {
            this.kept = kept;
            this.scores = scores;
            this.keptNames = List.copyOf(keptNames);
        }

        @Override
        public Rows apply(Rows rows) {
            if (rows.p() != scores.length) {
                throw new IllegalArgumentException("selection was fitted on " + scores.length + " columns, got "
                        + rows.p());
            }
            double[][] out = new double[rows.n()][kept.length];
            for (int i = 0; i < rows.n(); i++) {
                for (int k = 0; k < kept.length; k++) {
                    out[i][k] = rows.x()[i][kept[k]];
                }
            }
            return rows.withValues(out, keptNames);
        }
    }
}
