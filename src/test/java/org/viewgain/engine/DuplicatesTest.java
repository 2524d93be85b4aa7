package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;
import org.apache.commons.math3.stat.correlation.PearsonsCorrelation;
import org.junit.jupiter.api.Test;

/** Near-duplicate scans: planted copies are found with their exact correlation, and nothing else is. */
class DuplicatesTest {

    static double[][] noise(int n, int p, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        double[][] x = new double[n][p];
        for (double[] r : x) {
            for (int j = 0; j < p; j++) {
                r[j] = rng.nextGaussian();
            }
        }
        return x;
    }

    @Test
    void givenPlantedCopies_whenSearched_thenExactlyThosePairsWithCommonsMathCorrelations() {
        int n = 203;
        int p = 3001;
        double[][] x = noise(n, p, 5);
        SplittableRandom rng = new SplittableRandom(6);
        for (int j = 0; j < p; j++) {
            x[150][j] = 2 * x[3][j] + 7;                              // affine copy: r = 1
            x[202][j] = x[40][j] + 0.02 * rng.nextGaussian();        // rescan: r about 0.9998
            x[201][j] = x[41][j] + 0.2 * rng.nextGaussian();         // a relative: r about 0.98, below threshold
        }
        x[100] = new double[p];                                      // constant: no correlation, never reported
        List<Duplicates.Pair> found = Duplicates.find(x, 0.999);
        assertEquals(2, found.size(), found.toString());
        assertEquals(List.of(3, 150), List.of(found.get(0).a(), found.get(0).b()));
        assertEquals(List.of(40, 202), List.of(found.get(1).a(), found.get(1).b()));
        // reference library: Apache Commons Math 3.6.1 PearsonsCorrelation; tolerance 1e-12 (rounding only)
        PearsonsCorrelation pc = new PearsonsCorrelation();
        for (Duplicates.Pair d : found) {
            assertEquals(pc.correlation(x[d.a()], x[d.b()]), d.correlation(), 1e-12);
        }
        assertTrue(found.get(1).correlation() < 1 && found.get(1).correlation() > 0.999);
    }

    @Test
    void givenAThresholdJustBelowAPair_whenSearched_thenTheFloatPrefilterDoesNotLoseIt() {
        double[][] x = noise(9, 5000, 8);
        SplittableRandom rng = new SplittableRandom(9);
        for (int j = 0; j < 5000; j++) {
            x[7][j] = x[2][j] + 0.03 * rng.nextGaussian();
        }
        double r = Duplicates.correlation(x[2], x[7]);
        // Apache Commons Math 3.6.1 agrees up to rounding (1e-12); the thresholds below use the value itself
        assertEquals(new PearsonsCorrelation().correlation(x[2], x[7]), r, 1e-12);
        // thresholds a hair below the exact value and at it: found, then not found (strictly above)
        assertEquals(1, Duplicates.find(x, r - 1e-9).size());
        assertEquals(0, Duplicates.find(x, r).size());
    }

    @Test
    void givenTwoThousandSubjectsOfSevenHundredEdges_whenSearched_thenFastEnough() {
        // timing guard against an accidental slow path (boxing, no blocking); 2000 x 35778 is 51 times this work
        // and took 43 s on the shared 2-core build machine under a load average of 13 (docs/preprocessing.md)
        double[][] x = noise(2000, 703, 10);
        long start = System.nanoTime();
        List<Duplicates.Pair> found = Duplicates.find(x, 0.999);
        double seconds = (System.nanoTime() - start) / 1e9;
        assertEquals(0, found.size());
        assertTrue(seconds < 20, seconds + " s");
    }
}
