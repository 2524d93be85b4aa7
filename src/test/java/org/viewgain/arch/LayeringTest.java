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
                .and().doNotHaveFullyQualifiedName("org.viewgain.imputation.SmileMatrices")
                .should().dependOnClassesThat().resideInAnyPackage("smile..", "weka..").check(MAIN);
    }
}
