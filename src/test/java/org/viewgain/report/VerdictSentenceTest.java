package org.viewgain.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The one-sentence answer ({@link Verdict}) on a fixture run whose comparisons.csv plants a known outcome
 * (ReportFixtures: A = B + 0.05 for both classifiers; the forest's corrected t-test adjusted p = 0.00084, the SVM's
 * 0.371), so every clause can be checked against what was planted.
 */
class VerdictSentenceTest {
    @TempDir
    static Path dir;
    static Path run;

    @BeforeAll
    static void fixture() throws IOException {
        run = ReportFixtures.run(dir.resolve("cohort"));
    }

    @Test
    void givenOneWinAndNoPermutations_whenSummarised_thenTheWinWithItsNumbersAndChanceNotTested() throws IOException {
        Path r = ReportFixtures.copy(run, dir.resolve("a"));
        ReportFixtures.comparisons(r);
        String v = Verdict.of(r);
        // the planted difference, its unadjusted interval (difference -0.081 / +0.0794) and the adjusted p
        assertTrue(v.startsWith("source+imputed beat source in 1 of 2 comparisons at level 0.05 after holm "
                + "adjustment (forest, ridge imputer: +0.050 balanced accuracy, unadjusted 95% interval -0.031 to "
                + "+0.129, adjusted p = 8.4e-04)"), v);
        assertTrue(v.endsWith("chance not tested (significance.permutations: 0)."), v);
    }

    @Test
    void givenPermutations_whenSummarised_thenHowManyPipelinesBeatChance() throws IOException {
        Path r = ReportFixtures.copy(run, dir.resolve("b"));
        ReportFixtures.comparisons(r);
        ReportFixtures.optionalTables(r);
        // permutations.csv of the fixture: ridge source+imputed forest p = 0.01, none source forest p = 0.317
        assertTrue(Verdict.of(r).endsWith("1 of 2 pipelines beat chance (permutation p \u2264 0.05 on balanced "
                + "accuracy, unadjusted)."), Verdict.of(r));
    }

    @Test
    void givenNoWinOnAFewResamplePlan_whenSummarised_thenNotEvidenceOfNoDifference() throws IOException {
        Path r = ReportFixtures.copy(run, dir.resolve("c"));
        ReportFixtures.comparisons(r);
        // every p-value made large: nothing is significant
        String text = Files.readString(r.resolve("comparisons.csv")).replace(",holm,", ",none,");
        StringBuilder out = new StringBuilder();
        for (String line : text.split("\n")) {
            String[] c = line.split(",", -1);
            if (!c[0].equals("comparison") && !c[17].isEmpty()) {
                c[17] = "0.5";
                c[18] = "0.5";
            }
            out.append(String.join(",", c)).append('\n');
        }
        Files.writeString(r.resolve("comparisons.csv"), out);
        String v = Verdict.of(r);
        // the fixture's plan is 3 folds x 2 repeats, below the 10 x 10 of Bouckaert & Frank (2004)
        assertEquals("source+imputed did not beat source in any of the 2 comparisons at level 0.05 (not evidence of "
                + "no difference: 3 folds x 2 repeats leave the corrected t-test little power); chance not tested "
                + "(significance.permutations: 0).", v);
    }

    @Test
    void givenTheReport_whenWritten_thenItOpensWithTheSentence() throws IOException {
        Path r = ReportFixtures.copy(run, dir.resolve("d"));
        ReportFixtures.comparisons(r);
        HtmlReport.write(r, false);
        String html = Files.readString(r.resolve("report.html"));
        int at = html.indexOf("id=\"verdict\"");
        assertTrue(at > 0 && at < html.indexOf("id=\"verdict-basis\""), "the sentence comes first in the answer");
        assertTrue(html.contains("source+imputed beat source in 1 of 2 comparisons"));
        // every interval shown says its level and that it is unadjusted
        assertTrue(html.contains("<th>95% interval (unadjusted)</th>"));
        assertTrue(html.contains("(unadjusted 95% interval -0.031 to +0.129); adjusted p"), "sentence interval");
    }
}
