package org.viewgain.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.viewgain.report.HtmlReport;
import org.viewgain.spec.BadInputException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code viewgain report RUN_DIR}: rebuilds the HTML report of a finished run from its tables alone. */
@Command(name = "report", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Rebuild RUN_DIR/report.html from run.json and the tables of a run folder (no data or engine "
                + "needed).")
final class ReportCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "RUN_DIR", description = "A run folder (results/<experiment>/<run-id>).")
    Path runDir;

    @Option(names = "--redact-ids", description = "Replace subject ids by pseudonyms (subject-0001, ...) everywhere "
            + "in the report.")
    boolean redactIds;

    @Option(names = "--out", paramLabel = "FILE", description = "Write the report here instead of RUN_DIR/report.html.")
    Path out;

    @Option(names = "--verbose", description = "Print stack traces of errors.")
    boolean verbose;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws IOException {
        if (!Files.isDirectory(runDir)) {
            throw new BadInputException(runDir + ": no such run folder");
        }
        Path written = HtmlReport.write(runDir, redactIds, out == null ? runDir.resolve(HtmlReport.FILE) : out);
        cs.commandLine().getOut().println("report: " + written);
        cs.commandLine().getOut().flush();
        return 0;
    }
}
