package org.viewgain.classify;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;

class WekaClassifierTest {

    private static final ReferenceTable IRIS = ReferenceTable.load("iris.csv");
    private static final ReferenceTable CANCER = ReferenceTable.load("breast-cancer-wisconsin.csv");

    private static String oneLineError(Executable action) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, action);
        assertTrue(!e.getMessage().isBlank() && !e.getMessage().contains("\n"), e.getMessage());
        return e.getMessage();
    }

    @Test
    void givenSameFolds_whenWekaAndSmileForestsCrossValidated_thenAccuraciesAgreeWithinFivePoints() {
        // Two implementations of Breiman's forest should agree within a few points (common practice, no source);
        // features per split matched: sqrt(p) rounded down, 2 for iris and 5 for WDBC.
        ClassifierMethod smile = ClassifierRegistry.create("random-forest");
        for (ReferenceTable table : new ReferenceTable[] {IRIS, CANCER}) {
            int mtry = (int) Math.floor(Math.sqrt(table.rows().p()));
            ClassifierMethod weka = ClassifierRegistry.create("weka", WekaClassifier.settings("weka.classifiers.trees.RandomForest", "-I 100 -K " + mtry));
            double a = Crossval.accuracy(smile, smile.resolve(Map.of("trees", 100)), table, 5, 21);
            double b = Crossval.accuracy(weka, weka.resolve(Map.of()), table, 5, 21);
            assertEquals(a, b, 0.05, "smile " + a + " weka " + b);
            assertTrue(b > 0.9, "weka accuracy " + b);
        }
    }

    @Test
    void givenGridFlag_whenResolved_thenItReplacesTheBaseOption() throws Exception {
        WekaClassifier weka = new WekaClassifier("weka.classifiers.functions.Logistic", "-R 1.0E-8 -M 50");
        String[] opts = weka.options(weka.resolve(Map.of("-R", 0.5)));
        assertArrayEquals(new String[] {"-R", "0.5", "-M", "50"}, opts);
    }

    @Test
    void givenWrongClassName_whenCreating_thenOneLineMessageNamesIt() {
        String m = oneLineError(() -> ClassifierRegistry.create("weka", WekaClassifier.settings("weka.classifiers.trees.NoSuchForest", null)));
        assertTrue(m.contains("NoSuchForest") && m.contains("does not exist"), m);
    }

    @Test
    void givenClassThatIsNotAClassifier_whenCreating_thenOneLineMessage() {
        String m = oneLineError(() -> ClassifierRegistry.create("weka", WekaClassifier.settings("weka.core.Instances", null)));
        assertTrue(m.contains("not a Weka classifier"), m);
    }

    @Test
    void givenBadBaseOption_whenCreating_thenOneLineMessage() {
        String m = oneLineError(() -> ClassifierRegistry.create("weka", WekaClassifier.settings("weka.classifiers.trees.RandomForest", "-I many")));
        assertTrue(m.contains("rejects"), m);
    }

    @Test
    void givenUnknownFlagInGrid_whenResolving_thenOneLineMessage() {
        ClassifierMethod weka = ClassifierRegistry.create("weka", WekaClassifier.settings("weka.classifiers.functions.Logistic", null));
        String m = oneLineError(() -> weka.resolve(Map.of("-Q", 3)));
        assertTrue(m.contains("-Q"), m);
    }

    @Test
    void givenKeyWithoutDash_whenResolving_thenOneLineMessage() {
        ClassifierMethod weka = ClassifierRegistry.create("weka", WekaClassifier.settings("weka.classifiers.functions.Logistic", null));
        String m = oneLineError(() -> weka.resolve(Map.of("ridge", 1.0)));
        assertTrue(m.contains("'-'"), m);
    }

    @Test
    void givenWekaClassForAnotherMethod_whenCreating_thenOneLineMessage() {
        oneLineError(() -> ClassifierRegistry.create("knn", WekaClassifier.settings("weka.classifiers.functions.Logistic", null)));
    }
}
