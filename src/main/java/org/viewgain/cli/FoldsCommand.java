package org.viewgain.cli;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import org.viewgain.cohort.ViewLoader;
import org.viewgain.engine.Experiment;
import org.viewgain.engine.ImputationTasks;
import org.viewgain.engine.Setup;
import org.viewgain.engine.StudyData;
import org.viewgain.report.CsvTable;
import org.viewgain.spec.BadInputException;
import org.viewgain.spec.SpecLoader;
import org.viewgain.spec.Specs;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code viewgain folds SPEC --out DIR}: checks the spec and data, then writes the fold plan and the imputation
 * tasks an outside program must carry out for the {@code external} imputer (layout: docs/external-imputations.md).
 */
@Command(name = "folds", mixinStandardHelpOptions = true, versionProvider = Root.Version.class,
        description = "Write the fold plan and, per repeat and outer fold, whom an outside imputer may train on and "
                + "whom it must impute (for the 'external' imputer); runs nothing.")
final class FoldsCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "SPEC", description = "The experiment spec (YAML).")
    Path spec;

    @Option(names = "--out", paramLabel = "DIR", required = true,
            description = "A new or empty folder for the task files.")
    Path out;

    @Option(names = "--verbose", description = "Print stack traces of errors.")
    boolean verbose;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec cs;

    @Override
    public Integer call() throws IOException {
        Experiment ex = Setup.prepare(SpecLoader.load(spec));
        if (ex.data().target() == null) {
            throw new BadInputException(spec + ": the spec has no target view, so there is nothing to impute");
        }
        prepareFolder(out);
        write(out.resolve("folds.csv"), folds(ex));
        CsvTable tasks = tasks(ex);
        write(out.resolve("tasks.csv"), tasks);
        write(out.resolve("target_features.csv"), features(ex));
        write(out.resolve("inputs.csv"), inputs(ex));
        Files.writeString(out.resolve("README.txt"), readme(ex), StandardCharsets.UTF_8);
        var o = cs.commandLine().getOut();
        o.println("wrote the fold plan and the imputation tasks (" + tasks.size() + " task rows) to " + out);
        o.println("the outside program writes one CSV: repeat,fold,task,inner,subject and the "
                + ex.data().target().width() + " target features of target_features.csv");
        o.flush();
        return 0;
    }

    private static void prepareFolder(Path dir) throws IOException {
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new BadInputException("--out " + dir + " is a file, not a folder");
        }
        if (Files.isDirectory(dir)) {
            try (Stream<Path> s = Files.list(dir)) {
                if (s.findAny().isPresent()) {
                    throw new BadInputException("--out " + dir + " is not empty; give a new or empty folder");
                }
            }
        }
        Files.createDirectories(dir);
    }

    /** repetition, subject, fold, has_target: the outer fold plan (repeats and folds from 1). */
    static CsvTable folds(Experiment ex) {
        CsvTable t = new CsvTable("repetition", "subject", "fold", "has_target");
        StudyData d = ex.data();
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int i = 0; i < d.n(); i++) {
                t.row().integer(r + 1).text(d.id(i)).integer(ex.plan().foldOf(r, i) + 1)
                        .text(d.hasTarget(i) ? "true" : "false");
            }
        }
        return t;
    }

    /** repetition, fold, task, inner, subject, role: one row per subject a task trains on or imputes. */
    static CsvTable tasks(Experiment ex) {
        CsvTable t = new CsvTable("repetition", "fold", "task", "inner", "subject", "role");
        StudyData d = ex.data();
        for (int r = 0; r < ex.plan().repeats(); r++) {
            for (int f = 0; f < ex.plan().folds(r); f++) {
                for (ImputationTasks.Task task : ImputationTasks.of(ex, r, f)) {
                    for (String role : List.of("train", "impute")) {
                        for (int i : role.equals("train") ? task.train() : task.impute()) {
                            t.row().integer(r + 1).integer(f + 1).text(task.name()).integer(task.inner() + 1)
                                    .text(d.id(i)).text(role);
                        }
                    }
                }
            }
        }
        return t;
    }

    /** position, feature: the target features, in the order of the imputation file's columns. */
    static CsvTable features(Experiment ex) {
        CsvTable t = new CsvTable("position", "feature");
        List<String> names = ex.data().target().baseNames();
        for (int c = 0; c < names.size(); c++) {
            t.row().integer(c + 1).text(names.get(c));
        }
        return t;
    }

    /** subject, source_file, target_file: where each subject's views are (target empty where missing). */
    static CsvTable inputs(Experiment ex) {
        CsvTable t = new CsvTable("subject", "source_file", "target_file");
        StudyData d = ex.data();
        for (int i = 0; i < d.n(); i++) {
            String id = d.id(i);
            t.row().text(id).text(file(ex.spec().source(), id))
                    .text(d.hasTarget(i) ? file(ex.spec().target(), id) : "");
        }
        return t;
    }

    private static String file(Specs.View v, String id) {
        String loc = v.location().toAbsolutePath().normalize().toString();
        return v.layout() == Specs.Layout.MATRICES ? loc.replace(ViewLoader.SUBJECT_PLACEHOLDER, id) : loc;
    }

    private static String readme(Experiment ex) {
        Specs.View s = ex.spec().source();
        Specs.View t = ex.spec().target();
        return "Imputation tasks for the 'external' imputer of viewgain (layout: docs/external-imputations.md).\n"
                + "spec: " + ex.spec().specFile().toAbsolutePath().normalize() + "\n"
                + "experiment: " + ex.spec().experiment() + ", seed " + ex.spec().seed() + ", imputed-for-training: "
                + ex.spec().imputedForTraining().label() + ", inner folds: " + ex.spec().validation().innerFolds()
                + "\n"
                + "source view: " + describe(s) + "\n"
                + "target view: " + describe(t) + "\n"
                + "folds.csv            outer fold of every subject per repeat\n"
                + "tasks.csv            per repeat, fold and task: the subjects to train on (role train) and to"
                + " impute (role impute)\n"
                + "target_features.csv  the target features, in the column order of the imputation file\n"
                + "inputs.csv           the source and target file of every subject\n"
                + "Write one CSV: repeat,fold,task,inner,subject,<target features>, one row per impute row of"
                + " tasks.csv, and name it in the spec: { method: external, fixed: { file: ... } }.\n"
                + "Train each task only on its train subjects; a row for a train subject is refused.\n";
    }

    private static String describe(Specs.View v) {
        return v.layout().name().toLowerCase(java.util.Locale.ROOT) + " "
                + v.location().toAbsolutePath().normalize()
                + (v.idColumn() == null ? "" : " (id column " + v.idColumn() + ")");
    }

    private static void write(Path file, CsvTable table) throws IOException {
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            table.write(w);
        }
    }
}
