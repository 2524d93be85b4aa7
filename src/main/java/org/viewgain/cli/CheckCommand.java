package org.viewgain.cli;

import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.Setup;
import org.viewgain.report.CheckReport;
import org.viewgain.spec.SpecLoader;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;

/** {@code viewgain check SPEC}: validates the spec and the data, prints the cohort and the plan, runs nothing. */
@Command(name = "check", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Check a spec and its data without running anything; print the cohort and the plan.")
final class CheckCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "SPEC", description = "The experiment spec (YAML).")
    Path spec;

    @CommandLine.Option(names = "--verbose", description = "Print stack traces of errors.")
    boolean verbose;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() {
        Experiment ex = Setup.prepare(SpecLoader.load(spec));
        cs.commandLine().getOut().print(CheckReport.text(ex));
        cs.commandLine().getOut().println("\nspec and data are fine");
        cs.commandLine().getOut().flush();
        return 0;
    }
}
