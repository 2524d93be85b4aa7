package org.viewgain.classify;

import java.util.List;
import java.util.SplittableRandom;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import org.viewgain.stats.SmileMatrices;

/**
 * {@code svm-linear}: the soft-margin linear support vector machine (Cortes &amp; Vapnik 1995, Machine Learning
 * 20:273-297), {@code min 1/2 |w|^2 + C sum_i max(0, 1 - y_i (w.x_i + b))}, solved in the dual by coordinate descent
 * (Hsieh, Chang, Lin, Keerthi &amp; Sundararajan 2008, ICML, Algorithm 1; the L1-loss dual solver of LIBLINEAR). As in
 * LIBLINEAR, the intercept is a weight on a constant input of 1 and is regularized with the others. The rows are
 * visited in a seeded random order each pass; the solver stops when the spread of the projected gradient falls
 * below {@code tolerance} (LIBLINEAR's criterion, default 0.1 as LIBLINEAR's) or after {@code iterations} passes;
 * a fit that stopped at {@code iterations} says so ({@link Model#converged()}), as LIBLINEAR warns.
 *
 * <p>Why not a library: Smile's LASVM ({@code smile.classification.SVM} with a linear kernel) ranked the training
 * subjects themselves below chance on wide standardized inputs (35,778 edges; training AUC 0.29, measured
 * 2026-12-02, docs/benchmarks.md), and the Java port of LIBLINEAR stores every value as an object (~32 bytes instead
 * of 8), 1.8 GB for one fit at 800 x 71,556. This solver works on the rows as given, without a copy, and is checked
 * against LIBLINEAR itself in the tests.
 *
 * <p>Where the training rows are fewer than their features, a fit that has not converged after {@link #switchAfter}
 * passes goes on with the same steps on the rows' Gram matrix (a step then costs n instead of p), computed once per
 * set of training rows and shared by every later machine and grid point on them ({@link SharedGram}); results
 * differ from the primal solver's by rounding only. With {@link FitHints} from the earlier fits of the same
 * pipeline's training, a grid point whose last fit needed at least {@link #switchAfter} passes starts on the Gram
 * matrix at once.
 *
 * <p>Two classes: one machine, class 1 on the positive side; more: one machine per class against the rest. Scores
 * are decision values {@code w.x + b} (for two classes {@code scores[i][1]} is the value and {@code scores[i][0]} its
 * negative). Importance: {@code |w_j|} times input j's training standard deviation, kind {@code abs_weight}.
 */
public final class LinearSvm implements ClassifierMethod {
    private final java.util.function.Function<double[][], double[][]> gramOf;

    public LinearSvm() {
        this(LinearSvm::gram);
    }

    /** With another way to compute the Gram matrix (a seam for tests that count how often it happens). */
    LinearSvm(java.util.function.Function<double[][], double[][]> gramOf) {
        this.gramOf = gramOf;
    }

    @Override
    public String method() {
        return "svm-linear";
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(
                ParamDef.number("C", Double.MIN_VALUE, Double.MAX_VALUE, 1.0, "soft-margin penalty"),
                ParamDef.number("tolerance", Double.MIN_VALUE, 1, 0.1,
                        "stop when the projected gradient's spread is below this (LIBLINEAR's dual criterion)"),
                ParamDef.integer("iterations", 1, 100_000, 1000, "most passes over the training rows"));
    }

    @Override
    public boolean producesScores() {
        return true;
    }

    @Override
    public String scoreKind() {
        return "decision_value";
    }

    /** A fitted machine: weights of the inputs and the intercept. */
    record Machine(double[] w, double b, int passes, boolean converged) {
        double decision(double[] row) {
            double s = b;
            for (int j = 0; j < w.length; j++) {
                s += w[j] * row[j];
            }
            return s;
        }
    }

    /**
     * Solves one machine by the primal solver alone. {@code signs[i]} is +1 or -1; the rows are read, never written.
     *
     * @param iterations most passes over the rows
     */
    static Machine solve(double[][] x, int[] signs, double c, double tolerance, int iterations, long seed) {
        return solve(x, signs, c, tolerance, iterations, seed, null);
    }

    /**
     * {@link #solve} on the Gram matrix from the first pass: the same coordinate descent ({@link #descend}), keeping
     * the decision values of all rows up to date instead of the weights (a step moves them by {@code d K[i]}), and
     * forming {@code w} and {@code b} from the duals at the end. Equal to {@link #solve} up to rounding (checked in
     * tests).
     */
    static Machine solveGram(double[][] gram, double[][] x, int[] signs, double c, double tolerance, int iterations,
                             long seed) {
        SharedGram shared = new SharedGram(x, rows -> gram);
        shared.matrix(); // ready before the first pass
        return solve(x, signs, c, tolerance, iterations, seed, shared);
    }

