package org.viewgain.classify;

import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.Params;

/** Out-of-fold accuracy of a classifier on a reference table, for plausibility and agreement checks. */
final class Crossval {
    private Crossval() {
    }

    static double accuracy(ClassifierMethod method, Params params, ReferenceTable table, int k, long seed) {
        int[] fold = table.folds(k, seed);
        int correct = 0;
        for (int f = 0; f < k; f++) {
            int[] train = ReferenceTable.positions(fold, f, false);
            int[] test = ReferenceTable.positions(fold, f, true);
            FitContext ctx = new FitContext(0, 0, f, FitContext.WHOLE, FitContext.Role.FINAL, Seeds.derive(seed, f));
            ClassifierMethod.Model model = method.fit(ctx, table.rows().select(train),
                    ReferenceTable.pick(table.y(), train), table.classes(), params);
            int[] predicted = model.predict(table.rows().select(test)).labels();
            for (int i = 0; i < test.length; i++) {
                if (predicted[i] == table.y()[test[i]]) {
                    correct++;
                }
            }
        }
        return correct / (double) table.y().length;
    }
}
