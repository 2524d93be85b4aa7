package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.spec.Params;

/**
 * SIMLR has no published numeric example (Wang et al. 2017, Nature Methods 14:414-416): these checks use data with a known
 * block structure (3 well-separated Gaussian clusters) and the constraints the paper places on S and w.
 */
class MultiKernelNeighboursImputerTest {

    private static final int PER_BLOCK = 20;
    private static final int BLOCKS = 3;

    /** Cluster b is centred at 12 on axis b (unit spread): clusters are about 17 units apart, spread about 3. */
    private static double[][] blocks(int perBlock, long seed) {
        Random rnd = new Random(seed);
        double[][] x = new double[perBlock * BLOCKS][6];
        for (int i = 0; i < x.length; i++) {
            for (int j = 0; j < 6; j++) {
                x[i][j] = rnd.nextGaussian() + (j == i / perBlock ? 12 : 0);
            }
        }
        return x;
    }

    private static Rows blockTargets(Rows src) {
        double[][] y = new double[src.n()][2];
        for (int i = 0; i < y.length; i++) {
            y[i][0] = 100.0 * (i / PER_BLOCK);
            y[i][1] = 1;
        }
        return new Rows(src.ids(), y, java.util.List.of("block", "one"));
    }

    private static MultiKernelNeighboursImputer.Learned fitBlocks(Rows src) {
        MultiKernelNeighboursImputer m = new MultiKernelNeighboursImputer();
        return (MultiKernelNeighboursImputer.Learned) m.fit(Fixtures.CTX, src, blockTargets(src),
                m.resolve(java.util.Map.of()));
    }

    @Test
    void givenThreeSeparatedBlocks_whenLearned_thenSimilarityStaysWithinBlocksAndRowsSumToOne() {
        Rows src = Fixtures.rows("s", blocks(PER_BLOCK, 1));
        double[][] s = fitBlocks(src).similarity();
        int n = src.n();
        double within = 0;
        double between = 0;
        for (int i = 0; i < n; i++) {
            double sum = 0;
            int nonZero = 0;
            for (int j = 0; j < n; j++) {
                assertTrue(s[i][j] >= 0, "non-negative");
                sum += s[i][j];
                boolean same = i / PER_BLOCK == j / PER_BLOCK;
                if (s[i][j] > 0) {
                    nonZero++;
                    assertTrue(same, "neighbour " + j + " of " + i + " from another block");
                }
                if (same) {
                    within += s[i][j];
                } else {
                    between += s[i][j];
                }
            }
            assertEquals(0.0, s[i][i], 0.0, "a subject is not its own neighbour");
            assertEquals(1.0, sum, 1e-12, "row " + i + " sums to 1");
            assertTrue(nonZero <= 10, "sparse: at most `neighbours` entries");
        }
        assertTrue(within > between, "within-block similarity exceeds between-block");
    }

    @Test
    void givenThreeSeparatedBlocks_whenLearned_thenKernelWeightsOnTheSimplex() {
        double[] w = fitBlocks(Fixtures.rows("s", blocks(PER_BLOCK, 2))).kernelWeights();
        assertEquals(55, w.length, "11 k values x 5 sigmas when n = 60");
        double sum = 0;
        for (double v : w) {
            assertTrue(v >= 0);
            sum += v;
        }
        assertEquals(1.0, sum, 1e-12);
    }

    @Test
    void givenNewSubjectsFromEachBlock_whenImputed_thenTargetsOfTheirOwnBlock() {
        Rows src = Fixtures.rows("s", blocks(PER_BLOCK, 3));
        Rows news = Fixtures.rows("n", blocks(4, 4));
        double[][] out = fitBlocks(src).impute(Fixtures.CTX, news);
        for (int i = 0; i < out.length; i++) {
            // all 10 neighbours from the subject's own block: exactly that block's target (rounding only)
            assertEquals(100.0 * (i / 4), out[i][0], 1e-9, "new subject " + i);
            assertEquals(1.0, out[i][1], 1e-12);
        }
    }

    @Test
    void givenTwoTrainingSubjects_whenFitted_thenRejectedWithReason() {
        Rows src = Fixtures.rows("s", new double[][] {{1}, {2}});
        MultiKernelNeighboursImputer m = new MultiKernelNeighboursImputer();
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> m.fit(Fixtures.CTX, src, src, Params.of("neighbours", 1, "rank", 1, "iterations", 1)));
        assertTrue(e.getMessage().contains("at least 3"));
    }

    @Test
    void givenCosts_whenEntropyWeighted_thenOnSimplexWithTargetPerplexityAndCheapestHeaviest() {
        double[] cost = new double[55];
        for (int l = 0; l < cost.length; l++) {
            cost[l] = 0.2 + 0.01 * l;
        }
        double[] w = EntropyWeights.withPerplexity(cost, 20);
        double sum = 0;
        double h = 0;
        for (int l = 0; l < w.length; l++) {
            sum += w[l];
            h -= w[l] * Math.log(w[l]);
            if (l > 0) {
                assertTrue(w[l] < w[l - 1], "weights fall with cost");
            }
        }
        assertEquals(1.0, sum, 1e-12);
        // the perplexity rule of the SIMLR authors' code: exp(entropy) = 20; bisection tolerance 1e-6
        assertEquals(20.0, Math.exp(h), 1e-6);
    }
}
