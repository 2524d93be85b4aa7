package org.viewgain.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.Callable;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.Journal;
import org.viewgain.engine.Progress;
import org.viewgain.engine.RunResults;
import org.viewgain.engine.Runner;
import org.viewgain.engine.Setup;
import org.viewgain.engine.Shard;
import org.viewgain.report.Provenance;
import org.viewgain.report.RunFolder;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.SpecLoader;
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
        TreeMap<Integer, Journal> byIndex = new TreeMap<>();
        Map<String, Object> first = null;
        Path specFile = null;
        int count = -1;
        for (Path dir : shards) {
            Map<String, Object> run = Provenance.read(RunFolder.existing(dir).dir().resolve("run.json"));
            Journal j = Journal.read(dir.resolve(Journal.FILE));
            Map<String, Object> id = j.identity();
            Object label = id.get("shard");
            if (label == null || "all".equals(label)) {
                throw new BadInputException(dir + " is not a shard folder (made by 'run --shard I/N')");
            }
            Shard s = Shard.parse(label.toString());
            Map<String, Object> common = withoutShard(id);
            if (first == null) {
                first = common;
                specFile = Path.of(String.valueOf(run.get("spec_file")));
                count = s.count();
            } else if (!first.equals(common)) {
                throw new BadInputException(dir + " comes from another spec, data, seed or tool version than "
                        + shards.get(0) + "; merge only shards of one run");
            } else if (s.count() != count) {
                throw new BadInputException(dir + " is shard " + s.label() + " but " + shards.get(0) + " is one of "
                        + count + " shards");
            }
            if (byIndex.put(s.index(), j) != null) {
                throw new BadInputException("shard " + s.label() + " is given twice (" + dir + ")");
            }
        }
        for (int i = 1; i <= count; i++) {
            if (!byIndex.containsKey(i)) {
                throw new BadInputException("shard " + i + "/" + count + " is missing; give all " + count
                        + " shard folders");
            }
        }
        Experiment ex = Setup.prepare(SpecLoader.load(specFile));
        Instant start = Instant.now();
        Provenance prov = RunCommand.provenance(cl, ex, common);
        Map<String, Object> now = Journal.normalize(prov.identity(null));
        if (!withoutShard(now).equals(first)) {
            throw new BadInputException("the spec or data changed since the shards ran (" + specFile + "); "
                    + "the shards cannot be merged");
        }
        Runner runner = new Runner(ex, common.threads(), Progress.NONE);
        for (Map.Entry<Integer, Journal> e : byIndex.entrySet()) {
            Shard s = new Shard(e.getKey(), count);
            List<String> want = runner.unitKeys(s);
            Set<String> have = new HashSet<>(e.getValue().keys());
            List<String> missing = new ArrayList<>(want.stream().filter(k -> !have.contains(k)).toList());
            if (!missing.isEmpty()) {
                throw new BadInputException("shard " + s.label() + " is not finished: " + missing.size() + " of "
                        + want.size() + " units missing; continue it with 'viewgain run --resume "
                        + e.getValue().file().getParent() + "'");
            }
            want.forEach(have::remove);
            if (!have.isEmpty()) {
                throw new BadInputException("shard " + s.label() + " holds units of another shard (e.g. "
                        + have.iterator().next() + ")");
            }
        }
        RunFolder folder = RunFolder.create(out, ex.spec().experiment(), start);
        prov.put("merged_from", shards.stream().map(p -> p.toAbsolutePath().toString()).toList());
        folder.writeText("run.json", prov.toJson());
        RunResults results;
        org.viewgain.engine.FinalPipelines finals;
        try (Journal merged = Journal.create(folder.dir().resolve(Journal.FILE), now)) {
            byIndex.values().forEach(merged::appendAll);
            results = runner.journal(merged).run();
            finals = runner.finals();
        } catch (RuntimeException | Error e) {
            return Failure.report(cl, common, folder, prov, e);
        }
        return RunCommand.finish(cl, common, ex, folder, prov, results, finals, start);
    }

    private static Map<String, Object> withoutShard(Map<String, Object> id) {
        Map<String, Object> m = new TreeMap<>(id);
        m.remove("shard");
        return m;
    }
}
