package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import org.viewgain.folds.FoldPlan;

/**
 * Runs an experiment as independent work units on a thread pool. Phase one fits every imputer in every outer fold
 * (label-free work, done once and shared by all pipelines and permutations); phase two trains and tests every
 * pipeline in every outer fold; phase three, when the spec asks for it, runs the label permutation test. Results are
 * gathered in unit order, so they do not depend on the number of threads.
 */
public final class Runner {
    private final Experiment ex;
    private final int threads;
    private final Progress progress;

    public Runner(Experiment ex, int threads, Progress progress) {
        this.ex = ex;
        this.threads = Math.max(1, threads);
        this.progress = progress;
    }

    /** Label-free results of phase one, shared with the permutation test. */
    final class State {
        private final List<int[]> folds = new ArrayList<>();
        private int[][] innerOf;
        private ImputedFold[][] imputed;

        int threads() {
            return threads;
        }

        int slot(int repeat, int fold) {
            for (int[] rf : folds) {
                if (rf[0] == repeat && rf[1] == fold) {
                    return rf[2];
                }
            }
            throw new IllegalArgumentException("no fold " + repeat + "/" + fold);
        }

        int[] innerOf(int slot) {
            return innerOf[slot];
        }

        ImputedFold imputed(int slot, int imputer) {
            return imputed[slot][imputer];
        }

        int imputerIndex(String name) {
            for (int m = 0; m < ex.imputers().size(); m++) {
                if (ex.imputers().get(m).name().equals(name)) {
                    return m;
                }
            }
            throw new IllegalStateException("no imputer " + name);
        }
    }

    /** Progress bookkeeping: finished units out of a total that shrinks when permutations stop early. */
    final class Counter {
        private final AtomicLong done = new AtomicLong();
        private final AtomicLong total;

        Counter(long total) {
            this.total = new AtomicLong(total);
        }

        void done() {
            progress.update(done.incrementAndGet(), total.get());
        }

        void shrink(long by) {
            progress.update(done.get(), total.addAndGet(-by));
        }
    }

    private boolean anyImputed() {
        return ex.pipelines().stream().anyMatch(p -> p.featureSet().needsImputer());
    }

    /** Number of work units: imputer fits and pipeline fits per outer fold, plus planned permutations. */
    public long units() {
        long folds = 0;
        for (int r = 0; r < ex.plan().repeats(); r++) {
            folds += ex.plan().folds(r);
        }
        return folds * ((anyImputed() ? ex.imputers().size() : 0) + ex.pipelines().size())
                + (long) ex.spec().significance().permutations() * ex.pipelines().size();
    }

