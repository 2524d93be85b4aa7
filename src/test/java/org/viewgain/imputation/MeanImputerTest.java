package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.spec.Params;

class MeanImputerTest {

    @Test
    void givenTrainingTargets_whenImputed_thenEveryRowIsTheTrainingMean() {
        Rows src = Fixtures.rows("s", new double[][] {{1}, {2}, {3}});
        Rows tgt = Fixtures.rows("s", new double[][] {{1, 10}, {2, 20}, {6, 60}});
        double[][] out = new MeanImputer().fit(Fixtures.CTX, src, tgt, Params.NONE)
                .impute(Fixtures.CTX, Fixtures.rows("n", new double[][] {{100}, {-5}}));
        assertArrayEquals(new double[] {3, 30}, out[0], 1e-12);
        assertArrayEquals(new double[] {3, 30}, out[1], 1e-12);
    }

    @Test
    void givenWrongWidth_whenImputed_thenRejected() {
        Rows src = Fixtures.rows("s", new double[][] {{1}, {2}});
        var fitted = new MeanImputer().fit(Fixtures.CTX, src, src, Params.NONE);
        assertThrows(IllegalArgumentException.class,
                () -> fitted.impute(Fixtures.CTX, Fixtures.rows("n", new double[][] {{1, 2}})));
    }
}
