package org.viewgain.cli;

import picocli.CommandLine.Option;

/** Options shared by the commands that run work. */
final class Common {
    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @Option(names = "--quiet", description = "No progress line on stderr.")
    boolean quiet;

    @Option(names = "--verbose", description = "Print stack traces of errors.")
    boolean verbose;

    int threads() {
        return threads == null ? Runtime.getRuntime().availableProcessors() : threads;
    }
}
