package org.slopewatch.pipeline;

import io.quarkus.runtime.Startup;
import io.quarkus.scheduler.Scheduled.ConcurrentExecution;
import io.quarkus.scheduler.Scheduler;
import jakarta.inject.Singleton;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.AlertDesk;
import org.slopewatch.alerting.AlertMetrics;
import org.slopewatch.alerting.AlertsConfig;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.PolicyVersions;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyHash;

/**
 * Hot reload of the policy file. Every {@code slopewatch.alerts.reload-check} the file's content
 * hash is compared with the one in force; a changed, valid file replaces the policy as a whole
 * (the monitors are rebuilt from the journal under the new watch list, open alert episodes of
 * rules kept by name carry over) and is journalled with its hash. An invalid file is rejected
 * with its problems logged, counted and journalled, and the previous policy keeps running; the
 * rejection stays visible ({@link #rejected()}, reported by the wellness check) until the file is
 * applied or is back to the content in force.
 *
 * <p>Polling the content rather than watching the directory: it also sees files replaced by a
 * symlink swap (as Kubernetes does with a mounted ConfigMap) and costs one small read.
 */
@Startup
@Singleton
public class PolicyReloader {

    private static final Logger LOG = Logger.getLogger(PolicyReloader.class);

    /** What a reload check came to. */
    public record Outcome(String result, String hash, String detail) {
    }

    // stands for the content of a file that could not be read, so that it is rejected once; short
    // enough for the journal's content_hash column (64 characters), which holds it
    private static final String UNREADABLE = "unreadable";

    /**
     * The file on disk as last rejected, while it stays so: the previous policy keeps running.
     *
     * @param hash     the SHA-256 of the rejected content, or a mark for a file that could not be read
     * @param problems one line each, as logged and journalled
     */
    public record Rejection(String file, String hash, Instant at, List<String> problems) {

        public Rejection {
            problems = List.copyOf(problems);
        }

        /** The rejected content's SHA-256; empty when the file could not be read. */
        public Optional<String> contentHash() {
            return UNREADABLE.equals(hash) ? Optional.empty() : Optional.of(hash);
        }
    }

    private final PolicyHolder policies;
    private final QuotePipeline pipeline;
    private final AlertDesk desk;
    private final PolicyVersions store;
    private final AlertMetrics metrics;
    private final Clock clock;
    // the file's content as last rejected, until a check finds other content
    private volatile Rejection rejected;

    PolicyReloader(PolicyHolder policies, QuotePipeline pipeline, AlertDesk desk, PolicyVersions store, AlertMetrics metrics,
                   AlertsConfig config, Clock clock, Scheduler scheduler) {
        this.clock = clock;
        this.policies = policies;
        this.pipeline = pipeline;
        this.desk = desk;
        this.store = store;
        this.metrics = metrics;
        PolicyHolder.Loaded current = policies.current();
        if (!current.hash().equals(store.currentPolicyHash())) {
            store.policyVersion(current.hash(), current.source(), "applied", "loaded at start-up");
        }
        LOG.infof("policy %s in force (sha256 %s)", current.source(), current.hash());
        warn(current);
        Duration every = config.reloadCheck();
        if (!every.isZero() && !every.isNegative()) {
            scheduler.newJob("slopewatch-policy-reload").setInterval(every.toString()).setDelayed(every.toString())
                    .setConcurrentExecution(ConcurrentExecution.SKIP).setTask(execution -> checkQuietly()).schedule();
        }
    }

    private void checkQuietly() {
        try {
            check();
        } catch (RuntimeException e) {
            LOG.warnf("policy reload check failed: %s", e.getMessage());
        }
    }

    /** Looks at the file now; applies it when it changed and is valid. */
    public synchronized Outcome check() {
        PolicyHolder.Loaded current = policies.current();
        String file = current.source();
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(Path.of(file));
        } catch (IOException e) {
            return reject(file, UNREADABLE, List.of("cannot read " + file + ": " + e.getMessage()));
        }
        String hash = PolicyHash.of(bytes);
        if (hash.equals(current.hash())) {
            rejected = null; // the file is back to the policy in force
            return new Outcome("unchanged", hash, "the policy in force has this content");
        }
        Rejection last = rejected;
        if (last != null && hash.equals(last.hash())) {
            return new Outcome("rejected", hash, "this content was rejected before; the previous policy keeps running");
        }
        PolicyHolder.Loaded next;
        try {
            next = PolicyHolder.read(file);
        } catch (IOException e) {
            return reject(file, hash, List.of("cannot read " + file + ": " + e.getMessage()));
        } catch (PolicyException e) {
            return reject(file, hash, e.lines());
        }
        List<String> problems = desk.checkChannels(next.policy());
        if (!problems.isEmpty()) {
            return reject(file, hash, problems);
        }
        policies.replace(next);
        if (!next.policy().watches().equals(current.policy().watches())) {
            long replayed = pipeline.reconfigure(next.policy().watches());
            LOG.infof("watch list changed: monitors rebuilt from %d journalled quote message(s)", replayed);
        } else {
            desk.replaceRules(next.policy());
        }
        store.policyVersion(hash, file, "applied", "reloaded");
        metrics.reload("applied");
        rejected = null;
        LOG.infof("policy %s reloaded (sha256 %s): %d watch(es), %d alert rule(s)", file, hash, next.policy().watches().size(),
                next.policy().alerts().size());
        warn(next);
        return new Outcome("applied", hash, "reloaded");
    }

    /** One log line per warning of a policy put in force (a deprecated key, with the key that replaces it). */
    private static void warn(PolicyHolder.Loaded loaded) {
        loaded.policy().warnings().forEach(w -> LOG.warnf("policy warning: %s", w));
    }

    /**
     * @param problems one line each; the parser lists at most a hundred, each a few hundred
     *                 characters at most, so neither the answer nor the log grows with the file
     */
    private Outcome reject(String file, String hash, List<String> problems) {
        String why = String.join(System.lineSeparator(), problems);
        rejected = new Rejection(file, hash, clock.instant(), problems);
        metrics.reload("rejected");
        store.policyVersion(hash, file, "rejected", why);
        // one log line per problem: a record never spans lines (the log guard escapes line breaks)
        LOG.errorf("policy %s rejected, the previous policy keeps running; %d line(s) of problems follow", file, problems.size());
        for (String problem : problems) {
            LOG.errorf("policy rejected: %s", problem);
        }
        return new Outcome("rejected", hash, why);
    }

    /** The policy file's rejection while the file on disk stays rejected; empty once it is applied or back to the policy in force. */
    public Optional<Rejection> rejected() {
        return Optional.ofNullable(rejected);
    }
}
