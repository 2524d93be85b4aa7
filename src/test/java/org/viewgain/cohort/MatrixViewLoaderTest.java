package org.viewgain.cohort;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.viewgain.cohort.TestFiles.expectBadInput;
import static org.viewgain.cohort.TestFiles.write;

class MatrixViewLoaderTest {
    private static final List<String> IDS = List.of("007", "s2", "s3");
    private static final String M3 = "0,1,2\n1,0,3\n2,3,0\n";

    @TempDir
    Path dir;

    private static Path pattern(String folder) {
        return TestFiles.resource(folder + "/007.csv").resolveSibling("{subject}.csv");
    }

    private View load(String content007, String contentS2) {
        write(dir, "007.csv", content007);
        write(dir, "s2.csv", contentS2);
        return ViewLoader.matrices("thick", dir.resolve("{subject}.csv"), List.of("007", "s2"), false, 1e-9);
    }

    @Test
    void givenCommaFilesWithHeaderAndRowNames_whenLoaded_thenUpperTriangleRowMajorWithNamedEdges() {
        View v = ViewLoader.matrices("thick", pattern("comma-named"), IDS, true, 0.0);
        assertTrue(v.isGraph());
        assertEquals(4, v.regions());
        assertEquals(List.of("frontA~parB", "frontA~tempC", "frontA~occD", "parB~tempC", "parB~occD", "tempC~occD"),
                v.baseNames());
        assertArrayEquals(single(0.1, 0.2, 0.3, 0.4, 0.5, 0.6), v.base("007"), 0.0);
        assertArrayEquals(single(0.9, 0.8, 0.7, 0.6, 0.5, 0.4), v.base("s2"), 0.0);
        assertEquals(List.of("007", "s2"), List.copyOf(v.subjects()));
        assertFalse(v.has("s3"));
    }

    @Test
    void givenWhitespaceFilesWithoutNames_whenLoaded_thenDefaultRegionNamesAndDiagonalIgnored() {
        View v = ViewLoader.matrices("thick", pattern("whitespace-plain"), IDS, true, 0.0);
        assertEquals(List.of("R1~R2", "R1~R3", "R1~R4", "R2~R3", "R2~R4", "R3~R4"), v.baseNames());
        assertArrayEquals(single(1, 2, 3, 4, 5, 6), v.base("007"), 0.0);
        assertArrayEquals(single(-0.15, 2, 2.5, 3, 1, 4), v.base("s2"), 0.0);
    }

    @Test
    void givenNamesOnlyInHeaderOrOnlyInFirstColumn_whenLoaded_thenNamesTaken() {
        List<String> one = List.of("007");
        View h = ViewLoader.matrices("v", pattern("header-only"), one, false, 0.0);
        View l = ViewLoader.matrices("v", pattern("labels-only"), one, false, 0.0);
        assertEquals(List.of("a~b", "a~c", "b~c"), h.baseNames());
        assertEquals(h.baseNames(), l.baseNames());
        assertArrayEquals(single(1, 2, 3), l.base("007"), 0.0);
    }

    @Test
    void givenAsymmetryWithinTolerance_whenLoaded_thenAcceptedAndUpperValueKept() {
        write(dir, "007.csv", "0,1.0005\n1,0\n");
        View v = ViewLoader.matrices("v", dir.resolve("{subject}.csv"), List.of("007"), false, 1e-3);
        assertArrayEquals(single(1.0005), v.base("007"), 0.0);
    }

    @Test
    void givenAsymmetricMatrix_whenLoaded_thenMessageNamesCellAndBothValues() {
        expectBadInput(() -> load(M3, "a,b,c\n0,1,2\n1,0,3\n2,3.5,0\n"), "subject s2", "s2.csv",
                "not symmetric", "cell (2,3)", "is 3.0", "cell (3,2)", "is 3.5", "b~c");
    }

