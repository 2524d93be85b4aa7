package org.viewgain.imputation;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.junit.jupiter.api.Test;
import org.viewgain.cohort.Rows;
import org.viewgain.spec.Params;

class PlsImputerTest {

    private static void assertClose(double[][] expected, double[][] actual, double tol) {
        assertEquals(expected.length, actual.length);
        for (int i = 0; i < expected.length; i++) {
            for (int j = 0; j < expected[i].length; j++) {
                assertEquals(expected[i][j], actual[i][j], tol, "row " + i + " col " + j);
            }
        }
    }

    private static double[][] pls(Rows src, Rows tgt, Rows news, int components) {
        return new PlsImputer().fit(Fixtures.CTX, src, tgt, Params.of("components", components))
                .impute(Fixtures.CTX, news);
    }

    @Test
    void givenComponentsEqualToRankOfX_whenFitted_thenPredictionsEqualOrdinaryLeastSquares() {
        // With A = rank(X) components the orthonormal scores T = X0 R span the column space of the centred X, so
        // TT'Y0 is the least-squares projection and B = R T'Y0 = (X0'X0)^-1 X0'Y0 (de Jong 1993 states PLS with
        // rank(X) components equals OLS: from memory; the two-line derivation here is recomputed).
        // Independent solution: commons-math3 3.6.1 OLSMultipleLinearRegression with intercept, per target.
        Rows src = Fixtures.gaussian("s", 40, 5, 11);
        Rows tgt = Fixtures.linearTarget(src, 3, 0.7, 12);
        Rows news = Fixtures.gaussian("n", 6, 5, 13);
        double[][] expected = new double[news.n()][tgt.p()];
        for (int t = 0; t < tgt.p(); t++) {
            double[] y = new double[src.n()];
            for (int i = 0; i < y.length; i++) {
                y[i] = tgt.x()[i][t];
            }
            OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
            ols.newSampleData(y, src.x());
            double[] b = ols.estimateRegressionParameters();
            for (int r = 0; r < news.n(); r++) {
                double s = b[0];
                for (int j = 0; j < src.p(); j++) {
                    s += b[j + 1] * news.x()[r][j];
                }
                expected[r][t] = s;
            }
        }
        // tolerance 1e-8: both exact up to rounding
        assertClose(expected, pls(src, tgt, news, 5), 1e-8);
    }

    @Test
    void givenMoreComponentsThanRank_whenFitted_thenClampedToRankAndSameAsRank() {
        Rows src = Fixtures.gaussian("s", 30, 4, 21);
        Rows tgt = Fixtures.linearTarget(src, 2, 0.5, 22);
        Rows news = Fixtures.gaussian("n", 5, 4, 23);
        assertEquals(4, PlsImputer.model(src, tgt, 50).components());
        assertClose(pls(src, tgt, news, 4), pls(src, tgt, news, 50), 1e-10);
    }

    @Test
    void givenWideSourceAndTarget_whenFitted_thenScoresAreOrthonormal() {
        // SIMPLS property: scores t_a are orthogonal by construction (de Jong 1993); normalised here to unit length
        Rows src = Fixtures.gaussian("s", 20, 50, 31);
        Rows tgt = Fixtures.linearTarget(src, 30, 1.0, 32);
        SimplsModel m = PlsImputer.model(src, tgt, 6);
        assertEquals(6, m.components());
        double[][] t = m.scores();
        for (int a = 0; a < t.length; a++) {
            for (int b = 0; b < t.length; b++) {
                double dot = 0;
                for (int i = 0; i < t[a].length; i++) {
                    dot += t[a][i] * t[b][i];
                }
                assertEquals(a == b ? 1.0 : 0.0, dot, 1e-9, "t" + a + ".t" + b);
            }
        }
    }

    @Test
    void givenOneTarget_whenFewerComponentsThanRank_thenEqualsNipalsPls1() {
        // For a single response SIMPLS gives the same model as NIPALS PLS1 (de Jong 1993, abstract). Independent
        // solution: textbook NIPALS PLS1 with X deflation, B = W (P'W)^-1 c (Wold et al. 2001, Chemometrics and
        // Intelligent Laboratory Systems 58:109-130), written below with commons-math3 for the inverse.
        Rows src = Fixtures.gaussian("s", 35, 8, 41);
        Rows tgt = Fixtures.linearTarget(src, 1, 2.0, 42);
        Rows news = Fixtures.gaussian("n", 6, 8, 43);
        int comps = 3;
        double[][] expected = nipalsPls1(src.x(), tgt.x(), news.x(), comps);
        // tolerance 1e-9: both exact up to rounding
        assertClose(expected, pls(src, tgt, news, comps), 1e-9);
    }

    private static double[][] nipalsPls1(double[][] x, double[][] yy, double[][] news, int comps) {
        int n = x.length;
        int p = x[0].length;
        double[] mx = Centring.columnMeans(x, p);
        double my = Centring.columnMeans(yy, 1)[0];
        double[][] e = Centring.centre(x, mx);
        double[] f = new double[n];
        for (int i = 0; i < n; i++) {
            f[i] = yy[i][0] - my;
        }
        RealMatrix w = new Array2DRowRealMatrix(p, comps);
        RealMatrix pl = new Array2DRowRealMatrix(p, comps);
        double[] c = new double[comps];
        for (int a = 0; a < comps; a++) {
            double[] wa = new double[p];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < p; j++) {
                    wa[j] += e[i][j] * f[i];
                }
            }
            double norm = Math.sqrt(java.util.Arrays.stream(wa).map(v -> v * v).sum());
            double[] t = new double[n];
            for (int j = 0; j < p; j++) {
                wa[j] /= norm;
            }
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < p; j++) {
                    t[i] += e[i][j] * wa[j];
                }
            }
            double tt = java.util.Arrays.stream(t).map(v -> v * v).sum();
            double[] pa = new double[p];
            double ca = 0;
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < p; j++) {
                    pa[j] += e[i][j] * t[i] / tt;
                }
                ca += f[i] * t[i] / tt;
            }
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < p; j++) {
                    e[i][j] -= t[i] * pa[j];
                }
                f[i] -= ca * t[i];
            }
            w.setColumn(a, wa);
            pl.setColumn(a, pa);
            c[a] = ca;
        }
        RealMatrix inv = new LUDecomposition(pl.transpose().multiply(w)).getSolver().getInverse();
        double[] b = w.multiply(inv).operate(c);
        double[][] out = new double[news.length][1];
        for (int r = 0; r < news.length; r++) {
            double s = my;
            for (int j = 0; j < p; j++) {
                s += (news[r][j] - mx[j]) * b[j];
            }
            out[r][0] = s;
        }
        return out;
    }
}
