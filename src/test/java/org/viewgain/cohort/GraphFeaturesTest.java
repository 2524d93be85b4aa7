package org.viewgain.cohort;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.viewgain.cohort.TestFiles.expectBadInput;

class GraphFeaturesTest {
    // Edges of a 4-region graph, upper triangle row-major: (1,2)=1 (1,3)=2 (1,4)=3 (2,3)=4 (2,4)=5 (3,4)=6.
    private static final double[] UPPER = {1, 2, 3, 4, 5, 6};

    private static View graph() {
        Map<String, double[]> m = new LinkedHashMap<>();
        m.put("a", UPPER);
        return View.graph("g", List.of("fA", "pB", "tC", "oD"), m);
    }

    private static View table() {
        Map<String, double[]> m = new LinkedHashMap<>();
        m.put("a", new double[] {7, 8});
        return View.tabular("t", List.of("x", "y"), m);
    }

    @Test
    void givenUpperTriangle_whenStrength_thenRowSumsOfTheMatrix() {
        // Hand computation from the definition s_i = sum_j w_ij (Barrat et al. 2004, PNAS 101:3747), exact:
        // s1 = 1+2+3, s2 = 1+4+5, s3 = 2+4+6, s4 = 3+5+6.
        assertArrayEquals(new double[] {6, 10, 12, 14}, GraphFeatures.strength(UPPER, 4), 0.0);
    }

    @Test
    void givenUpperTriangle_whenToMatrix_thenSymmetricWithZeroDiagonal() {
        double[][] m = GraphFeatures.toMatrix(UPPER, 4);
        assertArrayEquals(new double[] {0, 1, 2, 3}, m[0], 0.0);
        assertArrayEquals(new double[] {1, 0, 4, 5}, m[1], 0.0);
        assertArrayEquals(new double[] {2, 4, 0, 6}, m[2], 0.0);
        assertArrayEquals(new double[] {3, 5, 6, 0}, m[3], 0.0);
    }

    @Test
    void givenWrongLength_whenStrength_thenIllegalArgument() {
        assertThrows(IllegalArgumentException.class, () -> GraphFeatures.strength(UPPER, 5));
        assertEquals(276, GraphFeatures.edgeCount(24));
    }

    @Test
    void givenEdgesThenStrength_whenExtracted_thenConcatenatedInListOrderWithNames() {
        View v = graph();
        List<String> names = Extractors.names(List.of("strength", "edges"), v);
        assertEquals(List.of("strength:fA", "strength:pB", "strength:tC", "strength:oD", "fA~pB", "fA~tC", "fA~oD",
                "pB~tC", "pB~oD", "tC~oD"), names);
        double[] f = Extractors.apply(List.of("strength", "edges"), v, v.base("a"));
        assertArrayEquals(new double[] {6, 10, 12, 14, 1, 2, 3, 4, 5, 6}, f, 0.0);
    }

    @Test
    void givenImputedVector_whenStrengthExtracted_thenSameRuleAsObserved() {
        double[] imputed = {0.5, 0.5, 0.5, 0.5, 0.5, 0.5};
        assertArrayEquals(new double[] {1.5, 1.5, 1.5, 1.5}, Extractors.apply(List.of("strength"), graph(), imputed),
                0.0);
    }

    @Test
    void givenTabularView_whenEdgesExtracted_thenColumnsPassThrough() {
        View t = table();
        assertEquals(List.of("x", "y"), Extractors.names(List.of("edges"), t));
        assertArrayEquals(new double[] {7, 8}, Extractors.apply(List.of("edges"), t, t.base("a")), 0.0);
    }

    @Test
    void givenBadExtractorLists_whenChecked_thenMessagesSayWhatIsAllowed() {
        expectBadInput(() -> Extractors.names(List.of("strength"), table()), "view t", "strength", "graph");
        expectBadInput(() -> Extractors.names(List.of("degree"), graph()), "'degree'", "[edges, strength]");
        expectBadInput(() -> Extractors.names(List.of("edges", "edges"), graph()), "twice");
        expectBadInput(() -> Extractors.names(List.of(), graph()), "no extractors");
    }

    @Test
    void givenView_whenBaseRead_thenCopyReturnedAndUnknownSubjectRejected() {
        View v = graph();
        v.base("a")[0] = 99;
        assertEquals(1.0, v.base("a")[0], 0.0);
        assertThrows(IllegalArgumentException.class, () -> v.base("zz"));
        assertThrows(IllegalArgumentException.class, () -> Extractors.apply(List.of("edges"), v, new double[3]));
    }
}
