package org.viewgain.spec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

class SpecLoaderTest {
    static final Path FILE = Path.of("/data/specs/exp.yaml");

    static final String GOOD = """
            experiment: t1
            seed: 7
            cohort:
              subjects: ../cohort/subjects.csv
              groups: [control, patient]
              positive: patient
            views:
              source: { matrices: "views/a/{subject}.csv" }
              target: { table: b.csv, missing: allowed }
            imputers:
              - { name: r, method: ridge, grid: { alpha: [1, 10] } }
            feature-sets: [source, source+imputed]
            classifiers:
              - { name: f, method: random-forest, fixed: { trees: 10 }, grid: { features-per-split: [sqrt, 0.2] } }
            validation:
              outer: { folds: 4, repeats: 2 }
              inner: { folds: 2 }
            """;

    private static BadInputException bad(String text) {
        return assertThrows(BadInputException.class, () -> SpecLoader.parse(text, FILE));
    }

    @Test
    void givenGoodSpec_whenParsed_thenValuesAndPathsResolvedAgainstSpecFolder() {
        ExperimentSpec s = SpecLoader.parse(GOOD, FILE);
        assertEquals("t1", s.experiment());
        assertEquals(7L, s.seed());
        assertEquals(Path.of("/data/cohort/subjects.csv"), s.cohort().subjects());
        assertEquals(Path.of("/data/specs/views/a/{subject}.csv"), s.source().location());
        assertEquals(Specs.Layout.TABLE, s.target().layout());
        assertTrue(s.target().missingAllowed());
        assertFalse(s.source().missingAllowed());
        assertEquals(List.of(FeatureSet.SOURCE, FeatureSet.SOURCE_IMPUTED), s.featureSets());
        assertEquals(List.of(1, 10), s.imputers().get(0).grid().get("alpha"));
        assertEquals(4, s.validation().folds());
        assertEquals(2, s.validation().innerFolds());
        assertEquals(1, s.cohort().positiveIndex());
        assertEquals(Specs.TrainingImputation.CROSS_FITTED, s.imputedForTraining());
    }

    @Test
    void givenMisspelledKey_whenParsed_thenErrorNamesKeyLineAndAllowedKeys() {
        BadInputException e = bad(GOOD.replace("classifiers:", "clasifiers:"));
        assertTrue(e.getMessage().contains("exp.yaml:13: clasifiers: unknown key; did you mean 'classifiers'?"), e.getMessage());
        assertEquals(1, e.getMessage().lines().count(), "the missing 'classifiers' is not reported again");
    }

    @Test
    void givenSeveralProblems_whenParsed_thenAllAreReportedTogetherWithLines() {
        String text = GOOD.replace("folds: 4", "folds: four").replace("[source, source+imputed]", "[source, both]")
                .replace("{ name: f,", "{ name: f, colour: red,");
        BadInputException e = bad(text);
        String m = e.getMessage();
        assertTrue(m.startsWith("3 problems in the spec"), m);
        assertTrue(m.contains("exp.yaml:16: validation.outer.folds: expected a whole number from 2 to 1000, found 'four'"), m);
        assertTrue(m.contains("exp.yaml:12: feature-sets[1]: 'both' is not a feature set; expected one of source,"), m);
        assertTrue(m.contains("classifiers[0].colour: unknown key"), m);
    }

    @Test
    void givenSiteIdOrCovariateEqualToTheGroupColumn_whenParsed_thenRefusedNamingTheKey() {
        String cohort = "  positive: patient\n";
        BadInputException site = bad(GOOD.replace(cohort, cohort + "  site: group\n"));
        assertTrue(site.getMessage().contains("cohort.site: 'group' is also cohort.group"), site.getMessage());
        BadInputException id = bad(GOOD.replace(cohort, cohort + "  id: diagnosis\n  group: diagnosis\n"));
        assertTrue(id.getMessage().contains("cohort.id: 'diagnosis' is also cohort.group"), id.getMessage());
        BadInputException cov = bad(GOOD.replace(cohort, cohort + "  covariates: [age, group]\n"));
        assertTrue(cov.getMessage().contains("cohort.covariates: 'group' is cohort.group"), cov.getMessage());
        // a different column is fine
        SpecLoader.parse(GOOD.replace(cohort, cohort + "  site: scanner\n  covariates: [age]\n"), FILE);
    }

