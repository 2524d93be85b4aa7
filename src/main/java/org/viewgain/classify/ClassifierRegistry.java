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

    /** A classifier method by name, without settings of its own (every method but {@code weka}). */
    public static ClassifierMethod create(String method) {
        return create(method, Map.of());
    }

    /**
     * A classifier method by name, with the settings a spec gives beside {@code method} (only {@code weka} has any:
     * its {@code class} and {@code options}, {@link WekaClassifier#settings}).
     *
     * @param method   a name from {@link #methods()}
     * @param settings the method's own settings; empty for every method but {@code weka}
     * @throws IllegalArgumentException with a one-line message: an unknown method (listing the allowed ones), a Weka
     *                                  class that does not exist or is not a classifier, options it rejects, or
     *                                  settings given to a method that takes none
     */
    public static ClassifierMethod create(String method, Map<String, String> settings) {
        Supplier<ClassifierMethod> factory = FACTORIES.get(method);
        if (WEKA.equals(method)) {
            return WekaClassifier.of(settings);
        }
        if (factory == null) {
            throw new IllegalArgumentException("unknown classifier method '" + method + "'; allowed: "
                    + String.join(", ", methods()));
        }
        boolean given = settings.entrySet().stream().anyMatch(e -> e.getValue() != null && !e.getValue().isBlank());
        if (given) {
            throw new IllegalArgumentException("classifier method '" + method
                    + "' takes no Weka class or options; those are for method 'weka' only");
        }
        return factory.get();
    }
}
