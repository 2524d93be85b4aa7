package org.viewgain.engine;

import org.viewgain.spec.BadInputException;

/**
 * One share of a run's work units for a cluster job: shard {@code index} of {@code count} (from 1) owns the units
 * whose position in each phase's fixed unit order leaves remainder {@code index - 1} when divided by {@code count}.
 * Permutations are shared by permutation number.
 */
public record Shard(int index, int count) {
    public Shard {
        if (!(count >= 1 && index >= 1 && index <= count)) {
            throw new BadInputException("--shard must be I/N with 1 <= I <= N, got " + index + "/" + count);
        }
    }

    /** Parses {@code I/N}. */
    public static Shard parse(String text) {
        String[] parts = text.trim().split("/");
        try {
            if (parts.length == 2) {
                return new Shard(Integer.parseInt(parts[0].trim()), Integer.parseInt(parts[1].trim()));
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new BadInputException("--shard must be I/N with 1 <= I <= N (e.g. 2/8), got '" + text + "'");
    }

    /** Whether this shard owns the unit at {@code position} of its phase's unit order. */
    public boolean owns(long position) {
        return position % count == index - 1;
    }

    /** {@code I/N}. */
    public String label() {
        return index + "/" + count;
    }
}
