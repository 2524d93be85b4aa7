package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.FeatureSet;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * The memory properties issue 7 asks for, checked as facts rather than timed: features extracted with {@code edges}
 * alone are the view's stored arrays (one copy of the data, in single precision), rows handed to a work unit are its
 * own double arrays, and a journal keeps the records it appends on disk only.
 */
class CompactStorageTest {
    @TempDir
    Path dir;

    static final String BODY = """
            features: { extract: [%s], scale: standardize }
            imputers:
              - { name: avg, method: mean }
            feature-sets: [source, source+imputed]
            classifiers:
              - { name: knn, method: knn, fixed: { k: 3 } }
            validation: { outer: { folds: 3, repeats: 1 }, inner: { folds: 2 } }
            """;

    Experiment experiment(String extract) {
        TestCohorts.synthetic(dir, 30, 5, 4, 0.5, 0.2, 5);
        return Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, BODY.formatted(extract))));
    }

    @Test
    void givenEdgesAlone_whenLoaded_thenFeaturesAreTheViewsStoredArraysAndUnitRowsAreCopies() {
        Experiment ex = experiment("edges");
        StudyData d = ex.data();
        for (int i = 0; i < d.n(); i++) {
            assertSame(d.source().stored(d.id(i)), d.storedSource(i), "subject " + d.id(i));
        }
        ImputedFold none = null;
        double[] row = ClassifierStage.rows(ex, FeatureSet.SOURCE, new int[] {0}, none).x()[0];
        float[] stored = d.source().stored(d.id(0));
        assertEquals(stored.length, row.length);
        for (int c = 0; c < row.length; c++) {
            assertEquals(stored[c], row[c], 0.0);
        }
        // a unit may transform its rows in place without touching the shared data
        row[0] = 1e9;
        assertEquals(stored[0], d.sourceFeatures(0)[0], 0.0);
        // the prefixed names are one shared list per feature set, not rebuilt for every block of rows
        assertSame(d.featureNames(FeatureSet.SOURCE),
                ClassifierStage.rows(ex, FeatureSet.SOURCE, new int[] {1, 2}, none).featureNames());
    }

    @Test
    void givenStrengthToo_whenLoaded_thenFeaturesAreExtractedIntoTheirOwnArrays() throws IOException {
        // the committed demo cohort: graph views (matrix files), which strength needs
        Path demo = Path.of("demo-data").toAbsolutePath();
        Path spec = dir.resolve("graph.yaml");
        java.nio.file.Files.writeString(spec, """
                experiment: graph
                cohort: { subjects: %1$s/subjects.csv, groups: [control, patient], positive: patient }
                views:
                  source: { matrices: "%1$s/views/thickness/{subject}.csv" }
                  target: { matrices: "%1$s/views/area/{subject}.csv", missing: allowed }
                """.formatted(demo) + BODY.formatted("edges, strength"));
        StudyData d = Setup.prepare(SpecLoader.load(spec)).data();
        assertNotSame(d.source().stored(d.id(0)), d.storedSource(0));
        assertEquals(d.source().width() + d.source().regions(), d.storedSource(0).length);
    }

    @Test
    void givenAppendedRecords_whenJournaled_thenOnlyKeysStayInMemoryAndTheFileHoldsThem() throws IOException {
        Path file = dir.resolve("journal.jsonl");
        ObjectMapper json = new ObjectMapper();
        try (Journal j = Journal.create(file, Map.of("spec", "x"))) {
            for (int k = 0; k < 3; k++) {
                ObjectNode rec = json.createObjectNode().put("unit", "p/0/" + k).put("statistic", "0." + k);
                j.append(rec);
            }
            j.append(json.createObjectNode().put("unit", "p/0/1").put("statistic", "9"));
            assertEquals(Set.of("p/0/0", "p/0/1", "p/0/2"), j.keys());
            assertEquals(3, j.size());
            assertTrue(j.units().isEmpty(), "appended records are not kept: " + j.units().keySet());
        }
        Journal read = Journal.read(file);
        assertEquals(3, read.units().size());
        assertEquals("0.1", read.unit("p/0/1").get("statistic").asText(), "the first record of a key wins");
        read.take("p/0/1");
        assertEquals(null, read.unit("p/0/1"));
        assertTrue(read.keys().contains("p/0/1"), "a taken unit stays finished");

        // merged records are kept for the run that follows, and a unit in two shards is refused
        try (Journal merged = Journal.create(dir.resolve("merged.jsonl"), Map.of("spec", "x"))) {
            merged.appendAll(Journal.read(file));
            assertEquals(3, merged.units().size());
            assertThrows(BadInputException.class, () -> merged.appendAll(Journal.read(file)));
        }
    }
}
