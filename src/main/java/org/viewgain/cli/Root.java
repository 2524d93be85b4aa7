package org.viewgain.cli;

import org.viewgain.report.Provenance;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The root command: lists the subcommands. */
@Command(name = "viewgain", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Does an imputed brain-network view help tell diagnostic groups apart? Leak-free nested "
                + "cross-validated experiments from a spec file. For research use only, not for diagnosis.",
        subcommands = {CheckCommand.class, RunCommand.class, MergeCommand.class, SlurmCommand.class, FoldsCommand.class,
            ReportCommand.class, DemoCommand.class, ApplyCommand.class, CommandLine.HelpCommand.class},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {"0:success", "1:the run failed", "2:bad usage, spec or data"})
public final class Root implements Runnable {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(),
                "say which command to run (check, run, merge, slurm, folds, report, demo)");
    }

    /** Reads the version from the jar manifest (the same string goes into run.json). */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"viewgain " + Provenance.toolVersion(),
                    "Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vendor") + ")"};
        }
    }
}
