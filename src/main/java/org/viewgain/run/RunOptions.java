package org.viewgain.run;

import java.io.PrintWriter;
import java.util.List;

/**
 * How a run is carried out and where it talks.
 *
 * @param threads     worker threads, at least 1
 * @param quiet       no progress line
 * @param commandLine the command's arguments as given (recorded in run.json)
 * @param err         where progress, warnings and notes go
 */
public record RunOptions(int threads, boolean quiet, List<String> commandLine, PrintWriter err) {
    public RunOptions {
        if (!(threads >= 1)) {
            throw new IllegalArgumentException("threads must be at least 1, got " + threads);
        }
        commandLine = List.copyOf(commandLine);
    }
}
