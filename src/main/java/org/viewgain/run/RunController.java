package org.viewgain.run;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.viewgain.cohort.Subject;
import org.viewgain.engine.Analysis;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.FinalPipelines;
import org.viewgain.engine.IndependentResults;
import org.viewgain.engine.Journal;
import org.viewgain.engine.Progress;
import org.viewgain.engine.RunResults;
import org.viewgain.engine.Runner;
import org.viewgain.engine.Setup;
import org.viewgain.engine.Shard;
import org.viewgain.report.CheckReport;
import org.viewgain.report.HtmlReport;
import org.viewgain.report.IndependentTables;
import org.viewgain.report.MissingTargets;
import org.viewgain.report.Provenance;
import org.viewgain.report.RunFolder;
import org.viewgain.report.RunWriter;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.SpecLoader;

/**
 * The lifecycle of a run, in one place: a fresh run, a resumed one, a shard, a merge of shards; the journal, the run
 * folder and its status. It is the only writer of {@code run.json}: {@link RunStatus#RUNNING} when work starts,
 * {@link RunStatus#COMPLETE} after the last table (a shard: after its last unit), {@link RunStatus#FAILED} with the
 * cause and the command that continues, when an error stops it. A user's mistake is a {@link BadInputException}
 * before anything is written (or, for resume and merge, before the folder changes).
 */
public final class RunController {
    private RunController() {
    }

    /** A fresh run of a spec into a new folder under {@code outRoot}. */
    public static RunOutcome run(Path specFile, Path outRoot, RunOptions o) throws IOException {
        return execute(specFile, outRoot, null, null, null, o);
    }

    /** Shard {@code shard} of a spec into {@code outRoot/shard-I-of-N}; join the shards with {@link #merge}. */
    public static RunOutcome shard(Path specFile, Path outRoot, Shard shard, RunOptions o) throws IOException {
        return execute(specFile, outRoot, shard, null, null, o);
    }

    /** Finishes a run (or shard) that stopped, skipping its journaled units. */
    public static RunOutcome resume(Path runDir, RunOptions o) throws IOException {
        Map<String, Object> old = Provenance.read(RunFolder.existing(runDir).dir().resolve("run.json"));
        if (RunStatus.COMPLETE.label().equals(old.get("status"))) {
            throw new BadInputException(runDir + " is already complete; nothing to resume");
        }
        Object sh = old.get("shard");
        return execute(Path.of(String.valueOf(old.get("spec_file"))), null,
                sh == null ? null : Shard.parse(sh.toString()), runDir, old, o);
    }

    private static RunOutcome execute(Path specFile, Path outRoot, Shard shard, Path resumeDir,
                                      Map<String, Object> old, RunOptions o) throws IOException {
        PrintWriter err = o.err();
        Experiment ex = Setup.prepare(SpecLoader.load(specFile));
        err.print(CheckReport.duplicateWarning(ex));
        err.print(CheckReport.costWarning(ex));
        err.flush();
        Instant start = Instant.now();
        Provenance prov = provenance(ex, o);
        Map<String, Object> identity = prov.identity(shard == null ? null : shard.label());
        RunFolder folder;
        Journal journal;
        if (resumeDir != null) {
            folder = RunFolder.existing(resumeDir);
            journal = Journal.resume(folder.dir().resolve(Journal.FILE), identity);
            prov.put("started_at", old.get("started_at")).put("resumed_at", start.toString());
        } else {
            folder = shard == null ? RunFolder.create(outRoot, ex.spec().experiment(), start)
                    : RunFolder.createAt(outRoot.resolve("shard-" + shard.index() + "-of-" + shard.count()));
            journal = Journal.create(folder.dir().resolve(Journal.FILE), identity);
        }
        if (shard != null) {
            prov.put("shard", shard.label());
        }
        record(folder, prov, RunStatus.RUNNING);
        // after the journal's checks, so that a refused resume stays one line
        err.print(CheckReport.powerWarning(ex));
        err.print(MissingTargets.warning(ex));
        err.flush();
        if (!o.quiet()) {
            long curveFits = org.viewgain.engine.Availability.modelFits(ex);
            err.println("[viewgain] " + ex.pipelines().size() + " pipelines, " + ex.modelFits() + " model fits"
                    + (curveFits > 0 ? " (+ " + curveFits + " for the availability curve)" : "") + ", "
                    + o.threads() + " thread(s)" + (shard == null ? "" : ", shard " + shard.label())
                    + (journal.size() > 0 ? ", " + journal.size() + " units already done" : "") + "; writing "
                    + folder.dir());
            err.flush();
        }
        Progress progress = o.quiet() ? Progress.NONE : new ProgressLine(err);
        RunResults results = null;
        FinalPipelines finals = null;
        try (journal) {
            Runner runner = new Runner(ex, o.threads(), progress).journal(journal);
            if (shard != null) {
                runner.runShard(shard);
            } else {
                results = runner.run();
                finals = runner.finals();
            }
        } catch (RuntimeException | Error e) {
            return failed(folder, prov, e);
        }
        if (shard != null) {
            prov.put("finished_at", Instant.now().toString()).put("units", journal.size());
            record(folder, prov, RunStatus.COMPLETE);
            return new RunOutcome.ShardFinished(shard.label(), journal.size(), folder.dir());
        }
        try {
            return finish(ex, folder, prov, results, finals, start, o);
        } catch (IOException | RuntimeException e) {
            return failed(folder, prov, e); // e.g. disk full while writing the tables
        }
    }

