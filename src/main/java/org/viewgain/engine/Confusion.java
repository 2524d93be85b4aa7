package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;

/** Confusion matrices of the out-of-fold predictions: one per pipeline and repeat, every cell listed (zeros too). */
public final class Confusion {
    private Confusion() {
    }

    /** One cell: how many subjects of group {@code truth} were predicted as {@code predicted} (class indices). */
    public record Cell(Pipeline pipeline, int repeat, int truth, int predicted, long count) {
    }

    /** Cells in pipeline order, then repeat, truth and predicted group in the order of {@code cohort.groups}. */
    public static List<Cell> cells(RunResults res) {
        Experiment ex = res.experiment();
        int classes = ex.spec().cohort().groups().size();
        int repeats = res.plan().repeats();
        List<Pipeline> pipelines = ex.pipelines();
        long[][][][] count = new long[pipelines.size()][repeats][classes][classes];
        java.util.Map<Pipeline, Integer> index = new java.util.HashMap<>();
        for (int k = 0; k < pipelines.size(); k++) {
            index.put(pipelines.get(k), k);
        }
        for (RunResults.Prediction p : res.predictions()) {
            count[index.get(p.pipeline())][p.repeat()][p.truth()][p.predicted()]++;
        }
        List<Cell> out = new ArrayList<>();
        for (int k = 0; k < pipelines.size(); k++) {
            for (int r = 0; r < repeats; r++) {
                for (int t = 0; t < classes; t++) {
                    for (int q = 0; q < classes; q++) {
                        out.add(new Cell(pipelines.get(k), r, t, q, count[k][r][t][q]));
                    }
                }
            }
        }
        return out;
    }
}
