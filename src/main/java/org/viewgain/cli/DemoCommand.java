package org.viewgain.cli;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.viewgain.demo.DemoCohort;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code viewgain demo}: writes the invented demo cohort and its spec to a folder and runs it. */
@Command(name = "demo", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Write the invented demo cohort and its spec to a folder and run it there: "
                + "DIR/demo-data/, DIR/experiment-specs/demo.yaml, DIR/results/.")
final class DemoCommand implements Callable<Integer> {
    /** Seed of the committed demo data. */
    static final long DEMO_SEED = 2026;

    @Option(names = "--out", paramLabel = "DIR", description = "Folder to write into (default: ${DEFAULT-VALUE}).")
    Path out = Path.of("viewgain-demo");

    @Option(names = "--regenerate", description = "Write the demo data again even if DIR/demo-data exists.")
    boolean regenerate;

    @Option(names = "--data-only", description = "Write the data and spec, do not run.")
    boolean dataOnly;

    @Mixin
    Common common;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws IOException {
        Path data = out.resolve("demo-data");
        if (regenerate || !Files.exists(data)) {
            DemoCohort.write(data, DEMO_SEED);
        }
        Path spec = out.resolve("experiment-specs").resolve("demo.yaml");
        if (!Files.exists(spec)) {
            Files.createDirectories(spec.getParent());
            try (InputStream in = DemoCommand.class.getResourceAsStream("/org/viewgain/demo/demo.yaml")) {
                Files.copy(in, spec);
            }
        }
        if (dataOnly) {
            cs.commandLine().getOut().println("demo cohort: " + data + "\ndemo spec: " + spec);
            return 0;
        }
        CommandLine cl = cs.commandLine();
        return Outcomes.print(cl, common, org.viewgain.run.RunController.run(spec, out.resolve("results"),
                Outcomes.options(cl, common)));
    }
}
