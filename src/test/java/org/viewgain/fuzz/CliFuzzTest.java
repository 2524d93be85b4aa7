package org.viewgain.fuzz;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.EdgeCasesMode;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import net.jqwik.api.statistics.Statistics;
import net.jqwik.api.statistics.StatisticsReport;

/**
 * Fuzzes {@code viewgain check} end to end (spec loader, method registries, data loaders, fold plan): mutated specs
 * and mutated cohort files exit 0, or exit 2 with one line per problem naming a file and no stack trace.
 */
@StatisticsReport(StatisticsReport.StatisticsReportMode.OFF)
class CliFuzzTest {
    private static final List<String> DATA_FILES = List.of("subjects.csv", "src.csv", "tgt.csv", "mats/a3.csv",
            "tmats/a1.csv");
    /** What the array-views spec reads as text (its .npy and .mat files are fuzzed by ArrayLoaderFuzzTest). */
    private static final List<String> ARRAY_DATA_FILES = List.of("subjects.csv", "arrays/order.txt");
    private static final AtomicInteger TRIES = new AtomicInteger();
    private static Path root;

    @BeforeContainer
    static void makeFolder() throws IOException {
        root = Files.createTempDirectory("viewgain-fuzz-cli");
    }

    @AfterContainer
    static void removeFolder() {
        Corpus.delete(root);
    }

    /** A fresh copy of the cohort per try, so that no try (or a shrinker still running) sees another's files. */
    private static Path freshCohort() {
        Path dir = root.resolve("try-" + TRIES.incrementAndGet());
        Corpus.writeCohort(dir);
        return dir;
    }

    @Provide
    Arbitrary<Path> corpusSpecs() {
        return Arbitraries.of(Corpus.files("spec"));
    }

    @Provide
    Arbitrary<List<Edit>> edits() {
        return Edit.lists(3);
    }

    @Provide
    Arbitrary<List<Shapes.TreeEdit>> treeEdits() {
        return Shapes.edits(2);
    }

    @Example
    void givenTheCorpusSpecsOnTheirCohort_whenChecked_thenExitZero() {
        Path dir = freshCohort();
        for (Path spec : Corpus.files("spec")) {
            Path copy = dir.resolve(spec.getFileName());
            Corpus.write(copy, Corpus.read(spec));
            Outcomes.Cli o = Outcomes.cli("check", copy.toString());
            assertEquals(0, o.code(), spec + ": " + o.err());
        }
    }

    @Property(tries = 200, seed = "7201", edgeCases = EdgeCasesMode.NONE)
    void givenMutatedSpecs_whenChecked_thenExit0Or2WithOneLinePerProblemAndNoStackTrace(
            @ForAll("corpusSpecs") Path seed, @ForAll("edits") List<Edit> edits,
            @ForAll("treeEdits") List<Shapes.TreeEdit> treeEdits, @ForAll boolean structural) {
        String text = Corpus.read(seed);
        Path dir = freshCohort();
        String mutated = structural ? Shapes.apply(text, treeEdits) : Edit.applyAll(text, edits);
        Path spec = dir.resolve("fuzzed.yaml");
        Corpus.write(spec, mutated);
        try {
            boolean ok = Outcomes.cliIsClean(Outcomes.cli("check", spec.toString()), dir.toString());
            Statistics.label("exit 0").collect(ok).coverage(c -> c.check(false).percentage(p -> p > 30));
        } finally {
            Corpus.delete(dir);
        }
    }

    @Property(tries = 100, seed = "7202", edgeCases = EdgeCasesMode.NONE)
    void givenMutatedCohortFiles_whenChecked_thenExit0Or2WithOneLineAndNoStackTrace(
            @ForAll("corpusSpecs") Path seed, @ForAll("edits") List<Edit> edits) {
        Path dir = freshCohort();
        Path spec = dir.resolve(seed.getFileName());
        Corpus.write(spec, Corpus.read(seed));
        List<String> files = seed.getFileName().toString().startsWith("array") ? ARRAY_DATA_FILES : DATA_FILES;
        Path data = dir.resolve(files.get(Math.floorMod(edits.get(0).pick(), files.size())));
        Corpus.write(data, Edit.applyAll(Corpus.read(data), edits));
        try {
            boolean ok = Outcomes.cliIsClean(Outcomes.cli("check", spec.toString()), dir.toString());
            Statistics.label("exit 0").collect(ok).coverage(c -> {
                c.check(true).percentage(p -> p > 3);
                c.check(false).percentage(p -> p > 30);
            });
        } finally {
            Corpus.delete(dir);
        }
    }
}
