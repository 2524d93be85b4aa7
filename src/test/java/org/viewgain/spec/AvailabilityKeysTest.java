package org.viewgain.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** The {@code availability-curve} key: read as written, every mistake one line naming the key and its line. */
class AvailabilityKeysTest {
    private static ExperimentSpec parse(String curve) {
        return SpecLoader.parse(SpecLoaderTest.GOOD + curve, SpecLoaderTest.FILE);
    }

    private static String bad(String curve) {
        String m = assertThrows(BadInputException.class, () -> parse(curve)).getMessage();
        assertEquals(1, m.lines().count(), m);
        return m;
    }

    @Test
    void givenNoKey_whenParsed_thenNoCurve() {
        assertNull(parse("").availability());
    }

    @Test
    void givenFractions_whenParsed_thenLevelsMarginAndKeptCountsAsDocumented() {
        AvailabilityCurve c = parse("availability-curve: { fractions: [0.1, 0.25, 0.5, 1.0], margin: 0.05 }\n")
                .availability();
        assertTrue(c.byFraction());
        assertEquals(List.of(0.1, 0.25, 0.5, 1.0), c.fractions());
        assertEquals(0.05, c.margin());
        // the nearest whole number to f x available, halves up: 0.25 x 10 = 2.5 -> 3; 0.1 x 67 = 6.7 -> 7
        assertEquals(3, c.keep(1, 10));
        assertEquals(7, c.keep(0, 67));
        assertEquals(67, c.keep(3, 67));
        assertEquals("0.25", c.label(1));
        assertEquals("1", c.label(3));
    }

    @Test
    void givenCounts_whenParsed_thenCountsAndDefaultMargin() {
        AvailabilityCurve c = parse("availability-curve: { counts: [4, 8, 20] }\n").availability();
        assertFalse(c.byFraction());
        assertEquals(List.of(4, 8, 20), c.counts());
        assertEquals(AvailabilityCurve.DEFAULT_MARGIN, c.margin());
        assertEquals(8, c.keep(1, 30));
    }

    @Test
    void givenBadLevels_whenParsed_thenOneLineNamingKeyAndLine() {
        assertTrue(bad("availability-curve: { fractions: [0.5, 0.25] }\n")
                .contains("exp.yaml:18: availability-curve.fractions[1]: 0.25 does not exceed"));
        assertTrue(bad("availability-curve: { fractions: [0, 0.5] }\n")
                .contains("availability-curve.fractions[0]: expected a fraction in (0, 1]"));
        assertTrue(bad("availability-curve: { fractions: [0.5, 1.5] }\n")
                .contains("availability-curve.fractions[1]: expected a fraction in (0, 1]"));
        // inner folds are 2 in the spec: a count must be at least 4
        assertTrue(bad("availability-curve: { counts: [3, 10] }\n")
                .contains("availability-curve.counts[0]: expected a whole number of at least 4"));
        assertTrue(bad("availability-curve: { counts: [10, 10] }\n").contains("does not exceed the level before"));
        assertTrue(bad("availability-curve: { counts: [5.5] }\n").contains("counts[0]: expected a whole number"));
        assertTrue(bad("availability-curve: { counts: [10], fractions: [0.5] }\n").contains("not both"));
        assertTrue(bad("availability-curve: { margin: 0.1 }\n").contains("give either fractions"));
        assertTrue(bad("availability-curve: { fractions: [] }\n").contains("an empty list"));
        assertTrue(bad("availability-curve: { fractions: 0.5 }\n").contains("expected a list of levels"));
        assertTrue(bad("availability-curve: { fractions: [0.5], margin: 2 }\n")
                .contains("availability-curve.margin: expected a number"));
        assertTrue(bad("availability-curve: { fraction: [0.5] }\n").contains("did you mean 'fractions'"));
    }

    @Test
    void givenCurveWithoutSourceSet_whenParsed_thenRefusedNamingTheKey() {
        String m = assertThrows(BadInputException.class, () -> SpecLoader.parse(SpecLoaderTest.GOOD
                .replace("feature-sets: [source, source+imputed]", "feature-sets: [source+imputed]")
                + "availability-curve: { fractions: [0.5, 1] }\n", SpecLoaderTest.FILE)).getMessage();
        assertTrue(m.contains("availability-curve: the curve compares source+imputed with source"), m);
    }
}
