package org.viewgain.fuzz;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.EdgeCasesMode;
import net.jqwik.api.Example;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.statistics.Statistics;
import net.jqwik.api.statistics.StatisticsReport;
import org.viewgain.spec.SpecLoader;

/**
 * Fuzzes {@link SpecLoader#parse}: mutated corpus specs (text edits and wrong YAML shapes) and random documents
 * either load or are refused with one line per problem, each naming the spec file. Seeds are fixed so that a run
 * is reproducible; tries are bounded so the class stays within seconds.
 */
@StatisticsReport(StatisticsReport.StatisticsReportMode.OFF)
class SpecLoaderFuzzTest {
    private static final Path SPEC = Path.of("fuzzed", "spec.yaml");

    @Provide
    Arbitrary<String> corpusSpecs() {
        return Arbitraries.of(Corpus.texts("spec"));
    }

    @Provide
    Arbitrary<List<Edit>> edits() {
        return Edit.lists(4);
    }

    @Provide
    Arbitrary<List<Shapes.TreeEdit>> treeEdits() {
        return Shapes.edits(3);
    }

    @Provide
    Arbitrary<JsonNode> documents() {
        return Shapes.values(3);
    }

    @Example
    void givenTheCorpusSpecs_whenParsed_thenEveryOneLoads() {
        for (String text : Corpus.texts("spec")) {
            assertDoesNotThrow(() -> SpecLoader.parse(text, SPEC), text);
        }
    }

    @Property(tries = 400, seed = "7001", edgeCases = EdgeCasesMode.NONE)
    void givenTextMutationsOfValidSpecs_whenParsed_thenLoadsOrRefusesNamingTheFile(
            @ForAll("corpusSpecs") String seed, @ForAll("edits") List<Edit> edits) {
        String text = Edit.applyAll(seed, edits);
        boolean loaded = Outcomes.specLoadsOrRefuses(() -> SpecLoader.parse(text, SPEC), SPEC.toString());
        // the mutations must exercise both outcomes, or the fuzzer is degenerate (common practice, no source)
        Statistics.label("loaded").collect(loaded).coverage(c -> {
            c.check(true).percentage(p -> p > 3);
            c.check(false).percentage(p -> p > 30);
        });
    }

    @Property(tries = 300, seed = "7002", edgeCases = EdgeCasesMode.NONE)
    void givenWrongShapesAndTypesInValidSpecs_whenParsed_thenLoadsOrRefusesNamingTheFile(
            @ForAll("corpusSpecs") String seed, @ForAll("treeEdits") List<Shapes.TreeEdit> edits) {
        String text = Shapes.apply(seed, edits);
        boolean loaded = Outcomes.specLoadsOrRefuses(() -> SpecLoader.parse(text, SPEC), SPEC.toString());
        Statistics.label("loaded").collect(loaded).coverage(c -> c.check(false).percentage(p -> p > 30));
    }

    @Property(tries = 200, seed = "7003", edgeCases = EdgeCasesMode.NONE)
    void givenRandomYamlDocuments_whenParsed_thenRefusedNamingTheFile(@ForAll("documents") JsonNode root) {
        String text = Shapes.document(root);
        Outcomes.specLoadsOrRefuses(() -> SpecLoader.parse(text, SPEC), SPEC.toString());
    }
}
