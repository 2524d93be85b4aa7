package org.viewgain.classify;

import java.util.List;
import java.util.SplittableRandom;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;

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
 * <p>Two classes: one machine, class 1 on the positive side; more: one machine per class against the rest. Scores
 * are decision values {@code w.x + b} (for two classes {@code scores[i][1]} is the value and {@code scores[i][0]} its
 * negative). Importance: {@code |w_j|} times input j's training standard deviation, kind {@code abs_weight}.
 */
public final class LinearSvm implements ClassifierMethod {

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
     * Solves one machine. {@code signs[i]} is +1 or -1; the rows are read, never written.
     *
     * @param iterations most passes over the rows
     */
    static Machine solve(double[][] x, int[] signs, double c, double tolerance, int iterations, long seed) {
        int n = x.length;
        double[] qii = new double[n];
        for (int i = 0; i < n; i++) {
            double s = 1; // the constant input
            for (double v : x[i]) {
                s += v * v;
            }
            qii[i] = s;
        }
        Primal primal = new Primal(x);
        Descent d = descend(primal, qii, signs, c, tolerance, iterations, seed);
        return new Machine(primal.w, primal.b, d.passes(), d.converged());
    }

    /** The rows' Gram matrix with the constant input: {@code K[i][j] = x_i . x_j + 1} (symmetric). */
    static double[][] gram(double[][] x) {
        int n = x.length;
        double[][] k = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double v = RbfKernel.dot(x[i], x[j]) + 1;
                k[i][j] = v;
                k[j][i] = v;
            }
        }
        return k;
    }

    /**
     * {@link #solve} on the Gram matrix: the same coordinate descent ({@link #descend}), keeping the decision values
     * of all rows up to date instead of the weights (a step moves them by {@code d K[i]}), and forming {@code w} and
     * {@code b} from the duals at the end. Equal to {@link #solve} up to rounding (checked in tests).
     */
    static Machine solveGram(double[][] gram, double[][] x, int[] signs, double c, double tolerance, int iterations,
                             long seed) {
        int n = x.length;
        int p = x[0].length;
        double[] qii = new double[n];
        for (int i = 0; i < n; i++) {
            qii[i] = gram[i][i];
        }
        Descent d = descend(new Dual(gram), qii, signs, c, tolerance, iterations, seed);
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

    /** The duals at the end, the passes made and whether the stopping rule held. */
    private record Descent(double[] alpha, int passes, boolean converged) {
    }

    /**
     * Coordinate descent on the dual (Hsieh et al. 2008, Algorithm 1): the rows in a seeded random order each pass;
     * a step clips {@code alpha_i - g / Q_ii} to [0, C]; stops when the projected gradient's spread is at most
     * {@code tolerance} or after {@code iterations} passes.
     */
    private static Descent descend(Decisions d, double[] qii, int[] signs, double c, double tolerance,
                                   int iterations, long seed) {
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
        }
        return new Descent(alpha, pass, converged);
    }

    @Override
    public boolean freezable() {
        return true;
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        return fit(ctx, x, y, classes, params, null);
    }

    /**
     * Grid points fitted on the same rows share the subjects' Gram matrix when it is cheaper than the passes it
     * saves: building it costs about n/2 passes of the primal solver, and the dual steps on it cost n instead of p
     * each. Taken when n &lt; 60 x (grid points), i.e. when the grid's fits would average more than about 30 passes
     * each (measured: 69 at C = 0.1 and 6 at C = 0.001 on the demo); otherwise each point runs the primal solver.
     */
    @Override
    public List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid) {
        if (contexts.size() != grid.size()) {
            throw new IllegalArgumentException("contexts " + contexts.size() + " != grid points " + grid.size());
        }
        int n = x.n();
        double[][] gram = n > 0 && n < 60 * grid.size() && n < x.p() ? gram(x.x()) : null;
        List<Model> out = new java.util.ArrayList<>(grid.size());
        for (int g = 0; g < grid.size(); g++) {
            out.add(fit(contexts.get(g), x, y, classes, grid.get(g), gram));
        }
        return out;
    }

    private Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params, double[][] gram) {
        TrainingLabels.check(method(), x, y, classes);
        int machines = OneAgainstRest.machines(classes);
        Machine[] fitted = new Machine[machines];
        for (int m = 0; m < machines; m++) {
            int[] signs = OneAgainstRest.signs(y, classes, m);
            long seed = Seeds.derive(ctx.seed(), "svm-linear", m);
            fitted[m] = gram == null
                    ? solve(x.x(), signs, params.getDouble("C"), params.getDouble("tolerance"),
                            params.getInt("iterations"), seed)
                    : solveGram(gram, x.x(), signs, params.getDouble("C"), params.getDouble("tolerance"),
                            params.getInt("iterations"), seed);
        }
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
