package org.viewgain.run;

import java.nio.file.Path;
import java.util.List;
import org.viewgain.engine.Evaluation;

/** How a run ended, for the command to print. */
public sealed interface RunOutcome {
    /** A whole run (fresh, resumed or merged) with its tables, run.json and, if it could be drawn, its report. */
    record Finished(Path folder, List<Evaluation.MetricRow> metrics, double confidence) implements RunOutcome {
        public Finished {
            metrics = List.copyOf(metrics);
        }
    }

    /** A shard whose share of units is journaled. */
    record ShardFinished(String shard, int units, Path folder) implements RunOutcome {
    }

    /**
     * A run stopped by an error; run.json says failed (when it could still be written) and the journal keeps the
     * finished units.
     *
     * @param what       one phrase naming the cause
     * @param resumeWith the command that continues the run
     */
    record Failed(String what, String resumeWith, Throwable cause) implements RunOutcome {
    }
}
