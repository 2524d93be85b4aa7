package org.viewgain.engine;

import java.util.ArrayList;
import java.util.List;
import org.viewgain.cohort.Extractors;
import org.viewgain.cohort.Subject;
import org.viewgain.cohort.SubjectsTable;
import org.viewgain.cohort.View;
import org.viewgain.cohort.ViewLoader;
import org.viewgain.spec.ExperimentSpec;
import org.viewgain.spec.Specs;

/** Loads the subjects and views a spec names and extracts the observed features. */
public final class DataLoader {
    private DataLoader() {
    }

    /** Loads everything; bad data raises a one-line {@code BadInputException} naming the file, line and subject. */
    public static StudyData load(ExperimentSpec spec) {
        Specs.Cohort c = spec.cohort();
        List<Subject> subjects = SubjectsTable.load(c.subjects(), c.id(), c.group(), c.site(), c.covariates(),
                c.groups());
        List<String> ids = subjects.stream().map(Subject::id).toList();
        View source = loadView(spec.source(), ids);
        View target = spec.target() == null ? null : loadView(spec.target(), ids);
        int n = subjects.size();
        int[] y = new int[n];
        float[][] sf = new float[n][];
        float[][] tf = target == null ? null : new float[n][];
        List<String> extract = spec.features().extract();
        for (int i = 0; i < n; i++) {
            Subject s = subjects.get(i);
            y[i] = c.groups().indexOf(s.group());
            sf[i] = features(extract, source, s.id());
            if (target != null && target.has(s.id())) {
                tf[i] = features(extract, target, s.id());
            }
        }
        List<String> sn = new ArrayList<>(Extractors.names(extract, source));
        List<String> tn = target == null ? List.of() : Extractors.names(extract, target);
        return new StudyData(subjects, y, source, target, sf, tf, sn, tn);
    }

    /** A subject's observed features: the view's stored vector itself for {@code edges} alone, else extracted. */
    private static float[] features(List<String> extract, View view, String id) {
        Extractors.check(extract, view);
        if (extract.equals(List.of(Extractors.EDGES))) {
            return view.stored(id);
        }
        double[] f = Extractors.apply(extract, view, view.base(id));
        return ImputedFold.compact(f);
    }

    private static View loadView(Specs.View v, List<String> ids) {
        return ViewLoader.load(v, ids);
    }
}
