package org.viewgain.engine;

import com.fasterxml.jackson.databind.JsonNode;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.concurrent.Callable;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import org.viewgain.folds.FoldPlan;

/**
 * Runs an experiment as independent work units on a thread pool. Phase one fits every imputer in every outer fold
 * (label-free work, done once and shared by all pipelines); phase two trains and tests every pipeline in every outer
 * fold; phase three, when the spec asks for it, runs the label permutation test (see {@link Permutations}). Results are
 * gathered in unit order, so they do not depend on the number of threads. With a {@link Journal} every finished
 * unit of phases two and three is journaled and units already there are skipped, so a killed run resumes where it
 * stopped; with a {@link Shard} only a share of the units runs (for a cluster job array).
 */
public final class Runner {
    private final Experiment ex;
    private final int threads;
    private final Progress progress;
    private final Map<String, Object> done = new ConcurrentHashMap<>();
    private Journal journal;
    private UnitCodec codec;
    private final AvailabilityRun curve;
    private final Map<String, ImputationStage.Final> finalImputers = new ConcurrentHashMap<>();
    private FinalPipelines finals;

    public Runner(Experiment ex, int threads, Progress progress) {
        this.ex = ex;
        this.threads = Math.max(1, threads);
        this.progress = progress;
        this.curve = new AvailabilityRun(ex);
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

        int slots() {
            return folds.size();
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
                + (long) ex.spec().significance().permutations() * ex.pipelines().size() + curve.keys(null).size()
                + (ex.spec().finalPipelines() ? ex.pipelines().size() : 0);
    }

    /**
     * Journals every finished unit and skips units already in the journal (resume). Without a journal nothing is
     * written and every unit runs.
     */
    public Runner journal(Journal j) {
        this.journal = j;
        this.codec = new UnitCodec(ex);
        return this;
    }

    /** Runs everything (skipping units already journaled) and returns the results. */
    public RunResults run() {
        return execute(null);
    }

    /**
     * Runs only the units a shard owns, every planned permutation of its share without early stopping, and journals
     * them; the merged journals give the results of a single run (see {@link #run()}).
     */
    public void runShard(Shard shard) {
        if (journal == null) {
            throw new IllegalStateException("a shard needs a journal");
        }
        execute(shard);
    }

    /** Keys of every unit a shard owns (all units for a whole run, {@code shard} null). */
    public List<String> unitKeys(Shard shard) {
        List<String> out = new ArrayList<>();
        int slots = slotCount();
        if (anyImputed()) {
            for (int s = 0; s < slots; s++) {
                for (int m = 0; m < ex.imputers().size(); m++) {
                    if (shard == null || shard.owns((long) s * ex.imputers().size() + m)) {
                        out.add(UnitCodec.imputerKey(s, m));
                    }
                }
            }
        }
        int pipelines = ex.pipelines().size();
        for (int s = 0; s < slots; s++) {
            for (int pi = 0; pi < pipelines; pi++) {
                if (shard == null || shard.owns((long) s * pipelines + pi)) {
                    out.add(UnitCodec.classifierKey(s, pi));
                }
            }
        }
        out.addAll(curve.keys(shard));
        if (ex.spec().finalPipelines()) {
            for (int pi = 0; pi < pipelines; pi++) {
                if (shard == null || shard.owns(pi)) {
                    out.add(UnitCodec.finalKey(pi));
                }
            }
        }
        if (shard != null) {
            for (int pi = 0; pi < pipelines; pi++) {
                for (int k = 0; k < ex.spec().significance().permutations(); k++) {
                    if (shard.owns(k)) {
                        out.add(UnitCodec.permutationKey(pi, k));
                    }
                }
            }
        }
        return out;
    }

    private int slotCount() {
        int n = 0;
        for (int r = 0; r < ex.plan().repeats(); r++) {
            n += ex.plan().folds(r);
        }
        return n;
    }

    private Object known(String key) {
        Object v = done.get(key);
        if (v == null && journal != null) {
            JsonNode rec = journal.unit(key);
            if (rec != null) {
                v = switch (kind(key)) {
                    case 'i' -> codec.imputer(rec);
                    case 'c' -> codec.classifier(rec);
                    case 'f' -> codec.finalUnit(rec);
                    default -> UnitCodec.permutation(rec);
                };
                done.put(key, v);
                journal.take(key);
            }
        }
        return v;
    }

    /** The kind of a unit: 'i' imputation, 'c' classifier, 'p' permutation (curve units are of the first two). */
    private static char kind(String key) {
        return AvailabilityRun.isCurveKey(key) ? key.charAt(1) : key.charAt(0);
    }

    private void record(String key, Object value) {
        if (journal != null) {
            journal.append(switch (kind(key)) {
                case 'i' -> codec.imputer(key, (UnitCodec.ImputerSummary) value);
                case 'c' -> codec.classifier(key, (ClassifierStage.Output) value);
                case 'f' -> codec.finalUnit(key, (FinalStage.Unit) value);
                default -> codec.permutation(key, (Double) value);
            });
        }
        done.put(key, value);
    }

    private RunResults execute(Shard shard) {
        FoldPlan plan = ex.plan();
        List<String> mine = unitKeys(shard);
        // a shard counts its own share; a whole run also counts the permutations it plans
        Counter counter = new Counter(shard == null ? units() : mine.size());
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
            state.imputed = new ImputedFold[state.folds.size()][ex.imputers().size()];
            Set<Integer> needed = new TreeSet<>();
            boolean allSlots = false;
            for (String key : mine) {
                if (known(key) != null) {
                    counter.done();
                } else if (key.charAt(0) == 'p') {
                    allSlots = true;
                } else if (!AvailabilityRun.isCurveKey(key) && key.charAt(0) != 'f') {
                    needed.add(Integer.parseInt(key.split("/")[1]));
                }
            }
            // phase one: imputations, label-free, recomputed for the folds still to run (never journaled)
            if (allSlots) {
                needed.clear();
                state.folds.forEach(rf -> needed.add(rf[2]));
            }
            impute(state, needed, pool, shard, counter, true);
            // phase two: pipelines
            ClassifierStage stage = new ClassifierStage(ex);
            List<Callable<Void>> tasks = new ArrayList<>();
            for (String key : mine) {
                if (key.charAt(0) != 'c' || known(key) != null) {
                    continue;
                }
                String[] parts = key.split("/");
                int[] rf = state.folds.get(Integer.parseInt(parts[1]));
                Pipeline p = ex.pipelines().get(Integer.parseInt(parts[2]));
                int m = p.featureSet().needsImputer() ? state.imputerIndex(p.imputer()) : -1;
                tasks.add(() -> {
                    record(key, stage.run(p, 0, plan, rf[0], rf[1], state.innerOf[rf[2]],
                            m < 0 ? null : state.imputed[rf[2]][m], ex.data().y()));
                    counter.done();
                    return null;
                });
            }
            invokeAll(pool, tasks);
            // the availability curve: its own units, level by level, on the same folds
            curve.run(mine, state.innerOf, host(pool, counter));
            runFinals(mine, pool, counter);
            Permutations perm = new Permutations(ex, state, (p, k) -> (Double) known(UnitCodec.permutationKey(p, k)),
                    (p, k, v) -> record(UnitCodec.permutationKey(p, k), v), () -> impute(state,
                    allFolds(state), pool, null, counter, false));
            if (shard != null) {
                // permutation-major, a few permutations at a time: the pipelines of one permutation share its
                // imputations, which are dropped after each batch
                TreeMap<Integer, List<Callable<Void>>> byPermutation = new TreeMap<>();
                String metric = ex.spec().significance().metricColumn();
                for (String key : mine) {
                    if (key.charAt(0) == 'p' && known(key) == null) {
                        String[] parts = key.split("/");
                        int pi = Integer.parseInt(parts[1]);
                        int k = Integer.parseInt(parts[2]);
                        byPermutation.computeIfAbsent(k, x -> new ArrayList<>()).add(() -> {
                            record(key, perm.statistic(ex.pipelines().get(pi), k + 1, metric));
                            counter.done();
                            return null;
                        });
                    }
                }
                int per = Math.max(1, (int) Math.ceil(2.0 * threads / Math.max(1, ex.pipelines().size())));
                List<Callable<Void>> batch = new ArrayList<>();
                int inBatch = 0;
                for (List<Callable<Void>> tasksOfK : byPermutation.values()) {
                    batch.addAll(tasksOfK);
                    if (++inBatch == per) {
                        invokeAll(pool, batch);
                        perm.release();
                        batch.clear();
                        inBatch = 0;
                    }
                }
                invokeAll(pool, batch);
                return null;
            }
            RunResults res = collect(state).withAvailability(curve.collect(host(pool, counter)));
            if (ex.spec().finalPipelines()) {
                finals = collectFinals(pool);
            }
            // phase three: permutation test
            if (ex.spec().significance().permutations() > 0) {
                String metric = ex.spec().significance().metricColumn();
                List<Double> observed = new ArrayList<>();
                RunResults run = res;
                for (Pipeline p : ex.pipelines()) {
                    observed.add(Evaluation.pooled(ex, plan.repeats(), r -> Evaluation.select(run, p, r, -1), metric));
                }
                res = res.withPermutations(perm.run(observed, t -> invokeAll(pool, t), counter));
            }
            return res;
        } finally {
            pool.shutdownNow();
        }
    }

