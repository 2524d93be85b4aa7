package org.viewgain.engine;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.Callable;
import org.viewgain.spec.AvailabilityCurve;
import org.viewgain.spec.FeatureSet;

/**
 * The work units of an availability curve and their results. For every level below the full data, outer fold and
 * imputer, one imputation unit ({@code ai/level/slot/imputer}) fits the imputer as the run does (tuning and
 * cross-fitting included) on the level's subset; for every such level, outer fold and {@code source+imputed}
 * pipeline, one classifier unit ({@code ac/level/slot/pipeline}) re-runs the pipeline on those imputations. Both are
 * journaled like the run's own units, so {@code --resume} and shards cover them. A level whose subset in an outer fold
 * holds all the block's targets (fraction 1, or a count equal to them) is the run itself there: it has no units and
 * its results are the run's (re-fitting would give the same bytes: same subjects, same seeds). The source pipelines
 * are not re-run: they do not read the target.
 */
final class AvailabilityRun {
    /** What the runner lends the curve: its unit store, its thread pool and its progress count. */
    interface Host {
        UnitCodec.ImputerSummary known(WorkUnit.Imputation u);

        ClassifierStage.Output known(WorkUnit.Classifier u);

        void record(WorkUnit u, Object value);

        void runAll(List<Callable<Void>> tasks);

        void done();
    }

    private final Experiment ex;
    private final AvailabilityCurve curve;
    /** The outer folds, in the runner's slot order. */
    private final List<OuterFold> slots;
    /** Per level and slot, the kept positions (ascending), or null when the level keeps every target there. */
    private final int[][][] keep;
    private final int[] available;
    /** Indices of the source+imputed pipelines in the experiment's list. */
    private final List<Integer> pipelines = new ArrayList<>();

    AvailabilityRun(Experiment ex) {
        this.ex = ex;
        this.curve = ex.spec().availability();
        this.slots = OuterFold.of(ex.plan());
        for (int pi = 0; pi < ex.pipelines().size(); pi++) {
            if (ex.pipelines().get(pi).featureSet() == FeatureSet.SOURCE_IMPUTED) {
                pipelines.add(pi);
            }
        }
        int levels = curve == null ? 0 : curve.size();
        keep = new int[levels][slots.size()][];
        available = new int[slots.size()];
        for (int s = 0; s < slots.size() && curve != null; s++) {
            int[] order = Availability.order(ex, slots.get(s).repeat(), slots.get(s).fold());
            available[s] = order.length;
            for (int l = 0; l < levels; l++) {
                int[] kept = Availability.subset(curve, l, order);
                keep[l][s] = kept.length == order.length ? null : kept;
            }
        }
    }

    /** True when the spec asks for a curve. */
    boolean active() {
        return curve != null;
    }

    /** The curve's units a shard owns (all of them for {@code shard} null): imputation units, then classifier units. */
    List<WorkUnit> units(Shard shard) {
        List<WorkUnit> out = new ArrayList<>();
        if (!active()) {
            return out;
        }
        long position = 0;
        for (int l = 0; l < keep.length; l++) {
            for (int s = 0; s < slots.size(); s++) {
                for (int m = 0; m < ex.imputers().size() && keep[l][s] != null; m++) {
                    if (shard == null || shard.owns(position)) {
                        out.add(new WorkUnit.Imputation(l, s, m));
                    }
                    position++;
                }
            }
        }
        position = 0;
        for (int l = 0; l < keep.length; l++) {
            for (int s = 0; s < slots.size(); s++) {
                for (int k = 0; k < pipelines.size() && keep[l][s] != null; k++) {
                    if (shard == null || shard.owns(position)) {
                        out.add(new WorkUnit.Classifier(l, s, pipelines.get(k)));
                    }
                    position++;
                }
            }
        }
        return out;
    }

    /**
     * Model fits the curve adds to the run: per level and outer fold re-fitted, the imputers' fits and the
     * source+imputed pipelines' fits (nested imputations for tuning included), counted as {@link Experiment#modelFits}
     * counts the run's.
     */
    long modelFits() {
        if (!active()) {
            return 0;
        }
        long refitted = 0;
        for (int[][] level : keep) {
            for (int[] kept : level) {
                refitted += kept == null ? 0 : 1;
            }
        }
        Experiment only = new Experiment(ex.spec(), ex.data(), ex.plan(), ex.imputers(), ex.classifiers(),
                pipelines.stream().map(ex.pipelines()::get).toList(), ex.scaler(), ex.prep(), ex.duplicates());
        long slotsTotal = slots.size();
        return only.modelFits() / slotsTotal * refitted;
    }

