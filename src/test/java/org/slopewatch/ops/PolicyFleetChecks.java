package org.slopewatch.ops;

import static org.assertj.core.api.Assertions.assertThat;

import io.agroal.api.AgroalDataSource;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.eclipse.microprofile.health.HealthCheckResponse;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.alerting.AlertStage;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.journal.PolicyInForce;
import org.slopewatch.journal.PolicyVersions;
import org.slopewatch.pipeline.FleetConfig;
import org.slopewatch.pipeline.PipelineListener;
import org.slopewatch.pipeline.PolicyFleet;
import org.slopewatch.pipeline.PolicyReloader;
import org.slopewatch.pipeline.QuotePipeline;
import org.slopewatch.testsupport.MutableClock;

/**
 * Two instances on one journal, each with its own copy of the policy file, as two daemons behind
 * one ConfigMap: the reloader, the fleet's check and the wellness check of each, without Quarkus.
 * A check of {@link PolicyFleet} is what the scheduler runs every {@code slopewatch.fleet.check-every};
 * the tests call it by hand, so "at its next check" means "within one check interval". The
 * checks are written once and run on H2 ({@link PolicyFleetTest}) and PostgreSQL ({@link PolicyFleetPostgresTest}).
 *
 * <p>Expected hashes are SHA-256 (FIPS 180-4) of the files' bytes, worked out with the JDK's
 * {@link MessageDigest}, not with the project's own {@code PolicyHash}.
 */
abstract class PolicyFleetChecks {

    /** One watched spread: the policy both instances start with. */
    static final String OLD = """
            watch:
              - spread: 10Y-3M
                enter-below-bp: 0
                exit-at-or-above-bp: 0
                confirm:
                  - quarter-average: { below-bp: 0 }
            """;

    /** The desk's edit: a second spread watched. */
    static final String NEW = OLD + """
              - spread: 10Y-2Y
                enter-below-bp: 0
                exit-at-or-above-bp: 0
                confirm:
                  - days-inverted: { days: 20 }
            """;

    static final Duration CHECK_EVERY = Duration.ofSeconds(5);
    static final Duration LIVE_WITHIN = Duration.ofSeconds(30);

    final MutableClock clock = new MutableClock(Instant.parse("2026-10-05T08:00:00Z"));
    private final List<AutoCloseable> open = new ArrayList<>();

    @TempDir
    Path dir;

    /** A new pool on the one journal of this test (migrated on first use): each instance opens its own. */
    protected abstract AgroalDataSource journal();

    protected final <T extends AutoCloseable> T closeAfterTest(T resource) {
        open.add(resource);
        return resource;
    }

    @AfterEach
    void close() throws Exception {
        Collections.reverse(open);
        for (AutoCloseable c : open) {
            c.close();
        }
        open.clear();
    }

    /** One daemon's policy pieces: its own file, pool, policy, pipeline, reloader, fleet check and wellness check. */
    final class Instance {
        final String id;
        final Path file;
        final PolicyHolder policies;
        final QuotePipeline pipeline;
        final PolicyReloader reloader;
        final PolicyFleet fleet;
        final PolicyFleetCheck health;
        final List<String> reloads = new ArrayList<>();

        Instance(String id, String policy) throws Exception {
            this.id = id;
            this.file = dir.resolve(id + "/policy.yaml");
            Files.createDirectories(file.getParent());
            Files.writeString(file, policy);
            AgroalDataSource ds = journal();
            policies = new PolicyHolder(PolicyHolder.read(file.toString()));
            pipeline = new QuotePipeline(policies.policy().watches(), new JournalWriter(ds, clock), new JournalReader(ds),
                    PipelineListener.NONE, AlertStage.NONE, clock);
            pipeline.recover();
            PolicyInForce store = new PolicyInForce(ds, clock);
            reloader = new PolicyReloader(policies, pipeline, AlertStage.NONE, new PolicyVersions(ds, clock), store, id, reloads::add, clock);
            fleet = new PolicyFleet(reloader, policies, store, id);
            health = new PolicyFleetCheck(store, fleet, config(), clock);
        }

        /** The ConfigMap reaches this instance's copy of the file. */
        void fileGives(String policy) throws IOException {
            Files.writeString(file, policy);
        }

        String hash() {
            return policies.current().hash();
        }

        int watches() {
            return pipeline.watches().size();
        }
    }

    static FleetConfig config() {
        return new FleetConfig() {
            @Override
            public Optional<String> instanceId() {
                return Optional.empty();
            }

            @Override
            public Duration checkEvery() {
                return CHECK_EVERY;
            }

            @Override
            public Duration liveWithin() {
                return LIVE_WITHIN;
            }
        };
    }

