package org.viewgain.engine;

import java.util.List;
import org.viewgain.classify.ClassifierMethod;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.spec.Params;

/** Methods of a spec found in the registries, with their grids expanded into checked points. */
public final class Resolved {
    private Resolved() {
    }

    /** An imputer entry: its name in the spec, the method and the grid points (at least one). */
    public record Imputer(String name, ViewImputer method, List<Params> grid) {
        public Imputer {
            grid = List.copyOf(grid);
        }
    }

    /** A classifier entry: its name in the spec, the method and the grid points (at least one). */
    public record Classifier(String name, ClassifierMethod method, List<Params> grid) {
        public Classifier {
            grid = List.copyOf(grid);
        }
    }
}
