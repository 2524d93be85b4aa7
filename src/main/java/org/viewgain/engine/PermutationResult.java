package org.viewgain.engine;

/**
 * The permutation test of one pipeline.
 *
 * @param observed     the metric on the real labels (mean over repeats)
 * @param null_        the metric under each permutation run, in permutation order
 * @param exceedances  permuted values at least as good as the observed one (NaN counts as reaching it)
 * @param pValue       (C+1)/(N+1), or h/l when stopped early (Besag &amp; Clifford 1991)
 * @param stoppedEarly true when sequential stopping ended the test before the planned number of permutations
 */
public record PermutationResult(Pipeline pipeline, String metric, double observed, double[] null_, int exceedances,
                                double pValue, boolean stoppedEarly, boolean withinSites) {
}