    /** Joins the folders of {@code run --shard I/N} into one run folder whose tables are those of a single run. */
    public static RunOutcome merge(List<Path> shards, Path outRoot, RunOptions o) throws IOException {
        TreeMap<Integer, Journal> byIndex = new TreeMap<>();
        Map<String, Object> first = null;
        Path specFile = null;
        int count = -1;
        for (Path dir : shards) {
            Map<String, Object> run = Provenance.read(RunFolder.existing(dir).dir().resolve("run.json"));
            Journal j = Journal.read(dir.resolve(Journal.FILE));
            Map<String, Object> id = j.identity();
            Object label = id.get("shard");
            if (label == null || "all".equals(label)) {
                throw new BadInputException(dir + " is not a shard folder (made by 'run --shard I/N')");
            }
            Shard s = Shard.parse(label.toString());
            Map<String, Object> common = withoutShard(id);
            if (first == null) {
                first = common;
                specFile = Path.of(String.valueOf(run.get("spec_file")));
                count = s.count();
            } else if (!first.equals(common)) {
                throw new BadInputException(dir + " comes from another spec, data, seed or tool version than "
                        + shards.get(0) + "; merge only shards of one run");
            } else if (s.count() != count) {
                throw new BadInputException(dir + " is shard " + s.label() + " but " + shards.get(0) + " is one of "
                        + count + " shards");
            }
            if (byIndex.put(s.index(), j) != null) {
                throw new BadInputException("shard " + s.label() + " is given twice (" + dir + ")");
            }
        }
        for (int i = 1; i <= count; i++) {
            if (!byIndex.containsKey(i)) {
                throw new BadInputException("shard " + i + "/" + count + " is missing; give all " + count
                        + " shard folders");
            }
        }
        Experiment ex = Setup.prepare(SpecLoader.load(specFile));
        Instant start = Instant.now();
        Provenance prov = provenance(ex, o);
        Map<String, Object> now = Journal.normalize(prov.identity(null));
        if (!withoutShard(now).equals(first)) {
            throw new BadInputException("the spec or data changed since the shards ran (" + specFile + "); "
                    + "the shards cannot be merged");
        }
        Runner runner = new Runner(ex, o.threads(), Progress.NONE);
        for (Map.Entry<Integer, Journal> e : byIndex.entrySet()) {
            Shard s = new Shard(e.getKey(), count);
            List<String> want = runner.unitKeys(s);
            Set<String> have = new HashSet<>(e.getValue().keys());
            List<String> missing = new ArrayList<>(want.stream().filter(k -> !have.contains(k)).toList());
            if (!missing.isEmpty()) {
                throw new BadInputException("shard " + s.label() + " is not finished: " + missing.size() + " of "
                        + want.size() + " units missing; continue it with 'viewgain run --resume "
                        + e.getValue().file().getParent() + "'");
            }
            want.forEach(have::remove);
            if (!have.isEmpty()) {
                throw new BadInputException("shard " + s.label() + " holds units of another shard (e.g. "
                        + have.iterator().next() + ")");
            }
        }
        RunFolder folder = RunFolder.create(outRoot, ex.spec().experiment(), start);
        prov.put("merged_from", shards.stream().map(p -> p.toAbsolutePath().toString()).toList());
        record(folder, prov, RunStatus.RUNNING);
        RunResults results;
        FinalPipelines finals;
        try (Journal merged = Journal.create(folder.dir().resolve(Journal.FILE), now)) {
            byIndex.values().forEach(merged::appendAll);
            results = runner.journal(merged).run();
            finals = runner.finals();
        } catch (RuntimeException | Error e) {
            return failed(folder, prov, e);
        }
        try {
            return finish(ex, folder, prov, results, finals, start, o);
        } catch (IOException | RuntimeException e) {
            return failed(folder, prov, e);
        }
    }

