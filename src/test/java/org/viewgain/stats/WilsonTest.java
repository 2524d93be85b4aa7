package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class WilsonTest {
    // Newcombe 1998, Table I (published to 4 decimals): tolerance half a unit in the last digit
    private static final double TOL = 5e-5;

    @ParameterizedTest
    @CsvSource({"81, 263, 0.2553, 0.3662", "15, 148, 0.0624, 0.1605", "0, 20, 0.0000, 0.1611",
            "1, 29, 0.0061, 0.1718", "29, 29, 0.8830, 1.0000"})
    void givenNewcombeCases_whenWilsonScore_thenPublishedLimits(long x, long n, double low, double high) {
        Interval ci = Wilson.interval(x, n, 0.95);
        assertEquals(low, ci.low(), TOL);
        assertEquals(high, ci.high(), TOL);
    }

    @ParameterizedTest
    @CsvSource({"81, 263, 0.2535, 0.3682", "15, 148, 0.0598, 0.1644", "0, 20, 0.0000, 0.2005",
            "1, 29, 0.0018, 0.1963"})
    void givenNewcombeCases_whenContinuityCorrected_thenPublishedLimits(long x, long n, double low, double high) {
        Interval ci = Wilson.continuityCorrected(x, n, 0.95);
        assertEquals(low, ci.low(), TOL);
        assertEquals(high, ci.high(), TOL);
    }

    @Test
    void givenNoTrialsOrBadCounts_whenInterval_thenUndefinedOrError() {
        assertFalse(Wilson.interval(0, 0, 0.95).isDefined());
        assertThrows(IllegalArgumentException.class, () -> Wilson.interval(5, 4, 0.95));
        assertThrows(IllegalArgumentException.class, () -> Wilson.interval(1, 4, 1.0));
        assertThrows(IllegalArgumentException.class, () -> Wilson.continuityCorrected(1, 4, Double.NaN));
    }
}
