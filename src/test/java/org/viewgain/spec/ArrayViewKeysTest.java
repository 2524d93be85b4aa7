package org.viewgain.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The view keys for binary arrays: stacked, subject-order, subject-axis, variable and labels (README, "The spec"). */
class ArrayViewKeysTest {
    private static final Path FILE = SpecLoaderTest.FILE;

    private static String withViews(String views) {
        return SpecLoaderTest.GOOD.replace("""
                  source: { matrices: "views/a/{subject}.csv" }
                  target: { table: b.csv, missing: allowed }
                """, views);
    }

    private static String problems(String views) {
        return assertThrows(BadInputException.class, () -> SpecLoader.parse(withViews(views), FILE)).getMessage();
    }

    @Test
    void givenStackedAndMatViews_whenParsed_thenPathsResolvedAndOptionsKept() {
        ExperimentSpec s = SpecLoader.parse(withViews("""
                  source: { stacked: all/thick.mat, variable: thickness, subject-order: all/order.txt, subject-axis: last, labels: all/regions.txt }
                  target: { matrices: "views/b/{subject}.npy", missing: allowed, labels: all/regions.txt }
                """), FILE);
        assertEquals(Specs.Layout.STACKED, s.source().layout());
        assertEquals(Path.of("/data/specs/all/thick.mat"), s.source().location());
        assertEquals("thickness", s.source().variable());
        assertEquals(Path.of("/data/specs/all/order.txt"), s.source().subjectOrder());
        assertTrue(s.source().subjectAxisLast());
        assertEquals(List.of(Path.of("/data/specs/all/thick.mat"), Path.of("/data/specs/all/order.txt"),
                Path.of("/data/specs/all/regions.txt")), s.source().sharedFiles(), "hashed into run.json");
        assertEquals(Specs.Layout.MATRICES, s.target().layout());
        assertEquals(Path.of("/data/specs/all/regions.txt"), s.target().labels());
    }

    @Test
    void givenMisplacedArrayKeys_whenParsed_thenEachNamedWithItsLine() {
        String m = problems("""
                  source: { stacked: all/thick.npy, variable: x, subject-axis: middle }
                  target: { table: b.csv, labels: r.txt, subject-order: o.txt, colour: red }
                """);
        assertTrue(m.contains("exp.yaml:8: views.source.subject-order: missing"), m);
        assertTrue(m.contains("views.source.variable: only for MATLAB files (.mat)"), m);
        assertTrue(m.contains("views.source.subject-axis: 'middle' is not allowed; expected one of first, last"), m);
        assertTrue(m.contains("exp.yaml:9: views.target.labels: only for 'matrices' or 'stacked' views"), m);
        assertTrue(m.contains("views.target.subject-order: only for a 'stacked' view"), m);
        assertTrue(m.contains("views.target.colour: unknown key"), m); // unknown keys stay errors
    }

    @Test
    void givenTwoLayoutsOrAStackedCsv_whenParsed_thenRefused() {
        assertTrue(problems("""
                  source: { stacked: all.npy, matrices: "a/{subject}.csv", subject-order: o.txt }
                """).contains("views.source: give exactly one of 'matrices'"), "two layouts");
        assertTrue(problems("""
                  source: { stacked: all.csv, subject-order: o.txt }
                """).contains("views.source.stacked: 'all.csv': a stacked view is a .npy or .mat file"));
    }
}