    @Test
    void givenFeatureSetNeedingTargetWithoutTargetView_whenParsed_thenError() {
        String text = GOOD.replace("  target: { table: b.csv, missing: allowed }\n", "");
        BadInputException e = bad(text);
        assertTrue(e.getMessage().contains("feature-sets[1]: 'source+imputed' needs a target view"), e.getMessage());
        assertTrue(e.getMessage().contains("imputers need a target view"), e.getMessage());
    }

    @Test
    void givenNoFeatureSetsAndNoTargetView_whenParsed_thenTheErrorSaysTheDefaultWasUsed() {
        String text = GOOD.replace("  target: { table: b.csv, missing: allowed }\n", "")
                .replaceAll("(?m)^feature-sets:.*\n", "");
        BadInputException e = bad(text);
        assertTrue(e.getMessage().contains("feature-sets (not given; the default is [source, source+imputed]): "
                + "'source+imputed' needs a target view"), e.getMessage());
    }

    @Test
    void givenBrokenYaml_whenParsed_thenOneLineWithLineNumber() {
        BadInputException e = bad("experiment: x\ncohort: [a, b\n");
        assertTrue(e.getMessage().startsWith("/data/specs/exp.yaml:"), e.getMessage());
        assertTrue(e.getMessage().contains("not valid YAML"), e.getMessage());
        assertEquals(1, e.getMessage().lines().count(), e.getMessage());
    }

    @Test
    void givenTabIndentedLine8_whenParsed_thenNamesTabsAndLine8() {
        // issue 16: this used to say only "exp.yaml:7: not valid YAML: while scanning for the next token"
        String text = GOOD.replace("  positive: patient\n", "  positive: patient\n\tsite: s\n");
        assertEquals("\tsite: s", text.lines().toList().get(6), "the tab is on line 7 of this text");
        String m = bad(text).getMessage();
        assertTrue(m.startsWith("/data/specs/exp.yaml:7: not valid YAML at column 1: a tab character;"), m);
        assertTrue(m.contains("spaces"), m);
    }

    @Test
    void givenUnclosedBracketOrMisindentedKey_whenParsed_thenParserProblemAndWhereItStarted() {
        String m = bad("experiment: x\ncohort: [a, b\n").getMessage();
        assertTrue(m.contains("expected ',' or ']', but got the end of the file"), m);
        assertTrue(m.contains("while parsing a flow sequence started on line 2"), m);
        m = bad("experiment: x\n  cohort: 1\n").getMessage();
        assertTrue(m.startsWith("/data/specs/exp.yaml:2: not valid YAML at column 9: mapping values are not"), m);
        assertTrue(m.contains("indentation"), m);
    }

    @Test
    void givenDuplicateKey_whenParsed_thenError() {
        BadInputException e = bad(GOOD.replace("seed: 7", "seed: 7\nseed: 8"));
        assertTrue(e.getMessage().contains("not valid YAML") && e.getMessage().contains("seed"), e.getMessage());
    }

    @Test
    void givenTwoGroupsWithoutPositive_whenParsed_thenErrorSaysWhichToName() {
        BadInputException e = bad(GOOD.replace("  positive: patient\n", ""));
        assertTrue(e.getMessage().contains("cohort.positive: missing"), e.getMessage());
    }

    @Test
    void givenPatternWithoutSubjectPlaceholder_whenParsed_thenError() {
        BadInputException e = bad(GOOD.replace("views/a/{subject}.csv", "views/a/all.csv"));
        assertTrue(e.getMessage().contains("views.source.matrices: the path pattern must contain {subject}"),
                e.getMessage());
    }

    @Test
    void givenStrengthOnTableView_whenParsed_thenError() {
        BadInputException e = bad(GOOD + "features: { extract: [edges, strength] }\n");
        assertTrue(e.getMessage().contains("features.extract[1]: 'strength' needs graph views"), e.getMessage());
    }

    @Test
    void givenLeaveSiteOutWithoutSiteColumn_whenParsed_thenError() {
        BadInputException e = bad(GOOD.replace("outer: { folds: 4, repeats: 2 }", "outer: { scheme: leave-site-out }"));
        assertTrue(e.getMessage().contains("leave-site-out needs cohort.site"), e.getMessage());
    }
}
