package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.report.CsvTable;
import org.viewgain.report.ResultTables;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * Imputation quality: skill against a mean imputer fitted on the same training subjects, per-feature absolute
 * errors, and the per-imputer summary and per-feature tables (checked against values worked out by hand).
 */
class ImputationQualityTablesTest {
    @TempDir
    Path dir;

    static final String BODY = """
            imputers:
              - { name: avg, method: mean }
              - { name: ridge, method: ridge, fixed: { alpha: 1 } }
            feature-sets: [source+imputed]
            classifiers:
              - { name: knn, method: knn, fixed: { k: 3 } }
            validation: { outer: { folds: 3, repeats: 1 }, inner: { folds: 2 } }
            """;

    Experiment experiment() {
        TestCohorts.synthetic(dir, 36, 4, 3, 0.0, 0.2, 3);
        return Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, BODY)));
    }

    @Test
    void givenMeanAndRidgeOnALinearTarget_whenOneFoldIsImputed_thenMeanSkillIsZeroAndRidgeSkillPositive() {
        Experiment ex = experiment();
        ImputationStage stage = new ImputationStage(ex);
        ImputedFold avg = stage.run(ex.imputer("avg"), 0, ex.plan(), 0, 1);
        ImputedFold ridge = stage.run(ex.imputer("ridge"), 0, ex.plan(), 0, 1);
        assertTrue(avg.quality().size() >= 5, "test subjects with a target: " + avg.quality().size());
        assertEquals(avg.quality().size(), ridge.quality().size());
        for (int t = 0; t < avg.quality().size(); t++) {
            ImputedFold.Quality a = avg.quality().get(t);
            ImputedFold.Quality r = ridge.quality().get(t);
            // the internal baseline is the same mean imputer on the same subjects: skill exactly 0
            assertEquals(0.0, a.skill(), 0.0);
            // skill = 1 - mae / mae_mean by definition (issue 4); 1e-12 is rounding
            assertEquals(1 - r.mae() / a.mae(), r.skill(), 1e-12);
        }
        // the per-feature error sums hold the same errors as the rows: sum over features / width = sum of row MAEs
        for (ImputedFold f : List.of(avg, ridge)) {
            assertEquals(3, f.edgeErrors().length);
            double rows = f.quality().stream().mapToDouble(ImputedFold.Quality::mae).sum();
            assertEquals(rows, (f.edgeErrors()[0] + f.edgeErrors()[1] + f.edgeErrors()[2]) / 3, 1e-12);
        }
        // target = linear map of 4 source columns + noise sd 0.3 (TestCohorts): ridge must beat the mean overall
        double skill = ridge.quality().stream().mapToDouble(ImputedFold.Quality::skill).average().orElseThrow();
        assertTrue(skill > 0.2, "mean ridge skill " + skill);
    }

    @Test
    void givenHandMadeRows_whenSummarisedAndTabulatedPerFeature_thenHandComputedValues() throws IOException {
        Experiment ex = experiment();
        double nan = Double.NaN;
        List<RunResults.ImputationRow> rows = List.of(
                new RunResults.ImputationRow("avg", 0, 0, 0, 1, 2, 0.5, nan, 0),
                new RunResults.ImputationRow("avg", 0, 0, 1, 3, 4, nan, nan, 0),
                new RunResults.ImputationRow("avg", 0, 1, 2, 5, 6, 0.1, nan, 0),
                new RunResults.ImputationRow("ridge", 0, 2, 3, 1, 1, 0.9, nan, 0.75));
        // per-feature absolute errors of the four rows: {1,1,1}, {0,3,6}, {5,5,5}, {2,1,0}, summed per fold
        List<RunResults.EdgeErrors> edgeErrors = List.of(
                new RunResults.EdgeErrors("avg", 0, 0, 2, new double[] {1, 4, 7}),
                new RunResults.EdgeErrors("avg", 0, 1, 1, new double[] {5, 5, 5}),
                new RunResults.EdgeErrors("ridge", 0, 2, 1, new double[] {2, 1, 0}));
        RunResults res = new RunResults(ex, ex.plan(), List.of(), List.of(), rows, edgeErrors, List.of(), List.of(),
                Map.of());
        List<String> summary = lines(ResultTables.imputationSummary(ImputationAggregates.summary(res)));
        assertEquals("imputer,n_subject_folds,n_folds,mae_mean,mae_sd,rmse_mean,pearson_r_mean,strength_mae_mean,"
                + "skill_mean", summary.get(0));
        // mae: mean of 1, 3, 5 = 3; fold means 2 and 5, sd = 3 / sqrt(2); pearson_r: NaN left out, (0.5+0.1)/2
        String[] a = summary.get(1).split(",", -1);
        assertEquals(List.of("avg", "3", "2", "3"), List.of(a).subList(0, 4));
        assertEquals(3 / Math.sqrt(2), Double.parseDouble(a[4]), 1e-15);
        assertEquals(4.0, Double.parseDouble(a[5]), 0.0);
        assertEquals(0.3, Double.parseDouble(a[6]), 1e-15);
        assertEquals("", a[7]);
        assertEquals("0", a[8]);
        // one fold only: no spread
        assertEquals("ridge,1,1,1,,1,0.9,,0.75", summary.get(2));
        List<String> edges = lines(ResultTables.imputationEdges(ImputationAggregates.edges(res)));
        assertEquals(List.of("imputer,feature,mae", "avg,t1,2", "avg,t2,3", "avg,t3,4", "ridge,t1,2", "ridge,t2,1",
                "ridge,t3,0"), edges);
        assertEquals("imputer,repetition,fold,subject,mae,rmse,pearson_r,strength_mae,skill",
                lines(ResultTables.imputation(res)).get(0));
        assertEquals("ridge,1,3,s004,1,1,0.9,,0.75", lines(ResultTables.imputation(res)).get(4));
    }

    static List<String> lines(CsvTable t) throws IOException {
        StringWriter w = new StringWriter();
        t.write(w);
        return w.toString().lines().toList();
    }
}
