package org.viewgain.cli;

import java.io.PrintWriter;
import org.viewgain.spec.BadInputException;
import picocli.CommandLine;

/**
 * Turns exceptions into one clear message and an exit code: 2 for a user's mistake (bad spec or data), 1 for a
 * failed run. The stack trace is printed only with {@code --verbose}.
 */
final class ErrorHandler implements CommandLine.IExecutionExceptionHandler {
    static final int BAD_INPUT = 2;
    static final int FAILED = 1;

    @Override
    public int handleExecutionException(Exception ex, CommandLine cl, CommandLine.ParseResult parsed) {
        PrintWriter err = cl.getErr();
        boolean verbose = parsed.hasMatchedOption("--verbose")
                || (parsed.subcommand() != null && parsed.subcommand().hasMatchedOption("--verbose"));
        if (ex instanceof BadInputException) {
            // every line starts the same way, also the lines of a spec with several problems
            ex.getMessage().lines().forEach(l -> err.println(UsageErrors.PREFIX + l));
            if (verbose) {
                ex.printStackTrace(err);
            }
            err.flush();
            return BAD_INPUT;
        }
        String what = org.viewgain.run.RunFailure.describe(ex);
        err.println("viewgain: the run failed: " + what + (verbose ? "" : " (use --verbose for details)"));
        if (verbose) {
            ex.printStackTrace(err);
        }
        err.flush();
        return FAILED;
    }
}
