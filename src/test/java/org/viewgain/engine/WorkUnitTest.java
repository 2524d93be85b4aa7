package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Work units and their journal keys: the same text as before the units were typed, and read back exactly. */
class WorkUnitTest {

    @Test
    void givenEveryKindOfUnit_whenKeyedAndParsed_thenTheSameUnitAndTheJournalsSpelling() {
        List<WorkUnit> units = List.of(WorkUnit.Imputation.of(3, 1), WorkUnit.Classifier.of(12, 7),
                new WorkUnit.Imputation(2, 3, 1), new WorkUnit.Classifier(0, 4, 9), new WorkUnit.Final(5),
                new WorkUnit.Permutation(7, 198));
        List<String> keys = List.of("i/3/1", "c/12/7", "ai/2/3/1", "ac/0/4/9", "f/5", "p/7/198");
        for (int i = 0; i < units.size(); i++) {
            assertEquals(keys.get(i), units.get(i).key());
            assertEquals(units.get(i), WorkUnit.parse(keys.get(i)));
        }
        assertTrue(units.get(2).curve() && units.get(3).curve() && !units.get(0).curve() && !units.get(4).curve());
    }

    @Test
    void givenTextThatNamesNoUnit_whenParsed_thenRefused() {
        for (String bad : List.of("", "c/1", "c/1/2/3/4", "x/1/2", "c/01/2", "p/a/1", "f/", "header", "c/1/-", "c/-1/2",
                "ai/-2/1/1")) {
            assertThrows(IllegalArgumentException.class, () -> WorkUnit.parse(bad), bad);
        }
    }
}
