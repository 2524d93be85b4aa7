package org.viewgain.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

/** The one-line messages for a parameter outside its range say the range in words (no "from 4.9E-324 to any"). */
class ParamDefTest {
    private static String message(ParamDef def, Object value) {
        return assertThrows(IllegalArgumentException.class, () -> def.coerce(value)).getMessage();
    }

    @Test
    void givenValuesOutsideTheirRanges_whenCoerced_thenTheRangeIsSaidInWords() {
        assertEquals("expected a number of at least 1.0E-12",
                message(ParamDef.number("alpha", 1e-12, Double.MAX_VALUE, 1.0, "penalty"), -5));
        assertEquals("expected a number above 0",
                message(ParamDef.number("C", Double.MIN_VALUE, Double.MAX_VALUE, 1.0, "penalty"), 0));
        assertEquals("expected a number above 0 and at most 1",
                message(ParamDef.number("tolerance", Double.MIN_VALUE, 1, 0.1, "tolerance"), 2));
        assertEquals("expected a whole number from 1 to 100000",
                message(ParamDef.integer("trees", 1, 100_000, 500, "trees"), 0));
        assertEquals("expected a whole number of at least 1",
                message(ParamDef.integer("k", 1, Integer.MAX_VALUE, 5, "neighbours"), 0.5));
    }
}
