package org.viewgain.arch;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.Test;

/**
 * The dependency arrows of docs/architecture.md: cli -> engine -> methods (imputation, prep, classify, stats) -> data
 * (cohort, folds, spec); nothing imports cli; the engine and the methods never import report; Smile and Weka are
 * imported only by the adapters in classify and by imputation's one matrix helper.
 */
class LayeringTest {
    static final JavaClasses MAIN = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS).importPackages("org.viewgain");

    @Test
    void givenMainClasses_whenChecked_thenNothingImportsCli() {
        noClasses().that().resideOutsideOfPackage("org.viewgain.cli..").should().dependOnClassesThat()
                .resideInAPackage("org.viewgain.cli..").check(MAIN);
    }

    @Test
    void givenMainClasses_whenChecked_thenEngineAndMethodsNeverImportReport() {
        noClasses().that().resideInAnyPackage("org.viewgain.engine..", "org.viewgain.imputation..",
                "org.viewgain.prep..", "org.viewgain.classify..", "org.viewgain.stats..", "org.viewgain.cohort..",
                "org.viewgain.folds..", "org.viewgain.spec..").should().dependOnClassesThat()
                .resideInAPackage("org.viewgain.report..").check(MAIN);
    }

    @Test
    void givenMainClasses_whenChecked_thenDataPackagesDoNotReachUp() {
        noClasses().that().resideInAnyPackage("org.viewgain.cohort..", "org.viewgain.folds..", "org.viewgain.spec..",
                "org.viewgain.stats..").should().dependOnClassesThat().resideInAnyPackage("org.viewgain.engine..",
                "org.viewgain.imputation..", "org.viewgain.prep..", "org.viewgain.classify..").check(MAIN);
    }

    @Test
    void givenMainClasses_whenChecked_thenMethodsDoNotImportTheEngine() {
        noClasses().that().resideInAnyPackage("org.viewgain.imputation..", "org.viewgain.prep..",
                "org.viewgain.classify..").should().dependOnClassesThat().resideInAPackage("org.viewgain.engine..")
                .check(MAIN);
    }

    @Test
    void givenMainClasses_whenChecked_thenSmileAndWekaOnlyInAdapters() {
        noClasses().that().resideOutsideOfPackage("org.viewgain.classify..")
                .and().doNotHaveFullyQualifiedName("org.viewgain.stats.SmileMatrices")
                .should().dependOnClassesThat().resideInAnyPackage("smile..", "weka..").check(MAIN);
    }

    /**
     * The HTML report is built from the run folder's files alone: only the table writers and the printed checks of
     * the report package touch engine types (issue 13's layering).
     */
    @Test
    void givenMainClasses_whenChecked_thenTheHtmlReportImportsNoEngineClass() {
        noClasses().that().resideInAPackage("org.viewgain.report..")
                .and().haveSimpleNameNotStartingWith("RunWriter")
                .and().haveSimpleNameNotStartingWith("ResultTables")
                .and().haveSimpleNameNotStartingWith("SignificanceTables")
                .and().haveSimpleNameNotStartingWith("SummaryTable")
                .and().haveSimpleNameNotStartingWith("IndependentTables")
                .and().haveSimpleNameNotStartingWith("IndependentText")
                .and().haveSimpleNameNotStartingWith("AvailabilityTable")
                .and().haveSimpleNameNotStartingWith("MissingTargets")
                .and().haveSimpleNameNotStartingWith("CheckReport")
                .should().dependOnClassesThat().resideInAPackage("org.viewgain.engine..").check(MAIN);
    }

    /**
     * The writers lay out what {@code engine.Analysis} computed once; none of them calls the computations behind it
     * (metrics, comparisons, separation, importance, confusion, site metrics, the curve's rows, imputation aggregates).
     */
    @Test
    void givenMainClasses_whenChecked_thenTheReportCallsNoComputationOfTheAnalysis() {
        java.util.Set<String> computations = java.util.Set.of("org.viewgain.engine.Evaluation",
                "org.viewgain.engine.Comparisons", "org.viewgain.engine.Separation", "org.viewgain.engine.Importance",
                "org.viewgain.engine.Confusion", "org.viewgain.engine.SiteMetrics",
                "org.viewgain.engine.AvailabilityRows", "org.viewgain.engine.ImputationAggregates");
        noClasses().that().resideInAPackage("org.viewgain.report..").should().callMethodWhere(
                new com.tngtech.archunit.base.DescribedPredicate<com.tngtech.archunit.core.domain.JavaMethodCall>(
                        "a method of the classes that compute the analysis") {
                    @Override
                    public boolean test(com.tngtech.archunit.core.domain.JavaMethodCall call) {
                        return computations.contains(call.getTargetOwner().getName());
                    }
                }).check(MAIN);
    }

    /** The run lifecycle lives in {@code run}: the commands call the controller, never the runner or the journal. */
    @Test
    void givenMainClasses_whenChecked_thenTheCliUsesNeitherRunnerNorJournal() {
        noClasses().that().resideInAPackage("org.viewgain.cli..").should().dependOnClassesThat()
                .haveFullyQualifiedName("org.viewgain.engine.Runner").orShould().dependOnClassesThat()
                .haveFullyQualifiedName("org.viewgain.engine.Journal").check(MAIN);
    }

    /** {@code run.json} has one writer: the run controller (the only caller of {@code RunFolder.writeText}). */
    @Test
    void givenMainClasses_whenChecked_thenOnlyTheRunControllerWritesRunJson() {
        noClasses().that().doNotHaveFullyQualifiedName("org.viewgain.run.RunController").should()
                .callMethod(org.viewgain.report.RunFolder.class, "writeText", String.class, String.class).check(MAIN);
    }

    /** Below the commands, nothing reaches up to the run lifecycle. */
    @Test
    void givenMainClasses_whenChecked_thenOnlyTheCliUsesTheRunPackage() {
        noClasses().that().resideOutsideOfPackages("org.viewgain.cli..", "org.viewgain.run..").should()
                .dependOnClassesThat().resideInAPackage("org.viewgain.run..").check(MAIN);
    }
}
