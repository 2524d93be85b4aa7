package org.viewgain.classify;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.viewgain.cohort.Rows;

/** A reference CSV (id, class word, numeric columns) read from test resources, with a seeded stratified split. */
record ReferenceTable(Rows rows, int[] y, int classes) {

    static ReferenceTable load(String resource) {
        try (BufferedReader in = new BufferedReader(new InputStreamReader(
                ReferenceTable.class.getResourceAsStream("/reference/" + resource), StandardCharsets.UTF_8))) {
            String[] header = in.readLine().split(",");
            List<String> ids = new ArrayList<>();
            List<double[]> values = new ArrayList<>();
            List<String> words = new ArrayList<>();
            List<Integer> labels = new ArrayList<>();
            for (String line = in.readLine(); line != null; line = in.readLine()) {
                String[] cells = line.split(",");
                ids.add(cells[0]);
                if (!words.contains(cells[1])) {
                    words.add(cells[1]);
                }
                labels.add(words.indexOf(cells[1]));
                double[] v = new double[cells.length - 2];
                for (int j = 0; j < v.length; j++) {
                    v[j] = Double.parseDouble(cells[j + 2]);
                }
                values.add(v);
            }
            Rows rows = new Rows(ids, values.toArray(double[][]::new),
                    Arrays.asList(header).subList(2, header.length));
            return new ReferenceTable(rows, labels.stream().mapToInt(Integer::intValue).toArray(), words.size());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * The same table with every column z-scored over all rows. Only for classifier checks that need comparable
     * scales; it is not a leak-free pipeline step (prep.Standardize is).
     */
    ReferenceTable standardized() {
        double[][] x = rows.x();
        int n = x.length;
        int p = rows.p();
        double[][] z = new double[n][p];
        for (int j = 0; j < p; j++) {
            double mean = 0;
            for (double[] r : x) {
                mean += r[j] / n;
            }
            double ss = 0;
            for (double[] r : x) {
                ss += (r[j] - mean) * (r[j] - mean);
            }
            double sd = Math.sqrt(ss / (n - 1));
            for (int i = 0; i < n; i++) {
                z[i][j] = (x[i][j] - mean) / sd;
            }
        }
        return new ReferenceTable(rows.withValues(z, rows.featureNames()), y, classes);
    }

    /** Fold of each row for a stratified k-fold split shuffled by the seed. */
    int[] folds(int k, long seed) {
        int[] fold = new int[y.length];
        Random random = new Random(seed);
        for (int c = 0; c < classes; c++) {
            List<Integer> members = new ArrayList<>();
            for (int i = 0; i < y.length; i++) {
                if (y[i] == c) {
                    members.add(i);
                }
            }
            java.util.Collections.shuffle(members, random);
            for (int r = 0; r < members.size(); r++) {
                fold[members.get(r)] = r % k;
            }
        }
        return fold;
    }

    static int[] positions(int[] fold, int f, boolean inFold) {
        return java.util.stream.IntStream.range(0, fold.length).filter(i -> (fold[i] == f) == inFold).toArray();
    }

    static int[] pick(int[] values, int[] positions) {
        return Arrays.stream(positions).map(i -> values[i]).toArray();
    }
}
