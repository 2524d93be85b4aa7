package org.viewgain.imputation;

import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;

/**
 * Imputations made by another program, read from one CSV file (layout in docs/external-imputations.md; the tasks
 * come from {@code viewgain folds}). A fit looks up the task of its {@link FitContext} ({@code final} for the final
 * fit, {@code cross-fit} with the inner fold for a cross-fit), refuses the file when it holds a row for one of the
 * fit's training subjects (the outside program would then have seen that subject's target), and imputes by returning
 * the file's rows. A fitted imputer expects all of its task's subjects in one {@code impute} call, as the engine
 * makes it: a row for any other subject is refused as unknown.
 *
 * <p>The file is read once per instance and path, lazily and thread-safely; its rows are never changed.
 */
public final class ExternalImputer implements ViewImputer {

    /** The name used in specs. */
    public static final String METHOD = "external";

    private final Map<String, ExternalImputations> loaded = new ConcurrentHashMap<>();

    @Override
    public String method() {
        return METHOD;
    }

    @Override
    public List<ParamDef> parameters() {
        return List.of(ParamDef.path("file", "CSV of imputations written by an outside program for the tasks of "
                + "'viewgain folds' (relative to the spec file)"));
    }

    @Override
    public Fitted fit(FitContext ctx, Rows source, Rows target, Params params) {
        Shapes.checkTraining(METHOD, source, target);
        ExternalImputations file = loaded.computeIfAbsent(params.getString("file"),
                f -> ExternalImputations.read(Path.of(f)));
        checkFeatures(file, target.featureNames());
        ExternalImputations.Key key = key(ctx);
        Map<String, ExternalImputations.Entry> rows = file.task(key);
        for (String id : target.ids()) {
            ExternalImputations.Entry e = rows.get(id);
            if (e != null) {
                throw new BadInputException(file.file() + ":" + e.line() + ": subject '" + id + "' is a training "
                        + "subject of " + key + "; an imputation for it means the outside program saw its target");
            }
        }
        return (c, news) -> impute(file, key, rows, news);
    }

    private static double[][] impute(ExternalImputations file, ExternalImputations.Key key,
                                     Map<String, ExternalImputations.Entry> rows, Rows news) {
        double[][] out = new double[news.n()][];
        Set<String> asked = new HashSet<>(news.ids());
        for (int i = 0; i < out.length; i++) {
            ExternalImputations.Entry e = rows.get(news.ids().get(i));
            if (e == null) {
                throw new BadInputException(file.file() + ": no row for " + key + ", subject '" + news.ids().get(i)
                        + "'" + (rows.isEmpty() ? " (the file has no rows for this task)" : ""));
            }
            out[i] = e.values().clone();
        }
        ExternalImputations.Entry extra = null;
        String extraId = null;
        for (Map.Entry<String, ExternalImputations.Entry> e : rows.entrySet()) {
            if (!asked.contains(e.getKey()) && (extra == null || e.getValue().line() < extra.line())) {
                extra = e.getValue();
                extraId = e.getKey();
            }
        }
        if (extra != null) {
            throw new BadInputException(file.file() + ":" + extra.line() + ": unknown subject '" + extraId + "' for "
                    + key + ": not a subject this task imputes (see tasks.csv of viewgain folds)");
        }
        return out;
    }

    private static void checkFeatures(ExternalImputations file, List<String> expected) {
        List<String> got = file.features();
        int shift = ExternalImputations.KEY_COLUMNS.size();
        for (int c = 0; c < Math.min(got.size(), expected.size()); c++) {
            if (!got.get(c).equals(expected.get(c))) {
                throw new BadInputException(file.file() + ":1: column " + (c + shift + 1) + " is '" + got.get(c)
                        + "', expected target feature '" + expected.get(c) + "' (target_features.csv of viewgain"
                        + " folds lists them in order)");
            }
        }
        if (got.size() != expected.size()) {
            throw new BadInputException(file.file() + ":1: " + got.size() + " target feature columns, expected "
                    + expected.size() + " (target_features.csv of viewgain folds lists them in order)");
        }
    }

    private static ExternalImputations.Key key(FitContext ctx) {
        return switch (ctx.role()) {
            case FINAL -> new ExternalImputations.Key(ctx.repeat() + 1, ctx.outerFold() + 1,
                    ExternalImputations.FINAL, 0);
            case CROSS_FIT -> new ExternalImputations.Key(ctx.repeat() + 1, ctx.outerFold() + 1,
                    ExternalImputations.CROSS_FIT, ctx.innerFold() + 1);
            case TUNE, NESTED -> throw new IllegalStateException("external imputations exist for final and cross-fit fits"
                    + " only, not for " + ctx);
        };
    }
}