    /**
     * Passes of the primal solver after which a fit that has not converged moves to the Gram matrix ({@link
     * SharedGram}), for n rows. A primal pass costs about 2np multiply-adds (each row's decision value, then the move
     * of the weights) and reads every row; the Gram matrix costs n^2 p / 2 multiply-adds, vectorized and blocked, and
     * after it a pass costs about 2n^2. Per multiply-add the Gram matrix was measured 2.4 to 6 times faster than the
     * passes (96 x 1,190: 1.0 ms, a pass 0.1 ms; 800 x 20,000: 0.6 s; docs/benchmarks.md). Taking the ratio as 4,
     * moving after n/16 passes spends on the passes before the move what the matrix costs (the rent-or-buy rule), so
     * a fit pays at most about twice what the cheaper way alone would; a fit that converges sooner (the demo's C =
     * 0.001 takes about 6 passes) never builds it.
     */
    static int switchAfter(int n) {
        return Math.max(1, n / 16);
    }

    /**
     * The Gram matrix of one set of training rows, computed the first time a fit on those rows needs it (after
     * {@link #switchAfter} passes) and then used from the first pass by every later machine and grid point fitted on
     * the same rows. Made only for rows fewer than their features (otherwise a dual pass costs more than a primal
     * one).
     */
    static final class SharedGram {
        private final double[][] x;
        private final java.util.function.Function<double[][], double[][]> gramOf;
        private double[][] k;

        SharedGram(double[][] x, java.util.function.Function<double[][], double[][]> gramOf) {
            this.x = x;
            this.gramOf = gramOf;
        }

        boolean ready() {
            return k != null;
        }

        double[][] matrix() {
            if (k == null) {
                k = gramOf.apply(x);
            }
            return k;
        }
    }

    /** Columns of the rows copied out together by {@link #gram} (64 x n doubles stay in the processor's cache). */
    private static final int GRAM_BLOCK = 64;

    /**
     * Features from which {@link #gram} hands the product to native BLAS ({@code dsyrk}, a block of 2,048 columns at a
     * time): measured side by side, BLAS took 0.53 s against 0.93-0.98 s here at 533 x 71,556 rows x features, 0.58
     * against 1.03-1.13 s at 800 x 35,778, 9 against 25 ms at 60 x 35,778; the same at 213 x 9,900 (26 against 25 ms)
     * and slower below (46 against 41 ms at 400 x 4,950, 5 against 2 ms at 128 x 1,190).
     */
    static final int BLAS_FROM = 16_384;

    /**
     * The rows' Gram matrix with the constant input: {@code K[i][j] = x_i . x_j + 1} (symmetric). Computed a block of
     * columns at a time: the block is copied out column by column, and each row of the lower triangle adds
     * {@code x_i[j] * column j} for the block's columns (two at a time), a loop the just-in-time compiler turns into
     * vector instructions (a dot product per entry is not: its sum is one chain of dependent additions). Every entry
     * is summed in the same order on every machine. From {@link #BLAS_FROM} features on, BLAS's symmetric update
     * computes it instead ({@link SmileMatrices#rowGram}, as the separation test does: half the square, a block of
     * columns at a time), in BLAS's order (the same on every run on one machine); below that this loop is as fast or
     * faster (measurements at {@link #BLAS_FROM}).
     */
    static double[][] gram(double[][] x) {
        int n = x.length;
        int p = n == 0 ? 0 : x[0].length;
        if (p >= BLAS_FROM) {
            double[][] k = SmileMatrices.rowGram(x);
            for (double[] row : k) {
                for (int j = 0; j < n; j++) {
                    row[j] += 1;
                }
            }
            return k;
        }
        double[][] k = new double[n][n];
        double[][] columns = new double[Math.min(GRAM_BLOCK, p)][n];
        for (int j0 = 0; j0 < p; j0 += GRAM_BLOCK) {
            int width = Math.min(GRAM_BLOCK, p - j0);
            for (int r = 0; r < n; r++) {
                double[] row = x[r];
                for (int b = 0; b < width; b++) {
                    columns[b][r] = row[j0 + b];
                }
            }
            for (int i = 0; i < n; i++) {
                double[] ki = k[i];
                double[] xi = x[i];
                int b = 0;
                for (; b + 1 < width; b += 2) {
                    double u = xi[j0 + b];
                    double v = xi[j0 + b + 1];
                    double[] cu = columns[b];
                    double[] cv = columns[b + 1];
                    for (int r = 0; r <= i; r++) {
                        ki[r] += u * cu[r] + v * cv[r];
                    }
                }
                for (; b < width; b++) {
                    double u = xi[j0 + b];
                    double[] cu = columns[b];
                    for (int r = 0; r <= i; r++) {
                        ki[r] += u * cu[r];
                    }
                }
            }
        }
        for (int i = 0; i < n; i++) {
            for (int r = 0; r <= i; r++) {
                double v = k[i][r] + 1;
                k[i][r] = v;
                k[r][i] = v;
            }
        }
        return k;
    }

