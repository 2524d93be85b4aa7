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
            err.println("viewgain: " + ex.getMessage());
            if (verbose) {
                ex.printStackTrace(err);
            }
            err.flush();
            return BAD_INPUT;
        }
        Throwable root = ex;
        while (root.getCause() != null && root.getCause() != root) {
            root = root.getCause();
        }
        String what = root instanceof OutOfMemoryError
                ? Failure.outOfMemory()
                : root.getClass().getSimpleName() + (root.getMessage() == null ? "" : ": " + root.getMessage());
        err.println("viewgain: the run failed: " + what + (verbose ? "" : " (use --verbose for details)"));
        if (verbose) {
            ex.printStackTrace(err);
        }
        err.flush();
        return FAILED;
    }
}
