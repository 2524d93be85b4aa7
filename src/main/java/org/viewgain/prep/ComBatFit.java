package org.viewgain.prep;

import java.util.List;
import java.util.Map;
import org.viewgain.cohort.Rows;

/** ComBat fitted on training rows: standardization and the per-site posterior location and scale. */
final class ComBatFit implements Transform.Fitted {

    private final ComBat owner;
    private final Map<String, Integer> siteIndex;
    private final double[] alpha;
    private final double[][] slopes;
    private final double[] pooledSd;
    /** Features that vary on the training rows; the others pass through. */
    private final boolean[] active;
    double[][] gammaStar;
    double[][] delta2Star;

    ComBatFit(ComBat owner, Map<String, Integer> siteIndex, double[] alpha, double[][] slopes, double[] pooledSd) {
        this.owner = owner;
        this.siteIndex = siteIndex;
        this.alpha = alpha;
        this.slopes = slopes;
        this.pooledSd = pooledSd;
        this.active = new boolean[alpha.length];
        for (int j = 0; j < alpha.length; j++) {
            active[j] = pooledSd[j] > 1e-12 * Math.max(1, Math.abs(alpha[j]));
        }
    }

    /** alpha + covariates * beta for one subject and feature. */
    private double standardMean(double[] covariates, int j) {
        double m = alpha[j];
        for (int c = 0; c < slopes.length; c++) {
            m += covariates[c] * slopes[c][j];
        }
        return m;
    }

    private double[] standardized(String id, double[] row) {
        double[] cov = owner.covariatesOf(id, slopes.length);
        double[] s = new double[row.length];
        for (int j = 0; j < row.length; j++) {
            s[j] = active[j] ? (row[j] - standardMean(cov, j)) / pooledSd[j] : 0;
        }
        return s;
    }

    void estimateSites(Rows train, Map<String, List<Integer>> members, List<String> sites) {
        int p = alpha.length;
        int[] on = java.util.stream.IntStream.range(0, p).filter(j -> active[j]).toArray();
        if (on.length < 2) {
            throw new IllegalArgumentException("ComBat needs at least 2 features that vary on the training rows");
        }
        gammaStar = new double[sites.size()][p];
        delta2Star = new double[sites.size()][p];
        for (int s = 0; s < sites.size(); s++) {
            List<Integer> rows = members.get(sites.get(s));
            double[][] z = new double[rows.size()][];
            for (int r = 0; r < rows.size(); r++) {
                int i = rows.get(r);
                z[r] = standardized(train.ids().get(i), train.x()[i]);
            }
            double[] gammaHat = new double[on.length];
            double[] delta2Hat = new double[on.length];
            double[][] columns = new double[on.length][rows.size()];
            for (int f = 0; f < on.length; f++) {
                for (int r = 0; r < rows.size(); r++) {
                    columns[f][r] = z[r][on[f]];
                }
                gammaHat[f] = ComBatPriors.mean(columns[f]);
                delta2Hat[f] = ComBatPriors.variance(columns[f], gammaHat[f]);
            }
            ComBatPriors priors = new ComBatPriors(gammaHat, delta2Hat);
            for (int f = 0; f < on.length; f++) {
                double[] post = priors.posterior(columns[f], gammaHat[f], delta2Hat[f]);
                gammaStar[s][on[f]] = post[0];
                delta2Star[s][on[f]] = post[1];
            }
        }
    }

    @Override
    public Rows apply(Rows rows) {
        int p = alpha.length;
        if (rows.p() != p) {
            throw new IllegalArgumentException("ComBat was fitted on " + p + " columns, got " + rows.p());
        }
        double[][] out = new double[rows.n()][p];
        for (int i = 0; i < rows.n(); i++) {
            String id = rows.ids().get(i);
            String site = owner.siteOf(id);
            Integer s = siteIndex.get(site);
            if (s == null) {
                throw new IllegalArgumentException("site '" + site + "' of subject '" + id
                        + "' has no training subjects; ComBat cannot harmonize it");
            }
            double[] row = rows.x()[i];
            double[] cov = owner.covariatesOf(id, slopes.length);
            for (int j = 0; j < p; j++) {
                if (!active[j]) {
                    out[i][j] = row[j];
                    continue;
                }
                double m = standardMean(cov, j);
                double z = (row[j] - m) / pooledSd[j];
                out[i][j] = (z - gammaStar[s][j]) / Math.sqrt(delta2Star[s][j]) * pooledSd[j] + m;
            }
        }
        return rows.withValues(out, rows.featureNames());
    }
}
