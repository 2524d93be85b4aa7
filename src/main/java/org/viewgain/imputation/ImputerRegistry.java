package org.viewgain.imputation;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;

/** The imputer methods a spec may name, held in an explicit map from method name to factory. */
public final class ImputerRegistry {

    private static final Map<String, Supplier<ViewImputer>> METHODS = new LinkedHashMap<>();

    static {
        METHODS.put(MeanImputer.METHOD, MeanImputer::new);
        METHODS.put(NearestNeighboursImputer.METHOD, NearestNeighboursImputer::new);
        METHODS.put(RidgeImputer.METHOD, RidgeImputer::new);
        METHODS.put(PlsImputer.METHOD, PlsImputer::new);
        METHODS.put(MultiKernelNeighboursImputer.METHOD, MultiKernelNeighboursImputer::new);
        METHODS.put(ExternalImputer.METHOD, ExternalImputer::new);
    }

    private ImputerRegistry() {
    }

    /**
     * The imputer for a method name as written in a spec.
     *
     * @throws IllegalArgumentException for an unknown name, listing the known ones
     */
    public static ViewImputer byMethod(String method) {
        Supplier<ViewImputer> f = METHODS.get(method);
        if (f == null) {
            throw new IllegalArgumentException("unknown imputer method '" + method + "'; expected one of "
                    + String.join(", ", METHODS.keySet()));
        }
        return f.get();
    }

    /** The known method names, in a fixed order. */
    public static List<String> methods() {
        return List.copyOf(METHODS.keySet());
    }
}
