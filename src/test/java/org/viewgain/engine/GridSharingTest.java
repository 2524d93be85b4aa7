package org.viewgain.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentLinkedQueue;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.viewgain.classify.ClassifierMethod;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.prep.Transform;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import org.viewgain.spec.SpecLoader;
import org.viewgain.testing.TestCohorts;

/**
 * The engine hands every grid point that sees the same rows to one {@link ClassifierMethod#fitGrid} call, so that a
 * method's label-free work on those rows (the forest's bins, the SVM's kernel matrix; counted in BinnedForestTest
 * and KernelSvmTest) is done once per training block rather than once per grid point. Counted here by recording the
 * calls; nothing is timed.
 */
class GridSharingTest {
    @TempDir
    Path dir;

    record Call(FitContext ctx, Rows rows, int points) {
    }

    @Test
    void givenAGridOfSixPoints_whenTuned_thenOneCallPerInnerFoldCarriesAllSixOnTheSameRows() {
        TestCohorts.synthetic(dir, 40, 5, 4, 1.0, 0.3, 3);
        String body = """
                imputers:
                  - { name: ridge, method: ridge, fixed: { alpha: 5 } }
                feature-sets: [source, source+imputed]
                classifiers:
                  - { name: svm, method: svm-rbf, grid: { C: [0.1, 1, 10], gamma: [scale, 0.01] } }
                validation: { outer: { folds: 4, repeats: 1 }, inner: { folds: 3 } }
                significance: { permutations: 0, bootstrap: 0 }
                """;
        ConcurrentLinkedQueue<Call> calls = new ConcurrentLinkedQueue<>();
        Experiment ex = Setup.prepare(SpecLoader.load(TestCohorts.spec(dir, body)), counting(calls));
        new Runner(ex, 2, Progress.NONE).run();
        long tune = calls.stream().filter(c -> c.ctx().role() == FitContext.Role.TUNE).count();
        // 2 pipelines x 4 outer folds x 3 inner folds, each once with all 6 points
        assertEquals(2 * 4 * 3, tune);
        assertTrue(calls.stream().filter(c -> c.ctx().role() == FitContext.Role.TUNE).allMatch(c -> c.points() == 6),
                "every tuning call carries the whole grid");
        // the final fits: one point each, 2 pipelines x 4 outer folds
        assertEquals(2 * 4, calls.stream().filter(c -> c.ctx().role() == FitContext.Role.FINAL).count());
    }

    /** Standard methods whose classifiers record each fitGrid call (and check its points share one row block). */
    private static Methods counting(ConcurrentLinkedQueue<Call> calls) {
        Methods real = Methods.standard();
        return new Methods() {
            @Override
            public ViewImputer imputer(String method) {
                return real.imputer(method);
            }

            @Override
            public Transform scaler(String scale) {
                return real.scaler(scale);
            }

            @Override
            public ClassifierMethod classifier(String method, String wekaClass, String wekaOptions) {
                ClassifierMethod d = real.classifier(method, wekaClass, wekaOptions);
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
                    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
                        calls.add(new Call(ctx, x, 1));
                        return d.fit(ctx, x, y, classes, params);
                    }

                    @Override
                    public List<Model> fitGrid(List<FitContext> contexts, Rows x, int[] y, int classes,
                                               List<Params> grid) {
                        for (FitContext c : contexts) {
                            assertSame(contexts.get(0).role(), c.role());
                            assertEquals(contexts.get(0).innerFold(), c.innerFold());
                        }
                        calls.add(new Call(contexts.get(0), x, grid.size()));
                        return d.fitGrid(contexts, x, y, classes, grid);
                    }
                };
            }
        };
    }
}
