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
 * (label-free work, done once and shared by all pipelines); phase two trains and tests every pipeline in every outer
 * fold. Results are gathered in unit order, so they do not depend on the number of threads.
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

    /** Number of work units: imputer fits per outer fold plus pipeline fits per outer fold. */
    public long units() {
        long folds = outerFolds();
        boolean anyImputed = ex.pipelines().stream().anyMatch(p -> p.featureSet().needsImputer());
        return folds * ((anyImputed ? ex.imputers().size() : 0) + ex.pipelines().size());
    }

    private long outerFolds() {
        long f = 0;
        for (int r = 0; r < ex.plan().repeats(); r++) {
            f += ex.plan().folds(r);
        }
        return f;
    }

    /** Runs everything with the observed labels. */
    public RunResults run() {
        FoldPlan plan = ex.plan();
        long total = units();
        AtomicLong done = new AtomicLong();
        ExecutorService pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "viewgain-worker");
            t.setDaemon(true);
            return t;
        });
        try {
            boolean anyImputed = ex.pipelines().stream().anyMatch(p -> p.featureSet().needsImputer());
            List<int[]> foldList = new ArrayList<>();
            for (int r = 0; r < plan.repeats(); r++) {
                for (int f = 0; f < plan.folds(r); f++) {
                    foldList.add(new int[] {r, f, foldList.size()});
                }
            }
            int[][] innerOf = new int[foldList.size()][];
            for (int[] rf : foldList) {
                innerOf[rf[2]] = InnerFolds.of(ex, rf[0], rf[1]);
            }
            // phase one: imputations
            ImputedFold[][] imputed = new ImputedFold[foldList.size()][ex.imputers().size()];
            if (anyImputed) {
                ImputationStage stage = new ImputationStage(ex);
                List<Callable<Void>> tasks = new ArrayList<>();
                for (int[] rf : foldList) {
                    for (int m = 0; m < ex.imputers().size(); m++) {
                        final int mm = m;
                        tasks.add(() -> {
                            imputed[rf[2]][mm] = stage.run(ex.imputers().get(mm), 0, rf[0], rf[1], innerOf[rf[2]]);
                            progress.update(done.incrementAndGet(), total);
                            return null;
                        });
                    }
                }
                invokeAll(pool, tasks);
            }
            // phase two: pipelines
            ClassifierStage stage = new ClassifierStage(ex);
            List<Callable<ClassifierStage.Output>> tasks = new ArrayList<>();
            for (int[] rf : foldList) {
                for (Pipeline p : ex.pipelines()) {
                    int m = p.featureSet().needsImputer() ? imputerIndex(p.imputer()) : -1;
                    tasks.add(() -> {
                        ClassifierStage.Output o = stage.run(p, 0, rf[0], rf[1], innerOf[rf[2]],
                                m < 0 ? null : imputed[rf[2]][m], ex.data().y());
                        progress.update(done.incrementAndGet(), total);
                        return o;
                    });
                }
            }
            List<ClassifierStage.Output> outputs = invokeAll(pool, tasks);
            return collect(foldList, imputed, outputs);
        } finally {
            pool.shutdownNow();
        }
    }

    private RunResults collect(List<int[]> foldList, ImputedFold[][] imputed, List<ClassifierStage.Output> outputs) {
        List<RunResults.Prediction> predictions = new ArrayList<>();
        List<RunResults.Choice> choices = new ArrayList<>();
        List<RunResults.ImputationRow> quality = new ArrayList<>();
        for (int[] rf : foldList) {
            for (int m = 0; m < ex.imputers().size(); m++) {
                ImputedFold fi = imputed[rf[2]][m];
                if (fi == null) {
                    continue;
                }
                Resolved.Imputer imp = ex.imputers().get(m);
                choices.add(new RunResults.Choice(rf[0], rf[1], "imputer", imp.name(), "", "",
                        fi.chosen().toString(), fi.innerMae(), imp.grid().size()));
                for (ImputedFold.Quality q : fi.quality()) {
                    quality.add(new RunResults.ImputationRow(imp.name(), rf[0], rf[1], q.subject(), q.mae(), q.rmse(),
                            q.pearsonR(), q.strengthMae()));
                }
            }
        }
        // pipeline-major order: all folds of the first pipeline, then the next
        int perFold = ex.pipelines().size();
        for (int pi = 0; pi < perFold; pi++) {
            for (int[] rf : foldList) {
                ClassifierStage.Output o = outputs.get(rf[2] * perFold + pi);
                predictions.addAll(o.predictions());
                choices.add(o.choice());
            }
        }
        return new RunResults(ex, ex.plan(), predictions, choices, quality);
    }

    private int imputerIndex(String name) {
        for (int m = 0; m < ex.imputers().size(); m++) {
            if (ex.imputers().get(m).name().equals(name)) {
                return m;
            }
        }
        throw new IllegalStateException("no imputer " + name);
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