    private static Map<String, Object> withoutShard(Map<String, Object> id) {
        Map<String, Object> m = new TreeMap<>(id);
        m.remove("shard");
        return m;
    }

    private static Provenance provenance(Experiment ex, RunOptions o) throws IOException {
        List<String> ids = ex.data().subjects().stream().map(Subject::id).toList();
        return new Provenance(ex.spec(), ids, o.threads(), o.commandLine(), Instant.now().toString());
    }

    /** Writes run.json with this status: the only place it is written. */
    private static void record(RunFolder folder, Provenance prov, RunStatus status) throws IOException {
        prov.put("status", status.label());
        folder.writeText("run.json", prov.toJson());
    }

    /**
     * Marks run.json failed with the cause and the command that continues (when it can still be written: a run.json
     * that says running is never mistaken for a finished run). A user's mistake is not a failure: it goes on up.
     */
    private static RunOutcome failed(RunFolder folder, Provenance prov, Throwable e) {
        if (e instanceof BadInputException bad) {
            throw bad;
        }
        String what = RunFailure.describe(e);
        String resume = "viewgain run --resume " + folder.dir();
        try {
            prov.put("error", what).put("resume_with", resume).put("finished_at", Instant.now().toString());
            record(folder, prov, RunStatus.FAILED);
        } catch (IOException | RuntimeException | OutOfMemoryError ignored) {
            // run.json still says running
        }
        return new RunOutcome.Failed(what, resume, e);
    }

    /**
     * A warning line when some model fits stopped at their solver's iteration limit before converging (counted per
     * classifier over all outer folds, inner and final fits); empty when none did.
     */
    static String convergenceWarning(RunResults results) {
        Map<String, Integer> byClassifier = new TreeMap<>();
        for (RunResults.Choice c : results.choices()) {
            if (c.unconverged() > 0) {
                byClassifier.merge(c.classifier(), c.unconverged(), Integer::sum);
            }
        }
        if (byClassifier.isEmpty()) {
            return "";
        }
        List<String> parts = new ArrayList<>();
        byClassifier.forEach((name, n) -> parts.add(name + ": " + n + (n == 1 ? " fit" : " fits")));
        return "[viewgain] warning: some model fits stopped at their iteration limit before converging ("
                + String.join(", ", parts) + "); hyperparameters.csv (unconverged_fits) says in which folds. "
                + "Their predictions are kept; raise the classifier's iterations or lower C, and rerun.\n";
    }

    /** The analysis, the tables, run.json (complete) and the report of finished results. */
    private static RunOutcome finish(Experiment ex, RunFolder folder, Provenance prov, RunResults results,
                                     FinalPipelines finals, Instant start, RunOptions o) throws IOException {
        PrintWriter err = o.err();
        if (!o.quiet()) {
            // intervals, comparisons, the separation test and the report can take minutes on a large cohort
            err.println("[viewgain] all units done; computing the tables, the separation test and the report");
            err.flush();
        }
        err.print(convergenceWarning(results));
        err.flush();
        Analysis analysis = Analysis.of(results);
        Instant end = Instant.now();
        prov.put("finished_at", end.toString())
                .put("elapsed_seconds", Duration.between(start, end).toMillis() / 1000.0)
                .put("subjects", ex.data().n())
                .put("pipelines", ex.pipelines().size())
                .put("model_fits", ex.modelFits());
        if (finals != null) {
            IndependentTables.writeFinals(folder, finals, prov.specSha256());
            if (ex.independent() != null) {
                IndependentTables.write(folder, IndependentResults.of(finals.pipelines(), ex.independent(),
                        IndependentResults.Settings.of(ex)));
                IndependentTables.writeDuplicates(folder, ex);
            }
        }
        RunWriter.write(folder, analysis);
        record(folder, prov, RunStatus.COMPLETE);
        try {
            HtmlReport.write(folder.dir(), false);
        } catch (IOException | RuntimeException e) {
            // the tables are complete; a report that cannot be drawn must not turn a finished run into a failure
            err.println("[viewgain] the report could not be written (" + e.getMessage() + "); rebuild it with "
                    + "'viewgain report " + folder.dir() + "'");
        }
        return new RunOutcome.Finished(folder.dir(), analysis.metrics(), ex.spec().significance().confidence());
    }
}