    static String sha256(String text) throws NoSuchAlgorithmException {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(text.getBytes(StandardCharsets.UTF_8)));
    }

    /** Both instances run their checks, as the scheduler does once every check interval. */
    void interval(Instance... instances) {
        clock.advance(CHECK_EVERY);
        for (Instance i : instances) {
            i.fleet.check();
        }
    }

    @Test
    void aReloadAcceptedOnOneInstanceIsTakenByTheOtherAtItsNextCheck() throws Exception {
        Instance a = new Instance("desk-a", OLD);
        Instance b = new Instance("desk-b", OLD);
        a.fileGives(NEW);
        b.fileGives(NEW);

        assertThat(a.reloader.check().result()).as("the reload asked of instance A").isEqualTo("applied");
        assertThat(b.hash()).as("B has not looked at the journal yet").isEqualTo(sha256(OLD));

        interval(b);

        assertThat(b.hash()).as("one check of B later, B runs what A accepted").isEqualTo(sha256(NEW));
        assertThat(b.watches()).as("B's monitors follow the new watch list").isEqualTo(2);
        assertThat(b.reloads).as("B applied once, and rejected nothing").containsExactly("applied");
        assertThat(b.fleet.waiting()).isEmpty();
        interval(a, b);
        assertThat(b.reloads).as("a reload is taken once, not at every check").containsExactly("applied");
        assertThat(a.health.call().getStatus()).isEqualTo(HealthCheckResponse.Status.UP);
        assertThat(b.health.call().getStatus()).isEqualTo(HealthCheckResponse.Status.UP);
    }

    @Test
    void anInstanceWhoseFileIsBehindWaitsAndHealthNamesBothUntilItsFileCatchesUp() throws Exception {
        Instance a = new Instance("desk-a", OLD);
        Instance b = new Instance("desk-b", OLD);
        a.fileGives(NEW); // the ConfigMap has reached A's machine, not yet B's

        assertThat(a.reloader.check().result()).isEqualTo("applied");
        interval(a, b);

        assertThat(b.hash()).as("B's file still gives the old policy: B keeps running it").isEqualTo(sha256(OLD));
        assertThat(b.fleet.waiting()).as("B says what it waits for").get()
                .satisfies(w -> assertThat(w.reload().hash()).isEqualTo(sha256(NEW)));
        for (Instance seen : List.of(a, b)) {
            HealthCheckResponse well = seen.health.call();
            assertThat(well.getStatus()).as("wellness seen from %s: %s", seen.id, well.getData()).isEqualTo(HealthCheckResponse.Status.DOWN);
            Map<String, Object> data = well.getData().orElseThrow();
            assertThat(data.get("disagreement").toString()).as("both instances and both hashes named")
                    .contains("desk-a run sha256 " + sha256(NEW)).contains("desk-b run sha256 " + sha256(OLD));
            assertThat(data.get("desk-b").toString()).contains("waiting for its file to give sha256 " + sha256(NEW));
        }
        assertThat(b.health.call().getData().orElseThrow().get("waiting").toString()).as("B's own check says why")
                .contains("desk-a").contains(sha256(NEW)).contains("not yet the accepted");

        interval(a, b);
        assertThat(b.hash()).as("still behind: tried again, nothing changed").isEqualTo(sha256(OLD));
        assertThat(b.reloads).as("waiting is neither an applied nor a rejected reload").isEmpty();

        b.fileGives(NEW); // the ConfigMap reaches B
        interval(a, b);

        assertThat(b.hash()).isEqualTo(sha256(NEW));
        assertThat(b.fleet.waiting()).isEmpty();
        for (Instance seen : List.of(a, b)) {
            HealthCheckResponse well = seen.health.call();
            assertThat(well.getStatus()).as("wellness seen from %s: %s", seen.id, well.getData()).isEqualTo(HealthCheckResponse.Status.UP);
            assertThat(well.getData().orElseThrow()).containsEntry("live instances", 2L);
        }
    }

    @Test
    void aRejectedReloadChangesNothingAnywhere() throws Exception {
        Instance a = new Instance("desk-a", OLD);
        Instance b = new Instance("desk-b", OLD);
        a.fileGives("watch:\n  - spread: 10Y-3M\n    enter-below-bp: zero\n");
        b.fileGives(NEW); // B's file holds something else, valid: only an accepted reload may make B take it

        assertThat(a.reloader.check().result()).isEqualTo("rejected");
        interval(a, b);

        assertThat(a.hash()).isEqualTo(sha256(OLD));
        assertThat(b.hash()).as("nothing accepted, nothing taken").isEqualTo(sha256(OLD));
        assertThat(b.fleet.waiting()).isEmpty();
        assertThat(b.reloads).isEmpty();
        assertThat(b.health.call().getStatus()).isEqualTo(HealthCheckResponse.Status.UP);
    }

    @Test
    void anInstanceNotSeenWithinTheBoundNoLongerCounts() throws Exception {
        Instance a = new Instance("desk-a", OLD);
        Instance b = new Instance("desk-b", OLD);
        a.fileGives(NEW);
        a.reloader.check();
        interval(a, b);
        assertThat(a.health.call().getStatus()).isEqualTo(HealthCheckResponse.Status.DOWN);

        // B stops; A goes on checking past the bound
        for (long s = 0; s <= LIVE_WITHIN.toSeconds(); s += CHECK_EVERY.toSeconds()) {
            interval(a);
        }

        HealthCheckResponse well = a.health.call();
        assertThat(well.getStatus()).as("%s", well.getData()).isEqualTo(HealthCheckResponse.Status.UP);
        assertThat(well.getData().orElseThrow()).containsEntry("live instances", 1L).doesNotContainKey("desk-b");
    }
}
