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
    void givenManyRowsAcrossTilesAndChunks_whenSearched_thenThePlantedPairIsFoundWithTheBlockedPathOnly() {
        // 401 rows (not a multiple of the 4-row tiles) x 1,100 columns (two 512-column chunks and a remainder):
        // the blocked search must find a pair planted in the last, ragged tile and nothing else. Its speed is
        // measured by bench/duplicates.sh, not here (timing belongs to benchmarks).
        double[][] x = noise(401, 1100, 10);
        SplittableRandom rng = new SplittableRandom(11);
        for (int j = 0; j < 1100; j++) {
            x[400][j] = x[1][j] + 0.01 * rng.nextGaussian();
        }
        List<Duplicates.Pair> found = Duplicates.find(x, 0.999);
        assertEquals(1, found.size(), found.toString());
        assertEquals(List.of(1, 400), List.of(found.get(0).a(), found.get(0).b()));
        assertEquals(new PearsonsCorrelation().correlation(x[1], x[400]), found.get(0).correlation(), 1e-12);
    }

    @Test
    void givenTwoCohortsWithPlantedCopies_whenSearchedAcross_thenExactlyThoseCrossPairsWithCommonsMathCorrelations() {
        // 37 development rows (ragged last tile) and 23 independent rows; the copies sit across the cohorts, and a
        // copy within one cohort (dev 5 ~ dev 30) must not be reported by the cross search
        double[][] dev = noise(37, 700, 12);
        double[][] ind = noise(23, 700, 13);
        SplittableRandom rng = new SplittableRandom(14);
        for (int j = 0; j < 700; j++) {
            ind[22][j] = 3 * dev[36][j] - 1;                          // affine copy in the last tiles: r = 1
            ind[4][j] = dev[2][j] + 0.01 * rng.nextGaussian();       // rescan
            dev[30][j] = dev[5][j];                                  // within the development cohort only
        }
        List<Duplicates.Pair> found = Duplicates.across(dev, ind, 0.999);
        assertEquals(2, found.size(), found.toString());
        assertEquals(List.of(2, 4), List.of(found.get(0).a(), found.get(0).b()));
        assertEquals(List.of(36, 22), List.of(found.get(1).a(), found.get(1).b()));
        // reference library: Apache Commons Math 3.6.1 PearsonsCorrelation; tolerance 1e-12 (rounding only)
        PearsonsCorrelation pc = new PearsonsCorrelation();
        for (Duplicates.Pair d : found) {
            assertEquals(pc.correlation(dev[d.a()], ind[d.b()]), d.correlation(), 1e-12);
        }
        assertEquals(List.of(), Duplicates.across(dev, new double[0][], 0.999));
    }
}