    /**
     * Solves one machine: the primal solver, moving to the Gram matrix after {@link #switchAfter} passes when
     * {@code gram} is given, or on it from the start when it is already computed. The same descent either way (same
     * order, same steps); only rounding differs.
     */
    static Machine solve(double[][] x, int[] signs, double c, double tolerance, int iterations, long seed,
                         SharedGram gram) {
        int n = x.length;
        int p = x[0].length;
        double[] qii = new double[n];
        Decisions start;
        if (gram != null && gram.ready()) {
            double[][] k = gram.matrix();
            for (int i = 0; i < n; i++) {
                qii[i] = k[i][i];
            }
            start = new Dual(k);
        } else {
            for (int i = 0; i < n; i++) {
                double s = 1; // the constant input
                for (double v : x[i]) {
                    s += v * v;
                }
                qii[i] = s;
            }
            start = new Primal(x);
        }
        Descent d = descend(start, gram, qii, signs, c, tolerance, iterations, seed);
        if (d.decisions() instanceof Primal primal) {
            return new Machine(primal.w, primal.b, d.passes(), d.converged());
        }
        double[] w = new double[p];
        double b = 0;
        for (int i = 0; i < n; i++) {
            double a = d.alpha()[i] * signs[i];
            if (a != 0) {
                double[] xi = x[i];
                for (int j = 0; j < p; j++) {
                    w[j] += a * xi[j];
                }
                b += a;
            }
        }
        return new Machine(w, b, d.passes(), d.converged());
    }

    /** The decision values {@code w.x_i + b} the descent reads, and how a step on one dual moves them. */
    private interface Decisions {
        double value(int i);

        /** After alpha_i changed by {@code step / y_i}: w += step x_i and b += step. */
        void move(int i, double step);
    }

    /** Decisions kept as the weights themselves (a step costs p). */
    private static final class Primal implements Decisions {
        private final double[][] x;
        final double[] w;
        double b; // the weight of the constant input 1

        Primal(double[][] x) {
            this.x = x;
            this.w = new double[x[0].length];
        }

        @Override
        public double value(int i) {
            // four running sums: a single one is bound by the latency of each addition
            return b + RbfKernel.dot(w, x[i]);
        }

        @Override
        public void move(int i, double step) {
            double[] xi = x[i];
            for (int j = 0; j < w.length; j++) {
                w[j] += step * xi[j];
            }
            b += step;
        }
    }

    /** Decisions kept as the values of every row, moved by a column of the Gram matrix (a step costs n). */
    private static final class Dual implements Decisions {
        private final double[][] gram;
        private final double[] f;

        Dual(double[][] gram) {
            this.gram = gram;
            this.f = new double[gram.length];
        }

        /** The decision values of the duals so far: {@code f = sum_i alpha_i y_i K[i]}. */
        static Dual at(double[][] gram, double[] alpha, int[] signs) {
            Dual d = new Dual(gram);
            for (int i = 0; i < alpha.length; i++) {
                if (alpha[i] != 0) {
                    d.move(i, alpha[i] * signs[i]);
                }
            }
            return d;
        }

        @Override
        public double value(int i) {
            return f[i];
        }

        @Override
        public void move(int i, double step) {
            double[] ki = gram[i];
            for (int r = 0; r < f.length; r++) {
                f[r] += step * ki[r];
            }
        }
    }

    /** The duals at the end, the passes made, whether the stopping rule held, and the decisions last kept. */
    private record Descent(double[] alpha, int passes, boolean converged, Decisions decisions) {
    }

