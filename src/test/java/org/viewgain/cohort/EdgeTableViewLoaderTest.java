package org.viewgain.cohort;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.viewgain.cohort.TestFiles.expectBadInput;
import static org.viewgain.cohort.TestFiles.write;

class EdgeTableViewLoaderTest {
    private static final List<String> IDS = List.of("007", "s2", "s3");

    @TempDir
    Path dir;

    private View load(String content, boolean missingAllowed) {
        return ViewLoader.edgeTable("cog", write(dir, "cog.csv", content), null, IDS, missingAllowed);
    }

    @Test
    void givenTableWithIdFirst_whenLoaded_thenTabularViewInSubjectsTableOrder() {
        View v = load("id,memory,speed\ns2,1.5,2\n007,-3,4e-1\ns3,0,0\n", false);
        assertFalse(v.isGraph());
        assertEquals(0, v.regions());
        assertEquals(List.of("memory", "speed"), v.baseNames());
        assertEquals(List.of("007", "s2", "s3"), List.copyOf(v.subjects()));
        assertArrayEquals(MatrixViewLoaderTest.single(-3, 0.4), v.base("007"), 0.0);
    }

    @Test
    void givenNamedIdColumnNotFirst_whenLoaded_thenOtherColumnsAreFeatures() {
        Path csv = write(dir, "t.csv", "memory,subject,speed\n1,007,2\n");
        View v = ViewLoader.edgeTable("cog", csv, "subject", IDS, true);
        assertEquals(List.of("memory", "speed"), v.baseNames());
        assertArrayEquals(MatrixViewLoaderTest.single(1, 2), v.base("007"), 0.0);
        assertFalse(v.has("s2"));
    }

    @Test
    void givenUnknownIdColumn_whenLoaded_thenColumnsListed() {
        Path csv = write(dir, "t.csv", "memory,subject\n1,007\n");
        expectBadInput(() -> ViewLoader.edgeTable("cog", csv, "id", IDS, true), "t.csv", "'id'",
                "[memory, subject]");
    }

    @Test
    void givenUnknownSubject_whenLoaded_thenLineAndIdNamed() {
        expectBadInput(() -> load("id,a\n007,1\ns9,2\n", true), "cog.csv", "line 3", "'s9'",
                "not in the subjects table");
    }

    @Test
    void givenDuplicateSubject_whenLoaded_thenBothLinesNamed() {
        expectBadInput(() -> load("id,a\n007,1\ns2,2\n007,3\n", true), "cog.csv", "subject 007", "lines 2 and 4");
    }

    @Test
    void givenMissingSubjectWhenNotAllowed_whenLoaded_thenSubjectNamed() {
        expectBadInput(() -> load("id,a\n007,1\ns3,2\n", false), "cog.csv", "no row for subject s2");
        assertEquals(2, load("id,a\n007,1\ns3,2\n", true).subjects().size());
    }

    @Test
    void givenBadCell_whenLoaded_thenLineColumnAndSubjectNamed() {
        expectBadInput(() -> load("id,a,b\n007,1,2\ns2,3,abc\n", true), "line 3", "column 'b'", "subject s2",
                "'abc'");
        expectBadInput(() -> load("id,a,b\n007,1,Inf\n", true), "line 2", "column 'b'", "finite");
        expectBadInput(() -> load("id,a,b\n007,,2\n", true), "line 2", "column 'a'", "empty cell");
    }

    @Test
    void givenRaggedRowOrEmptyId_whenLoaded_thenLineNamed() {
        expectBadInput(() -> load("id,a,b\n007,1,2\ns2,3\n", true), "cog.csv", "line 3", "expected 3 cells");
        expectBadInput(() -> load("id,a,b\n,1,2\n", true), "line 2", "empty subject id");
    }

    @Test
    void givenEmptyOrFeaturelessOrBadHeader_whenLoaded_thenRejected() {
        expectBadInput(() -> load("", true), "cog.csv", "empty");
        expectBadInput(() -> load("id\n007\n", true), "no feature columns");
        expectBadInput(() -> load("id,a,a\n007,1,2\n", true), "'a'", "twice");
        expectBadInput(() -> load("id,,b\n007,1,2\n", true), "column 2", "no name");
        expectBadInput(() -> load("id,a\n", true), "no rows");
        expectBadInput(() -> ViewLoader.edgeTable("cog", dir.resolve("none.csv"), null, IDS, true), "none.csv",
                "not found");
    }
}
