package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ImputerRegistryTest {

    @Test
    void givenEveryListedMethod_whenLookedUp_thenImputerOfThatName() {
        assertTrue(ImputerRegistry.methods().contains("mean"));
        for (String m : ImputerRegistry.methods()) {
            assertEquals(m, ImputerRegistry.byMethod(m).method());
        }
    }

    @Test
    void givenUnknownMethod_whenLookedUp_thenMessageNamesItAndListsTheKnownOnes() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ImputerRegistry.byMethod("rigde"));
        assertTrue(e.getMessage().contains("'rigde'"));
        assertTrue(e.getMessage().contains("expected one of"));
        assertTrue(e.getMessage().contains("nearest-neighbours"));
    }
}
