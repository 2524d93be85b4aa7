package org.viewgain.imputation;

import org.viewgain.cohort.Rows;

/** Size checks shared by the imputers: training blocks must match and be non-empty, new rows must be as wide. */
final class Shapes {
    private Shapes() {
    }

    static void checkTraining(String method, Rows source, Rows target) {
        if (source.n() != target.n()) {
            throw new IllegalArgumentException(method + ": source has " + source.n() + " subjects but target has "
                    + target.n());
        }
        if (!source.ids().equals(target.ids())) {
            throw new IllegalArgumentException(method + ": source and target rows are not the same subjects in the"
                    + " same order");
        }
        if (source.n() < 1 || source.p() < 1 || target.p() < 1) {
            throw new IllegalArgumentException(method + ": needs at least one training subject, one source feature"
                    + " and one target feature");
        }
    }

    static void checkWidth(String method, Rows source, int p) {
        if (source.p() != p) {
            throw new IllegalArgumentException(method + ": fitted on " + p + " source features but given "
                    + source.p());
        }
    }
}
