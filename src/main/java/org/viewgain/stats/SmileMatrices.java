package org.viewgain.stats;

import smile.math.blas.EVDJob;
import smile.math.blas.EigenRange;
import smile.math.blas.LAPACK;
import smile.math.blas.Layout;
import smile.math.blas.UPLO;
import smile.math.matrix.Matrix;

/**
 * The one place outside the classifier adapters that calls Smile's dense linear algebra (native BLAS/LAPACK through
 * Smile 3.1.1, and OpenBLAS's {@code dsyrk}, which Smile's interface lacks, through the binding Smile loads), so the
 * imputers, the linear SVM and the separation test work on plain {@code double[][]} row-major arrays.
 */
public final class SmileMatrices {
    static {
        // viewgain already runs its work units on --threads threads; OpenBLAS's own threads on top of them waited
        // for work by spinning in the kernel, which on 2 cores cost as much sys time as a third of the user time
        // (docs/benchmarks.md, "Native BLAS on one thread")
        org.bytedeco.openblas.global.openblas.blas_set_num_threads(1);
    }

    private SmileMatrices() {
    }

    /** {@code a a'} (rows of a against rows of a). */
    public static double[][] gram(double[][] a) {
        return rows(matrix(a).aat());
    }

    /** Columns copied together between row-major arrays and Smile's column-major matrices. */
    private static final int COPY_BLOCK = 64;

    /**
     * The rows as a Smile matrix: the same column-major layout and leading dimension as {@code Matrix.of}, filled a
     * block of columns at a time (Matrix.of writes element by element across columns, a cache miss per value on large
     * matrices: about 8% of a 1,000 x 268 run's CPU), so BLAS sees the same numbers in the same places.
     */
    private static Matrix matrix(double[][] a) {
        int m = a.length;
        int n = m == 0 ? 0 : a[0].length;
        int ld = new Matrix(m, 1).ld();
        double[] data = new double[ld * n];
        for (int j0 = 0; j0 < n; j0 += COPY_BLOCK) {
            int j1 = Math.min(n, j0 + COPY_BLOCK);
            for (int i = 0; i < m; i++) {
                double[] row = a[i];
                for (int j = j0; j < j1; j++) {
                    data[j * ld + i] = row[j];
                }
            }
        }
        return new Matrix(m, n, ld, data);
    }

    /** A Smile matrix as row-major arrays (as {@code toArray}, read a block of columns at a time). */
    private static double[][] rows(Matrix c) {
        int m = c.nrow();
        int n = c.ncol();
        double[][] out = new double[m][n];
        double[][] cols = new double[Math.min(n, COPY_BLOCK)][];
        for (int j0 = 0; j0 < n; j0 += COPY_BLOCK) {
            int j1 = Math.min(n, j0 + COPY_BLOCK);
            for (int j = j0; j < j1; j++) {
                cols[j - j0] = c.col(j);
            }
            for (int i = 0; i < m; i++) {
                double[] row = out[i];
                for (int j = j0; j < j1; j++) {
                    row[j] = cols[j - j0][i];
                }
            }
        }
        return out;
    }

    /** Columns of the rows copied together into one block for each BLAS call of {@link #lowerGram}. */
    private static final int GRAM_BLOCK = 2048;

    /**
     * The Gram matrix {@code x x'} (every pair of rows' inner product) by native BLAS's symmetric rank-k update, a
     * block of columns at a time so that no copy of all the rows is made (wide views hold hundreds of megabytes; see
     * {@link #lowerGram}); exactly symmetric. Sums in BLAS's order, not a scalar loop's: the last digits differ from a
     * plain dot product, and are the same on every run on one machine (BLAS on one thread).
     */
    public static double[][] rowGram(double[][] x) {
        int n = x.length;
        int p = n == 0 ? 0 : x[0].length;
        return lowerGram(n, p, (i, from, width, dest, at) -> System.arraycopy(x[i], from, dest, at, width));
    }

    /** Writes {@code width} values of row {@code row}, from column {@code from}, into {@code dest} at {@code at}. */
    @FunctionalInterface
    public interface RowBlock {
        void copy(int row, int from, int width, double[] dest, int at);
    }