    /** Runs the curve units among {@code mine} that are not done yet, level by level (one level's imputations held). */
    void run(List<WorkUnit> mine, int[][] innerOf, Host host) {
        Set<WorkUnit> pending = new HashSet<>();
        for (WorkUnit u : mine) {
            if (u instanceof WorkUnit.Imputation i && i.curve() && host.known(i) == null
                    || u instanceof WorkUnit.Classifier c && c.curve() && host.known(c) == null) {
                pending.add(u);
            }
        }
        if (pending.isEmpty()) {
            return;
        }
        for (int l = 0; l < keep.length; l++) {
            final int level = l;
            Set<Integer> needed = new java.util.TreeSet<>();
            for (WorkUnit u : pending) {
                if (u instanceof WorkUnit.Imputation i && i.level() == level) {
                    needed.add(i.slot());
                } else if (u instanceof WorkUnit.Classifier c && c.level() == level) {
                    needed.add(c.slot());
                }
            }
            ImputedFold[][] imputed = new ImputedFold[slots.size()][ex.imputers().size()];
            Experiment[] masked = new Experiment[slots.size()];
            List<Callable<Void>> tasks = new ArrayList<>();
            for (int s : needed) {
                OuterFold of = slots.get(s);
                masked[s] = Availability.masked(ex, of.repeat(), of.fold(), keep[level][s]);
                for (int m = 0; m < ex.imputers().size(); m++) {
                    final int slot = s;
                    final int mm = m;
                    tasks.add(() -> {
                        ImputedFold fi = new ImputationStage(masked[slot]).run(ex.imputers().get(mm), 0, ex.plan(),
                                of.repeat(), of.fold());
                        imputed[slot][mm] = fi;
                        WorkUnit unit = new WorkUnit.Imputation(level, slot, mm);
                        if (pending.contains(unit)) {
                            host.record(unit, Runner.summary(ex, of, mm, fi));
                            host.done();
                        }
                        return null;
                    });
                }
            }
            host.runAll(tasks);
            tasks.clear();
            for (int s : needed) {
                OuterFold of = slots.get(s);
                for (int pi : pipelines) {
                    WorkUnit unit = new WorkUnit.Classifier(level, s, pi);
                    if (!pending.contains(unit)) {
                        continue;
                    }
                    Pipeline p = ex.pipelines().get(pi);
                    int m = ex.imputers().indexOf(ex.imputer(p.imputer()));
                    final int slot = s;
                    tasks.add(() -> {
                        ClassifierStage.Output o = new ClassifierStage(masked[slot]).run(p, 0, ex.plan(),
                                of.repeat(), of.fold(), innerOf[slot], imputed[slot][m], ex.data().y());
                        // what the model used is reported for the run's own fits only
                        host.record(unit, new ClassifierStage.Output(o.predictions(), o.choice(), null));
                        host.done();
                        return null;
                    });
                }
            }
            host.runAll(tasks);
        }
    }

    /** The curve's levels from finished units (the run's own where a level keeps every target), full data last. */
    List<RunResults.AvailabilityLevel> collect(Host host) {
        List<RunResults.AvailabilityLevel> out = new ArrayList<>();
        if (!active()) {
            return out;
        }
        for (int l = 0; l < keep.length; l++) {
            out.add(level(host, l, curve.label(l), curve.byFraction() ? curve.fractions().get(l) : Double.NaN,
                    curve.byFraction() ? -1 : curve.counts().get(l)));
        }
        boolean endsFull = curve.byFraction() && curve.fractions().get(curve.size() - 1) == 1.0;
        if (!endsFull) {
            out.add(level(host, -1, "all", 1.0, -1));
        }
        return out;
    }

    private RunResults.AvailabilityLevel level(Host host, int l, String label, double fraction, int count) {
        List<Integer> targets = new ArrayList<>();
        boolean full = true;
        for (int s = 0; s < slots.size(); s++) {
            int[] kept = l < 0 ? null : keep[l][s];
            targets.add(kept == null ? available[s] : kept.length);
            full &= kept == null;
        }
        List<RunResults.Prediction> predictions = new ArrayList<>();
        for (int pi : pipelines) {
            for (int s = 0; s < slots.size(); s++) {
                boolean own = l < 0 || keep[l][s] == null;
                ClassifierStage.Output o = host.known(own ? WorkUnit.Classifier.of(s, pi)
                        : new WorkUnit.Classifier(l, s, pi));
                predictions.addAll(o.predictions());
            }
        }
        List<RunResults.ImputationRow> quality = new ArrayList<>();
        for (int m = 0; m < ex.imputers().size(); m++) {
            for (int s = 0; s < slots.size(); s++) {
                boolean own = l < 0 || keep[l][s] == null;
                UnitCodec.ImputerSummary sum = host.known(own ? WorkUnit.Imputation.of(s, m)
                        : new WorkUnit.Imputation(l, s, m));
                quality.addAll(sum.quality());
            }
        }
        return new RunResults.AvailabilityLevel(label, fraction, count, full, targets, predictions, quality);
    }
}