    /** Runs everything. */
    public RunResults run() {
        FoldPlan plan = ex.plan();
        Counter counter = new Counter(units());
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "viewgain-worker");
            t.setDaemon(true);
            return t;
        });
        try {
            State state = new State();
            for (int r = 0; r < plan.repeats(); r++) {
                for (int f = 0; f < plan.folds(r); f++) {
                    state.folds.add(new int[] {r, f, state.folds.size()});
                }
            }
            state.innerOf = new int[state.folds.size()][];
            for (int[] rf : state.folds) {
                state.innerOf[rf[2]] = InnerFolds.of(ex, rf[0], rf[1]);
            }
            // phase one: imputations
            state.imputed = new ImputedFold[state.folds.size()][ex.imputers().size()];
            if (anyImputed()) {
                ImputationStage stage = new ImputationStage(ex);
                List<Callable<Void>> tasks = new ArrayList<>();
                for (int[] rf : state.folds) {
                    for (int m = 0; m < ex.imputers().size(); m++) {
                        final int mm = m;
                        tasks.add(() -> {
                            state.imputed[rf[2]][mm] = stage.run(ex.imputers().get(mm), 0, rf[0], rf[1],
                                    state.innerOf[rf[2]]);
                            counter.done();
                            return null;
                        });
                    }
                }
                invokeAll(pool, tasks);
            }
            // phase two: pipelines
            ClassifierStage stage = new ClassifierStage(ex);
            List<Callable<ClassifierStage.Output>> tasks = new ArrayList<>();
            for (int[] rf : state.folds) {
                for (Pipeline p : ex.pipelines()) {
                    int m = p.featureSet().needsImputer() ? state.imputerIndex(p.imputer()) : -1;
                    tasks.add(() -> {
                        ClassifierStage.Output o = stage.run(p, 0, rf[0], rf[1], state.innerOf[rf[2]],
                                m < 0 ? null : state.imputed[rf[2]][m], ex.data().y());
                        counter.done();
                        return o;
                    });
                }
            }
            RunResults res = collect(state, invokeAll(pool, tasks));
            // phase three: permutation test
            if (ex.spec().significance().permutations() > 0) {
                String metric = ex.spec().significance().metric().replace('-', '_');
                List<Double> observed = new ArrayList<>();
                for (Pipeline p : ex.pipelines()) {
                    double sum = 0;
                    for (int r = 0; r < plan.repeats(); r++) {
                        sum += Evaluation.compute(ex, Evaluation.select(res, p, r, -1)).get(metric);
                    }
                    observed.add(sum / plan.repeats());
                }
                List<PermutationResult> perms = new Permutations(ex, state).run(observed,
                        t -> invokeAll(pool, t), counter);
                res = res.withPermutations(perms);
            }
            return res;
        } finally {
            pool.shutdownNow();
        }
    }

    private RunResults collect(State state, List<ClassifierStage.Output> outputs) {
        List<RunResults.Prediction> predictions = new ArrayList<>();
        List<RunResults.Choice> choices = new ArrayList<>();
        List<RunResults.ImputationRow> quality = new ArrayList<>();
        List<Importance.Fold> importance = new ArrayList<>();
        for (int[] rf : state.folds) {
            for (int m = 0; m < ex.imputers().size(); m++) {
                ImputedFold fi = state.imputed[rf[2]][m];
                if (fi == null) {
                    continue;
                }
                Resolved.Imputer imp = ex.imputers().get(m);
                choices.add(new RunResults.Choice(rf[0], rf[1], "imputer", imp.name(), "", "",
                        fi.chosen().toString(), fi.innerMae(), imp.grid().size()));
                for (ImputedFold.Quality q : fi.quality()) {
                    quality.add(new RunResults.ImputationRow(imp.name(), rf[0], rf[1], q.subject(), q.mae(), q.rmse(),
                            q.pearsonR(), q.strengthMae(), q.skill(), q.absError()));
                }
            }
        }
        // pipeline-major order: all folds of the first pipeline, then the next
        int perFold = ex.pipelines().size();
        for (int pi = 0; pi < perFold; pi++) {
            for (int[] rf : state.folds) {
                ClassifierStage.Output o = outputs.get(rf[2] * perFold + pi);
                predictions.addAll(o.predictions());
                choices.add(o.choice());
                if (o.importance() != null) {
                    importance.add(o.importance());
                }
            }
        }
        return new RunResults(ex, ex.plan(), predictions, choices, quality, List.of(), importance);
    }

    private static <T> List<T> invokeAll(ExecutorService pool, List<Callable<T>> tasks) {
        List<Future<T>> futures = new ArrayList<>();
        for (Callable<T> t : tasks) {
            futures.add(pool.submit(t));
        }
        List<T> out = new ArrayList<>(tasks.size());
        try {
            for (Future<T> f : futures) {
                out.add(f.get());
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            futures.forEach(f -> f.cancel(true));
            Throwable c = e.getCause();
            if (c instanceof RuntimeException re) {
                throw re;
            }
            if (c instanceof Error err) {
                throw err;
            }
            throw new IllegalStateException(c);
        }
        return out;
    }
}
