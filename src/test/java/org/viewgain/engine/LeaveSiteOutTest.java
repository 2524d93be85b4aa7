package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.Covariates;
import org.viewgain.testing.TestCohorts;

/**
 * Leave-site-out with every built-in classifier family and a Weka class, with adjustment and selection inside the
 * folds; per-site metrics; and the site problems ComBat cannot handle, refused before anything runs.
 */
class LeaveSiteOutTest {
    @TempDir
    Path dir;

    static final String FEATURES = "features: { adjust: [age], select: { method: anova, keep: [3, 8] } }\n";

    static final String BODY = """
            imputers:
              - { name: ridge, method: ridge, fixed: { alpha: 5 } }
            feature-sets: [source, source+imputed]
            classifiers:
              - { name: forest, method: random-forest, fixed: { trees: 30 } }
              - { name: lr, method: logistic }
              - { name: lda, method: lda }
              - { name: knn, method: knn, fixed: { k: 5 } }
              - { name: svm, method: svm-linear }
              - { name: j48, method: weka, class: weka.classifiers.trees.J48 }
            validation: { outer: { scheme: leave-site-out }, inner: { folds: 3 } }
            """;

    Path spec(String features, String body) throws IOException {
        Path f = TestCohorts.spec(dir, body);
        String text = Files.readString(f).replace("site: site }", "site: site, covariates: [age, sex] }");
        Files.writeString(f, text + features);
        return f;
    }

    @Test
    void givenTwoSites_whenLeaveSiteOutWithSixClassifiers_thenEverySubjectPredictedOnceAndMetricsPerSite()
            throws IOException {
        TestCohorts.synthetic(dir, 60, 10, 6, 5.0, 0.2, 8);
        Covariates.addAgeAndSex(dir, 5);
        Experiment ex = Setup.prepare(SpecLoader.load(spec(FEATURES, BODY)));
        RunResults res = new Runner(ex, 2, Progress.NONE).run();
        assertEquals(12, ex.pipelines().size());
        Map<String, Integer> siteSize = new HashMap<>();
        ex.data().subjects().forEach(s -> siteSize.merge(s.site(), 1, Integer::sum));
        for (Pipeline p : ex.pipelines()) {
            int[] seen = new int[ex.data().n()];
            res.predictions().stream().filter(pr -> pr.pipeline().equals(p)).forEach(pr -> seen[pr.subject()]++);
            for (int i = 0; i < seen.length; i++) {
                assertEquals(1, seen[i], p.label() + " subject " + i);
            }
        }
        List<SiteMetrics.Row> sites = SiteMetrics.rows(res);
        assertEquals(12 * 2 * 7, sites.size());
        for (SiteMetrics.Row r : sites) {
            assertEquals(siteSize.get(r.site()).intValue(), r.n(), r.toString());
        }
        // the planted group effect (a shift of one standard deviation in three of ten source columns) is found in
        // each held-out site: balanced accuracy above 0.6 (common practice, no source)
        sites.stream().filter(r -> r.pipeline().classifier().equals("lr") && r.metric().equals("balanced_accuracy")
                && r.pipeline().featureSet().label().equals("source"))
                .forEach(r -> assertTrue(r.estimate() > 0.6, r.toString()));
    }

    @Test
    void givenLeaveSiteOutAndCombat_whenLoaded_thenRefusedNamingTheKeyAndTheReason() throws IOException {
        TestCohorts.synthetic(dir, 40, 6, 4, 1.0, 0.2, 8);
        Covariates.addAgeAndSex(dir, 5);
        BadInputException e = assertThrows(BadInputException.class,
                () -> SpecLoader.load(spec("features: { harmonize: combat }\n", BODY)));
        assertTrue(e.getMessage().contains("features.harmonize") && e.getMessage().contains("leave-site-out")
                && e.getMessage().contains("unseen in training"), e.getMessage());
    }

    @Test
    void givenASiteWithOneSubject_whenKFoldWithCombat_thenCheckNamesTheSubjectAndSite() throws IOException {
        TestCohorts.synthetic(dir, 40, 6, 4, 1.0, 0.2, 8);
        Covariates.addAgeAndSex(dir, 5);
        Path subjects = dir.resolve("subjects.csv");
        Files.writeString(subjects, Files.readString(subjects).replaceFirst("s007,(\\w+),\\w+,", "s007,$1,north,"));
        Path spec = spec("features: { harmonize: combat }\n",
                BODY.replace("scheme: leave-site-out", "folds: 4"));
        BadInputException e = assertThrows(BadInputException.class, () -> Setup.prepare(SpecLoader.load(spec)));
        assertTrue(e.getMessage().contains("subject 's007' of site 'north'")
                && e.getMessage().contains("features.harmonize"), e.getMessage());
    }
}
