package org.viewgain.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The keys features.select, features.adjust, features.harmonize and cohort.duplicate-threshold. */
class FeatureStepsTest {
    static final Path FILE = Path.of("/data/specs/exp.yaml");

    static final String SPEC = """
            experiment: t1
            cohort:
              subjects: s.csv
              groups: %s
              positive: %s
              site: site
              covariates: [age, sex]
            views:
              source: { table: a.csv }
            features:
            %s
            feature-sets: [source]
            classifiers:
              - { name: f, method: knn }
            validation:
              outer: { %s }
            """;

    static String spec(String features) {
        return SPEC.formatted("[control, patient]", "patient", features, "folds: 4");
    }

    static String message(String text) {
        return assertThrows(BadInputException.class, () -> SpecLoader.parse(text, FILE)).getMessage();
    }

    @Test
    void givenAllSteps_whenParsed_thenValuesAndDefaults() {
        ExperimentSpec s = SpecLoader.parse(spec("""
                  select: { method: anova, keep: [100, 500] }
                  adjust: [age, sex]
                  harmonize: combat
                """), FILE);
        assertEquals(new Specs.Selection("anova", List.of(100, 500)), s.features().select());
        assertEquals(List.of("age", "sex"), s.features().adjust());
        assertEquals(Specs.Harmonization.COMBAT, s.features().harmonize());
        assertEquals(0.999, s.cohort().duplicateThreshold(), 0.0);
        ExperimentSpec plain = SpecLoader.parse(spec("  scale: none"), FILE);
        assertNull(plain.features().select());
        assertEquals(Specs.Harmonization.NONE, plain.features().harmonize());
        assertTrue(plain.features().adjust().isEmpty());
        ExperimentSpec one = SpecLoader.parse(spec("  select: { method: variance, keep: 7 }"), FILE);
        assertEquals(List.of(7), one.features().select().keep());
    }

    @Test
    void givenBadValues_whenParsed_thenEachProblemNamesItsKeyAndLine() {
        String m = message(spec("""
                  select: { method: chi2, keep: [0, 5, 5] }
                  adjust: [age, bmi, group]
                  harmonize: cobat
                """));
        assertTrue(m.contains("exp.yaml:11: features.select.method: 'chi2' is not allowed; expected one of t-test, "
                + "anova, variance"), m);
        assertTrue(m.contains("features.select.keep[0]: expected a whole number of at least 1, found '0'"), m);
        assertTrue(m.contains("features.select.keep[2]: 5 is listed twice"), m);
        assertTrue(m.contains("exp.yaml:12: features.adjust[1]: 'bmi' is not listed in cohort.covariates"), m);
        assertTrue(m.contains("features.adjust[2]: 'group' is the group column"), m);
        assertTrue(m.contains("exp.yaml:13: features.harmonize: 'cobat' is not allowed"), m);
    }

    @Test
    void givenThreeGroupsAndTTest_whenParsed_thenAskedToUseAnova() {
        String m = message(SPEC.formatted("[a, b, c]", "a", "  select: { method: t-test, keep: 10 }", "folds: 4"));
        assertTrue(m.contains("features.select.method: t-test compares two groups") && m.contains("use anova"), m);
    }

    @Test
    void givenCombatWithoutSiteOrWithLeaveSiteOut_whenParsed_thenRefused() {
        String noSite = message(spec("  harmonize: combat").replace("  site: site\n", ""));
        assertTrue(noSite.contains("features.harmonize: combat needs cohort.site"), noSite);
        String lso = message(SPEC.formatted("[control, patient]", "patient", "  harmonize: combat",
                "scheme: leave-site-out"));
        assertTrue(lso.contains("exp.yaml:11: features.harmonize: combat cannot be combined with leave-site-out"),
                lso);
    }

    @Test
    void givenADuplicateThreshold_whenParsed_thenReadAndRangeChecked() {
        String withThreshold = spec("  scale: none").replace("  site: site\n", "  site: site\n  duplicate-threshold: 0.99\n");
        assertEquals(0.99, SpecLoader.parse(withThreshold, FILE).cohort().duplicateThreshold(), 0.0);
        String m = message(withThreshold.replace("0.99", "1.5"));
        assertTrue(m.contains("cohort.duplicate-threshold: expected a number from 0.0 to 1.0, found '1.5'"), m);
    }

    @Test
    void givenSelectWithoutKeep_whenParsed_thenKeepIsRequired() {
        String m = message(spec("  select: { method: anova }"));
        assertTrue(m.contains("features.select.keep: missing"), m);
    }
}
