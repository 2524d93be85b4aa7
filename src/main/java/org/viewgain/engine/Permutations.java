package org.viewgain.engine;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.FutureTask;
import java.util.function.Function;
import org.viewgain.folds.FoldPlan;
import org.viewgain.spec.Specs;
import org.viewgain.stats.PermutationP;
import org.viewgain.stats.SequentialStop;

/**
 * Label permutation test of whole nested pipelines. For each permutation the labels are shuffled among the subjects
 * the pipeline uses (within sites when given, see {@link PermutedLabels}) and the whole procedure is re-run as the run
 * ran it: the outer fold plan is drawn from the permuted labels as the run's plan was drawn from the real ones
 * (stratified k-fold; leave-one-out and leave-site-out plans do not depend on labels), the inner folds are stratified
 * by the permuted labels, the imputers are fitted in the permuted plan's training sets, and every label-dependent
 * step (tuning, preprocessing, classifier) is re-fitted. So the observed statistic and the permuted ones come from one
 * procedure and are exchangeable under the null. Keeping the run's label-stratified folds for every permutation
 * would not be: the permuted labels would fall unevenly into them, and cross-validation on unbalanced folds scores
 * below chance at small n, which made the test liberal.
 *
 * <p>Imputations never see labels: within one permutation they are computed once per imputer and shared by every
 * pipeline that uses them; they are reused from the observed run when the permuted plan equals it (leave-one-out,
 * leave-site-out). Permutations are evaluated in batches but consumed in order, so sequential stopping gives the same
 * answer on any number of threads.
 */
final class Permutations {
    private final Experiment ex;
    private final Runner.State state;
    private final Known known;
    private final Record record;
    private final Runnable ready;
    /** Imputations of permutation k's plan per imputer (key k, imputer), for the pipelines of the current batch. */
    private final ConcurrentHashMap<List<Integer>, FutureTask<ImputedFold[]>> imputations = new ConcurrentHashMap<>();

    /** A statistic already computed (journaled), or null. */
    interface Known {
        Double get(int pipeline, int k);
    }

    /** Keeps a statistic just computed. */
    interface Record {
        void put(int pipeline, int k, double statistic);
    }

    /**
     * @param known  statistics already journaled, consumed in order before anything is computed
     * @param record receives every computed statistic
     * @param ready  makes {@code state} ready (phase one) before the first statistic is computed
     */
    Permutations(Experiment ex, Runner.State state, Known known, Record record, Runnable ready) {
        this.ex = ex;
        this.state = state;
        this.known = known;
        this.record = record;
        this.ready = ready;
    }

    /** Bytes of imputations one batch may hold for its permutations together (one permutation's always fit). */
    static final long IMPUTATION_BUDGET = 256L << 20;

    /**
     * About how many bytes one permutation's imputations take ({@link ImputedFold}: a float per subject and target
     * feature, and a double per target feature, in every outer-fold slot, for each imputer a pipeline uses).
     */
    long imputationBytes() {
        long imputers = ex.pipelines().stream().filter(p -> p.featureSet().needsImputer()).map(Pipeline::imputer)
                .distinct().count();
        long perSlot = (long) ex.data().targetNames().size() * (4L * ex.data().n() + 8L);
        return Math.max(1, imputers * state.slots() * perSlot);
    }

    /** Jobs a batch aims at on {@code threads} threads: several per thread, so that no thread idles long at its end. */
    static int jobsPerBatch(int threads) {
        return Math.max(2, 8 * threads);
    }

    /**
     * Permutations per active pipeline in one batch: {@code batch} jobs spread over the active pipelines (at least
     * one each), fewer when their imputations ({@code bytesPerPermutation} each) would pass the budget.
     */
    static int perPipeline(int batch, int active, long bytesPerPermutation) {
        long byMemory = Math.max(1, IMPUTATION_BUDGET / Math.max(1, bytesPerPermutation));
        int byJobs = Math.max(1, (int) Math.ceil(batch / (double) Math.max(1, active)));
        return (int) Math.min(byJobs, byMemory);
    }

