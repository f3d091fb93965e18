package org.slopewatch.alerting;

import io.quarkus.runtime.Startup;
import jakarta.annotation.PreDestroy;
import jakarta.inject.Singleton;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import org.jboss.logging.Logger;
import org.slopewatch.delivery.AlertChannel;
import org.slopewatch.delivery.ChannelRegistry;
import org.slopewatch.delivery.DeliveryOutcome;
import org.slopewatch.delivery.RetryDecision;
import org.slopewatch.delivery.RetryPolicy;
import org.slopewatch.journal.DeliveryOutbox;
import org.slopewatch.journal.JournalException;

/**
 * Delivers from the journal's outbox: one worker per configured channel takes that channel's due
 * deliveries in order, makes one attempt each, asks the one {@link RetryPolicy} what follows and
 * journals the attempt and the new schedule together. Because the schedule lives in the journal,
 * pending deliveries resume after a restart; because a delivery is marked done in the same
 * transaction that records its successful attempt, a restart repeats at most the attempt in
 * flight when the process died. Each attempt is preceded by a claim on the outbox row (a lease of
 * {@code slopewatch.alerts.delivery-claim}, two minutes by default), so that several daemons on
 * one journal never send the same delivery at once.
 *
 * <p>A channel with a long outage holds up only its own queue. Workers poll at
 * {@code slopewatch.alerts.delivery-poll} and are woken at once when new alerts are stored.
 */
@Startup
@Singleton
public class AlertDispatcher {

    private static final Logger LOG = Logger.getLogger(AlertDispatcher.class);
    private static final int BATCH = 50;

    private final ChannelRegistry channels;
    private final DeliveryOutbox store;
    private final RetryPolicy retry;
    private final AlertMetrics metrics;
    private final ChannelFailures failures;
    private final Clock clock;
    // how long a claimed delivery is this instance's alone (slopewatch.alerts.delivery-claim)
    private final Duration claim;
    private final ScheduledExecutorService workers;
    // names this process in outbox claims; only equality matters
    private final String instance = ProcessHandle.current().pid() + "@" + UUID.randomUUID();
    private final List<Worker> all = new ArrayList<>();

    AlertDispatcher(ChannelRegistry channels, DeliveryOutbox store, RetryPolicy retry, AlertMetrics metrics, ChannelFailures failures,
                    AlertsConfig config, Clock clock) {
        this.channels = channels;
        this.store = store;
        this.retry = retry;
        this.metrics = metrics;
        this.failures = failures;
        this.clock = clock;
        this.claim = config.deliveryClaim();
        this.workers = Executors.newScheduledThreadPool(Math.max(1, channels.all().size()), r -> {
            Thread t = new Thread(r, "slopewatch-delivery");
            t.setDaemon(true);
            return t;
        });
        long poll = Math.max(50, config.deliveryPoll().toMillis());
        for (AlertChannel channel : channels.all()) {
            Worker w = new Worker(channel);
            all.add(w);
            workers.scheduleWithFixedDelay(w::run, poll, poll, TimeUnit.MILLISECONDS);
        }
    }

    /** New alerts are stored: look at once rather than at the next poll. */
    public void wake() {
        for (Worker w : all) {
            workers.execute(w::run);
        }
    }

    @PreDestroy
    void stop() {
        workers.shutdownNow();
    }

    /** One channel's queue; never runs twice at once, so the channel's deliveries keep their order. */
    private final class Worker {

        private final AlertChannel channel;
        private final AtomicBoolean running = new AtomicBoolean();

        Worker(AlertChannel channel) {
            this.channel = channel;
        }

        void run() {
            if (!running.compareAndSet(false, true)) {
                return;
            }
            try {
                List<DeliveryOutbox.Due> due;
                do {
                    due = store.due(channel.name(), clock.instant(), BATCH);
                    for (DeliveryOutbox.Due d : due) {
                        deliver(d);
                    }
                } while (due.size() == BATCH);
                metrics.backlog(store.backlog());
            } catch (JournalException e) {
                LOG.warnf("delivery on %s paused: the journal cannot be read or written (%s); retrying at the next poll",
                        channel.name(), e.getMessage());
            } catch (RuntimeException e) {
                LOG.errorf(e, "delivery worker for %s failed; retrying at the next poll", channel.name());
            } finally {
                running.set(false);
            }
        }

        private void deliver(DeliveryOutbox.Due d) {
            Instant attemptedAt = clock.instant();
            if (!store.claim(d.delivery(), instance, attemptedAt, attemptedAt.plus(claim))) {
                return; // another instance is sending it, or has just sent it
            }
            DeliveryOutcome outcome;
            try {
                outcome = channel.deliver(d.alert());
            } catch (RuntimeException e) {
                // a channel should answer with an outcome; one that throws is treated as a transient failure
                outcome = new DeliveryOutcome.RetryLater("channel failed: " + e.getClass().getSimpleName());
            }
            int attempt = d.delivery().attempts() + 1;
            Instant first = d.delivery().firstAttemptAt() == null ? attemptedAt : d.delivery().firstAttemptAt();
            RetryDecision decision = retry.decide(outcome, attempt, first);
            String detail = detail(outcome);
            if (decision instanceof RetryDecision.Done) {
                store.attempt(d.delivery(), attemptedAt, "delivered", detail, decision.reason(), DeliveryOutbox.Status.DELIVERED, null);
                metrics.attempt(channel.name(), d.alert(), "delivered");
                metrics.finished(channel.name(), "delivered");
                failures.attempted(channel.name(), ChannelFailures.Outcome.DELIVERED, attemptedAt);
                LOG.debugf("alert %s delivered on %s (attempt %d)", d.alert().id(), channel.name(), attempt);
            } else if (decision instanceof RetryDecision.RetryAt r) {
                store.attempt(d.delivery(), attemptedAt, "retry", detail, decision.reason(), DeliveryOutbox.Status.PENDING, r.at());
                metrics.attempt(channel.name(), d.alert(), "retry");
                failures.attempted(channel.name(), ChannelFailures.Outcome.RETRY, attemptedAt);
                LOG.warnf("alert %s on %s: %s", d.alert().id(), channel.name(), decision.reason());
            } else {
                store.attempt(d.delivery(), attemptedAt, "failed", detail, decision.reason(), DeliveryOutbox.Status.FAILED, null);
                metrics.attempt(channel.name(), d.alert(), "failed");
                metrics.finished(channel.name(), "failed");
                failures.attempted(channel.name(), ChannelFailures.Outcome.FAILED, attemptedAt);
                LOG.errorf("alert %s on %s not delivered: %s", d.alert().id(), channel.name(), decision.reason());
            }
        }
    }

    private static String detail(DeliveryOutcome outcome) {
        if (outcome instanceof DeliveryOutcome.Delivered d) {
            return d.detail();
        } else if (outcome instanceof DeliveryOutcome.RetryLater r) {
            return r.reason();
        }
        return ((DeliveryOutcome.FailedForGood) outcome).reason();
    }
}
