package org.slopewatch;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/** The layers of DESIGN.md: the engine stays plain Java and depends only downwards. */
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
        // replay and fit read files through ingest's CSV reader, so replay sits outside ENGINE's layering
        // rule, but like the engine it must run without a container and without reading the clock
        noClasses().that().resideInAPackage("org.slopewatch.replay..")
                .should().dependOnClassesThat().resideInAnyPackage("io.quarkus..", "jakarta..", "javax.inject..", "io.smallrye..",
                        "io.vertx..", "java.sql..", "javax.sql..", "org.eclipse.microprofile..", "org.slopewatch.cli..",
                        "org.slopewatch.journal..", "org.slopewatch.delivery..", "org.slopewatch.web..", "org.slopewatch.ops..")
                .check(classes);
        noClasses().that().resideInAPackage("org.slopewatch.replay..")
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
                        "org.slopewatch.alerting..", "org.slopewatch.ingest..")
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
                        "org.slopewatch.ops..")
                .check(classes);
    }
}
