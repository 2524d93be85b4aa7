package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * A pipeline compared with itself under another seed (two random-forest entries that differ only in name, hence in
 * seeds) is not different in truth; the corrected repeated cross-validation t-test (Nadeau &amp; Bengio 2003) must not
 * reject more often than the nominal 5% allows (99% binomial bound), whereas the uncorrected t-test on the same
 * fold differences is known to be liberal (Bouckaert &amp; Frank 2004).
 */
class SelfComparisonTest {
    @TempDir
    Path dir;

    @Test
    void givenSamePipelineTwoSeeds_whenComparedOverManyCohorts_thenCorrectedTestRejectsAtMostNominally() {
        int cohorts = 120;
        int rejections = 0;
        for (int c = 0; c < cohorts; c++) {
            Path d = dir.resolve("c" + c);
            TestCohorts.synthetic(d, 40, 6, 2, 5.0, 0.0, 300 + c);
            Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(d, """
                    feature-sets: [source]
                    classifiers:
                      - { name: rf1, method: random-forest, fixed: { trees: 15 } }
                      - { name: rf2, method: random-forest, fixed: { trees: 15 } }
                    validation: { outer: { folds: 5, repeats: 3 }, inner: { folds: 2 } }
                    significance: { compare: ["none/source/rf1 vs none/source/rf2"], adjust: none, bootstrap: 0 }
                    """)));
            List<Comparisons.Row> rows = Comparisons.of(new Runner(ex, 2, Progress.NONE).run());
            Comparisons.Row t = rows.stream().filter(r -> r.test().equals("corrected-t")).findFirst().orElseThrow();
            assertEquals(40, t.n());
            if (t.pValue() <= 0.05) {
                rejections++;
            }
        }
        int hi = new BinomialDistribution(cohorts, 0.05).inverseCumulativeProbability(0.995);
        assertTrue(rejections <= hi, rejections + " rejections of " + cohorts + " > " + hi);
    }
}
