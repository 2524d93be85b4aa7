package org.viewgain.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.concurrent.Callable;
import org.viewgain.cohort.Subject;
import org.viewgain.engine.ComparisonPairs;
import org.viewgain.engine.Evaluation;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.Progress;
import org.viewgain.engine.RunResults;
import org.viewgain.engine.Runner;
import org.viewgain.engine.Setup;
import org.viewgain.report.HtmlReport;
import org.viewgain.report.Provenance;
import org.viewgain.report.RunFolder;
import org.viewgain.report.RunWriter;
import org.viewgain.report.SummaryTable;
import org.viewgain.spec.SpecLoader;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code viewgain run SPEC}: runs an experiment and writes a new results folder. */
@Command(name = "run", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Run the experiment of a spec; write results/<experiment>/<run-id>/ and print a summary.")
final class RunCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "SPEC", description = "The experiment spec (YAML).")
    Path spec;

    @Option(names = "--out", paramLabel = "DIR", description = "Root folder of results (default: ${DEFAULT-VALUE}).")
    Path out = Path.of("results");

    @Mixin
    Common common;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws IOException {
        return execute(cs.commandLine(), spec, out, common);
    }

    /** Runs one spec; shared with the demo command. */
    static int execute(CommandLine cl, Path specFile, Path outRoot, Common common) throws IOException {
        if (common.threads() < 1) {
            throw new CommandLine.ParameterException(cl, "--threads must be at least 1, got " + common.threads());
        }
        PrintWriter out = cl.getOut();
        PrintWriter err = cl.getErr();
        Experiment ex = Setup.prepare(SpecLoader.load(specFile));
        ComparisonPairs.of(ex); // names in significance.compare are checked before anything is written
        err.print(org.viewgain.report.CheckReport.duplicateWarning(ex));
        err.flush();
        Instant start = Instant.now();
        RunFolder folder = RunFolder.create(outRoot, ex.spec().experiment(), start);
        List<String> ids = ex.data().subjects().stream().map(Subject::id).toList();
        Provenance prov = new Provenance(ex.spec(), ids, common.threads(),
                cl.getParseResult() == null ? List.of() : cl.getParseResult().originalArgs(), start.toString());
        folder.writeText("run.json", prov.toJson());
        if (!common.quiet) {
            err.println("[viewgain] " + ex.pipelines().size() + " pipelines, " + ex.modelFits() + " model fits, "
                    + common.threads() + " thread(s); writing " + folder.dir());
            err.flush();
        }
        Progress progress = common.quiet ? Progress.NONE : new ProgressLine(err);
        RunResults results;
        try {
            results = new Runner(ex, common.threads(), progress).run();
        } catch (RuntimeException | Error e) {
            prov.put("status", "failed").put("error", String.valueOf(e.getMessage()))
                    .put("finished_at", Instant.now().toString());
            folder.writeText("run.json", prov.toJson());
            throw e;
        }
        List<Evaluation.MetricRow> metrics = Evaluation.metrics(results);
        Instant end = Instant.now();
        prov.put("finished_at", end.toString())
                .put("elapsed_seconds", Duration.between(start, end).toMillis() / 1000.0)
                .put("subjects", ex.data().n())
                .put("pipelines", ex.pipelines().size())
                .put("model_fits", ex.modelFits());
        RunWriter.write(folder, results, prov, metrics);
        try {
            HtmlReport.write(folder.dir(), false);
        } catch (IOException | RuntimeException e) {
            // the tables are complete; a report that cannot be drawn must not turn a finished run into a failure
            err.println("[viewgain] the report could not be written (" + e.getMessage() + "); rebuild it with "
                    + "'viewgain report " + folder.dir() + "'");
        }
        out.print(SummaryTable.text(metrics));
        out.println("results: " + folder.dir());
        out.flush();
        return 0;
    }
}
