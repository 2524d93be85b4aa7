package org.viewgain.imputation;

import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.viewgain.cohort.Rows;
import org.viewgain.folds.FitContext;

/** Test data: the breast-cancer reference set as two views, random blocks, and a fit context. */
final class Fixtures {
    static final FitContext CTX = new FitContext(0, 0, 0, FitContext.WHOLE, FitContext.Role.FINAL, 2026L);

    private Fixtures() {
    }

    /** Source and target views of one split. */
    record Split(Rows trainSource, Rows trainTarget, Rows testSource, Rows testTarget) {
    }

    /**
     * Breast Cancer Wisconsin (Wolberg et al. 1995): source = the 10 mean_* columns, target = the 10 worst_*
     * columns; a seeded 70% of subjects for training, the rest for testing. Nothing is standardised.
     */
    static Split breastCancer(long seed) {
        List<String> ids = new ArrayList<>();
        List<double[]> src = new ArrayList<>();
        List<double[]> tgt = new ArrayList<>();
        List<String> srcNames = new ArrayList<>();
        List<String> tgtNames = new ArrayList<>();
        try (InputStream in = Fixtures.class.getResourceAsStream("/reference/breast-cancer-wisconsin.csv");
             Reader r = new InputStreamReader(in, StandardCharsets.UTF_8)) {
            var parser = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get().parse(r);
            for (String h : parser.getHeaderNames()) {
                if (h.startsWith("mean_")) {
                    srcNames.add(h);
                } else if (h.startsWith("worst_")) {
                    tgtNames.add(h);
                }
            }
            for (CSVRecord rec : parser) {
                ids.add(rec.get("id"));
                src.add(srcNames.stream().mapToDouble(h -> Double.parseDouble(rec.get(h))).toArray());
                tgt.add(tgtNames.stream().mapToDouble(h -> Double.parseDouble(rec.get(h))).toArray());
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < ids.size(); i++) {
            order.add(i);
        }
        java.util.Collections.shuffle(order, new Random(seed));
        int nTrain = (int) Math.round(0.7 * ids.size());
        int[] train = order.subList(0, nTrain).stream().mapToInt(Integer::intValue).toArray();
        int[] test = order.subList(nTrain, order.size()).stream().mapToInt(Integer::intValue).toArray();
        Rows s = new Rows(ids, src.toArray(double[][]::new), srcNames);
        Rows t = new Rows(ids, tgt.toArray(double[][]::new), tgtNames);
        return new Split(s.select(train), t.select(train), s.select(test), t.select(test));
    }

    /** A block of standard normal values with ids {@code prefix0, prefix1, ...}. */
    static Rows gaussian(String prefix, int n, int p, long seed) {
        Random rnd = new Random(seed);
        double[][] x = new double[n][p];
        for (double[] row : x) {
            for (int j = 0; j < p; j++) {
                row[j] = rnd.nextGaussian();
            }
        }
        return rows(prefix, x);
    }

    static Rows rows(String prefix, double[][] x) {
        List<String> ids = new ArrayList<>();
        for (int i = 0; i < x.length; i++) {
            ids.add(prefix + i);
        }
        List<String> names = new ArrayList<>();
        for (int j = 0; j < (x.length == 0 ? 0 : x[0].length); j++) {
            names.add("f" + j);
        }
        return new Rows(ids, x, names);
    }

    /** The same subjects' targets: a linear map of the source plus noise. */
    static Rows linearTarget(Rows source, int q, double noise, long seed) {
        Random rnd = new Random(seed);
        double[][] w = new double[source.p()][q];
        for (double[] row : w) {
            for (int j = 0; j < q; j++) {
                row[j] = rnd.nextGaussian();
            }
        }
        double[][] y = new double[source.n()][q];
        for (int i = 0; i < source.n(); i++) {
            for (int j = 0; j < q; j++) {
                double s = 3.0 + j;
                for (int h = 0; h < source.p(); h++) {
                    s += source.x()[i][h] * w[h][j];
                }
                y[i][j] = s + noise * rnd.nextGaussian();
            }
        }
        List<String> names = new ArrayList<>();
        for (int j = 0; j < q; j++) {
            names.add("t" + j);
        }
        return new Rows(source.ids(), y, names);
    }

    /** Mean over test subjects of the per-subject MAE. */
    static double meanMae(double[][] observed, double[][] imputed) {
        double s = 0;
        for (int i = 0; i < observed.length; i++) {
            s += ImputationQuality.mae(observed[i], imputed[i]);
        }
        return s / observed.length;
    }
}
