package org.viewgain.classify;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.logging.Level;
import java.util.logging.Logger;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;
import org.viewgain.folds.Seeds;
import org.viewgain.spec.ParamDef;
import org.viewgain.spec.Params;
import weka.classifiers.Classifier;
import weka.core.Instances;
import weka.core.OptionHandler;
import weka.core.Randomizable;
import weka.core.Utils;

/**
 * {@code weka}: any Weka classifier named by class (Hall et al. 2009, SIGKDD Explorations 11:10-18). The base option
 * string applies to every fit; grid parameters are Weka flags (keys starting with {@code -}) whose value is added
 * after the flag, replacing the same flag in the base options. A value {@code true} adds the flag alone and
 * {@code false} leaves it out (switches such as {@code -U}). A classifier implementing {@code Randomizable} gets
 * its seed from the fit context, overriding any {@code -S}. Scores come from {@code distributionForInstance}.
 */
public final class WekaClassifier implements ClassifierMethod {

    /** Weka's linear-algebra back end logs failed native loads to stderr; keep it quiet (held to stay configured). */
    private static final Logger NETLIB_LOG = Logger.getLogger("com.github.fommil");

    static {
        NETLIB_LOG.setLevel(Level.SEVERE);
    }

    private final Class<? extends Classifier> type;
    private final String baseOptions;

    /**
     * @param className   fully qualified class name, e.g. {@code weka.classifiers.trees.RandomForest}
     * @param baseOptions Weka option string for every fit, or null
     * @throws IllegalArgumentException (one line) if the class is missing, is not a Weka classifier, cannot be built
     *                                  with no arguments, or rejects the options
     */
    public WekaClassifier(String className, String baseOptions) {
        if (className == null || className.isBlank()) {
            throw new IllegalArgumentException("classifier method 'weka' needs a class, e.g. "
                    + "weka.classifiers.functions.Logistic");
        }
        Class<?> found;
        try {
            found = Class.forName(className.trim());
        } catch (ClassNotFoundException | LinkageError e) {
            throw new IllegalArgumentException("Weka class '" + className + "' does not exist");
        }
        if (!Classifier.class.isAssignableFrom(found)) {
            throw new IllegalArgumentException("'" + className + "' is not a Weka classifier (weka.classifiers.Classifier)");
        }
        this.type = found.asSubclass(Classifier.class);
        this.baseOptions = baseOptions == null ? "" : baseOptions.trim();
        configured(Params.NONE, true);
    }

    /** The setting that names the Weka class, and the one that gives its option string. */
    public static final String CLASS = "class";
    public static final String OPTIONS = "options";

    /**
     * The method's own settings, as a spec gives them beside {@code method: weka}: {@code class} (required) and
     * {@code options} (optional).
     */
    public static java.util.Map<String, String> settings(String className, String options) {
        java.util.Map<String, String> m = new java.util.LinkedHashMap<>();
        if (className != null) {
            m.put(CLASS, className);
        }
        if (options != null) {
            m.put(OPTIONS, options);
        }
        return java.util.Collections.unmodifiableMap(m);
    }

    /** The method built from its settings (see {@link #settings}). */
    static WekaClassifier of(java.util.Map<String, String> settings) {
        return new WekaClassifier(settings.get(CLASS), settings.get(OPTIONS));
    }

    /** The Weka class name. */
    public String className() {
        return type.getName();
    }

    @Override
    public String method() {
        return "weka";
    }

    /** None declared: Weka flags are open-ended and checked by {@link #resolve(Map)}. */
    @Override
    public List<ParamDef> parameters() {
        return List.of();
    }

    /**
     * Checks one grid point by applying base options and flags to a fresh instance of the class.
     *
     * @throws IllegalArgumentException (one line) for a key not starting with '-', a value of another type, or
     *                                  options the class rejects
     */
    @Override
    public Params resolve(Map<String, Object> raw) {
        Map<String, Object> out = new TreeMap<>();
        for (Map.Entry<String, Object> e : raw.entrySet()) {
            String key = e.getKey();
            if (key == null || !key.startsWith("-") || key.length() < 2 || key.contains(" ")) {
                throw new IllegalArgumentException("Weka parameter '" + key
                        + "' must be an option flag starting with '-', e.g. -R");
            }
            Object v = e.getValue();
            if (v instanceof Integer || v instanceof Double || v instanceof String) {
                out.put(key, v);
            } else if (v instanceof Long || v instanceof Float) {
                out.put(key, ((Number) v).doubleValue());
            } else if (v instanceof Boolean b) {
                out.put(key, b.toString());
            } else {
                throw new IllegalArgumentException("Weka parameter '" + key + "' = " + v
                        + ": expected a number, text, true or false");
            }
        }
        Params params = new Params(out);
        configured(params, true);
        return params;
    }

