package org.viewgain.classify;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.cohort.Rows;
import weka.core.Attribute;
import weka.core.DenseInstance;
import weka.core.Instance;
import weka.core.Instances;

/** Rows as Weka Instances: numeric attributes f0..f(p-1) and a nominal class attribute with values 0..classes-1. */
final class WekaData {
    private WekaData() {
    }

    /**
     * A Weka row whose {@link #toStringNoWeight()} is a 64-bit hash of its values in hexadecimal instead of their
     * decimal text. In Weka 3.8.6 the only caller of that method is {@code Instances.getRandomNumberGenerator}, which
     * every {@code RandomTree} uses to seed itself from the text of one random row of its bag; at edge level that
     * text is tens of thousands of formatted numbers per tree, and profiling found it was 36% of all CPU of a
     * 400-subject x 4,950-edge run (docs/benchmarks.md). The seed still depends on the data and the given seed
     * only, so fits stay deterministic; they differ from a Weka GUI run with the same options. Copies made by Weka
     * (bagging, {@code new Instances(data)}) stay of this class, sharing the value array as DenseInstance does.
     */
    static final class Row extends DenseInstance {
        private static final long serialVersionUID = 1L;

        Row(double weight, double[] values) {
            super(weight, values);
        }

        private Row(Row other) {
            super(other);
        }

        @Override
        public Object copy() {
            Row copy = new Row(this);
            copy.m_Dataset = m_Dataset;
            return copy;
        }

        /** The value array itself (shared with copies), for tests. */
        double[] values() {
            return m_AttValues;
        }

        @Override
        public String toStringNoWeight() {
            return Long.toHexString(hash(m_AttValues));
        }

        static long hash(double[] values) {
            long h = 0x9E3779B97F4A7C15L;
            for (double v : values) {
                h = (h ^ Double.doubleToLongBits(v)) * 0x100000001B3L;
                h ^= h >>> 29;
            }
            return h;
        }
    }

    static Instances instances(Rows x, int[] y, int classes) {
        return instances(x, y, classes, false);
    }

    /**
     * The rows as Instances; with {@code release}, each row of {@code x} is set to null once copied (the caller
     * hands them over), so at most one row exists twice.
     */
    static Instances instances(Rows x, int[] y, int classes, boolean release) {
        ArrayList<Attribute> attributes = new ArrayList<>();
        for (int j = 0; j < x.p(); j++) {
            attributes.add(new Attribute("f" + j));
        }
        List<String> values = new ArrayList<>();
        for (int c = 0; c < classes; c++) {
            values.add(Integer.toString(c));
        }
        attributes.add(new Attribute("class", values));
        Instances data = new Instances("viewgain", attributes, x.n());
        data.setClassIndex(x.p());
        for (int i = 0; i < x.n(); i++) {
            double[] v = java.util.Arrays.copyOf(x.x()[i], x.p() + 1);
            v[x.p()] = y[i];
            data.add(new Row(1.0, v));
            if (release) {
                x.x()[i] = null;
            }
        }
        return data;
    }

    /** One unlabeled row attached to the training header. */
    static Instance instance(Instances header, double[] row) {
        double[] v = java.util.Arrays.copyOf(row, row.length + 1);
        v[row.length] = weka.core.Utils.missingValue();
        Instance inst = new DenseInstance(1.0, v);
        inst.setDataset(header);
        return inst;
    }
}
