package org.viewgain.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.viewgain.report.SummaryTable;
import org.viewgain.report.Verdict;
import org.viewgain.run.RunOptions;
import org.viewgain.run.RunOutcome;
import picocli.CommandLine;

/** What the commands that run work share: their run options, and the printing of how a run ended. */
final class Outcomes {
    private Outcomes() {
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
