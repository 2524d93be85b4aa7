package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;

class SmileForestTest {

    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv");
    private final ClassifierMethod forest = ClassifierRegistry.create("smile-random-forest");

    @Test
    void givenIris_whenFiveFoldCrossValidated_thenAccuracyAbove90Percent() {
        // Iris is close to separable; forests reach about 0.95 (common practice, no source).
        double accuracy = Crossval.accuracy(forest, forest.resolve(Map.of("trees", 100)), IRIS, 5, 11);
        assertTrue(accuracy > 0.9, "accuracy " + accuracy);
    }

    @Test
    void givenUnknownParameter_whenResolving_thenMessageListsAllowed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> forest.resolve(Map.of("mtry", 3)));
        assertTrue(e.getMessage().contains("features-per-split"), e.getMessage());
    }

    @Test
    void givenUnknownMethod_whenCreating_thenOneLineMessageListsMethods() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> ClassifierRegistry.create("forest"));
        assertTrue(e.getMessage().contains("random-forest") && !e.getMessage().contains("\n"), e.getMessage());
    }
}
