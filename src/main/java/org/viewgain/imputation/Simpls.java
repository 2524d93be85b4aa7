package org.viewgain.imputation;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.stats.SmileMatrices;

/**
 * SIMPLS (de Jong 1993) computed in subject space so that wide sources and wide targets cost no p x q matrix.
 * The cross-product {@code S = X0'Y0} is never formed: its dominant left singular vector after deflation by the
 * earlier loadings is {@code A'H w}, where {@code A = X0 (I - VV')}, {@code HH' = Y0Y0'} and {@code w} is the top
 * eigenvector of the small matrix {@code H'AA'H}, because {@code SS' = A'HH'A}.
 */
final class Simpls {
    private static final double RELATIVE_TOL = 1e-10;

    private Simpls() {
    }

    static SimplsModel fit(double[][] x, double[][] y, int p, int q, int components) {
        int n = x.length;
        double[] mx = Centring.columnMeans(x, p);
        double[] my = Centring.columnMeans(y, q);
        double[][] x0 = Centring.centre(x, mx);
        double[][] y0 = Centring.centre(y, my);
        double[][] h = rootOfGram(y0);
        int m = h.length == 0 ? 0 : h[0].length;
        double[][] c0 = m == 0 ? new double[0][0]
                : SmileMatrices.transposeTimes(h, SmileMatrices.times(SmileMatrices.gram(x0), h));
        List<double[]> rs = new ArrayList<>();
        List<double[]> qs = new ArrayList<>();
        List<double[]> ts = new ArrayList<>();
        List<double[]> vs = new ArrayList<>();
        List<double[]> xvs = new ArrayList<>();
        List<double[]> zs = new ArrayList<>();
        int max = Math.min(components, Math.min(n - 1, p));
        double first = Double.NaN;
        for (int a = 0; a < max && m > 0; a++) {
            double[][] mm = new double[m][m];
            for (int i = 0; i < m; i++) {
                for (int j = 0; j < m; j++) {
                    double s = c0[i][j];
                    for (double[] z : zs) {
                        s -= z[i] * z[j];
                    }
                    mm[i][j] = s;
                }
            }
            SmileMatrices.SymmetricEigen eig = SmileMatrices.symmetricEigen(mm);
            double lambda = eig.values()[0];
            if (a == 0) {
                first = lambda;
            }
            if (!(lambda > RELATIVE_TOL * first && first > 0)) {
                break;
            }
            double[] hw = new double[n];
            for (int i = 0; i < n; i++) {
                double s = 0;
                for (int j = 0; j < m; j++) {
                    s += h[i][j] * eig.vectors()[j][0];
                }
                hw[i] = s;
            }
            double[] r = transposeTimes(x0, hw, p);
            for (int b = 0; b < vs.size(); b++) {
                axpy(-dot(xvs.get(b), hw), vs.get(b), r);
            }
            double[] t = times(x0, r);
            double normT = Math.sqrt(dot(t, t));
            if (!(normT > 0)) {
                break;
            }
            scale(t, 1 / normT);
            scale(r, 1 / normT);
            double[] v = transposeTimes(x0, t, p);
            for (int pass = 0; pass < 2; pass++) {
                for (double[] old : vs) {
                    axpy(-dot(old, v), old, v);
                }
            }
            double normV = Math.sqrt(dot(v, v));
            if (!(normV > 0)) {
                break;
            }
            scale(v, 1 / normV);
            double[] xv = times(x0, v);
            double[] z = new double[m];
            for (int j = 0; j < m; j++) {
                double s = 0;
                for (int i = 0; i < n; i++) {
                    s += h[i][j] * xv[i];
                }
                z[j] = s;
            }
            rs.add(r);
            qs.add(transposeTimes(y0, t, q));
            ts.add(t);
            vs.add(v);
            xvs.add(xv);
            zs.add(z);
        }
        return new SimplsModel(mx, my, rs.toArray(double[][]::new), qs.toArray(double[][]::new),
                ts.toArray(double[][]::new));
    }

    /** H with HH' = aa', from the eigenvectors of aa' with clearly positive eigenvalues. */
    private static double[][] rootOfGram(double[][] a) {
        SmileMatrices.SymmetricEigen eig = SmileMatrices.symmetricEigen(SmileMatrices.gram(a));
        double[] val = eig.values();
        int m = 0;
        while (m < val.length && val[m] > RELATIVE_TOL * val[0] && val[0] > 0) {
            m++;
        }
        double[][] h = new double[a.length][m];
        for (int j = 0; j < m; j++) {
            double s = Math.sqrt(val[j]);
            for (int i = 0; i < a.length; i++) {
                h[i][j] = eig.vectors()[i][j] * s;
            }
        }
        return h;
    }

    private static double[] transposeTimes(double[][] a, double[] v, int width) {
        double[] out = new double[width];
        for (int i = 0; i < a.length; i++) {
            axpy(v[i], a[i], out);
        }
        return out;
    }

    private static double[] times(double[][] a, double[] v) {
        double[] out = new double[a.length];
        for (int i = 0; i < a.length; i++) {
            out[i] = dot(a[i], v);
        }
        return out;
    }

    private static double dot(double[] a, double[] b) {
        double s = 0;
        for (int i = 0; i < a.length; i++) {
            s += a[i] * b[i];
        }
        return s;
    }

    private static void axpy(double c, double[] x, double[] y) {
        for (int i = 0; i < x.length; i++) {
            y[i] += c * x[i];
        }
    }

    private static void scale(double[] v, double c) {
        for (int i = 0; i < v.length; i++) {
            v[i] *= c;
        }
    }
}
