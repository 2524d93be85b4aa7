package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.spec.Params;

class NearestNeighboursImputerTest {

    private final ViewImputer knn = new NearestNeighboursImputer();
    private final Rows source = Fixtures.rows("s", new double[][] {{0}, {1}, {3}, {10}});
    private final Rows target = Fixtures.rows("s", new double[][] {{0, 1}, {10, 1}, {30, 1}, {100, 1}});

    private double[] imputeOne(Params p, double x) {
        return knn.fit(Fixtures.CTX, source, target, knn.resolve(p.values()))
                .impute(Fixtures.CTX, Fixtures.rows("new", new double[][] {{x}}))[0];
    }

    @Test
    void givenUniformWeights_whenImputed_thenMeanOfKNearestTargets() {
        // hand computation: x = 0.9 -> nearest 1 (0.1), 0 (0.9); mean of targets 10 and 0 = 5
        assertArrayEquals(new double[] {5, 1}, imputeOne(Params.of("k", 2), 0.9), 1e-12);
    }

    @Test
    void givenDistanceWeights_whenImputed_thenInverseDistanceMean() {
        // hand computation: weights 1/0.1 = 10 and 1/0.9; (10*10 + 0) / (10 + 1/0.9)
        double expected = 100 / (10 + 1 / 0.9);
        assertEquals(expected, imputeOne(Params.of("k", 2, "weights", "distance"), 0.9)[0], 1e-12);
    }

    @Test
    void givenExactMatch_whenDistanceWeighted_thenExactTargetReturned() {
        assertArrayEquals(new double[] {30, 1}, imputeOne(Params.of("k", 3, "weights", "distance"), 3), 1e-12);
    }

    @Test
    void givenKLargerThanTrainingSet_whenImputed_thenAllTrainingSubjectsAveraged() {
        // documented: k > n uses all n; mean of 0, 10, 30, 100 = 35
        assertArrayEquals(new double[] {35, 1}, imputeOne(Params.of("k", 50), 2), 1e-12);
    }

    @Test
    void givenDefaults_whenResolved_thenKIs5AndUniform() {
        Params p = knn.resolve(java.util.Map.of());
        assertEquals(5, p.getInt("k"));
        assertEquals("uniform", p.getString("weights"));
    }
}
