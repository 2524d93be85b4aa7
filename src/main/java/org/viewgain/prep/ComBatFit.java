package org.viewgain.prep;

import java.util.List;
import java.util.Map;
import org.viewgain.cohort.Rows;

/**
 * ComBat fitted on training rows: standardization (with the covariates' slopes) and the per-site posterior location
 * and scale. It can be frozen into a bundle and applied to subjects of another cohort from the sites it was fitted
 * on; a subject of any other site is refused, never given another site's parameters.
 */
final class ComBatFit implements Transform.Fitted, Transform.PerSubject, org.viewgain.frozen.Freezable {
    static final String KIND = "combat";

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

    @Override
    public Transform.Fitted forCohort(Map<String, String> siteById, Map<String, double[]> covariatesById) {
        ComBatFit f = new ComBatFit(new ComBat(siteById, slopes.length == 0 ? Map.of() : covariatesById), siteIndex,
                alpha, slopes, pooledSd);
        f.gammaStar = gammaStar;
        f.delta2Star = delta2Star;
        return f;
    }

    @Override
    public String kind() {
        return KIND;
    }

    /** Site names in the order of their parameters. */
    private List<String> siteNames() {
        String[] names = new String[siteIndex.size()];
        siteIndex.forEach((site, s) -> names[s] = site);
        return List.of(names);
    }

    @Override
    public void freeze(org.viewgain.frozen.FrozenOut out) {
        out.texts(siteNames()).numbers(alpha).matrix(slopes).numbers(pooledSd).matrix(gammaStar).matrix(delta2Star);
    }

    /**
     * A frozen ComBat read back; it needs the sites (and covariates) of the cohort it is applied to
     * ({@link #forCohort}).
     */
    static ComBatFit thaw(org.viewgain.frozen.FrozenIn in) {
        List<String> sites = in.texts();
        double[] alpha = in.numbers();
        double[][] slopes = in.matrix();
        double[] pooledSd = in.numbers();
        double[][] gamma = in.matrix();
        double[][] delta2 = in.matrix();
        if (sites == null || alpha == null || slopes == null || pooledSd == null || gamma == null || delta2 == null
                || sites.isEmpty() || alpha.length != pooledSd.length || gamma.length != sites.size()
                || delta2.length != sites.size()
                || java.util.Arrays.stream(slopes).anyMatch(r -> r == null || r.length != alpha.length)) {
            throw in.bad("sites, covariates and parameters differ in count");
        }
        Map<String, Integer> index = new java.util.HashMap<>();
        for (int s = 0; s < sites.size(); s++) {
            if (gamma[s].length != alpha.length || delta2[s].length != alpha.length
                    || index.put(sites.get(s), s) != null) {
                throw in.bad("a site's parameters differ in length from the features, or a site is repeated");
            }
        }
        ComBatFit f = new ComBatFit(new ComBat(Map.of(), Map.of()), index, alpha, slopes, pooledSd);
        f.gammaStar = gamma;
        f.delta2Star = delta2;
        return f;
    }

    /** How many covariates the fit keeps (ComBat's protected covariates). */
    int covariates() {
        return slopes.length;
    }

    /** The sites this fit has parameters for, sorted. */
    java.util.SortedSet<String> sites() {
        return new java.util.TreeSet<>(siteIndex.keySet());
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
