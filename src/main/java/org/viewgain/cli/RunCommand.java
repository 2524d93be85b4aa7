package org.viewgain.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.viewgain.engine.Shard;
import org.viewgain.report.SummaryTable;
import org.viewgain.report.Verdict;
import org.viewgain.run.RunController;
import org.viewgain.run.RunOptions;
import org.viewgain.run.RunOutcome;
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
            return print(cl, common, RunController.resume(resume, options(cl, common)));
        }
        if (spec == null) {
            throw new CommandLine.ParameterException(cl, "give a SPEC to run, or --resume RUN_DIR");
        }
        RunOptions o = options(cl, common);
        return print(cl, common, shard == null ? RunController.run(spec, out, o)
                : RunController.shard(spec, out, Shard.parse(shard), o));
    }

    /** The run options of a command's arguments ({@code --threads} checked here: a usage error). */
    static RunOptions options(CommandLine cl, Common common) {
        if (common.threads() < 1) {
            throw new CommandLine.ParameterException(cl, "--threads must be at least 1, got " + common.threads());
        }
        List<String> args = cl.getParseResult() == null ? List.of() : cl.getParseResult().originalArgs();
        return new RunOptions(common.threads(), common.quiet, args, cl.getErr());
    }

    /** Prints how a run ended and returns the exit code: the summary, a shard's count, or the failure in one line. */
    static int print(CommandLine cl, Common common, RunOutcome outcome) {
        PrintWriter out = cl.getOut();
        PrintWriter err = cl.getErr();
        if (outcome instanceof RunOutcome.ShardFinished s) {
            out.println("shard " + s.shard() + ": " + s.units() + " units in " + s.folder());
            out.flush();
            return 0;
        }
        if (outcome instanceof RunOutcome.Failed f) {
            err.println("viewgain: the run failed: " + f.what() + "; finished units are kept, continue with '"
                    + f.resumeWith() + "'");
            if (common.verbose) {
                f.cause().printStackTrace(err);
            }
            err.flush();
            return ErrorHandler.FAILED;
        }
        RunOutcome.Finished done = (RunOutcome.Finished) outcome;
        out.print(SummaryTable.text(done.metrics(), done.confidence()));
        try {
            out.println("answer: " + Verdict.of(done.folder()));
        } catch (IOException | RuntimeException e) {
            err.println("[viewgain] the one-sentence answer could not be formed (" + e.getMessage() + ")");
        }
        Path report = done.folder().resolve("report.html");
        if (Files.isRegularFile(report)) {
            out.println("report: " + report);
        }
        out.println("results: " + done.folder());
        out.flush();
        err.flush();
        return 0;
    }
}
