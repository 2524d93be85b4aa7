package org.viewgain.engine;

/**
 * A unit of a run's work. Its {@link #key()} names it in the journal and in a shard's share, and {@link #parse}
 * reads a key back: the one place where units and their text meet. Units are values (records), so they serve as
 * map keys.
 */
sealed interface WorkUnit permits WorkUnit.Imputation, WorkUnit.Classifier, WorkUnit.Final, WorkUnit.Permutation {

    /** The key in the journal, e.g. {@code c/3/7}. */
    String key();

    /** Whether the unit belongs to an availability curve's level rather than to the run itself. */
    default boolean curve() {
        return false;
    }

    /**
     * An imputer fitted in one outer fold: of the run ({@code level} -1, key {@code i/slot/imputer}) or of an
     * availability curve's level (key {@code ai/level/slot/imputer}). Label-free; its summary is journaled.
     */
    record Imputation(int level, int slot, int imputer) implements WorkUnit {
        public Imputation {
            check(level >= -1 && slot >= 0 && imputer >= 0);
        }

        static Imputation of(int slot, int imputer) {
            return new Imputation(-1, slot, imputer);
        }

        @Override
        public String key() {
            return (level < 0 ? "i/" : "ai/" + level + "/") + slot + "/" + imputer;
        }

        @Override
        public boolean curve() {
            return level >= 0;
        }
    }

    /**
     * A pipeline trained and tested in one outer fold: of the run ({@code level} -1, key {@code c/slot/pipeline})
     * or of an availability curve's level (key {@code ac/level/slot/pipeline}).
     */
    record Classifier(int level, int slot, int pipeline) implements WorkUnit {
        public Classifier {
            check(level >= -1 && slot >= 0 && pipeline >= 0);
        }

        static Classifier of(int slot, int pipeline) {
            return new Classifier(-1, slot, pipeline);
        }

        @Override
        public String key() {
            return (level < 0 ? "c/" : "ac/" + level + "/") + slot + "/" + pipeline;
        }

        @Override
        public boolean curve() {
            return level >= 0;
        }
    }

    /** A pipeline refitted on the whole development cohort (key {@code f/pipeline}). */
    record Final(int pipeline) implements WorkUnit {
        public Final {
            check(pipeline >= 0);
        }

        @Override
        public String key() {
            return "f/" + pipeline;
        }
    }

    /** One permutation's statistic of one pipeline, {@code k} from 0 (key {@code p/pipeline/k}). */
    record Permutation(int pipeline, int k) implements WorkUnit {
        public Permutation {
            check(pipeline >= 0 && k >= 0);
        }

        @Override
        public String key() {
            return "p/" + pipeline + "/" + k;
        }
    }

    /** Indices are positions: not negative (a level of -1 means the run itself). */
    private static void check(boolean ok) {
        if (!ok) {
            throw new IllegalArgumentException("a work unit's indices must not be negative");
        }
    }

    /**
     * The unit a key names.
     *
     * @throws IllegalArgumentException for text that is no unit's key
     */
    static WorkUnit parse(String key) {
        String[] parts = key.split("/", -1);
        try {
            int[] n = new int[parts.length - 1];
            for (int i = 1; i < parts.length; i++) {
                n[i - 1] = Integer.parseInt(parts[i]);
            }
            WorkUnit u = switch (parts[0]) {
                case "i" -> n.length == 2 ? Imputation.of(n[0], n[1]) : null;
                case "c" -> n.length == 2 ? Classifier.of(n[0], n[1]) : null;
                case "ai" -> n.length == 3 ? new Imputation(n[0], n[1], n[2]) : null;
                case "ac" -> n.length == 3 ? new Classifier(n[0], n[1], n[2]) : null;
                case "f" -> n.length == 1 ? new Final(n[0]) : null;
                case "p" -> n.length == 2 ? new Permutation(n[0], n[1]) : null;
                default -> null;
            };
            if (u != null && u.key().equals(key)) {
                return u;
            }
        } catch (IllegalArgumentException e) {
            // not numbers, or numbers out of range: falls through to the refusal
        }
        throw new IllegalArgumentException("not a work unit's key: '" + key + "'");
    }
}
