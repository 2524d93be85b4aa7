package org.viewgain.cli;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.StringJoiner;
import java.util.concurrent.Callable;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.ExperimentSpec;
import org.viewgain.spec.SpecLoader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code viewgain slurm SPEC --shards N --out DIR}: writes a Slurm job array ({@code array.sh}, one task per shard),
 * a merge job ({@code merge.sh}) and {@code submit.sh}, which submits the array and the merge job to run after every
 * task succeeded. A task that was killed (wall time, preemption) resumes its shard when run again.
 */
@Command(name = "slurm", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Write Slurm scripts that run a spec as a job array of N shards and then merge them "
                + "(DIR/array.sh, DIR/merge.sh); submit both with DIR/submit.sh on the login node.")
final class SlurmCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "SPEC", description = "The experiment spec (YAML).")
    Path spec;

    @Option(names = "--verbose", description = "Print stack traces of errors.")
    boolean verbose;

    @Option(names = "--shards", paramLabel = "N", required = true, description = "Number of array tasks.")
    int shards;

    @Option(names = "--out", paramLabel = "DIR", required = true,
            description = "Folder for the scripts, the shard folders, logs/ and results/ (on a shared file system).")
    Path out;

    @Option(names = "--launcher", paramLabel = "PATH",
            description = "The viewgain launcher on the cluster (default: the one of this installation).")
    Path launcher;

    @Option(names = "--cpus", paramLabel = "C", description = "CPUs per task (default: ${DEFAULT-VALUE}).")
    int cpus = 2;

    @Option(names = "--mem", paramLabel = "MEM", description = "Memory per task (default: ${DEFAULT-VALUE}).")
    String mem = "8G";

    @Option(names = "--time", paramLabel = "LIMIT", description = "Wall time per task (default: ${DEFAULT-VALUE}).")
    String time = "04:00:00";

    @Option(names = "--sbatch", paramLabel = "LINE",
            description = "Extra #SBATCH line for both jobs, e.g. --sbatch=--partition=short (repeatable).")
    java.util.List<String> extra = new java.util.ArrayList<>();

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws IOException {
        if (!(shards >= 1 && shards <= 10000)) {
            throw new BadInputException("--shards must be between 1 and 10000, got " + shards);
        }
        if (!(cpus >= 1)) {
            throw new BadInputException("--cpus must be at least 1, got " + cpus);
        }
        ExperimentSpec es = SpecLoader.load(spec); // a bad spec is refused here, not on the cluster
        Path specAbs = spec.toAbsolutePath().normalize();
        Path dir = out.toAbsolutePath().normalize();
        Path exe = (launcher == null ? defaultLauncher() : launcher).toAbsolutePath().normalize();
        if (!Files.isRegularFile(exe)) {
            throw new BadInputException("no viewgain launcher at " + exe + "; give it with --launcher");
        }
        if (Files.exists(dir.resolve("array.sh"))) {
            throw new BadInputException(dir + " already holds Slurm scripts; choose another --out");
        }
        Files.createDirectories(dir.resolve("logs"));
        String name = "viewgain-" + es.experiment().replaceAll("[^A-Za-z0-9_.-]", "_");
        StringBuilder head = new StringBuilder();
        extra.forEach(e -> head.append("#SBATCH ").append(e).append('\n'));
        String array = "#!/usr/bin/env bash\n"
                + "# One shard of " + q(specAbs.toString()) + " per array task (written by 'viewgain slurm').\n"
                + "#SBATCH --job-name=" + name + "\n"
                + "#SBATCH --array=1-" + shards + "\n"
                + "#SBATCH --cpus-per-task=" + cpus + "\n"
                + "#SBATCH --mem=" + mem + "\n"
                + "#SBATCH --time=" + time + "\n"
                + "#SBATCH --output=" + dir.resolve("logs") + "/shard-%a.out\n"
                + head
                + "set -euo pipefail\n"
                + "i=\"${SLURM_ARRAY_TASK_ID:?submit this script with sbatch (see submit.sh)}\"\n"
                + "shard=" + q(dir.toString()) + "/shard-$i-of-" + shards + "\n"
                + "threads=\"${SLURM_CPUS_PER_TASK:-1}\"\n"
                + "if [ -f \"$shard/run.json\" ] && grep -q '\"status\" : \"complete\"' \"$shard/run.json\"; then\n"
                + "  echo \"shard $i already complete\"; exit 0\n"
                + "elif [ -f \"$shard/run.json\" ]; then\n"
                + "  # killed earlier (wall time, preemption, node failure): go on from its journal\n"
                + "  exec " + q(exe.toString()) + " run --resume \"$shard\" --threads \"$threads\" --quiet\n"
                + "else\n"
                + "  rm -rf \"$shard\"  # created but killed before its first line: nothing to keep\n"
                + "  exec " + q(exe.toString()) + " run " + q(specAbs.toString()) + " --shard \"$i/" + shards
                + "\" --out " + q(dir.toString()) + " --threads \"$threads\" --quiet\n"
                + "fi\n";
        StringJoiner dirs = new StringJoiner(" ");
        for (int i = 1; i <= shards; i++) {
            dirs.add(q(dir.resolve("shard-" + i + "-of-" + shards).toString()));
        }
        String merge = "#!/usr/bin/env bash\n"
                + "# Joins the " + shards + " shards into one results folder under results/ (written by 'viewgain "
                + "slurm').\n"
                + "#SBATCH --job-name=" + name + "-merge\n"
                + "#SBATCH --cpus-per-task=1\n"
                + "#SBATCH --mem=" + mem + "\n"
                + "#SBATCH --time=" + time + "\n"
                + "#SBATCH --output=" + dir.resolve("logs") + "/merge.out\n"
                + head
                + "set -euo pipefail\n"
                + "exec " + q(exe.toString()) + " merge " + dirs + " --out " + q(dir.resolve("results").toString())
                + " --threads 1 --quiet\n";
        String submit = "#!/usr/bin/env bash\n"
                + "# Submits the shard array and the merge job, which starts only when every shard succeeded.\n"
                + "# Extra arguments go to both sbatch calls (e.g. --partition=short).\n"
                + "set -euo pipefail\n"
                + "cd " + q(dir.toString()) + "\n"
                + "array=\"$(sbatch --parsable \"$@\" array.sh)\"\n"
                + "array=\"${array%%;*}\"\n"
                + "merge=\"$(sbatch --parsable \"$@\" --dependency=afterok:\"$array\" merge.sh)\"\n"
                + "merge=\"${merge%%;*}\"\n"
                + "printf 'array %s\\nmerge %s\\n' \"$array\" \"$merge\" > jobs.txt\n"
                + "echo \"submitted: array job $array (" + shards + " tasks), merge job $merge; results in "
                + dir.resolve("results") + "\"\n";
        write(dir.resolve("array.sh"), array);
        write(dir.resolve("merge.sh"), merge);
        write(dir.resolve("submit.sh"), submit);
        cs.commandLine().getOut().println("wrote " + dir.resolve("array.sh") + ", merge.sh and submit.sh; on the "
                + "cluster run: " + dir.resolve("submit.sh"));
        cs.commandLine().getOut().flush();
        return 0;
    }

    private static void write(Path p, String text) throws IOException {
        Files.writeString(p, text);
        try {
            Files.setPosixFilePermissions(p, PosixFilePermissions.fromString("rwxr-xr-x"));
        } catch (UnsupportedOperationException e) {
            // not a POSIX file system: run the scripts with bash
        }
    }

    /** Single-quotes a word for bash. */
    static String q(String s) {
        return "'" + s.replace("'", "'\\''") + "'";
    }

    /** The {@code viewgain} launcher next to target/ of this installation (jar or classes). */
    static Path defaultLauncher() {
        try {
            Path code = Path.of(SlurmCommand.class.getProtectionDomain().getCodeSource().getLocation().toURI());
            return code.toAbsolutePath().getParent().getParent().resolve("viewgain");
        } catch (URISyntaxException | RuntimeException e) {
            return Path.of("viewgain");
        }
    }
}
