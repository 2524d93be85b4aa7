package org.viewgain.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.viewgain.engine.Shard;
import org.viewgain.run.RunController;
import org.viewgain.run.RunOptions;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/** {@code viewgain run SPEC}: runs an experiment and writes a new results folder (or resumes one, or a shard). */
@Command(name = "run", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Run the experiment of a spec; write results/<experiment>/<run-id>/ and print a summary. "
                + "Every finished unit is journaled: continue a stopped run with --resume RUN_DIR.")
final class RunCommand implements Callable<Integer> {
    @Parameters(index = "0", arity = "0..1", paramLabel = "SPEC", description = "The experiment spec (YAML).")
    Path spec;

    @Option(names = "--out", paramLabel = "DIR", description = "Root folder of results (default: ${DEFAULT-VALUE}).")
    Path out = Path.of("results");

    @Option(names = "--resume", paramLabel = "RUN_DIR",
            description = "Finish a run that stopped (killed, crashed, out of time): skip the units in its journal.")
    Path resume;

    @Option(names = "--shard", paramLabel = "I/N",
            description = "Run only shard I of N (a cluster job); writes DIR/shard-I-of-N/; join with 'merge'.")
    String shard;

    @Mixin
    Common common;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws IOException {
        CommandLine cl = cs.commandLine();
        if (resume != null) {
            if (spec != null || shard != null) {
                throw new CommandLine.ParameterException(cl, "--resume takes the run folder only, not SPEC or --shard");
            }
            return Outcomes.print(cl, common, RunController.resume(resume, Outcomes.options(cl, common)));
        }
        if (spec == null) {
            throw new CommandLine.ParameterException(cl, "give a SPEC to run, or --resume RUN_DIR");
        }
        RunOptions o = Outcomes.options(cl, common);
        return Outcomes.print(cl, common, shard == null ? RunController.run(spec, out, o)
                : RunController.shard(spec, out, Shard.parse(shard), o));
    }
}
