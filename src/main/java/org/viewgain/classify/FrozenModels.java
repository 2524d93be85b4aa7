package org.viewgain.classify;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.cohort.Rows;
import org.viewgain.frozen.Freezable;
import org.viewgain.frozen.FrozenIn;
import org.viewgain.frozen.FrozenOut;

/**
 * The trained models that can be frozen into a bundle: the project's own {@code random-forest}, {@code svm-linear}
 * and {@code svm-rbf}, in the project's own layout, and their readers. Smile and Weka models are not frozen: their
 * only portable form is Java serialization, which a bundle never holds (reading it back can run code). A thawed
 * model runs the same arithmetic on the same numbers as the trained one, so it predicts bit for bit the same.
 */
public final class FrozenModels {
    private FrozenModels() {
    }

    /** The freezable form of a trained model, or null when its method cannot be frozen. */
    public static Freezable of(ClassifierMethod.Model model) {
        ClassifierMethod.Model m = model instanceof Explained e ? e.inner() : model;
        return m instanceof Freezable f ? f : null;
    }

    /**
     * The model a part holds.
     *
     * @throws IllegalArgumentException for a part of another kind or a damaged one
     */
    public static ClassifierMethod.Model thaw(FrozenIn in) {
        ClassifierMethod.Model out = switch (in.kind()) {
            case Forest.KIND -> Forest.thaw(in);
            case Linear.KIND -> Linear.thaw(in);
            case Kernel.KIND -> Kernel.thaw(in);
            default -> throw in.bad("not a model this version can read");
        };
        in.end();
        return out;
    }

    /** A forest: its trees; class fractions averaged over them. */
    record Forest(BinnedForest.Tree[] trees, int classes) implements ClassifierMethod.Model, Freezable {
        static final String KIND = "random-forest";

        @Override
        public Predictions predict(Rows rows) {
            int[] labels = new int[rows.n()];
            double[][] scores = new double[rows.n()][classes];
            for (int i = 0; i < rows.n(); i++) {
                double[] row = rows.x()[i];
                for (BinnedForest.Tree tree : trees) {
                    tree.addProbabilities(row, scores[i]);
                }
                for (int c = 0; c < classes; c++) {
                    scores[i][c] /= trees.length;
                }
                labels[i] = TrainingLabels.argmax(scores[i]);
            }
            return new Predictions(labels, scores);
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.integer(classes).integer(trees.length);
            for (BinnedForest.Tree t : trees) {
                out.integers(t.feature()).numbers(t.threshold()).integers(t.left()).integers(t.right())
                        .numbers(t.leafProbabilities());
            }
        }

        static Forest thaw(FrozenIn in) {
            int classes = in.integer();
            int n = in.integer();
            if (classes < 2 || n < 1) {
                throw in.bad("a forest needs two classes and a tree");
            }
            BinnedForest.Tree[] trees = new BinnedForest.Tree[n];
            for (int t = 0; t < n; t++) {
                trees[t] = new BinnedForest.Tree(in.integers(), in.numbers(), in.integers(), in.integers(),
                        in.numbers(), classes);
                int nodes = trees[t].feature().length;
                if (trees[t].threshold().length != nodes || trees[t].left().length != nodes
                        || trees[t].right().length != nodes) {
                    throw in.bad("tree " + t + " has arrays of different lengths");
                }
            }
            return new Forest(trees, classes);
        }
    }

    /** Linear machines {@code w.x + b}, one per class against the rest (one for two classes). */
    record Linear(double[][] w, double[] b, int classes) implements ClassifierMethod.Model, Freezable {
        static final String KIND = "svm-linear";

        @Override
        public Predictions predict(Rows rows) {
            return OneAgainstRest.predict(rows, classes, (m, row) -> {
                double s = b[m];
                double[] wm = w[m];
                for (int j = 0; j < wm.length; j++) {
                    s += wm[j] * row[j];
                }
                return s;
            });
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.integer(classes).matrix(w).numbers(b);
        }

        static Linear thaw(FrozenIn in) {
            int classes = in.integer();
            double[][] w = in.matrix();
            double[] b = in.numbers();
            if (classes < 2 || w == null || b == null || w.length != OneAgainstRest.machines(classes)
                    || b.length != w.length) {
                throw in.bad("the machines do not match the classes");
            }
            return new Linear(w, b, classes);
        }
    }

    /** RBF machines: support vectors, their coefficients, rho and gamma per machine. */
    record Kernel(List<KernelSvm.Machine> machines, int classes, boolean converged) implements ClassifierMethod.Model, Freezable {
        static final String KIND = "svm-rbf";

        @Override
        public Predictions predict(Rows rows) {
            return OneAgainstRest.predict(rows, classes, (m, row) -> machines.get(m).decision(row));
        }

        @Override
        public boolean converged() {
            return converged;
        }

        @Override
        public String kind() {
            return KIND;
        }

        @Override
        public void freeze(FrozenOut out) {
            out.integer(classes).integer(machines.size());
            for (KernelSvm.Machine m : machines) {
                out.matrix(m.vectors()).numbers(m.coef()).number(m.rho()).number(m.gamma()).number(m.objective());
            }
        }

        static Kernel thaw(FrozenIn in) {
            int classes = in.integer();
            int n = in.integer();
            if (classes < 2 || n != OneAgainstRest.machines(classes)) {
                throw in.bad("the machines do not match the classes");
            }
            List<KernelSvm.Machine> ms = new ArrayList<>(n);
            for (int m = 0; m < n; m++) {
                double[][] v = in.matrix();
                double[] coef = in.numbers();
                if (v == null || coef == null || v.length != coef.length) {
                    throw in.bad("machine " + m + " has " + (v == null ? 0 : v.length) + " vectors but "
                            + (coef == null ? 0 : coef.length) + " coefficients");
                }
                ms.add(new KernelSvm.Machine(v, coef, in.number(), in.number(), in.number()));
            }
            return new Kernel(ms, classes, true);
        }
    }
}
