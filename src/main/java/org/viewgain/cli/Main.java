package org.viewgain.cli;

import picocli.CommandLine;

/** Entry point of the {@code viewgain} command. */
public final class Main {
    private Main() {
    }

    public static void main(String[] args) {
        System.exit(commandLine().execute(args));
    }

    /** The configured command line (tests call this and capture its out/err). */
    public static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Root());
        cl.setExecutionExceptionHandler(new ErrorHandler());
        cl.setParameterExceptionHandler(new UsageErrors());
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        return cl;
    }
}
