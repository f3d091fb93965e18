package org.slopewatch;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static com.tngtech.archunit.library.Architectures.layeredArchitecture;
import static com.tngtech.archunit.library.dependencies.SlicesRuleDefinition.slices;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The layers of DESIGN.md: the engine stays plain Java and depends only downwards, no two packages
 * depend on each other, and the daemon's ring runs one way: ingest → pipeline → journal/alerting → delivery.
 */
class ArchitectureTest {

    private static final String[] ENGINE = {"org.slopewatch.curve..", "org.slopewatch.spread..", "org.slopewatch.monitor..",
            "org.slopewatch.probability..", "org.slopewatch.rules.."};

    private static JavaClasses classes;

    @BeforeAll
    static void importClasses() {
        classes = new ClassFileImporter().withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS).importPackages("org.slopewatch");
    }

    @Test
    void theEngineUsesNoFrameworkNoJdbcAndNoWallClock() {
        noClasses().that().resideInAnyPackage(ENGINE)
                .should().dependOnClassesThat().resideInAnyPackage("io.quarkus..", "jakarta..", "javax.inject..", "io.smallrye..",
                        "io.vertx..", "java.sql..", "javax.sql..", "org.eclipse.microprofile..")
                .because("the engine is plain Java, driven the same way by the replay, the daemon and the tests")
                .check(classes);
        noClasses().that().resideInAnyPackage(ENGINE)
                .should().callMethod(java.time.LocalDate.class, "now")
                .orShould().callMethod(java.time.Instant.class, "now")
                .orShould().callMethod(System.class, "currentTimeMillis")
                .because("time comes in with the data or through an injected clock")
                .check(classes);
    }

    @Test
    void theOfflineAnalysisIsPlainJavaToo() {
        // replay and fit read files through the history reader; like the engine they run without a
        // container and without reading the clock
        noClasses().that().resideInAnyPackage("org.slopewatch.replay..", "org.slopewatch.history..")
                .should().dependOnClassesThat().resideInAnyPackage("io.quarkus..", "jakarta..", "javax.inject..", "io.smallrye..",
                        "io.vertx..", "java.sql..", "javax.sql..", "org.eclipse.microprofile..", "org.slopewatch.cli..",
                        "org.slopewatch.journal..", "org.slopewatch.delivery..", "org.slopewatch.web..", "org.slopewatch.ops..",
                        "org.slopewatch.ingest..", "org.slopewatch.pipeline..", "org.slopewatch.alerting..")
                .check(classes);
        noClasses().that().resideInAnyPackage("org.slopewatch.replay..", "org.slopewatch.history..")
                .should().callMethod(java.time.LocalDate.class, "now")
                .orShould().callMethod(java.time.Instant.class, "now")
                .orShould().callMethod(System.class, "currentTimeMillis")
                .check(classes);
    }

    @Test
    void reportsArePlainJavaToo() {
        // the replay command and the daemon's API render the same pages: each hands the report package plain data
        noClasses().that().resideInAPackage("org.slopewatch.report..")
                .should().dependOnClassesThat().resideInAnyPackage("io.quarkus..", "jakarta..", "javax.inject..", "io.smallrye..",
                        "io.vertx..", "java.sql..", "javax.sql..", "org.eclipse.microprofile..", "org.slopewatch.cli..",
                        "org.slopewatch.journal..", "org.slopewatch.delivery..", "org.slopewatch.web..", "org.slopewatch.ops..",
                        "org.slopewatch.alerting..", "org.slopewatch.ingest..", "org.slopewatch.pipeline..")
                .check(classes);
        noClasses().that().resideInAPackage("org.slopewatch.report..")
                .should().callMethod(java.time.LocalDate.class, "now")
                .orShould().callMethod(java.time.Instant.class, "now")
                .orShould().callMethod(System.class, "currentTimeMillis")
                .because("the generation time comes in with the document")
                .check(classes);
    }

    @Test
    void outsideTextRulesArePlainJavaAtTheBottom() {
        // the engine quotes input through them, so they may depend on nothing of slopewatch and on no framework
        noClasses().that().resideInAPackage("org.slopewatch.text..")
                .should().dependOnClassesThat().resideInAnyPackage("io.quarkus..", "jakarta..", "javax.inject..", "io.smallrye..",
                        "io.vertx..", "java.sql..", "javax.sql..", "org.eclipse.microprofile..")
                .orShould().dependOnClassesThat(com.tngtech.archunit.base.DescribedPredicate.describe("slopewatch outside text",
                        c -> c.getPackageName().startsWith("org.slopewatch") && !c.getPackageName().startsWith("org.slopewatch.text")))
                .check(classes);
    }

    @Test
    void layersDependOnlyDownwards() {
        noClasses().that().resideInAPackage("org.slopewatch.curve..")
                .should().dependOnClassesThat().resideInAnyPackage("org.slopewatch.spread..", "org.slopewatch.monitor..",
                        "org.slopewatch.probability..", "org.slopewatch.rules..")
                .check(classes);
        noClasses().that().resideInAPackage("org.slopewatch.spread..")
                .should().dependOnClassesThat().resideInAnyPackage("org.slopewatch.monitor..", "org.slopewatch.probability..",
                        "org.slopewatch.rules..")
                .check(classes);
        noClasses().that().resideInAPackage("org.slopewatch.monitor..")
                .should().dependOnClassesThat().resideInAnyPackage("org.slopewatch.probability..", "org.slopewatch.rules..")
                .check(classes);
        noClasses().that().resideInAPackage("org.slopewatch.probability..")
                .should().dependOnClassesThat().resideInAnyPackage("org.slopewatch.monitor..", "org.slopewatch.rules..")
                .check(classes);
        noClasses().that().resideInAnyPackage(ENGINE)
                .should().dependOnClassesThat().resideInAnyPackage("org.slopewatch.ingest..", "org.slopewatch.replay..",
                        "org.slopewatch.cli..", "org.slopewatch.journal..", "org.slopewatch.delivery..", "org.slopewatch.web..",
                        "org.slopewatch.ops..", "org.slopewatch.pipeline..", "org.slopewatch.alerting..", "org.slopewatch.history..")
                .check(classes);
    }

    @Test
    void noTwoPackagesDependOnEachOther() {
        // each package (sub-packages included as packages of their own) is a slice; a cycle of any length fails
        slices().matching("org.slopewatch.(**)").should().beFreeOfCycles().check(classes);
    }

    @Test
    void theDaemonsRingRunsOneWay() {
        layeredArchitecture().consideringOnlyDependenciesInLayers()
                .layer("Text").definedBy("org.slopewatch.text..")
                .layer("Engine").definedBy(ENGINE)
                .layer("History").definedBy("org.slopewatch.history..")
                .layer("Analysis").definedBy("org.slopewatch.replay..", "org.slopewatch.report..")
                .layer("Journal").definedBy("org.slopewatch.journal..")
                .layer("Delivery").definedBy("org.slopewatch.delivery..")
                .layer("Alerting").definedBy("org.slopewatch.alerting..")
                .layer("Pipeline").definedBy("org.slopewatch.pipeline..")
                .layer("Ingest").definedBy("org.slopewatch.ingest..")
                .layer("WhatIf").definedBy("org.slopewatch.whatif..")
                .layer("Ops").definedBy("org.slopewatch.ops..")
                .layer("Security").definedBy("org.slopewatch.security..")
                .layer("Api").definedBy("org.slopewatch.web..")
                .layer("Cli").definedBy("org.slopewatch.cli..")
                // the access filter answers its refusals with the API's problem documents, and documents its bearer scheme in
                // the API's OpenAPI document: security sits outside the API, the API never sees security
                .whereLayer("Api").mayOnlyBeAccessedByLayers("Security")
                .whereLayer("Cli").mayNotBeAccessedByAnyLayer()
                .whereLayer("Security").mayNotBeAccessedByAnyLayer()
                .whereLayer("Ops").mayOnlyBeAccessedByLayers("Api", "Cli")
                .whereLayer("Ingest").mayOnlyBeAccessedByLayers("Api")
                // the command line too: backfill drives the daemon's step itself, so a journal it fills is the daemon's
                .whereLayer("Pipeline").mayOnlyBeAccessedByLayers("Ingest", "Ops", "Api", "Cli")
                .whereLayer("Alerting").mayOnlyBeAccessedByLayers("Pipeline", "Ops", "Api")
                .whereLayer("Journal").mayOnlyBeAccessedByLayers("Alerting", "Pipeline", "Ingest", "WhatIf", "Ops", "Api", "Cli")
                // pulled sources retry on the delivery's retry policy: one policy for every retry of the daemon
                .whereLayer("Delivery").mayOnlyBeAccessedByLayers("Alerting", "Ingest", "Ops", "Api")
                .whereLayer("WhatIf").mayOnlyBeAccessedByLayers("Api", "Cli")
                .whereLayer("Analysis").mayOnlyBeAccessedByLayers("WhatIf", "Api", "Cli")
                .whereLayer("History").mayOnlyBeAccessedByLayers("Analysis", "Ingest", "WhatIf", "Api", "Cli")
                .because("the step sits at the centre: edges feed it, it drives alerting and the journal, alerting drives delivery")
                .check(classes);
    }
}
