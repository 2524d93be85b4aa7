package org.viewgain.demo;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/**
 * The invented generative model behind the demo cohort. Each subject has a few latent factors; both views express
 * all of them through region-structured loadings, so the target view is predictable from the source view. The first
 * {@link #GROUP_FACTORS} factors are shifted by group and are expressed strongly in the target view but only weakly
 * in the source view, which also carries more noise and a site shift. Edge values are logistic-squashed into 0..1,
 * like similarities.
 */
final class DemoModel {
    static final int SUBJECTS_PER_GROUP = 60;
    static final int FACTORS = 6;
    static final int GROUP_FACTORS = 2;
    static final double GROUP_SHIFT = 1.0;
    static final double TARGET_MISSING = 0.3;
    private static final String[] HEMISPHERES = {"L", "R"};
    private static final String[] LOBES = {"frontal", "parietal", "temporal", "occipital"};
    private static final int PER_LOBE = 3;
    private static final double SCALE = 0.3;
    private static final double MEAN_AGE = 48;

    /** One invented subject with both views' upper triangles (the target is written only when observed). */
    record Person(String id, String group, String site, double age, int sex, boolean targetObserved,
                  double[] source, double[] target) {
    }

    /** How one view expresses the latent factors. */
    private record ViewModel(double[] mean, double[][] loadings, double groupScale, double noise, double[] ageSlope) {
    }

    private final List<String> regions = new ArrayList<>();
    private final int edges;
    private final ViewModel sourceModel;
    private final ViewModel targetModel;
    private final double[] siteShift;

    DemoModel(SplittableRandom structure) {
        for (String h : HEMISPHERES) {
            for (String lobe : LOBES) {
                for (int k = 1; k <= PER_LOBE; k++) {
                    regions.add(h + "_" + lobe + "_" + k);
                }
            }
        }
        int n = regions.size();
        edges = n * (n - 1) / 2;
        sourceModel = viewModel(structure, new double[] {-0.3, 0.9, 0.4, 0.8}, 0.3, 0.9);
        targetModel = viewModel(structure, new double[] {-0.6, 0.5, 0.8, 1.1}, 1.5, 0.4);
        siteShift = new double[edges];
        for (int e = 0; e < edges; e++) {
            siteShift[e] = 0.8 + 0.3 * structure.nextGaussian();
        }
    }

    List<String> regions() {
        return regions;
    }

    /** Draws the cohort: equal groups in shuffled order, sites, age, sex, latent factors, views and missingness. */
    List<Person> cohort(SplittableRandom subjects, SplittableRandom missingness) {
        int total = 2 * SUBJECTS_PER_GROUP;
        String[] groups = new String[total];
        for (int i = 0; i < total; i++) {
            groups[i] = i < SUBJECTS_PER_GROUP ? "patient" : "control";
        }
        for (int i = total - 1; i > 0; i--) {
            int j = subjects.nextInt(i + 1);
            String t = groups[i];
            groups[i] = groups[j];
            groups[j] = t;
        }
        boolean[] missing = missingTargets(total, missingness);
        List<Person> people = new ArrayList<>(total);
        for (int s = 0; s < total; s++) {
            String site = subjects.nextBoolean() ? "north" : "south";
            double age = Math.round(10 * Math.max(20, Math.min(80, MEAN_AGE + 11 * subjects.nextGaussian()))) / 10.0;
            int sex = subjects.nextBoolean() ? 1 : 0;
            double sign = groups[s].equals("patient") ? 0.5 : -0.5;
            double[] z = new double[FACTORS];
            for (int k = 0; k < FACTORS; k++) {
                z[k] = subjects.nextGaussian() + (k < GROUP_FACTORS ? sign * GROUP_SHIFT : 0);
            }
            double[] source = draw(sourceModel, z, age, site.equals("south") ? siteShift : null, subjects);
            double[] target = draw(targetModel, z, age, null, subjects);
            people.add(new Person(String.format("sub-%03d", s + 1), groups[s], site, age, sex, !missing[s], source,
                    target));
        }
        return people;
    }

    /** Exactly round(30%) of subjects, a uniform random subset drawn apart from everything else (so not by group). */
    private static boolean[] missingTargets(int total, SplittableRandom rnd) {
        int[] order = new int[total];
        for (int i = 0; i < total; i++) {
            order[i] = i;
        }
        boolean[] missing = new boolean[total];
        int count = (int) Math.round(TARGET_MISSING * total);
        for (int i = 0; i < count; i++) {
            int j = i + rnd.nextInt(total - i);
            int t = order[i];
            order[i] = order[j];
            order[j] = t;
            missing[order[i]] = true;
        }
        return missing;
    }

    private double[] draw(ViewModel m, double[] z, double age, double[] site, SplittableRandom rnd) {
        double[] v = new double[edges];
        for (int e = 0; e < edges; e++) {
            double signal = 0;
            for (int k = 0; k < FACTORS; k++) {
                signal += m.loadings[e][k] * z[k] * (k < GROUP_FACTORS ? m.groupScale : 1.0);
            }
            double eta = m.mean[e] + SCALE * (signal + m.noise * rnd.nextGaussian())
                    + m.ageSlope[e] * (age - MEAN_AGE) + (site == null ? 0 : SCALE * site[e]);
            v[e] = 1 / (1 + Math.exp(-eta));
        }
        return v;
    }

    /**
     * Edge means from invented anatomy (same lobe, same hemisphere, homotopic pairs are more similar) and loadings
     * that are region-structured: a factor moves all edges of the regions it loads on.
     */
    private ViewModel viewModel(SplittableRandom rnd, double[] effects, double groupScale, double noise) {
        int n = regions.size();
        double[][] regionLoad = new double[n][FACTORS];
        for (double[] row : regionLoad) {
            for (int k = 0; k < FACTORS; k++) {
                row[k] = rnd.nextGaussian();
            }
        }
        double[] mean = new double[edges];
        double[][] loadings = new double[edges][FACTORS];
        double[] ageSlope = new double[edges];
        int e = 0;
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                String[] a = regions.get(i).split("_");
                String[] b = regions.get(j).split("_");
                boolean sameHemi = a[0].equals(b[0]);
                boolean sameLobe = sameHemi && a[1].equals(b[1]);
                boolean homotopic = !sameHemi && a[1].equals(b[1]) && a[2].equals(b[2]);
                mean[e] = effects[0] + (sameLobe ? effects[1] : 0) + (sameHemi ? effects[2] : 0)
                        + (homotopic ? effects[3] : 0) + 0.2 * rnd.nextGaussian();
                for (int k = 0; k < FACTORS; k++) {
                    loadings[e][k] = (regionLoad[i][k] + regionLoad[j][k]) / Math.sqrt(2) + 0.3 * rnd.nextGaussian();
                }
                ageSlope[e] = -0.004 * (1 + 0.5 * rnd.nextGaussian());
                e++;
            }
        }
        return new ViewModel(mean, loadings, groupScale, noise, ageSlope);
    }
}
