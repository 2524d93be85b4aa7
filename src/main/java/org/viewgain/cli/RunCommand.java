package org.viewgain.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.nio.file.Files;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.Callable;
import org.viewgain.cohort.Subject;
import org.viewgain.engine.ComparisonPairs;
import org.viewgain.engine.Evaluation;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.Journal;
import org.viewgain.engine.Progress;
import org.viewgain.engine.RunResults;
import org.viewgain.engine.Runner;
import org.viewgain.engine.Setup;
import org.viewgain.engine.Shard;
import org.viewgain.report.HtmlReport;
import org.viewgain.report.Verdict;
import org.viewgain.report.Provenance;
import org.viewgain.report.RunFolder;
import org.viewgain.report.RunWriter;
import org.viewgain.report.SummaryTable;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.SpecLoader;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code viewgain run SPEC}: runs an experiment and writes a new results folder (or resumes one, or a shard). */
@Command(name = "run", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Run the experiment of a spec; write results/<experiment>/<run-id>/ and print a summary. "
                + "Every finished unit is journaled: continue a stopped run with --resume RUN_DIR.")
final class RunCommand implements Callable<Integer> {
    @Parameters(index = "0", arity = "0..1", paramLabel = "SPEC", description = "The experiment spec (YAML).")
    Path spec;

    @Option(names = "--out", paramLabel = "DIR", description = "Root folder of results (default: ${DEFAULT-VALUE}).")
    Path out = Path.of("results");

    @Option(names = "--resume", paramLabel = "RUN_DIR",
            description = "Finish a run that stopped (killed, crashed, out of time): skip the units in its journal.")
    Path resume;

    @Option(names = "--shard", paramLabel = "I/N",
            description = "Run only shard I of N (a cluster job); writes DIR/shard-I-of-N/; join with 'merge'.")
    String shard;

    @Mixin
    Common common;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws IOException {
        CommandLine cl = cs.commandLine();
        if (resume != null) {
            if (spec != null || shard != null) {
                throw new CommandLine.ParameterException(cl, "--resume takes the run folder only, not SPEC or --shard");
            }
            Map<String, Object> old = Provenance.read(RunFolder.existing(resume).dir().resolve("run.json"));
            if ("complete".equals(old.get("status"))) {
                throw new BadInputException(resume + " is already complete; nothing to resume");
            }
            Object file = old.get("spec_file");
            Object sh = old.get("shard");
            return execute(cl, Path.of(String.valueOf(file)), null, common,
                    sh == null ? null : Shard.parse(sh.toString()), resume, old);
        }
        if (spec == null) {
            throw new CommandLine.ParameterException(cl, "give a SPEC to run, or --resume RUN_DIR");
        }
        return execute(cl, spec, out, common, shard == null ? null : Shard.parse(shard), null, null);
    }

    /** Runs one spec into a new folder; shared with the demo command. */
    static int execute(CommandLine cl, Path specFile, Path outRoot, Common common) throws IOException {
        return execute(cl, specFile, outRoot, common, null, null, null);
    }