    /** The final pipelines of a whole run (null before {@link #run()} or without final pipelines). */
    public FinalPipelines finals() {
        return finals;
    }

    /** Runs the final units of {@code mine} not journaled yet (their imputers fitted first, once each). */
    private void runFinals(List<String> mine, ExecutorService pool, Counter counter) {
        FinalStage stage = new FinalStage(ex);
        List<Integer> todo = new ArrayList<>();
        for (String key : mine) {
            if (key.charAt(0) == 'f' && known(key) == null) {
                todo.add(Integer.parseInt(key.split("/")[1]));
            }
        }
        if (todo.isEmpty()) {
            return;
        }
        Set<String> imputers = new TreeSet<>();
        todo.forEach(pi -> {
            Pipeline p = ex.pipelines().get(pi);
            if (p.featureSet().needsImputer()) {
                imputers.add(p.imputer());
            }
        });
        fitFinalImputers(imputers, pool);
        List<Callable<Void>> tasks = new ArrayList<>();
        for (int pi : todo) {
            Pipeline p = ex.pipelines().get(pi);
            tasks.add(() -> {
                ImputationStage.Final f = p.featureSet().needsImputer() ? finalImputers.get(p.imputer()) : null;
                record(UnitCodec.finalKey(pi), stage.unit(p, stage.train(p, f)));
                counter.done();
                return null;
            });
        }
        invokeAll(pool, tasks);
    }

