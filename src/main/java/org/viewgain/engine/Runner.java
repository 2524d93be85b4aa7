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
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import org.viewgain.folds.FoldPlan;

/**
 * Runs an experiment as independent work units on a thread pool. Phase one fits every imputer in every outer fold
 * (label-free work, done once and shared by all pipelines); phase two trains and tests every pipeline in every outer
 * fold; the two share one queue, a pipeline unit starting as soon as the imputations it reads are done (see
 * {@link UnitPool}); phase three, when the spec asks for it, runs the label permutation test (see
 * {@link Permutations}). Results are gathered in unit order, so they depend neither on the number of threads nor on
 * the order units ran in. With a {@link Journal} every finished unit of phases two and three is journaled and units
 * already there are skipped, so a killed run resumes where it stopped; with a {@link Shard} only a share of the units
 * runs (for a cluster job array).
 */
public final class Runner {
    private final Experiment ex;
    private final int threads;
    private final Progress progress;
    private final Map<WorkUnit, Object> done = new ConcurrentHashMap<>();
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
        private final List<OuterFold> folds = OuterFold.of(ex.plan());
        private int[][] innerOf;
        private ImputedFold[][] imputed;

        int threads() {
            return threads;
        }

        int slot(int repeat, int fold) {
            for (OuterFold of : folds) {
                if (of.repeat() == repeat && of.fold() == fold) {
                    return of.slot();
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
        long folds = ex.plan().outerFolds();
        return folds * ((anyImputed() ? ex.imputers().size() : 0) + ex.pipelines().size())
                + (long) ex.spec().significance().permutations() * ex.pipelines().size() + curve.units(null).size()
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

    /** Keys of every unit a shard owns (all units for a whole run, {@code shard} null), as the journal names them. */
    public List<String> unitKeys(Shard shard) {
        return units(shard).stream().map(WorkUnit::key).toList();
    }

    /** Every unit a shard owns (all units for a whole run, {@code shard} null), in the order they are listed. */
    List<WorkUnit> units(Shard shard) {
        List<WorkUnit> out = new ArrayList<>();
        int slots = ex.plan().outerFolds();
        if (anyImputed()) {
            for (int s = 0; s < slots; s++) {
                for (int m = 0; m < ex.imputers().size(); m++) {
                    if (shard == null || shard.owns((long) s * ex.imputers().size() + m)) {
                        out.add(WorkUnit.Imputation.of(s, m));
                    }
                }
            }
        }
        int pipelines = ex.pipelines().size();
        for (int s = 0; s < slots; s++) {
            for (int pi = 0; pi < pipelines; pi++) {
                if (shard == null || shard.owns((long) s * pipelines + pi)) {
                    out.add(WorkUnit.Classifier.of(s, pi));
                }
            }
        }
        out.addAll(curve.units(shard));
        if (ex.spec().finalPipelines()) {
            for (int pi = 0; pi < pipelines; pi++) {
                if (shard == null || shard.owns(pi)) {
                    out.add(new WorkUnit.Final(pi));
                }
            }
        }
        if (shard != null) {
            for (int pi = 0; pi < pipelines; pi++) {
                for (int k = 0; k < ex.spec().significance().permutations(); k++) {
                    if (shard.owns(k)) {
                        out.add(new WorkUnit.Permutation(pi, k));
                    }
                }
            }
        }
        return out;
    }

    /** The result of a finished unit (this run's, or read from the journal), or null when it has not run. */
    private Object known(WorkUnit u) {
        Object v = done.get(u);
        if (v == null && journal != null) {
            JsonNode rec = journal.unit(u.key());
            if (rec != null) {
                v = codec.decode(u, rec);
                done.put(u, v);
                journal.take(u.key());
            }
        }
        return v;
    }

    /** The results of finished units, typed by their kind (the only casts of the unit store). */
    UnitCodec.ImputerSummary known(WorkUnit.Imputation u) {
        return (UnitCodec.ImputerSummary) known((WorkUnit) u);
    }

    ClassifierStage.Output known(WorkUnit.Classifier u) {
        return (ClassifierStage.Output) known((WorkUnit) u);
    }

    FinalStage.Unit known(WorkUnit.Final u) {
        return (FinalStage.Unit) known((WorkUnit) u);
    }

    Double known(WorkUnit.Permutation u) {
        return (Double) known((WorkUnit) u);
    }

    private void record(WorkUnit u, Object value) {
        if (journal != null) {
            journal.append(codec.encode(u, value));
        }
        done.put(u, value);
    }

    private RunResults execute(Shard shard) {
        FoldPlan plan = ex.plan();
        List<WorkUnit> mine = units(shard);
        // a shard counts its own share; a whole run also counts the permutations it plans
        Counter counter = new Counter(shard == null ? units() : mine.size());
        UnitPool pool = new UnitPool(threads);
        try {
            State state = new State();
            state.innerOf = new int[state.folds.size()][];
            for (OuterFold of : state.folds) {
                state.innerOf[of.slot()] = InnerFolds.of(ex, of.repeat(), of.fold());
            }
            state.imputed = new ImputedFold[state.folds.size()][ex.imputers().size()];
            Set<Integer> needed = new TreeSet<>();
            boolean allSlots = false;
            for (WorkUnit u : mine) {
                if (known(u) != null) {
                    counter.done();
                } else if (u instanceof WorkUnit.Permutation) {
                    allSlots = true;
                } else if (u instanceof WorkUnit.Imputation i && !i.curve()) {
                    needed.add(i.slot());
                } else if (u instanceof WorkUnit.Classifier c && !c.curve()) {
                    needed.add(c.slot());
                }
            }
            // phases one and two: imputations (label-free, recomputed for the folds still to run, never journaled)
            // and pipelines, on one queue
            if (allSlots) {
                needed.clear();
                state.folds.forEach(of -> needed.add(of.slot()));
            }
            List<Future<Separation.Row>> separation = foldUnits(state, mine, needed, pool, shard, counter);
            // the availability curve: its own units, level by level, on the same folds
            curve.run(mine, state.innerOf, host(pool, counter));
            runFinals(mine, pool, counter);
            Permutations perm = new Permutations(ex, state, (p, k) -> known(new WorkUnit.Permutation(p, k)),
                    (p, k, v) -> record(new WorkUnit.Permutation(p, k), v), () -> impute(state,
                    allFolds(state), pool, null, counter, false));
            if (shard != null) {
                // permutation-major, a few permutations at a time: the pipelines of one permutation share its
                // imputations, which are dropped after each batch
                TreeMap<Integer, List<Callable<Void>>> byPermutation = new TreeMap<>();
                String metric = ex.spec().significance().metricColumn();
                for (WorkUnit u : mine) {
                    if (u instanceof WorkUnit.Permutation pu && known(pu) == null) {
                        byPermutation.computeIfAbsent(pu.k(), x -> new ArrayList<>()).add(() -> {
                            record(pu, perm.statistic(ex.pipelines().get(pu.pipeline()), pu.k() + 1, metric));
                            counter.done();
                            return null;
                        });
                    }
                }
                // as many permutations per batch as a whole run's batches hold (Permutations.perPipeline)
                int per = Permutations.perPipeline(Permutations.jobsPerBatch(threads), ex.pipelines().size(),
                        perm.imputationBytes());
                List<Callable<Void>> batch = new ArrayList<>();
                int inBatch = 0;
                for (List<Callable<Void>> tasksOfK : byPermutation.values()) {
                    batch.addAll(tasksOfK);
                    if (++inBatch == per) {
                        pool.invokeInOrder(batch);
                        perm.release();
                        batch.clear();
                        inBatch = 0;
                    }
                }
                pool.invokeInOrder(batch);
                return null;
            }
            RunResults res = collect(state).withAvailability(curve.collect(host(pool, counter)));
            if (separation != null) {
                res = res.withSeparation(UnitPool.await(separation));
            }
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
                res = res.withPermutations(perm.run(observed, t -> pool.invokeInOrder(t), counter));
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
    private void runFinals(List<WorkUnit> mine, UnitPool pool, Counter counter) {
        FinalStage stage = new FinalStage(ex);
        List<Integer> todo = new ArrayList<>();
        for (WorkUnit u : mine) {
            if (u instanceof WorkUnit.Final f && known(f) == null) {
                todo.add(f.pipeline());
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
                record(new WorkUnit.Final(pi), stage.unit(p, stage.train(p, f)));
                counter.done();
                return null;
            });
        }
        pool.invokeInOrder(tasks);
    }

    private void fitFinalImputers(Set<String> names, UnitPool pool) {
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
        pool.invokeInOrder(tasks);
    }

    private FinalPipelines collectFinals(UnitPool pool) {
        Set<String> used = new TreeSet<>();
        ex.pipelines().stream().filter(p -> p.featureSet().needsImputer()).forEach(p -> used.add(p.imputer()));
        fitFinalImputers(used, pool);
        List<FinalPipelines.Entry> entries = new ArrayList<>();
        for (int pi = 0; pi < ex.pipelines().size(); pi++) {
            Pipeline p = ex.pipelines().get(pi);
            FinalStage.Unit u = known(new WorkUnit.Final(pi));
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
        state.folds.forEach(of -> all.add(of.slot()));
        return all;
    }

    /**
     * Fits the imputers in the given folds unless done already, recording the summaries this run owns (and counting
     * them as finished units when {@code counted}: a unit journaled earlier was counted when the run started).
     */
    private void impute(State state, Set<Integer> slots, UnitPool pool, Shard shard, Counter counter,
                        boolean counted) {
        pool.invokeInOrder(new ArrayList<>(imputations(state, slots, shard, counter, counted).values()));
    }

    /** The imputation tasks of {@link #impute}, by slot and imputer, in listing order (none without imputed sets). */
    private Map<WorkUnit.Imputation, Callable<Void>> imputations(State state, Set<Integer> slots, Shard shard,
                                                                Counter counter, boolean counted) {
        Map<WorkUnit.Imputation, Callable<Void>> tasks = new java.util.LinkedHashMap<>();
        if (!anyImputed()) {
            return tasks;
        }
        ImputationStage stage = new ImputationStage(ex);
        for (int slot : slots) {
            OuterFold of = state.folds.get(slot);
            for (int m = 0; m < ex.imputers().size(); m++) {
                if (state.imputed[slot][m] != null) {
                    continue;
                }
                final int mm = m;
                WorkUnit.Imputation unit = WorkUnit.Imputation.of(slot, m);
                boolean owned = shard == null || shard.owns((long) slot * ex.imputers().size() + m);
                tasks.put(unit, () -> {
                    ImputedFold fi = stage.run(ex.imputers().get(mm), 0, ex.plan(), of.repeat(), of.fold());
                    state.imputed[slot][mm] = fi;
                    if (owned && known(unit) == null) {
                        record(unit, summary(ex, of, mm, fi));
                        if (counted) {
                            counter.done();
                        }
                    }
                    return null;
                });
            }
        }
        return tasks;
    }

    /**
     * Phases one and two on one queue: the imputations of the folds still to run first, then the pipeline units of
     * {@code mine} not journaled yet in their listing order; a unit that reads an imputer's imputations of a fold
     * joins the queue (in its listing place) when they are done, so no thread waits for the slowest imputation. A
     * whole run also queues the separation test's rows last, once the first repeat's imputations are all done, to
     * fill threads that would otherwise idle at the end (the last units, the availability curve, the final
     * pipelines); their futures are returned (null when the rows are left to {@link Separation#of}). Waits for every
     * imputation and pipeline unit. (Ordering the units costliest first was tried: two memory-bound units of one
     * kind then ran side by side and took longer; docs/benchmarks.md.)
     */
    private List<Future<Separation.Row>> foldUnits(State state, List<WorkUnit> mine, Set<Integer> needed,
                                                   UnitPool pool, Shard shard, Counter counter) {
        Map<WorkUnit.Imputation, Callable<Void>> imputations = imputations(state, needed, shard, counter, true);
        Map<WorkUnit.Imputation, List<UnitPool.Ranked<Void>>> waiting = new java.util.HashMap<>();
        List<UnitPool.Ranked<Void>> pipelines = new ArrayList<>();
        ClassifierStage stage = new ClassifierStage(ex);
        for (WorkUnit u : mine) {
            if (!(u instanceof WorkUnit.Classifier c) || c.curve() || known(c) != null) {
                continue;
            }
            OuterFold of = state.folds.get(c.slot());
            Pipeline p = ex.pipelines().get(c.pipeline());
            int m = p.featureSet().needsImputer() ? state.imputerIndex(p.imputer()) : -1;
            UnitPool.Ranked<Void> task = pool.ranked(0, () -> {
                record(c, stage.run(p, 0, ex.plan(), of.repeat(), of.fold(), state.innerOf[of.slot()],
                        m < 0 ? null : state.imputed[of.slot()][m], ex.data().y()));
                counter.done();
                return null;
            });
            pipelines.add(task);
            WorkUnit.Imputation source = m < 0 ? null : WorkUnit.Imputation.of(c.slot(), m);
            if (source != null && imputations.containsKey(source)) {
                waiting.computeIfAbsent(source, k -> new ArrayList<>()).add(task);
            }
        }
        List<UnitPool.Ranked<Void>> first = new ArrayList<>();
        for (Map.Entry<WorkUnit.Imputation, Callable<Void>> e : imputations.entrySet()) {
            List<UnitPool.Ranked<Void>> then = waiting.getOrDefault(e.getKey(), List.of());
            first.add(pool.ranked(Double.POSITIVE_INFINITY, () -> {
                e.getValue().call();
                then.forEach(pool::execute);
                return null;
            }));
        }
        first.forEach(pool::execute);
        Set<UnitPool.Ranked<Void>> queuedLater = new java.util.HashSet<>();
        waiting.values().forEach(queuedLater::addAll);
        pipelines.stream().filter(t -> !queuedLater.contains(t)).forEach(pool::execute);
        UnitPool.await(first);
        List<Future<Separation.Row>> separation = null;
        Map<String, float[][]> firstRepeat = firstRepeatImputed(state);
        if (shard == null && (!anyImputed() || !firstRepeat.isEmpty())) {
            separation = new ArrayList<>();
            for (Pipeline p : Separation.pipelines(ex)) {
                UnitPool.Ranked<Separation.Row> row = pool.ranked(Double.NEGATIVE_INFINITY,
                        () -> Separation.row(ex, firstRepeat, p));
                pool.execute(row);
                separation.add(row);
            }
        }
        UnitPool.await(pipelines);
        return separation;
    }

    private AvailabilityRun.Host host(UnitPool pool, Counter counter) {
        return new AvailabilityRun.Host() {
            @Override
            public UnitCodec.ImputerSummary known(WorkUnit.Imputation u) {
                return Runner.this.known(u);
            }

            @Override
            public ClassifierStage.Output known(WorkUnit.Classifier u) {
                return Runner.this.known(u);
            }

            @Override
            public void record(WorkUnit u, Object value) {
                Runner.this.record(u, value);
            }

            @Override
            public void runAll(List<Callable<Void>> tasks) {
                pool.invokeInOrder(tasks);
            }

            @Override
            public void done() {
                counter.done();
            }
        };
    }

    /** What the journal keeps of one imputer in one outer fold. */
    static UnitCodec.ImputerSummary summary(Experiment ex, OuterFold of, int m, ImputedFold fi) {
        Resolved.Imputer imp = ex.imputers().get(m);
        List<RunResults.ImputationRow> quality = new ArrayList<>();
        for (ImputedFold.Quality q : fi.quality()) {
            quality.add(new RunResults.ImputationRow(imp.name(), of.repeat(), of.fold(), q.subject(), q.mae(),
                    q.rmse(), q.pearsonR(), q.strengthMae(), q.skill()));
        }
        RunResults.EdgeErrors edges = fi.edgeErrors() == null ? null
                : new RunResults.EdgeErrors(imp.name(), of.repeat(), of.fold(), quality.size(), fi.edgeErrors());
        return new UnitCodec.ImputerSummary(new RunResults.Choice(of.repeat(), of.fold(), "imputer", imp.name(), "", "",
                fi.chosen().toString(), fi.innerMae(), imp.grid().size(), 0), quality, edges);
    }

    private RunResults collect(State state) {
        List<RunResults.Prediction> predictions = new ArrayList<>();
        List<RunResults.Choice> choices = new ArrayList<>();
        List<RunResults.ImputationRow> quality = new ArrayList<>();
        List<RunResults.EdgeErrors> edges = new ArrayList<>();
        List<Importance.Fold> importance = new ArrayList<>();
        if (anyImputed()) {
            for (OuterFold of : state.folds) {
                for (int m = 0; m < ex.imputers().size(); m++) {
                    UnitCodec.ImputerSummary s = known(WorkUnit.Imputation.of(of.slot(), m));
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
            for (OuterFold of : state.folds) {
                ClassifierStage.Output o = known(WorkUnit.Classifier.of(of.slot(), pi));
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
            for (OuterFold of : state.folds) {
                if (of.repeat() != 0) {
                    continue;
                }
                ImputedFold fi = state.imputed[of.slot()][m];
                if (fi == null) {
                    return Map.of();
                }
                for (int i : ex.plan().test(0, of.fold())) {
                    rows[i] = fi.imputed()[i];
                }
            }
            out.put(ex.imputers().get(m).name(), rows);
        }
        return out;
    }
}