    /** Runs the test for every pipeline; {@code observed} is each pipeline's metric on the real labels. */
    List<PermutationResult> run(List<Double> observed, Function<List<Callable<Double>>, List<Double>> executor,
                                Runner.Counter counter) {
        Specs.Significance sig = ex.spec().significance();
        int n = sig.permutations();
        int h = sig.earlyStop() > 0 ? sig.earlyStop() : n + 1;
        int pipelines = ex.pipelines().size();
        SequentialStop[] stop = new SequentialStop[pipelines];
        double[][] values = new double[pipelines][n];
        int[] next = new int[pipelines];
        boolean[] active = new boolean[pipelines];
        for (int p = 0; p < pipelines; p++) {
            double obs = observed.get(p);
            active[p] = !Double.isNaN(obs);
            stop[p] = active[p] ? SequentialStop.start(obs, Math.min(h, n), n) : null;
        }
        // jobs per batch: several per thread, so that the slowest pipeline's fit does not leave the other threads idle
        // at the batch's end (a barrier: the batch's imputations are dropped there), as long as the imputations of the
        // permutations a batch holds stay within IMPUTATION_BUDGET
        int batch = jobsPerBatch(state.threads());
        long bytes = imputationBytes();
        while (anyActive(active)) {
            for (int p = 0; p < pipelines; p++) {
                Double v;
                while (active[p] && (v = known.get(p, next[p])) != null) {
                    values[p][next[p]] = v;
                    stop[p] = stop[p].next(v);
                    next[p]++;
                    counter.done();
                    if (stop[p].stopped()) {
                        active[p] = false;
                        counter.shrink(n - next[p]);
                    }
                }
            }
            if (!anyActive(active)) {
                break;
            }
            ready.run();
            List<int[]> jobs = new ArrayList<>();
            int activeCount = (int) java.util.stream.IntStream.range(0, pipelines).filter(p -> active[p]).count();
            int per = perPipeline(batch, activeCount, bytes);
            for (int p = 0; p < pipelines; p++) {
                for (int k = next[p]; active[p] && k < Math.min(n, next[p] + per); k++) {
                    jobs.add(new int[] {p, k});
                }
            }
            List<Callable<Double>> tasks = new ArrayList<>();
            for (int[] job : jobs) {
                tasks.add(() -> {
                    double v = statistic(ex.pipelines().get(job[0]), job[1] + 1, sig.metricColumn());
                    record.put(job[0], job[1], v);
                    counter.done();
                    return v;
                });
            }
            List<Double> got = executor.apply(tasks);
            release();
            for (int j = 0; j < jobs.size(); j++) {
                int p = jobs.get(j)[0];
                int k = jobs.get(j)[1];
                if (!active[p] || k != next[p]) {
                    continue; // beyond a stop already reached: not used, so the answer does not depend on batching
                }
                values[p][k] = got.get(j);
                stop[p] = stop[p].next(got.get(j));
                next[p]++;
                if (stop[p].stopped()) {
                    active[p] = false;
                    counter.shrink(n - next[p]);
                }
            }
        }
        List<PermutationResult> out = new ArrayList<>();
        for (int p = 0; p < pipelines; p++) {
            Pipeline pl = ex.pipelines().get(p);
            if (stop[p] == null) {
                out.add(new PermutationResult(pl, sig.metricColumn(), observed.get(p), new double[0], 0, Double.NaN,
                        false, PermutedLabels.withinSites(ex)));
                continue;
            }
            double[] nul = Arrays.copyOf(values[p], stop[p].draws());
            boolean early = stop[p].stoppedEarly();
            double pv = early ? stop[p].pValue() : PermutationP.ojalaGarriga(stop[p].exceedances(), stop[p].draws());
            out.add(new PermutationResult(pl, sig.metricColumn(), observed.get(p), nul, stop[p].exceedances(), pv,
                    early, PermutedLabels.withinSites(ex)));
        }
        return out;
    }

    private static boolean anyActive(boolean[] a) {
        for (boolean b : a) {
            if (b) {
                return true;
            }
        }
        return false;
    }

    /** The pipeline's metric (mean over repeats of the pooled out-of-fold value) under permutation k (from 1). */
    double statistic(Pipeline p, int k, String metric) {
        int[] labels = PermutedLabels.of(ex, k, p.featureSet());
        FoldPlan plan = ex.planFor(labels);
        ClassifierStage stage = new ClassifierStage(ex);
        int m = p.featureSet().needsImputer() ? state.imputerIndex(p.imputer()) : -1;
        return Evaluation.pooled(ex, plan.repeats(), r -> {
            List<RunResults.Prediction> ps = new ArrayList<>();
            for (int f = 0; f < plan.folds(r); f++) {
                int slot = state.slot(r, f);
                ImputedFold imputed = m < 0 ? null : imputed(k, plan, m, slot);
                ps.addAll(stage.run(p, k, plan, r, f, InnerFolds.of(ex, plan, labels, r, f), imputed, labels)
                        .predictions());
            }
            return ps;
        }, metric);
    }

    /**
     * The imputations of imputer {@code m} in one outer fold of permutation k's plan: the run's own when the plan is
     * the run's, otherwise fitted once for the permutation (every pipeline with imputed features uses the whole
     * cohort, so one plan per permutation serves them all) by the first pipeline that asks.
     */
    private ImputedFold imputed(int k, FoldPlan plan, int m, int slot) {
        if (plan == ex.plan() && state.imputed(slot, m) != null) {
            return state.imputed(slot, m);
        }
        FutureTask<ImputedFold[]> task = imputations.computeIfAbsent(List.of(k, m), key -> new FutureTask<>(() -> {
            ImputationStage stage = new ImputationStage(ex);
            ImputedFold[] out = new ImputedFold[state.slots()];
            for (int r = 0; r < plan.repeats(); r++) {
                for (int f = 0; f < plan.folds(r); f++) {
                    out[state.slot(r, f)] = stage.run(ex.imputers().get(m), k, plan, r, f);
                }
            }
            return out;
        }));
        task.run(); // returns at once when another thread runs it or has run it
        try {
            return task.get()[slot];
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException re) {
                throw re;
            }
            throw new IllegalStateException(e.getCause());
        }
    }

    /** Drops the imputations of the permutations run so far (called after each batch). */
    void release() {
        imputations.clear();
    }
}
