package org.viewgain.cohort;

import java.util.Arrays;
import java.util.stream.Collectors;

/**
 * A numeric n-dimensional array read from a binary file (.npy or .mat): its shape and its elements by index, in the
 * file's own axis order whatever its memory order.
 */
interface NumericArray {
    /** The size of every axis. */
    int[] shape();

    /** The element at {@code index} (one entry per axis, 0-based), as a double. */
    double get(int[] index);

    /** The shape as people write it: {@code 3 x 4 x 4}. */
    static String describe(int[] shape) {
        return shape.length == 0 ? "a single value"
                : Arrays.stream(shape).mapToObj(Integer::toString).collect(Collectors.joining(" x "));
    }
}
