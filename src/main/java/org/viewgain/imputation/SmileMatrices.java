package org.viewgain.imputation;

import smile.math.blas.UPLO;
import smile.math.matrix.Matrix;

/**
 * The one place in this package that calls Smile's dense linear algebra (native BLAS/LAPACK through Smile 3.1.1),
 * so the imputers work on plain {@code double[][]} row-major arrays.
 */
final class SmileMatrices {
    private SmileMatrices() {
    }

    /** {@code a a'} (rows of a against rows of a). */
    static double[][] gram(double[][] a) {
        return Matrix.of(a).aat().toArray();
    }

    /** {@code a b'} (rows of a against rows of b); both need the same width. */
    static double[][] cross(double[][] a, double[][] b) {
        Matrix ma = Matrix.of(a);
        return ma.mt(Matrix.of(b)).toArray();
    }

    /** {@code a' b}. */
    static double[][] transposeTimes(double[][] a, double[][] b) {
        return Matrix.of(a).tm(Matrix.of(b)).toArray();
    }

    /** {@code a b}. */
    static double[][] times(double[][] a, double[][] b) {
        return Matrix.of(a).mm(Matrix.of(b)).toArray();
    }

    /**
     * Solves {@code a z = b} for a symmetric positive definite {@code a} by Cholesky.
     *
     * @throws ArithmeticException when {@code a} is not positive definite
     */
    static double[][] solveSpd(double[][] a, double[][] b) {
        Matrix ma = Matrix.of(a);
        ma.uplo(UPLO.LOWER);
        Matrix.Cholesky chol = ma.cholesky();
        Matrix mb = Matrix.of(b);
        chol.solve(mb);
        return mb.toArray();
    }

    /**
     * Eigen-decomposition of a symmetric matrix, eigenvalues in descending order.
     *
     * @return values[i] and the matching unit eigenvector in column i of vectors
     */
    static SymmetricEigen symmetricEigen(double[][] a) {
        Matrix ma = Matrix.of(a);
        ma.uplo(UPLO.LOWER);
        Matrix.EVD evd = ma.eigen(false, true, true).sort();
        return new SymmetricEigen(evd.wr.clone(), evd.Vr.toArray());
    }

    /** Eigenvalues (descending) and eigenvectors (columns) of a symmetric matrix. */
    record SymmetricEigen(double[] values, double[][] vectors) {
    }
}
