package org.viewgain.folds;

import java.nio.charset.StandardCharsets;

/**
 * Seeds derived from the run seed and the coordinates of a piece of work, so that no result depends on the thread
 * count or the order in which work runs. The mixing function is SplitMix64's finalizer (Steele, Lea &amp; Flood 2014).
 */
public final class Seeds {
    private Seeds() {
    }

    /** A seed for the given coordinates; equal inputs give equal seeds, any change gives an unrelated seed. */
    public static long derive(long runSeed, Object... parts) {
        long h = mix(runSeed ^ 0x9E3779B97F4A7C15L);
        for (Object p : parts) {
            long v;
            if (p instanceof Number n) {
                v = n.longValue();
            } else {
                v = 1125899906842597L;
                for (byte b : String.valueOf(p).getBytes(StandardCharsets.UTF_8)) {
                    v = 31 * v + b;
                }
            }
            h = mix(h + 0x9E3779B97F4A7C15L + mix(v));
        }
        return h;
    }

    /** A non-negative int seed for libraries that take one (Weka), narrowed deterministically. */
    public static int toInt(long seed) {
        return (int) (mix(seed) >>> 33);
    }

    static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }
}