    private void fitFinalImputers(Set<String> names, ExecutorService pool) {
        FinalStage stage = new FinalStage(ex);
        List<Callable<Void>> tasks = new ArrayList<>();
        for (String name : names) {
            if (!finalImputers.containsKey(name)) {
                tasks.add(() -> {
                    finalImputers.put(name, stage.imputer(ex.imputer(name)));
                    return null;
                });
            }
        }
        invokeAll(pool, tasks);
    }

    private FinalPipelines collectFinals(ExecutorService pool) {
        Set<String> used = new TreeSet<>();
        ex.pipelines().stream().filter(p -> p.featureSet().needsImputer()).forEach(p -> used.add(p.imputer()));
        fitFinalImputers(used, pool);
        List<FinalPipelines.Entry> entries = new ArrayList<>();
        for (int pi = 0; pi < ex.pipelines().size(); pi++) {
            Pipeline p = ex.pipelines().get(pi);
            FinalStage.Unit u = (FinalStage.Unit) known(UnitCodec.finalKey(pi));
            entries.add(new FinalPipelines.Entry(p, u));
        }
        Map<String, byte[]> parts = new TreeMap<>();
        Map<String, String> chosen = new TreeMap<>();
        for (Resolved.Imputer imp : ex.imputers()) {
            ImputationStage.Final f = finalImputers.get(imp.name());
            if (f != null) {
                parts.put(imp.name(), FinalStage.imputerPart(f, imp.name()));
                chosen.put(imp.name(), f.imputed().chosen().toString());
            }
        }
        return new FinalPipelines(ex, entries, parts, chosen);
    }

    private static Set<Integer> allFolds(State state) {
        Set<Integer> all = new TreeSet<>();
        state.folds.forEach(rf -> all.add(rf[2]));
        return all;
    }

    /**
     * Fits the imputers in the given folds unless done already, recording the summaries this run owns (and counting
     * them as finished units when {@code counted}: a unit journaled earlier was counted when the run started).
     */
    private void impute(State state, Set<Integer> slots, ExecutorService pool, Shard shard, Counter counter,
                        boolean counted) {
        if (!anyImputed()) {
            return;
        }
        ImputationStage stage = new ImputationStage(ex);
        List<Callable<Void>> tasks = new ArrayList<>();
        for (int slot : slots) {
            int[] rf = state.folds.get(slot);
            for (int m = 0; m < ex.imputers().size(); m++) {
                if (state.imputed[slot][m] != null) {
                    continue;
                }
                final int mm = m;
                String key = UnitCodec.imputerKey(slot, m);
                boolean owned = shard == null || shard.owns((long) slot * ex.imputers().size() + m);
                tasks.add(() -> {
                    ImputedFold fi = stage.run(ex.imputers().get(mm), 0, ex.plan(), rf[0], rf[1]);
                    state.imputed[slot][mm] = fi;
                    if (owned && known(key) == null) {
                        record(key, summary(rf, mm, fi));
                        if (counted) {
                            counter.done();
                        }
                    }
                    return null;
                });
            }
        }
        invokeAll(pool, tasks);
    }

