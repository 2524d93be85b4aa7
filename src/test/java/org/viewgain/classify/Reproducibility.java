package org.viewgain.classify;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.Params;

/** Fits a method on a fixed train/test split, once alone and several times concurrently, to compare predictions. */
final class Reproducibility {
    private Reproducibility() {
    }

    static Predictions fitAndPredict(ClassifierMethod method, Params params, ReferenceTable table, int[] train,
                                     int[] test, long seed) {
        FitContext ctx = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, seed);
        Rows trainRows = table.rows().select(train);
        return method.fit(ctx, trainRows, ReferenceTable.pick(table.y(), train), table.classes(), params)
                .predict(table.rows().select(test));
    }

    /** Runs the same fit {@code copies} times on 4 threads at once, interleaved with fits under other seeds. */
    static List<Predictions> concurrently(ClassifierMethod method, Params params, ReferenceTable table, int[] train,
                                          int[] test, long seed, int copies) throws Exception {
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<Predictions>> same = new ArrayList<>();
            List<Future<Predictions>> noise = new ArrayList<>();
            for (int c = 0; c < copies; c++) {
                same.add(pool.submit(() -> fitAndPredict(method, params, table, train, test, seed)));
                long other = seed + 1000 + c;
                noise.add(pool.submit(() -> fitAndPredict(method, params, table, train, test, other)));
            }
            List<Predictions> out = new ArrayList<>();
            for (Future<Predictions> f : same) {
                out.add(f.get());
            }
            for (Future<Predictions> f : noise) {
                f.get();
            }
            return out;
        } finally {
            pool.shutdownNow();
        }
    }
}
