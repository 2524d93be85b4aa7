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

    static Instances instances(Rows x, int[] y, int classes) {
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
            data.add(new DenseInstance(1.0, v));
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
