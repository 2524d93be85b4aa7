package org.viewgain.prep;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.SingularMatrixException;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;

/**
 * Site harmonization by ComBat, parametric empirical Bayes (Johnson, Li &amp; Rabinovic 2007, Biostatistics
 * 8:118-127): per feature, {@code y = alpha + C beta + gamma_site + delta_site * e}; the site location and scale
 * estimates are shrunk toward their across-feature priors and removed. Fitted on training rows; applies to rows of
 * sites seen in training, and refuses a row from an unseen site. Optional covariates (never the diagnosis) are kept
 * in the data. Each site needs at least 2 training rows; features constant in training pass through unchanged.
 */
public final class ComBat implements Transform {

    private final Map<String, String> siteById;
    private final Map<String, double[]> covariatesById;

    /** @param siteById site of every subject that may be fitted or harmonized */
    public ComBat(Map<String, String> siteById) {
        this(siteById, Map.of());
    }

    /**
     * @param siteById       site of every subject that may be fitted or harmonized
     * @param covariatesById covariate values per subject (same length for all), or an empty map for none
     */
    public ComBat(Map<String, String> siteById, Map<String, double[]> covariatesById) {
        this.siteById = Map.copyOf(siteById);
        this.covariatesById = Map.copyOf(covariatesById);
    }

    @Override
    public String name() {
        return "combat";
    }

    String siteOf(String id) {
        String site = siteById.get(id);
        if (site == null) {
            throw new IllegalArgumentException("subject '" + id + "' has no site; ComBat needs one for every subject");
        }
        return site;
    }

    double[] covariatesOf(String id, int q) {
        if (q == 0) {
            return new double[0];
        }
        double[] c = covariatesById.get(id);
        if (c == null || c.length != q) {
            throw new IllegalArgumentException("subject '" + id + "' has no covariate values for ComBat");
        }
        return c;
    }

    private int covariateCount() {
        return covariatesById.values().stream().findFirst().map(c -> c.length).orElse(0);
    }

    @Override
    public Fitted fit(FitContext ctx, Rows train, int[] y) {
        int n = train.n();
        int p = train.p();
        int q = covariateCount();
        Map<String, List<Integer>> members = new TreeMap<>();
        for (int i = 0; i < n; i++) {
            members.computeIfAbsent(siteOf(train.ids().get(i)), s -> new ArrayList<>()).add(i);
        }
        List<String> sites = List.copyOf(members.keySet());
        for (String s : sites) {
            if (members.get(s).size() < 2) {
                throw new IllegalArgumentException("site '" + s + "' has " + members.get(s).size()
                        + " training subject(s); ComBat needs at least 2 per site");
            }
        }
        int k = sites.size();
        Map<String, Integer> siteIndex = new HashMap<>();
        for (int s = 0; s < k; s++) {
            siteIndex.put(sites.get(s), s);
        }
        // Design: one indicator per site (together they span the intercept), then the covariates.
        double[][] design = new double[n][k + q];
        for (int i = 0; i < n; i++) {
            String id = train.ids().get(i);
            design[i][siteIndex.get(siteOf(id))] = 1;
            System.arraycopy(covariatesOf(id, q), 0, design[i], k, q);
        }
        double[][] beta;
        try {
            beta = new QRDecomposition(new Array2DRowRealMatrix(design, false), 1e-10).getSolver()
                    .solve(new Array2DRowRealMatrix(train.x(), false)).getData();
        } catch (SingularMatrixException e) {
            throw new IllegalArgumentException("ComBat covariates are collinear with the sites on the training rows");
        }
        double[] alpha = new double[p];
        for (int s = 0; s < k; s++) {
            double weight = members.get(sites.get(s)).size() / (double) n;
            for (int j = 0; j < p; j++) {
                alpha[j] += weight * beta[s][j];
            }
        }
        double[][] slopes = new double[q][];
        System.arraycopy(beta, k, slopes, 0, q);
        double[] pooledSd = new double[p];
        for (int j = 0; j < p; j++) {
            double ss = 0;
            for (int i = 0; i < n; i++) {
                double fitted = 0;
                for (int c = 0; c < k + q; c++) {
                    fitted += design[i][c] * beta[c][j];
                }
                ss += (train.x()[i][j] - fitted) * (train.x()[i][j] - fitted);
            }
            pooledSd[j] = Math.sqrt(ss / n);
        }
        ComBatFit fit = new ComBatFit(this, siteIndex, alpha, slopes, pooledSd);
        fit.estimateSites(train, members, sites);
        return fit;
    }
}