    @Test
    void givenNonSquareMatrix_whenLoaded_thenRejected() {
        expectBadInput(() -> load(M3, "0,1,2\n1,0,3\n"), "subject s2", "s2.csv", "not square", "2 rows of 3");
    }

    @Test
    void givenRaggedRow_whenLoaded_thenMessageNamesLine() {
        expectBadInput(() -> load(M3, "0,1,2\n1,0\n2,3,0\n"), "subject s2", "line 2", "same length");
    }

    @Test
    void givenNaNOffDiagonal_whenLoaded_thenMessageNamesFileLineAndColumn() {
        expectBadInput(() -> load(M3, "0,1,2\n1,0,NaN\n2,3,0\n"), "subject s2", "s2.csv", "line 2", "column 3",
                "finite");
        expectBadInput(() -> load(M3, "0 1 2\n1 0 3\n2 Inf 0\n"), "subject s2", "line 3", "column 2", "finite");
    }

    @Test
    void givenNonNumericOrEmptyCell_whenLoaded_thenMessageNamesLineAndColumn() {
        expectBadInput(() -> load(M3, "0,1,2\n1,0,3\n2,x3,0\n"), "s2.csv", "line 3", "column 2", "'x3'");
        expectBadInput(() -> load(M3, "0,1,2\n1,0,\n2,3,0\n"), "s2.csv", "line 2", "column 3", "empty");
        expectBadInput(() -> load(M3, "r,0,1,2\ns,1,0,3\nt,2,3,0x1p1\n"), "s2.csv", "line 3", "column 4");
    }

    @Test
    void givenSizeDifferingFromFirstSubject_whenLoaded_thenBothSubjectsNamed() {
        expectBadInput(() -> load(M3, "0,1\n1,0\n"), "subject s2", "2 regions", "subject 007", "has 3");
    }

    @Test
    void givenRegionNamesDifferingBetweenSubjects_whenLoaded_thenPositionAndBothNamesGiven() {
        expectBadInput(() -> load("a,b,c\n" + M3, "a,B,c\n" + M3), "subject s2", "region 2", "'B'", "'b'",
                "subject 007");
    }

    @Test
    void givenRowAndColumnNamesDisagreeOrRepeat_whenLoaded_thenRejected() {
        expectBadInput(() -> load("x,a,b,c\na,0,1,2\nb,1,0,3\nd,2,3,0\n", M3), "subject 007", "position 3", "'d'");
        expectBadInput(() -> load("a,b,a\n" + M3, M3), "subject 007", "'a'", "twice");
        expectBadInput(() -> load("a,b\n" + M3, M3), "subject 007", "line 1", "2 names", "3 columns");
    }

    @Test
    void givenMissingFileWhenNotAllowed_whenLoaded_thenSubjectAndExpectedPathNamed() {
        write(dir, "007.csv", M3);
        Path p = dir.resolve("{subject}.csv");
        expectBadInput(() -> ViewLoader.matrices("area", p, List.of("007", "s2"), false, 0.0), "view area",
                "subject s2", dir.resolve("s2.csv").toString());
        View v = ViewLoader.matrices("area", p, List.of("007", "s2"), true, 0.0);
        assertEquals(List.of("007"), List.copyOf(v.subjects()));
    }

    @Test
    void givenNoFilesOrNoPlaceholderOrEmptyFile_whenLoaded_thenRejected() {
        Path p = dir.resolve("{subject}.csv");
        expectBadInput(() -> ViewLoader.matrices("area", p, List.of("a"), true, 0.0), "view area", "no matrix file");
        expectBadInput(() -> ViewLoader.matrices("area", dir.resolve("x.csv"), List.of("a"), true, 0.0),
                "{subject}");
        expectBadInput(() -> load(M3, "\n"), "subject s2", "empty");
        expectBadInput(() -> load(M3, "a,b,c\n"), "subject s2", "only a header");
    }

    /** The values as a view holds them: rounded to single precision (see View). */
    static double[] single(double... values) {
        double[] out = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            out[i] = (float) values[i];
        }
        return out;
    }
}