    /**
     * The Gram matrix of n rows of width p that {@code rows} supplies a block of columns at a time (so that no copy of
     * all the rows is made, and rows stored in another form can be widened or shifted as they are copied), by native
     * BLAS's symmetric rank-k update ({@code dsyrk}, half the multiply-adds of a general product); the lower triangle
     * is mirrored, so the result is exactly symmetric. Sums in BLAS's order; the same on every run on one machine.
     */
    public static double[][] lowerGram(int n, int p, RowBlock rows) {
        double[] g = new double[n * n];
        double[] buf = new double[n * Math.min(p, GRAM_BLOCK)];
        for (int c0 = 0; c0 < p; c0 += GRAM_BLOCK) {
            int w = Math.min(GRAM_BLOCK, p - c0);
            for (int i = 0; i < n; i++) {
                rows.copy(i, c0, w, buf, i * w);
            }
            org.bytedeco.openblas.global.openblas.cblas_dsyrk(org.bytedeco.openblas.global.openblas.CblasRowMajor,
                    org.bytedeco.openblas.global.openblas.CblasLower,
                    org.bytedeco.openblas.global.openblas.CblasNoTrans, n, w, 1.0, buf, w, 1.0, g, n);
        }
        double[][] out = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                out[i][j] = g[i * n + j];
                out[j][i] = g[i * n + j];
            }
        }
        return out;
    }

    /** {@code a b'} (rows of a against rows of b); both need the same width. */
    public static double[][] cross(double[][] a, double[][] b) {
        Matrix ma = matrix(a);
        return rows(ma.mt(matrix(b)));
    }

    /** {@code a' b}. */
    public static double[][] transposeTimes(double[][] a, double[][] b) {
        return rows(matrix(a).tm(matrix(b)));
    }

    /** {@code a b}. */
    public static double[][] times(double[][] a, double[][] b) {
        return rows(matrix(a).mm(matrix(b)));
    }

    /**
     * Solves {@code a z = b} for a symmetric positive definite {@code a} by Cholesky.
     *
     * @throws ArithmeticException when {@code a} is not positive definite
     */
    public static double[][] solveSpd(double[][] a, double[][] b) {
        Matrix ma = matrix(a);
        ma.uplo(UPLO.LOWER);
        Matrix.Cholesky chol = ma.cholesky();
        Matrix mb = matrix(b);
        chol.solve(mb);
        return rows(mb);
    }

    /**
     * The inverse of a symmetric positive definite {@code a} by Cholesky (LAPACK potrf, then potrs on the identity).
     *
     * @throws ArithmeticException when {@code a} is not positive definite
     */
    public static double[][] inverseSpd(double[][] a) {
        Matrix ma = matrix(a);
        ma.uplo(UPLO.LOWER);
        return rows(ma.cholesky().inverse());
    }

    /**
     * Eigen-decomposition of a symmetric matrix, eigenvalues in descending order.
     *
     * @return values[i] and the matching unit eigenvector in column i of vectors
     */
    public static SymmetricEigen symmetricEigen(double[][] a) {
        Matrix ma = matrix(a);
        ma.uplo(UPLO.LOWER);
        Matrix.EVD evd = ma.eigen(false, true, true).sort();
        return new SymmetricEigen(evd.wr.clone(), rows(evd.Vr));
    }

    /**
     * The eigenvectors of the r largest eigenvalues of a symmetric matrix (LAPACK dsyevr with an index range, so
     * the rest are not computed), largest first.
     *
     * @return n x r, column c the unit eigenvector of the (c+1)-th largest eigenvalue
     * @throws ArithmeticException when LAPACK reports a failure
     */
    public static double[][] topEigenvectors(double[][] a, int r) {
        int n = a.length;
        double[] packed = new double[n * n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(a[i], 0, packed, i * n, n);
        }
        int[] found = new int[1];
        double[] values = new double[n];
        double[] z = new double[n * r];
        int[] support = new int[2 * r];
        int info = LAPACK.engine.syevr(Layout.COL_MAJOR, EVDJob.VECTORS, EigenRange.INDEX, UPLO.LOWER, n, packed, n,
                0, 0, n - r + 1, n, 0, found, values, z, n, support);
        if (info != 0 || found[0] != r) {
            throw new ArithmeticException("LAPACK dsyevr failed: info " + info + ", found " + found[0] + " of " + r);
        }
        double[][] out = new double[n][r];
        for (int c = 0; c < r; c++) {
            int col = r - 1 - c;
            for (int i = 0; i < n; i++) {
                out[i][c] = z[col * n + i];
            }
        }
        return out;
    }

    /** Eigenvalues (descending) and eigenvectors (columns) of a symmetric matrix. */
    public record SymmetricEigen(double[] values, double[][] vectors) {
    }
}
