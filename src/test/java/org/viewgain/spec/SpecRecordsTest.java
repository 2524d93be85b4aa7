package org.viewgain.spec;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The spec records check their own values, in positive form so that NaN fails: a backstop behind the loader, which
 * reports a bad value with its key and line and then uses the default (so a loaded spec never reaches these).
 */
class SpecRecordsTest {

    static Specs.Significance significance(double alpha, double rope, double confidence) {
        return new Specs.Significance(0, 0, Specs.Metric.BALANCED_ACCURACY, alpha, List.of(), Specs.Adjustment.NONE, rope, 100, confidence);
    }

    @Test
    void givenValuesOutOfRangeOrNaN_whenRecordsAreMade_thenRefused() {
        assertDoesNotThrow(() -> significance(0.05, 0.01, 0.95));
        assertThrows(IllegalArgumentException.class, () -> significance(Double.NaN, 0.01, 0.95));
        assertThrows(IllegalArgumentException.class, () -> significance(0.05, Double.NaN, 0.95));
        assertThrows(IllegalArgumentException.class, () -> significance(0.05, 0.01, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> significance(0.05, 0.01, 1.0));
        assertThrows(IllegalArgumentException.class, () -> new Specs.Significance(-1, 0, Specs.Metric.AUC, 0.05, List.of(),
                Specs.Adjustment.NONE, 0.01, 100, 0.95));

        assertDoesNotThrow(() -> new Specs.Validation(Specs.Scheme.STRATIFIED_K_FOLD, 5, 1, 3, Specs.Metric.AUC));
        assertThrows(IllegalArgumentException.class,
                () -> new Specs.Validation(Specs.Scheme.STRATIFIED_K_FOLD, 1, 1, 3, Specs.Metric.AUC));
        assertThrows(IllegalArgumentException.class,
                () -> new Specs.Validation(Specs.Scheme.STRATIFIED_K_FOLD, 5, 0, 3, Specs.Metric.AUC));
        assertThrows(IllegalArgumentException.class,
                () -> new Specs.Validation(Specs.Scheme.STRATIFIED_K_FOLD, 5, 1, 1, Specs.Metric.AUC));
        assertThrows(IllegalArgumentException.class, () -> new Specs.Validation(null, 5, 1, 3, Specs.Metric.AUC));

        assertThrows(IllegalArgumentException.class, () -> new Specs.Selection("t-test", List.of()));
        assertThrows(IllegalArgumentException.class, () -> new Specs.Selection("t-test", List.of(5, 0)));

        Path p = Path.of("s.csv");
        assertThrows(IllegalArgumentException.class, () -> new Specs.Cohort(p, "id", "group", List.of("a", "b"), "b",
                null, List.of(), Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> new Specs.View("source", Specs.Layout.TABLE, p, null,
                false, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> new Specs.View("source", Specs.Layout.TABLE, p, null,
                false, -1e-6));
    }
}
