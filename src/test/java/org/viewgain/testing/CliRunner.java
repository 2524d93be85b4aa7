package org.viewgain.testing;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.viewgain.cli.Main;
import picocli.CommandLine;

/** Runs the command line in-process with captured stdout and stderr (for CLI tests). */
public final class CliRunner {
    private CliRunner() {
    }

    /** What the command line printed and returned. */
    public record Outcome(int code, String out, String err) {
    }

    public static Outcome run(String... args) {
        CommandLine cl = Main.commandLine();
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        cl.setOut(new PrintWriter(out));
        cl.setErr(new PrintWriter(err));
        int code = cl.execute(args);
        return new Outcome(code, out.toString(), err.toString());
    }
}