    private AvailabilityRun.Host host(ExecutorService pool, Counter counter) {
        return new AvailabilityRun.Host() {
            @Override
            public Object known(String key) {
                return Runner.this.known(key);
            }

            @Override
            public void record(String key, Object value) {
                Runner.this.record(key, value);
            }

            @Override
            public void runAll(List<Callable<Void>> tasks) {
                invokeAll(pool, tasks);
            }

            @Override
            public void done() {
                counter.done();
            }
        };
    }

    private UnitCodec.ImputerSummary summary(int[] rf, int m, ImputedFold fi) {
        return summary(ex, rf, m, fi);
    }

    /** What the journal keeps of one imputer in one outer fold ({@code rf}: repeat, fold). */
    static UnitCodec.ImputerSummary summary(Experiment ex, int[] rf, int m, ImputedFold fi) {
        Resolved.Imputer imp = ex.imputers().get(m);
        List<RunResults.ImputationRow> quality = new ArrayList<>();
        for (ImputedFold.Quality q : fi.quality()) {
            quality.add(new RunResults.ImputationRow(imp.name(), rf[0], rf[1], q.subject(), q.mae(), q.rmse(),
                    q.pearsonR(), q.strengthMae(), q.skill()));
        }
        RunResults.EdgeErrors edges = fi.edgeErrors() == null ? null
                : new RunResults.EdgeErrors(imp.name(), rf[0], rf[1], quality.size(), fi.edgeErrors());
        return new UnitCodec.ImputerSummary(new RunResults.Choice(rf[0], rf[1], "imputer", imp.name(), "", "",
                fi.chosen().toString(), fi.innerMae(), imp.grid().size(), 0), quality, edges);
    }

    private RunResults collect(State state) {
        List<RunResults.Prediction> predictions = new ArrayList<>();
        List<RunResults.Choice> choices = new ArrayList<>();
        List<RunResults.ImputationRow> quality = new ArrayList<>();
        List<RunResults.EdgeErrors> edges = new ArrayList<>();
        List<Importance.Fold> importance = new ArrayList<>();
        if (anyImputed()) {
            for (int[] rf : state.folds) {
                for (int m = 0; m < ex.imputers().size(); m++) {
                    UnitCodec.ImputerSummary s = (UnitCodec.ImputerSummary) known(UnitCodec.imputerKey(rf[2], m));
                    choices.add(s.choice());
                    quality.addAll(s.quality());
                    if (s.edgeErrors() != null) {
                        edges.add(s.edgeErrors());
                    }
                }
            }
        }
        // pipeline-major order: all folds of the first pipeline, then the next
        int perFold = ex.pipelines().size();
        for (int pi = 0; pi < perFold; pi++) {
            for (int[] rf : state.folds) {
                ClassifierStage.Output o = (ClassifierStage.Output) known(UnitCodec.classifierKey(rf[2], pi));
                predictions.addAll(o.predictions());
                if (o.choice() != null) {
                    choices.add(o.choice());
                }
                if (o.importance() != null) {
                    importance.add(o.importance());
                }
            }
        }
        return new RunResults(ex, ex.plan(), predictions, choices, quality, edges, List.of(), importance,
                firstRepeatImputed(state));
    }

    /** Out-of-fold imputations of repeat 1 per imputer when this run computed all of them (rows shared). */
    private Map<String, float[][]> firstRepeatImputed(State state) {
        Map<String, float[][]> out = new java.util.HashMap<>();
        if (!anyImputed()) {
            return out;
        }
        for (int m = 0; m < ex.imputers().size(); m++) {
            float[][] rows = new float[ex.data().n()][];
            for (int[] rf : state.folds) {
                if (rf[0] != 0) {
                    continue;
                }
                ImputedFold fi = state.imputed[rf[2]][m];
                if (fi == null) {
                    return Map.of();
                }
                for (int i : ex.plan().test(0, rf[1])) {
                    rows[i] = fi.imputed()[i];
                }
            }
            out.put(ex.imputers().get(m).name(), rows);
        }
        return out;
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
