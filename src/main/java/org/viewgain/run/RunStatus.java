package org.viewgain.run;

/** The status a run folder's {@code run.json} records, with its spelling there. */
public enum RunStatus {
    /** Started; units are being journaled (also what a killed run leaves). */
    RUNNING("running"),
    /** Every table (or, for a shard, every unit of its share) is written. */
    COMPLETE("complete"),
    /** Stopped by an error; the journal keeps the finished units for {@code --resume}. */
    FAILED("failed");

    private final String label;

    RunStatus(String label) {
        this.label = label;
    }

    /** The spelling in run.json. */
    public String label() {
        return label;
    }
}
