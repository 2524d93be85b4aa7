package org.viewgain.engine;

import org.viewgain.classify.ClassifierMethod;
import org.viewgain.classify.ClassifierRegistry;
import org.viewgain.imputation.ImputerRegistry;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.prep.Standardize;
import org.viewgain.prep.Transform;

/**
 * Where the engine finds its methods. The standard set looks names up in the registries; tests substitute recording
 * stand-ins to prove that nothing fitted sees an outer-test subject.
 */
public interface Methods {

    /** @throws IllegalArgumentException for an unknown method, listing the known ones */
    ViewImputer imputer(String method);

    /** @throws IllegalArgumentException for an unknown method or a bad Weka class/options */
    ClassifierMethod classifier(String method, String wekaClass, String wekaOptions);

    /** The scaling step for {@code features.scale}, or null for {@code none}. */
    Transform scaler(String scale);

    /** The methods of the registries. */
    static Methods standard() {
        return new Methods() {
            @Override
            public ViewImputer imputer(String method) {
                return ImputerRegistry.byMethod(method);
            }

            @Override
            public ClassifierMethod classifier(String method, String wekaClass, String wekaOptions) {
                return ClassifierRegistry.create(method, wekaClass, wekaOptions);
            }

            @Override
            public Transform scaler(String scale) {
                return "standardize".equals(scale) ? new Standardize() : null;
            }
        };
    }
}
