package org.viewgain.folds;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class SeedsTest {
    @Test
    void givenSameCoordinates_whenDerived_thenSameSeed_andAnyChangeGivesAnother() {
        long a = Seeds.derive(2026, "fold", 1, 2);
        assertEquals(a, Seeds.derive(2026, "fold", 1, 2));
        assertNotEquals(a, Seeds.derive(2026, "fold", 2, 1));
        assertNotEquals(a, Seeds.derive(2027, "fold", 1, 2));
        assertTrue(Seeds.toInt(a) >= 0);
    }
}