    @Override
    public boolean producesScores() {
        return true;
    }

    /** The full option array for a grid point: flags first, then base options without the flags they replace. */
    String[] options(Params params) throws Exception {
        List<String> base = new ArrayList<>(List.of(Utils.splitOptions(baseOptions)));
        List<String> opts = new ArrayList<>();
        for (Map.Entry<String, Object> e : params.values().entrySet()) {
            String flag = e.getKey();
            int at = base.indexOf(flag);
            if (at >= 0) {
                base.remove(at);
                if (at < base.size() && isValue(base.get(at))) {
                    base.remove(at);
                }
            }
            String value = format(e.getValue());
            if ("false".equals(value)) {
                continue;
            }
            opts.add(flag);
            if (!"true".equals(value)) {
                opts.add(value);
            }
        }
        opts.addAll(base);
        return opts.toArray(String[]::new);
    }

    private static boolean isValue(String token) {
        if (!token.startsWith("-")) {
            return true;
        }
        try {
            Double.parseDouble(token);
            return true;
        } catch (NumberFormatException e) {
            return false;
        }
    }

    private static String format(Object v) {
        if (v instanceof Double d && d == Math.rint(d) && Math.abs(d) < 1e15) {
            return String.valueOf(d.longValue());
        }
        return v instanceof Double d ? String.format(Locale.ROOT, "%s", d) : String.valueOf(v);
    }

    /** A fresh, configured instance; with {@code strict} any option the class did not consume is an error. */
    private Classifier configured(Params params, boolean strict) {
        Classifier c;
        try {
            c = type.getDeclaredConstructor().newInstance();
        } catch (ReflectiveOperationException | RuntimeException e) {
            throw new IllegalArgumentException("Weka class '" + type.getName() + "' cannot be created without arguments");
        }
        String[] opts;
        try {
            opts = options(params);
        } catch (Exception e) {
            throw new IllegalArgumentException("Weka options '" + baseOptions + "' cannot be parsed: " + firstLine(e));
        }
        if (opts.length == 0) {
            return c;
        }
        if (!(c instanceof OptionHandler handler)) {
            throw new IllegalArgumentException("Weka class '" + type.getName() + "' takes no options");
        }
        String shown = String.join(" ", opts);
        try {
            handler.setOptions(opts);
            if (strict) {
                Utils.checkForRemainingOptions(opts);
            }
        } catch (Exception e) {
            // Weka reports bad values as NumberFormatException or plain Exception, unknown flags as leftovers.
            throw new IllegalArgumentException("Weka class '" + type.getName() + "' rejects options '" + shown + "': "
                    + firstLine(e));
        }
        return c;
    }

    static String firstLine(Throwable e) {
        String m = e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage().strip();
        int nl = m.indexOf('\n');
        return nl >= 0 ? m.substring(0, nl).strip() : m;
    }

    @Override
    public Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        return fit(ctx, x, y, classes, params, false);
    }

    /** Weka keeps its own copy of the rows (with the class appended): owned rows are released as they are copied. */
    @Override
    public Model fitOwned(FitContext ctx, Rows x, int[] y, int classes, Params params) {
        return fit(ctx, x, y, classes, params, true);
    }

    private Model fit(FitContext ctx, Rows x, int[] y, int classes, Params params, boolean release) {
        TrainingLabels.check(method(), x, y, classes);
        Classifier c = configured(params, false);
        if (c instanceof Randomizable r) {
            r.setSeed(Seeds.toInt(ctx.seed()));
        }
        Instances train = WekaData.instances(x, y, classes, release);
        try {
            c.buildClassifier(train);
        } catch (Exception e) {
            throw new IllegalStateException("Weka " + type.getName() + " failed to train: " + firstLine(e), e);
        }
        Instances header = new Instances(train, 0);
        return rows -> {
            int[] labels = new int[rows.n()];
            double[][] scores = new double[rows.n()][];
            for (int i = 0; i < rows.n(); i++) {
                try {
                    scores[i] = c.distributionForInstance(WekaData.instance(header, rows.x()[i]));
                } catch (Exception e) {
                    throw new IllegalStateException("Weka " + type.getName() + " failed to predict: " + firstLine(e), e);
                }
                labels[i] = TrainingLabels.argmax(scores[i]);
            }
            return new Predictions(labels, scores);
        };
    }
}