    private static int execute(CommandLine cl, Path specFile, Path outRoot, Common common, Shard shard,
                               Path resumeDir, Map<String, Object> old) throws IOException {
        if (common.threads() < 1) {
            throw new CommandLine.ParameterException(cl, "--threads must be at least 1, got " + common.threads());
        }
        PrintWriter err = cl.getErr();
        Experiment ex = Setup.prepare(SpecLoader.load(specFile));
        ComparisonPairs.of(ex); // names in significance.compare are checked before anything is written
        err.print(org.viewgain.report.CheckReport.duplicateWarning(ex));
        err.print(org.viewgain.report.CheckReport.costWarning(ex));
        err.flush();
        Instant start = Instant.now();
        Provenance prov = provenance(cl, ex, common);
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
        folder.writeText("run.json", prov.toJson());
        // after the journal's checks, so that a refused resume stays one line
        err.print(org.viewgain.report.CheckReport.powerWarning(ex));
        err.print(org.viewgain.report.MissingTargets.warning(ex));
        err.flush();
        if (!common.quiet) {
            long curveFits = org.viewgain.engine.Availability.modelFits(ex);
            err.println("[viewgain] " + ex.pipelines().size() + " pipelines, " + ex.modelFits() + " model fits"
                    + (curveFits > 0 ? " (+ " + curveFits + " for the availability curve)" : "") + ", "
                    + common.threads() + " thread(s)" + (shard == null ? "" : ", shard " + shard.label())
                    + (journal.size() > 0 ? ", " + journal.size() + " units already done" : "") + "; writing "
                    + folder.dir());
            err.flush();
        }
        Progress progress = common.quiet ? Progress.NONE : new ProgressLine(err);
        RunResults results = null;
        org.viewgain.engine.FinalPipelines finals = null;
        try (journal) {
            Runner runner = new Runner(ex, common.threads(), progress).journal(journal);
            if (shard != null) {
                runner.runShard(shard);
            } else {
                results = runner.run();
                finals = runner.finals();
            }
        } catch (RuntimeException | Error e) {
            return Failure.report(cl, common, folder, prov, e);
        }
        if (shard != null) {
            prov.put("status", "complete").put("finished_at", Instant.now().toString())
                    .put("units", journal.size());
            folder.writeText("run.json", prov.toJson());
            cl.getOut().println("shard " + shard.label() + ": " + journal.size() + " units in " + folder.dir());
            cl.getOut().flush();
            return 0;
        }
        try {
            return finish(cl, common, ex, folder, prov, results, finals, start);
        } catch (IOException | RuntimeException e) {
            return Failure.report(cl, common, folder, prov, e); // e.g. disk full while writing the tables
        }
    }

    static Provenance provenance(CommandLine cl, Experiment ex, Common common) throws IOException {
        List<String> ids = ex.data().subjects().stream().map(Subject::id).toList();
        return new Provenance(ex.spec(), ids, common.threads(),
                cl.getParseResult() == null ? List.of() : cl.getParseResult().originalArgs(),
                Instant.now().toString());
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

    /** Writes the tables, run.json (complete) and the report of finished results; prints the summary. */
    static int finish(CommandLine cl, Common common, Experiment ex, RunFolder folder, Provenance prov,
                      RunResults results, org.viewgain.engine.FinalPipelines finals, Instant start)
            throws IOException {
        PrintWriter out = cl.getOut();
        PrintWriter err = cl.getErr();
        if (!common.quiet) {
            // intervals, comparisons, the separation test and the report can take minutes on a large cohort
            err.println("[viewgain] all units done; computing the tables, the separation test and the report");
            err.flush();
        }
        err.print(convergenceWarning(results));
        err.flush();
        org.viewgain.engine.Analysis analysis = org.viewgain.engine.Analysis.of(results);
        List<Evaluation.MetricRow> metrics = analysis.metrics();
        Instant end = Instant.now();
        prov.put("finished_at", end.toString())
                .put("elapsed_seconds", Duration.between(start, end).toMillis() / 1000.0)
                .put("subjects", ex.data().n())
                .put("pipelines", ex.pipelines().size())
                .put("model_fits", ex.modelFits());
        if (finals != null) {
            org.viewgain.report.IndependentTables.writeFinals(folder, finals, prov.specSha256());
            if (ex.independent() != null) {
                org.viewgain.report.IndependentTables.write(folder, org.viewgain.engine.IndependentResults.of(
                        finals.pipelines(), ex.independent(), org.viewgain.engine.IndependentResults.Settings.of(ex)));
                org.viewgain.report.IndependentTables.writeDuplicates(folder, ex);
            }
        }
        RunWriter.write(folder, analysis, prov);
        try {
            HtmlReport.write(folder.dir(), false);
        } catch (IOException | RuntimeException e) {
            // the tables are complete; a report that cannot be drawn must not turn a finished run into a failure
            err.println("[viewgain] the report could not be written (" + e.getMessage() + "); rebuild it with "
                    + "'viewgain report " + folder.dir() + "'");
        }
        out.print(SummaryTable.text(metrics, ex.spec().significance().confidence()));
        try {
            out.println("answer: " + Verdict.of(folder.dir()));
        } catch (IOException | RuntimeException e) {
            err.println("[viewgain] the one-sentence answer could not be formed (" + e.getMessage() + ")");
        }
        Path report = folder.dir().resolve("report.html");
        if (Files.isRegularFile(report)) {
            out.println("report: " + report);
        }
        out.println("results: " + folder.dir());
        out.flush();
        return 0;
    }
}
