package org.viewgain.engine;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.function.Function;
import org.viewgain.spec.Specs;
import org.viewgain.stats.PermutationP;
import org.viewgain.stats.SequentialStop;

/**
 * Label permutation test of whole nested pipelines: for each permutation the labels are shuffled (within sites when
 * given) and every label-dependent step (tuning, scaling, classifier) is re-run on the same fold plan; the imputations,
 * which never see labels, are reused from the observed run. Permutations are evaluated in batches but consumed in
 * order, so sequential stopping gives the same answer on any number of threads.
 */
final class Permutations {
    private final Experiment ex;
    private final Runner.State state;
    private final Known known;
    private final Record record;
    private final Runnable ready;

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
        int batch = Math.max(2, 2 * state.threads());
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
            int per = Math.max(1, (int) Math.ceil(batch / (double) activeCount));
            for (int p = 0; p < pipelines; p++) {
                for (int k = next[p]; active[p] && k < Math.min(n, next[p] + per); k++) {
                    jobs.add(new int[] {p, k});
                }
            }
            List<Callable<Double>> tasks = new ArrayList<>();
            for (int[] job : jobs) {
                tasks.add(() -> {
                    double v = statistic(ex.pipelines().get(job[0]), job[1] + 1, sig.metric());
                    record.put(job[0], job[1], v);
                    counter.done();
                    return v;
                });
            }
            List<Double> got = executor.apply(tasks);
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
                out.add(new PermutationResult(pl, sig.metric(), observed.get(p), new double[0], 0, Double.NaN, false,
                        PermutedLabels.withinSites(ex)));
                continue;
            }
            double[] nul = Arrays.copyOf(values[p], stop[p].draws());
            boolean early = stop[p].stoppedEarly();
            double pv = early ? stop[p].pValue() : PermutationP.ojalaGarriga(stop[p].exceedances(), stop[p].draws());
            out.add(new PermutationResult(pl, sig.metric(), observed.get(p), nul, stop[p].exceedances(), pv, early,
                    PermutedLabels.withinSites(ex)));
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

    /** The pipeline's metric (mean over repeats of the pooled out-of-fold value) under permutation k. */
    double statistic(Pipeline p, int k, String metric) {
        int[] labels = PermutedLabels.of(ex, k);
        ClassifierStage stage = new ClassifierStage(ex);
        int m = p.featureSet().needsImputer() ? state.imputerIndex(p.imputer()) : -1;
        double sum = 0;
        for (int r = 0; r < ex.plan().repeats(); r++) {
            List<RunResults.Prediction> ps = new ArrayList<>();
            for (int f = 0; f < ex.plan().folds(r); f++) {
                int slot = state.slot(r, f);
                ps.addAll(stage.run(p, k, r, f, state.innerOf(slot), m < 0 ? null : state.imputed(slot, m), labels)
                        .predictions());
            }
            sum += Evaluation.compute(ex, ps).get(metric.replace('-', '_'));
        }
        return sum / ex.plan().repeats();
    }
}
