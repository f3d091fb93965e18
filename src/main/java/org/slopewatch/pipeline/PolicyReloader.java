package org.slopewatch.pipeline;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.AlertStage;
import org.slopewatch.alerting.PolicyHolder;
import org.slopewatch.journal.PolicyInForce;
import org.slopewatch.journal.PolicyVersions;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyHash;

/**
 * Hot reload of the policy file. Every {@code slopewatch.alerts.reload-check} (scheduled by
 * {@link PipelineBeans}), and on {@code POST /api/policy/reload}, the file's content hash is
 * compared with the one in force; a changed, valid file replaces the policy as a whole (the
 * monitors are rebuilt from the journal under the new watch list, open alert episodes of rules
 * kept by name carry over) and is journalled with its hash, and as a reload accepted by this
 * instance, which every other instance on the journal then takes from its own copy of the file
 * ({@link PolicyFleet}, through {@link #follow}). An invalid file is rejected with its problems
 * logged, counted and journalled, and the previous policy keeps running, here and everywhere else;
 * the rejection stays visible ({@link #rejected()}, reported by the wellness check) until the file
 * is applied or is back to the content in force.
 *
 * <p>Polling the content rather than watching the directory: it also sees files replaced by a
 * symlink swap (as Kubernetes does with a mounted ConfigMap) and costs one small read. Plain
 * Java, so that two instances can be put side by side on one journal in a test.
 */
public class PolicyReloader {

    private static final Logger LOG = Logger.getLogger(PolicyReloader.class);

    /** What a reload check came to: {@code applied}, {@code unchanged}, {@code rejected}, or (following another instance) {@code waiting}. */
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
    private final AlertStage desk;
    private final PolicyVersions store;
    private final PolicyInForce fleet;
    private final String instance;
    private final Consumer<String> counted;
    private final Clock clock;
    // the file's content as last rejected, until a check finds other content
    private volatile Rejection rejected;

    /**
     * @param fleet    where a reload accepted here is recorded for the other instances
     * @param instance this instance's id ({@link InstanceId})
     * @param counted  told {@code applied} or {@code rejected} after each reload that came to either (the reloads metric)
     */
    public PolicyReloader(PolicyHolder policies, QuotePipeline pipeline, AlertStage desk, PolicyVersions store, PolicyInForce fleet,
                          String instance, Consumer<String> counted, Clock clock) {
        this.clock = clock;
        this.policies = policies;
        this.pipeline = pipeline;
        this.desk = desk;
        this.store = store;
        this.fleet = fleet;
        this.instance = instance;
        this.counted = counted;
        PolicyHolder.Loaded current = policies.current();
        if (!current.hash().equals(store.currentPolicyHash())) {
            store.policyVersion(current.hash(), current.source(), "applied", "loaded at start-up");
        }
        LOG.infof("policy %s in force (sha256 %s)", current.source(), current.hash());
        warn(current);
    }

    void checkQuietly() {
        try {
            check();
        } catch (RuntimeException e) {
            LOG.warnf("policy reload check failed: %s", e.getMessage());
        }
    }

    /**
     * Looks at the file now; applies it when it changed and is valid, and records the reload as
     * accepted here, so that every other instance on the journal follows.
     */
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
        Outcome outcome = apply(current, hash, null, "reloaded");
        if ("applied".equals(outcome.result())) {
            fleet.accepted(outcome.hash(), instance);
        }
        return outcome;
    }

    /**
     * Takes the content of a reload another instance accepted, when this instance's own file gives
     * exactly that content ({@code wanted}, a SHA-256); otherwise changes nothing and answers
     * {@code waiting} (a mounted ConfigMap reaches each machine in its own time), so that the
     * caller asks again later. Not recorded as a reload accepted here: the fleet already has it.
     */
    public synchronized Outcome follow(String wanted) {
        PolicyHolder.Loaded current = policies.current();
        if (wanted.equals(current.hash())) {
            return new Outcome("unchanged", wanted, "the policy in force has this content");
        }
        String file = current.source();
        String hash;
        try {
            hash = PolicyHash.of(Files.readAllBytes(Path.of(file)));
        } catch (IOException e) {
            return new Outcome("waiting", null, "cannot read " + file + ": " + e.getMessage());
        }
        if (!hash.equals(wanted)) {
            return new Outcome("waiting", hash, file + " gives sha256 " + hash + ", not yet the accepted sha256 " + wanted);
        }
        return apply(current, hash, wanted, "reloaded: accepted on another instance");
    }

    /**
     * Reads, checks and puts in force the file whose content was found to have {@code hash}, or
     * rejects it; with {@code required} set, only content of that hash.
     */
    private Outcome apply(PolicyHolder.Loaded current, String hash, String required, String why) {
        String file = current.source();
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
        if (required != null && !next.hash().equals(required)) {
            // the file changed between the two reads (a ConfigMap swapped meanwhile): the next check looks again
            return new Outcome("waiting", next.hash(), file + " changed while it was read");
        }
        hash = next.hash(); // what is put in force is named by the content parsed
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
        store.policyVersion(hash, file, "applied", why);
        counted.accept("applied");
        rejected = null;
        LOG.infof("policy %s %s (sha256 %s): %d watch(es), %d alert rule(s)", file, why, hash, next.policy().watches().size(),
                next.policy().alerts().size());
        warn(next);
        return new Outcome("applied", hash, why);
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
        counted.accept("rejected");
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
