package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentLinkedQueue;
import org.viewgain.classify.ClassifierMethod;
import org.viewgain.classify.Predictions;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.prep.Transform;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;

/**
 * Recording stand-ins (leakage canaries): they delegate to the real methods and record, for every fit, where it
 * happened, which subjects it saw and the labels it was given.
 */
final class Recording implements Methods {
    /** One fit: what kind of thing was fitted, where, on whom, with which labels (null for label-free fits). */
    record Fit(String kind, FitContext ctx, List<String> ids, int[] labels) {
    }

    /** One call that fitted a classifier's grid points together: where (the first point's context), how many. */
    record Grid(FitContext ctx, int points) {
    }

    final ConcurrentLinkedQueue<Fit> fits = new ConcurrentLinkedQueue<>();
    final ConcurrentLinkedQueue<Grid> grids = new ConcurrentLinkedQueue<>();
    private final Methods real = Methods.standard();

    @Override
    public ViewImputer imputer(String method) {
        ViewImputer d = real.imputer(method);
        return new ViewImputer() {
            @Override
            public String method() {
                return d.method();
            }

            @Override
            public List<ParamDef> parameters() {
                return d.parameters();
            }

            @Override
            public Params resolve(Map<String, Object> raw) {
                return d.resolve(raw);
            }

            @Override
            public Fitted fit(FitContext ctx, Rows source, Rows target, Params params) {
                if (!source.ids().equals(target.ids())) {
                    throw new AssertionError("source and target rows differ");
                }
                fits.add(new Fit("imputer", ctx, source.ids(), null));
                return d.fit(ctx, source, target, params);
            }
        };
    }

    @Override
    public ClassifierMethod classifier(String method, Map<String, String> settings) {
        ClassifierMethod d = real.classifier(method, settings);
        return new ClassifierMethod() {
            @Override
            public String method() {
                return d.method();
            }

            @Override
            public List<ParamDef> parameters() {
                return d.parameters();
            }

            @Override
            public Params resolve(Map<String, Object> raw) {
                return d.resolve(raw);
            }

            @Override
            public boolean producesScores() {
                return d.producesScores();
            }

            @Override
            public String scoreKind() {
                return d.scoreKind();
            }

            @Override
            public List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes, List<Params> grid) {
                for (FitContext c : contexts) {
                    fits.add(new Fit("classifier", c, x.ids(), y.clone()));
                }
                grids.add(new Grid(contexts.get(0), grid.size()));
                return d.fitGrid(contexts, x, y, classes, grid);
            }

            @Override
            public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
                fits.add(new Fit("classifier", ctx, x.ids(), y.clone()));
                Model m = d.fit(ctx, x, y, classes, params);
                return rows -> {
                    Predictions p = m.predict(rows);
                    return p;
                };
            }
        };
    }

    @Override
    public Transform scaler(org.viewgain.spec.Specs.Scaling scale) {
        Transform d = real.scaler(scale);
        if (d == null) {
            return null;
        }
        return new Transform() {
            @Override
            public String name() {
                return d.name();
            }

            @Override
            public Fitted fit(FitContext ctx, Rows train, int[] y) {
                fits.add(new Fit("scaler", ctx, train.ids(), null));
                return d.fit(ctx, train, y);
            }
        };
    }

    @Override
    public Transform selector(String method, int keep) {
        return recorded("selector", real.selector(method, keep), true);
    }

    @Override
    public Transform covariateAdjuster(Map<String, double[]> covariatesById, List<String> names) {
        return recorded("adjuster", real.covariateAdjuster(covariatesById, names), false);
    }

    @Override
    public Transform harmonizer(org.viewgain.spec.Specs.Harmonization method, Map<String, String> siteById,
                                 Map<String, double[]> covariatesById) {
        return recorded("harmonizer", real.harmonizer(method, siteById, covariatesById), false);
    }

    /** A step that records its fits (with labels when it uses them) and delegates. */
    private Transform recorded(String kind, Transform d, boolean labels) {
        return new Transform() {
            @Override
            public String name() {
                return d.name();
            }

            @Override
            public Fitted fit(FitContext ctx, Rows train, int[] y) {
                fits.add(new Fit(kind, ctx, train.ids(), labels ? y.clone() : null));
                return d.fit(ctx, train, y);
            }
        };
    }

    List<Fit> all() {
        return new ArrayList<>(fits);
    }
}
