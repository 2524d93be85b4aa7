package org.viewgain.stats;

/** Monte Carlo permutation p-values that never reach 0 (Ojala &amp; Garriga 2010, JMLR 11:1833-1863). */
public final class PermutationP {
    private PermutationP() {
    }

    /**
     * p = (C + 1) / (N + 1), C the number of permuted scores at least as good as the observed one, N the number
     * of permutations.
     */
    public static double ojalaGarriga(int exceedances, int permutations) {
        if (!(permutations >= 0 && exceedances >= 0 && exceedances <= permutations)) {
            throw new IllegalArgumentException("need 0 <= exceedances <= permutations, got " + exceedances + " of "
                    + permutations);
        }
        return (exceedances + 1.0) / (permutations + 1.0);
    }
}
