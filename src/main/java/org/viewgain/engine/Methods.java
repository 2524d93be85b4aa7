package org.viewgain.engine;

import org.viewgain.classify.ClassifierMethod;
import org.viewgain.classify.ClassifierRegistry;
import java.util.List;
import java.util.Map;
import org.viewgain.imputation.ImputerRegistry;
import org.viewgain.imputation.ViewImputer;
import org.viewgain.prep.ComBat;
import org.viewgain.prep.CovariateAdjust;
import org.viewgain.prep.SelectTopK;
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
    ClassifierMethod classifier(String method, Map<String, String> settings);

    /** The scaling step for {@code features.scale}, or null for {@code none}. */
    Transform scaler(org.viewgain.spec.Specs.Scaling scale);

    /**
     * The selection step of {@code features.select} for one value of {@code keep}.
     *
     * @throws IllegalArgumentException for an unknown method or a keep below 1
     */
    default Transform selector(String method, int keep) {
        return new SelectTopK(method, keep);
    }

    /** The covariate adjustment of {@code features.adjust}: covariate values per subject id, in {@code names} order. */
    default Transform covariateAdjuster(Map<String, double[]> covariatesById, List<String> names) {
        return new CovariateAdjust(covariatesById, names);
    }

    /**
     * The harmonization of {@code features.harmonize} ({@code combat}).
     *
     * @param siteById       site of every subject
     * @param covariatesById covariates ComBat keeps in the data (values per subject id), or an empty map
     */
    default Transform harmonizer(org.viewgain.spec.Specs.Harmonization method, Map<String, String> siteById,
                                 Map<String, double[]> covariatesById) {
        if (method != org.viewgain.spec.Specs.Harmonization.COMBAT) {
            throw new IllegalArgumentException("no harmonization to fit for '" + method.label() + "'");
        }
        return new ComBat(siteById, covariatesById);
    }

    /** The methods of the registries. */
    static Methods standard() {
        return new Methods() {
            @Override
            public ViewImputer imputer(String method) {
                return ImputerRegistry.byMethod(method);
            }

            @Override
            public ClassifierMethod classifier(String method, Map<String, String> settings) {
                return ClassifierRegistry.create(method, settings);
            }

            @Override
            public Transform scaler(org.viewgain.spec.Specs.Scaling scale) {
                return scale == org.viewgain.spec.Specs.Scaling.STANDARDIZE ? new Standardize() : null;
            }
        };
    }
}
