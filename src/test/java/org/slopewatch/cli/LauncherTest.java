package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.w3c.dom.Element;
import picocli.CommandLine;

/**
 * The launcher's own contract: no command is a usage error (usage on stderr, exit code 2, as
 * the POSIX utility conventions have it for a usage error, common practice), the version is
 * the one in pom.xml, and the demo leaves the HTTP port to the configuration unless told.
 */
class LauncherTest {

    @Test
    void noCommandPrintsUsageOnStderrAndExitsWithTwo() {
        CliRun run = CliRun.of();
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.out()).isEmpty();
        assertThat(run.err()).contains("a command is needed").contains("Usage: slopewatch").contains("replay").contains("serve");
    }

    @Test
    void versionIsThePomVersion() throws Exception {
        // read from pom.xml itself, not from anything the build derived
        Element project = DocumentBuilderFactory.newInstance().newDocumentBuilder().parse(Path.of("pom.xml").toFile()).getDocumentElement();
        String pomVersion = project.getElementsByTagName("version").item(0).getTextContent().strip();
        assertThat(((Element) project.getElementsByTagName("version").item(0)).getParentNode()).isSameAs(project);

        CliRun run = CliRun.of("--version");
        assertThat(run.exitCode()).isZero();
        assertThat(run.out().strip()).isEqualTo("slopewatch " + pomVersion);
    }

    @Test
    void demoLeavesThePortToTheConfigurationUnlessGivenOne() {
        DemoCommand unset = parse();
        assertThat(unset.settings(Path.of("target/demo-x"), "token-for-the-test").keySet()).doesNotContain("quarkus.http.port");

        DemoCommand given = parse("--port", "9123");
        assertThat(given.settings(Path.of("target/demo-x"), "token-for-the-test")).containsEntry("quarkus.http.port", "9123");
        assertThat(given.announcedPort()).isEqualTo(9123);

        String before = System.getProperty("quarkus.http.port");
        try {
            System.setProperty("quarkus.http.port", "9321");
            assertThat(unset.announcedPort()).as("what the configuration says is what the demo announces").isEqualTo(9321);
        } finally {
            if (before == null) {
                System.clearProperty("quarkus.http.port");
            } else {
                System.setProperty("quarkus.http.port", before);
            }
        }
    }

    private static DemoCommand parse(String... args) {
        DemoCommand demo = new DemoCommand();
        new CommandLine(demo).parseArgs(args);
        return demo;
    }
}
