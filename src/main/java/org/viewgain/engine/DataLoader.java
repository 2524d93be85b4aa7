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
        double[][] sf = new double[n][];
        double[][] tf = target == null ? null : new double[n][];
        List<String> extract = spec.features().extract();
        for (int i = 0; i < n; i++) {
            Subject s = subjects.get(i);
            y[i] = c.groups().indexOf(s.group());
            sf[i] = Extractors.apply(extract, source, source.base(s.id()));
            if (target != null && target.has(s.id())) {
                tf[i] = Extractors.apply(extract, target, target.base(s.id()));
            }
        }
        List<String> sn = new ArrayList<>(Extractors.names(extract, source));
        List<String> tn = target == null ? List.of() : Extractors.names(extract, target);
        return new StudyData(subjects, y, source, target, sf, tf, sn, tn);
    }

    private static View loadView(Specs.View v, List<String> ids) {
        return v.layout() == Specs.Layout.MATRICES
                ? ViewLoader.matrices(v.name(), v.location(), ids, v.missingAllowed(), v.tolerance())
                : ViewLoader.edgeTable(v.name(), v.location(), v.idColumn(), ids, v.missingAllowed());
    }
}