    /**
     * Coordinate descent on the dual (Hsieh et al. 2008, Algorithm 1): the rows in a seeded random order each pass;
     * a step clips {@code alpha_i - g / Q_ii} to [0, C]; stops when the projected gradient's spread is at most
     * {@code tolerance} or after {@code iterations} passes. Primal decisions move to {@code gram} (when given) after
     * {@link #switchAfter} passes.
     */
    private static Descent descend(Decisions d, SharedGram gram, double[] qii, int[] signs, double c,
                                   double tolerance, int iterations, long seed) {
        int n = qii.length;
        double[] alpha = new double[n];
        int[] order = new int[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        SplittableRandom rnd = new SplittableRandom(seed);
        int pass = 0;
        boolean converged = false;
        while (pass < iterations) {
            pass++;
            for (int i = n - 1; i > 0; i--) {
                int j = rnd.nextInt(i + 1);
                int t = order[i];
                order[i] = order[j];
                order[j] = t;
            }
            double maxPg = Double.NEGATIVE_INFINITY;
            double minPg = Double.POSITIVE_INFINITY;
            for (int k = 0; k < n; k++) {
                int i = order[k];
                int yi = signs[i];
                double g = yi * d.value(i) - 1;
                double pg = g;
                if (alpha[i] == 0) {
                    pg = Math.min(g, 0);
                } else if (alpha[i] == c) {
                    pg = Math.max(g, 0);
                }
                maxPg = Math.max(maxPg, pg);
                minPg = Math.min(minPg, pg);
                if (pg != 0) {
                    double old = alpha[i];
                    alpha[i] = Math.min(Math.max(old - g / qii[i], 0), c);
                    double step = (alpha[i] - old) * yi;
                    if (step != 0) {
                        d.move(i, step);
                    }
                }
            }
            if (maxPg - minPg <= tolerance) {
                converged = true;
                break;
            }
            if (gram != null && d instanceof Primal && pass >= switchAfter(n)) {
                d = Dual.at(gram.matrix(), alpha, signs);
            }
        }
        return new Descent(alpha, pass, converged, d);
    }

    @Override
    public boolean freezable() {
        return true;
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        return fit(ctx, x, y, classes, params, sharedGram(x), new FitHints());
    }

    /**
     * Fits the grid's points one after the other on one {@link SharedGram}: the first point that runs more than
     * {@link #switchAfter} passes builds the rows' Gram matrix, and every later point (and machine) starts on it.
     */
    @Override
    public List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid) {
        return fitGrid(contexts, x, y, classes, grid, new FitHints());
    }

    /**
     * {@link #fitGrid(List, Rows, int[], int, List)}; a grid point whose last fit in {@code hints} needed at least
     * {@link #switchAfter} passes for these rows (the rent-or-buy rule would move to the Gram matrix) starts on the
     * Gram matrix at once, and each point's passes are added to the hints.
     */
    @Override
    public List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid,
                               FitHints hints) {
        if (contexts.size() != grid.size()) {
            throw new IllegalArgumentException("contexts " + contexts.size() + " != grid points " + grid.size());
        }
        SharedGram gram = sharedGram(x);
        List<Model> out = new java.util.ArrayList<>(grid.size());
        for (int g = 0; g < grid.size(); g++) {
            out.add(fit(contexts.get(g), x, y, classes, grid.get(g), gram, hints));
        }
        return out;
    }

    @Override
    public Model fitOwned(FitContext ctx, Rows x, int[] y, int classes, Params params, FitHints hints) {
        return fit(ctx, x, y, classes, params, sharedGram(x), hints);
    }

    private SharedGram sharedGram(Rows x) {
        return x.n() > 0 && x.n() < x.p() ? new SharedGram(x.x(), gramOf) : null;
    }

    private Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params, SharedGram gram,
                      FitHints hints) {
        TrainingLabels.check(method(), x, y, classes);
        int machines = OneAgainstRest.machines(classes);
        Machine[] fitted = new Machine[machines];
        if (gram != null && hints.passes(params) >= switchAfter(x.n())) {
            gram.matrix(); // the last fit at this point needed the switch: build the matrix before the first pass
        }
        int passes = 0;
        for (int m = 0; m < machines; m++) {
            int[] signs = OneAgainstRest.signs(y, classes, m);
            long seed = Seeds.derive(ctx.seed(), "svm-linear", m);
            fitted[m] = solve(x.x(), signs, params.getDouble("C"), params.getDouble("tolerance"),
                    params.getInt("iterations"), seed, gram);
            passes = Math.max(passes, fitted[m].passes());
        }
        hints.passes(params, passes);
        double[] b = new double[machines];
        for (int m = 0; m < machines; m++) {
            b[m] = fitted[m].b();
        }
        double[][] w = new double[machines][];
        boolean converged = true;
        for (int m = 0; m < machines; m++) {
            w[m] = fitted[m].w();
            converged &= fitted[m].converged();
        }
        ClassifierMethod.Model model = new FrozenModels.Linear(w, b, classes);
        return new Explained(model, Explained.absWeights(w, x.x()), Explained.ABS_WEIGHT, converged);
    }
}
