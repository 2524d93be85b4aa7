package org.viewgain.classify;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;

/** The classifier methods a spec may name, held in an explicit map from method name to factory. */
public final class ClassifierRegistry {

    private static final String WEKA = "weka";

    private static final Map<String, Supplier<ClassifierMethod>> FACTORIES = new LinkedHashMap<>();

    static {
        FACTORIES.put("random-forest", BinnedForest::new);
        FACTORIES.put("smile-random-forest", SmileForest::new);
        FACTORIES.put("svm-linear", LinearSvm::new);
        FACTORIES.put("svm-rbf", KernelSvm::new);
        FACTORIES.put("smile-svm-rbf", SmileSvm::new);
        FACTORIES.put("logistic", SmileLogistic::new);
        FACTORIES.put("lda", SmileLda::new);
        FACTORIES.put("knn", SmileKnn::new);
        FACTORIES.put(WEKA, () -> {
            throw new IllegalStateException("weka is built by create(method, class, options)");
        });
    }

    private ClassifierRegistry() {
    }

    /**
     * The versions of the machine-learning libraries on the class path, as their own jars state them (Smile's
     * manifest, Weka's {@code weka.core.Version}), so that provenance cannot drift from the build; "unknown" when a
     * jar does not say.
     */
    public static Map<String, String> libraryVersions() {
        Map<String, String> out = new LinkedHashMap<>();
        String smile = smile.classification.RandomForest.class.getPackage().getImplementationVersion();
        out.put("smile", smile == null ? "unknown" : smile);
        out.put("weka", weka.core.Version.VERSION);
        return out;
    }

    /** Method names in a stable order, {@code weka} last. */
    public static List<String> methods() {
        return List.copyOf(FACTORIES.keySet());
    }

    /**
     * A classifier method by name.
     *
     * @param method      a name from {@link #methods()}
     * @param wekaClass   fully qualified Weka classifier class when {@code method} is {@code weka}, otherwise null
     * @param wekaOptions Weka option string applied to every fit (may be null or empty), only with {@code weka}
     * @throws IllegalArgumentException with a one-line message: an unknown method (listing the allowed ones), a Weka
     *                                  class that does not exist or is not a classifier, or options it rejects
     */
    public static ClassifierMethod create(String method, String wekaClass, String wekaOptions) {
        Supplier<ClassifierMethod> factory = FACTORIES.get(method);
        if (WEKA.equals(method)) {
            return wekaMethod(wekaClass, wekaOptions);
        }
        if (factory == null) {
            throw new IllegalArgumentException("unknown classifier method '" + method + "'; allowed: "
                    + String.join(", ", methods()));
        }
        if (wekaClass != null || (wekaOptions != null && !wekaOptions.isBlank())) {
            throw new IllegalArgumentException("classifier method '" + method
                    + "' takes no Weka class or options; those are for method 'weka' only");
        }
        return factory.get();
    }

    private static ClassifierMethod wekaMethod(String wekaClass, String wekaOptions) {
        return new WekaClassifier(wekaClass, wekaOptions);
    }
}
