package org.viewgain.cli;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.viewgain.engine.Bundle;
import org.viewgain.engine.IndependentData;
import org.viewgain.engine.IndependentResults;
import org.viewgain.report.IndependentTables;
import org.viewgain.report.RunFolder;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.IndependentKeys;
import org.viewgain.spec.Specs;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code viewgain apply BUNDLE COHORT --out DIR}: applies a run's frozen pipelines to a cohort that came later.
 * Everything is checked (the bundle's format, version and hashes; the cohort's regions) before {@code DIR} is
 * created, so a refusal writes nothing.
 */
@Command(name = "apply", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Apply the frozen pipelines of a run's bundle/ to a new cohort (a cohort file with the keys of "
                + "independent-cohort); write external_predictions.csv and, with labels, metrics and comparisons.")
final class ApplyCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "BUNDLE", description = "A run's bundle folder.")
    Path bundle;

    @Parameters(index = "1", paramLabel = "COHORT", description = "The cohort file (YAML).")
    Path cohort;

    @Option(names = "--out", required = true, paramLabel = "DIR", description = "A new or empty folder for the tables.")
    Path out;

    @Option(names = "--verbose", description = "Print stack traces of errors.")
    boolean verbose;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws Exception {
        Bundle.Loaded b = Bundle.read(bundle);
        Specs.Independent spec = IndependentKeys.load(cohort);
        IndependentData data = IndependentData.load(spec, b.shape());
        IndependentResults r = IndependentResults.of(b.pipelines(), data, b.settings());
        if (Files.exists(out)) {
            throw new BadInputException(out + " already exists; apply writes into a new folder");
        }
        RunFolder folder = RunFolder.createAt(out);
        IndependentTables.write(folder, r);
        cs.commandLine().getOut().println(r.predictions().size() + " predictions of " + b.pipelines().size()
                + " pipelines for " + data.n() + " subjects in " + out);
        cs.commandLine().getOut().flush();
        return 0;
    }
}
