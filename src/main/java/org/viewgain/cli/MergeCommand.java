package org.viewgain.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import org.viewgain.run.RunController;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code viewgain merge DIR...}: joins the folders of {@code run --shard I/N} into one run folder whose tables are
 * those of a single run. Refuses shards of different specs, data, seeds or tool versions, a missing or doubled
 * shard, and a shard that has not finished.
 */
@Command(name = "merge", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Join the shard folders of 'run --shard I/N' into one results folder (same tables as one run).")
final class MergeCommand implements Callable<Integer> {
    @Parameters(arity = "1..*", paramLabel = "SHARD_DIR", description = "The shard folders (all N of them).")
    List<Path> shards;

    @Option(names = "--out", paramLabel = "DIR", description = "Root folder of results (default: ${DEFAULT-VALUE}).")
    Path out = Path.of("results");

    @Mixin
    Common common;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws IOException {
        CommandLine cl = cs.commandLine();
        return Outcomes.print(cl, common, RunController.merge(shards, out, Outcomes.options(cl, common)));
    }
}
