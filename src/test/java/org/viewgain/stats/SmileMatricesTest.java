package org.viewgain.stats;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import smile.math.matrix.Matrix;

/**
 * The row-major adapters around Smile 3.1.1's dense algebra copy blocks of columns instead of Smile's element-by-element
 * {@code Matrix.of} and {@code toArray}: every product, solve and eigen-decomposition must equal Smile's own path bit
 * for bit (Smile is the reference here), on shapes below and above the sizes where Smile pads the leading dimension and
 * across several copy blocks (random values, seeded).
 */
class SmileMatricesTest {
    private static double[][] random(SplittableRandom rnd, int m, int n) {
        double[][] a = new double[m][n];
        for (double[] row : a) {
            for (int j = 0; j < n; j++) {
                row[j] = rnd.nextGaussian();
            }
        }
        return a;
    }

    private static void assertSame(double[][] expected, double[][] actual, String what) {
        assertEquals(expected.length, actual.length, what);
        for (int i = 0; i < expected.length; i++) {
            assertArrayEquals(expected[i], actual[i], 0.0, what + ", row " + i);
        }
    }

    @Test
    void givenMatricesOfManyShapes_whenMultiplied_thenBitForBitAsSmilesOwnCopies() {
        SplittableRandom rnd = new SplittableRandom(31);
        int[][] shapes = {{1, 1, 1}, {3, 200, 2}, {70, 70, 70}, {300, 5, 129}, {130, 513, 64}};
        for (int[] s : shapes) {
            double[][] a = random(rnd, s[0], s[1]);
            double[][] b = random(rnd, s[1], s[2]);
            double[][] c = random(rnd, s[0], s[1]);
            double[][] d = random(rnd, s[0], s[2]);
            String shape = s[0] + "x" + s[1] + "x" + s[2];
            assertSame(Matrix.of(a).mm(Matrix.of(b)).toArray(), SmileMatrices.times(a, b), "a b " + shape);
            assertSame(Matrix.of(a).aat().toArray(), SmileMatrices.gram(a), "a a' " + shape);
            assertSame(Matrix.of(a).mt(Matrix.of(c)).toArray(), SmileMatrices.cross(a, c), "a c' " + shape);
            assertSame(Matrix.of(a).tm(Matrix.of(d)).toArray(), SmileMatrices.transposeTimes(a, d), "a' d " + shape);
        }
    }

    @Test
    void givenSymmetricPositiveDefiniteMatrices_whenSolvedAndDecomposed_thenBitForBitAsSmilesOwnCopies() {
        SplittableRandom rnd = new SplittableRandom(32);
        for (int n : new int[] {1, 5, 70, 140}) {
            double[][] x = random(rnd, n, n + 3);
            double[][] a = Matrix.of(x).aat().toArray();
            for (int i = 0; i < n; i++) {
                a[i][i] += 1;
            }
            double[][] b = random(rnd, n, 3);
            Matrix ma = Matrix.of(a);
            ma.uplo(smile.math.blas.UPLO.LOWER);
            Matrix mb = Matrix.of(b);
            ma.cholesky().solve(mb);
            assertSame(mb.toArray(), SmileMatrices.solveSpd(a, b), "solve n " + n);
            Matrix me = Matrix.of(a);
            me.uplo(smile.math.blas.UPLO.LOWER);
            Matrix.EVD evd = me.eigen(false, true, true).sort();
            SmileMatrices.SymmetricEigen ours = SmileMatrices.symmetricEigen(a);
            assertArrayEquals(evd.wr, ours.values(), 0.0, "eigenvalues n " + n);
            assertSame(evd.Vr.toArray(), ours.vectors(), "eigenvectors n " + n);
        }
    }
}
