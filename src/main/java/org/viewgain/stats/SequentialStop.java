package org.viewgain.stats;

/**
 * Sequential Monte Carlo p-value (Besag &amp; Clifford 1991, Biometrika 78:301-304), as an immutable state: feed
 * permuted scores one at a time with {@link #next(double)} until {@link #stopped()}. Drawing stops when h permuted
 * scores have reached the observed score (p = h / l after l draws) or after maxDraws draws (p = (g + 1) /
 * (maxDraws + 1) with g &lt; h exceedances). Higher scores are better; a tie counts as reaching the observed score.
 */
public final class SequentialStop {
    private final double observed;
    private final int h;
    private final int maxDraws;
    private final int draws;
    private final int exceedances;

    private SequentialStop(double observed, int h, int maxDraws, int draws, int exceedances) {
        this.observed = observed;
        this.h = h;
        this.maxDraws = maxDraws;
        this.draws = draws;
        this.exceedances = exceedances;
    }

    /**
     * The state before any draw.
     *
     * @param observed the score on the real labels
     * @param h        number of exceedances that stops drawing, at least 1
     * @param maxDraws largest number of permutations, at least h
     */
    public static SequentialStop start(double observed, int h, int maxDraws) {
        if (Double.isNaN(observed)) {
            throw new IllegalArgumentException("observed score is NaN");
        }
        if (!(h >= 1 && maxDraws >= h)) {
            throw new IllegalArgumentException("need 1 <= h <= maxDraws, got h=" + h + ", maxDraws=" + maxDraws);
        }
        return new SequentialStop(observed, h, maxDraws, 0, 0);
    }

    /**
     * The state after one more permuted score. A NaN score counts as reaching the observed one: an undefined
     * permuted score cannot count as evidence against the null (conservative).
     */
    public SequentialStop next(double permutedScore) {
        if (stopped()) {
            throw new IllegalStateException("already stopped after " + draws + " draws");
        }
        int g = permutedScore < observed ? exceedances : exceedances + 1;
        return new SequentialStop(observed, h, maxDraws, draws + 1, g);
    }

    /** True when no more permutations are needed. */
    public boolean stopped() {
        return exceedances >= h || draws >= maxDraws;
    }

    /** True when drawing stopped because h exceedances were reached. */
    public boolean stoppedEarly() {
        return exceedances >= h;
    }

    /** Permutations drawn so far (l). */
    public int draws() {
        return draws;
    }

    /** Permuted scores so far at least as good as the observed one (g). */
    public int exceedances() {
        return exceedances;
    }

    /**
     * The Besag-Clifford p-value once stopped: h / l if h exceedances were reached, else (g + 1) / (maxDraws + 1).
     *
     * @throws IllegalStateException before drawing has stopped
     */
    public double pValue() {
        if (stoppedEarly()) {
            return h / (double) draws;
        }
        if (draws >= maxDraws) {
            return PermutationP.ojalaGarriga(exceedances, maxDraws);
        }
        throw new IllegalStateException("not stopped: " + draws + " of at most " + maxDraws + " draws");
    }
}
