package org.slopewatch.alerting;

import jakarta.inject.Singleton;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import org.jboss.logging.Logger;
import org.slopewatch.delivery.AlertChannel;
import org.slopewatch.delivery.ChannelRegistry;
import org.slopewatch.delivery.StreamChannel;
import org.slopewatch.delivery.StreamTransport;
import org.slopewatch.journal.Acknowledgements;
import org.slopewatch.journal.AlertHistory;
import org.slopewatch.journal.DeskChanges;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.journal.QuietPeriodBook;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.rules.Alert;
import org.slopewatch.rules.AlertCondition;
import org.slopewatch.rules.AlertConditions;
import org.slopewatch.rules.AlertDecision;
import org.slopewatch.rules.AlertEngine;
import org.slopewatch.rules.ChannelDeclaration;
import org.slopewatch.rules.Policy;

/**
 * The rule engine in the daemon: decides notices as the pipeline steps and the clock ticks, adds
 * them with their outbox rows to the step's journal transaction, and keeps acknowledgements and
 * quiet periods. Its memory (open episodes, quiet periods) is rebuilt from the journal on start and
 * after a failed write, so a restart neither sends a second opening notice nor forgets a closing one.
 * Quiet periods and acknowledgements made through another instance on the same journal are read
 * before a notice is let out ({@link DeskState}, which states the bound).
 *
 * <p>Synchronised: the pipeline calls it under its own lock, the API for acks and quiet periods does not.
 */
@Singleton
public class AlertDesk implements AlertStage {

    private static final Logger LOG = Logger.getLogger(AlertDesk.class);

    private final PolicyHolder policies;
    private final AlertHistory history;
    private final Acknowledgements acks;
    private final QuietPeriodBook quietPeriodBook;
    private final DeskState state;
    private final ChannelRegistry channels;
    private final AlertDispatcher dispatcher;
    private final AlertMetrics metrics;
    private final AlertComposer composer;
    private final Clock clock;

    private AlertEngine engine;

    AlertDesk(PolicyHolder policies, AlertHistory history, Acknowledgements acks, QuietPeriodBook quietPeriodBook, DeskChanges changes,
              ChannelRegistry channels, AlertDispatcher dispatcher, AlertMetrics metrics, AlertsConfig config, Clock clock) {
        this.policies = policies;
        this.history = history;
        this.acks = acks;
        this.quietPeriodBook = quietPeriodBook;
        this.state = new DeskState(changes, quietPeriodBook, acks);
        this.channels = channels;
        this.dispatcher = dispatcher;
        this.metrics = metrics;
        this.composer = new AlertComposer(config.dashboardUrl());
        this.clock = clock;
        List<String> problems = checkChannels(policies.policy());
        if (!problems.isEmpty()) {
            throw new IllegalStateException("the policy's channels do not match the configuration:" + System.lineSeparator()
                    + String.join(System.lineSeparator(), problems));
        }
        warnUnconfigured(policies.policy());
        metrics.expect(policies.policy(), channels.names());
        this.engine = new AlertEngine(policies.policy().alerts());
    }

    /**
     * What stops a policy from running with this configuration: a channel declared with one type
     * in the policy and configured with another, or a stream channel whose events would stay in
     * memory ({@link StreamTransport}). A declared channel that is not configured at all is
     * allowed (its deliveries are recorded as skipped), so that the shipped policy runs on a
     * machine with no chat or mail server or broker. Start-up and every reload ask this.
     */
    @Override
    public List<String> checkChannels(Policy policy) {
        return checkChannels(policy, channels::channel, channels.streamTransport());
    }

    static List<String> checkChannels(Policy policy, Function<String, Optional<AlertChannel>> configuredChannels, StreamTransport streams) {
        List<String> problems = new ArrayList<>();
        for (ChannelDeclaration declared : policy.channels()) {
            Optional<AlertChannel> configured = configuredChannels.apply(declared.name());
            if (configured.isEmpty()) {
                continue;
            }
            if (!configured.get().type().equals(declared.type())) {
                problems.add(policy.source() + ": channel " + declared.name() + " is declared as " + declared.type()
                        + " but configured as " + configured.get().type() + " (slopewatch.channels." + declared.name() + ".type)");
            } else if (StreamChannel.TYPE.equals(declared.type())) {
                streams.refusal(declared.name()).ifPresent(refusal -> problems.add(policy.source() + ": " + refusal));
            }
        }
        return problems;
    }

    /** Whether the rules of the policy in force can reach the desk with the channels configured here. */
    public ChannelReach reach() {
        return reach(policies.policy());
    }

    private ChannelReach reach(Policy policy) {
        return ChannelReach.of(policy, name -> channels.channel(name).map(AlertChannel::type));
    }

    private void warnUnconfigured(Policy policy) {
        ChannelReach reach = reach(policy);
        for (ChannelDeclaration declared : reach.unconfigured()) {
            LOG.warnf("channel %s (%s) is named in %s but not configured (slopewatch.channels.%s.*): its deliveries will be "
                    + "recorded as skipped", declared.name(), declared.type(), policy.source(), declared.name());
        }
        for (ChannelReach.RuleReach rule : reach.unreached()) {
            LOG.warnf("alert rule %s (%s) in %s %s", rule.rule(), rule.severity().name().toLowerCase(Locale.ROOT),
                    policy.source(), rule.describe());
        }
    }

    /** A new policy: rules change, open episodes of rules kept by name carry over. */
    @Override
    public synchronized void replaceRules(Policy policy) {
        warnUnconfigured(policy);
        metrics.expect(policy, channels.names());
        engine = engine.withRules(policy.alerts());
    }

    @Override
    public synchronized void onStep(Collection<SpreadStatus> changed, long sequence, JournalEntries journal) {
        if (changed.isEmpty()) {
            return;
        }
        Policy policy = policies.policy();
        decide(AlertConditions.of(policy.alerts(), List.copyOf(changed), Map.of(), policy.probability()), changed,
                sequence, journal);
    }

    @Override
    public synchronized void onTick(Collection<SpreadStatus> all, Map<String, LocalDate> staleCurves, JournalEntries journal) {
        refresh();
        Policy policy = policies.policy();
        decide(AlertConditions.of(policy.alerts(), List.copyOf(all), staleCurves, policy.probability()), all, null,
                journal);
    }

    private void decide(List<AlertCondition> conditions, Collection<SpreadStatus> statuses, Long sequence,
                        JournalEntries journal) {
        Instant now = clock.instant();
        List<AlertDecision> decisions = engine.decide(conditions, now);
        if (decisions.isEmpty()) {
            return;
        }
        // what people set through any instance holds for this notice: read the journal's now (DeskState)
        refresh();
        Map<String, SpreadStatus> byId = new HashMap<>();
        statuses.forEach(s -> byId.put(s.id(), s));
        Policy policy = policies.policy();
        String hash = policies.current().hash();
        for (AlertDecision d : decisions) {
            if (d.notice() == Alert.Kind.STANDING && state.acknowledged(d.rule().name(), d.subject(), d.since())) {
                // acknowledged through another instance since this engine last looked: no notice, and the
                // episode as it would be had the acknowledgement come before this decision
                engine.restore(d.rule().name(), d.subject(), new AlertEngine.Episode(d.since(), Instant.MAX, d.number() - 1));
                continue;
            }
            SpreadStatus status = byId.get(d.subject());
            Alert alert = composer.compose(d, status, status == null ? null : policy.probability().quoted(d.rule().when(), status).orElse(null), now);
            String quietedBy = quietedBy(d, now);
            List<JournalEntries.Outbox> outbox = new ArrayList<>();
            for (String channel : d.rule().channels()) {
                String skipped = quietedBy != null ? "held back: " + quietedBy
                        : channels.channel(channel).isEmpty() ? "channel " + channel + " is not configured" : null;
                outbox.add(new JournalEntries.Outbox(channel, skipped));
            }
            journal.alert(new JournalEntries.AlertEntry(alert, d.subject(), d.since(), d.number(), quietedBy, hash, sequence, outbox));
        }
    }

    /**
     * The quiet period that holds a decision back, described, or null. A quiet period of a spread
     * matches the spread id or its name.
     */
    private String quietedBy(AlertDecision d, Instant now) {
        for (QuietPeriodBook.QuietPeriod q : state.quietPeriods()) {
            if (!q.activeAt(now)) {
                continue;
            }
            boolean hit = "rule".equals(q.kind()) ? q.target().equals(d.rule().name())
                    : q.target().equals(d.subject()) || d.subject().endsWith(":" + q.target());
            if (hit) {
                return "quiet period " + q.id() + " on " + q.kind() + " " + q.target() + ", set by " + q.setBy() + " until " + q.until()
                        + " (" + q.note() + ")";
            }
        }
        return null;
    }

    @Override
    public void written(List<JournalEntries.AlertEntry> alerts) {
        if (alerts.isEmpty()) {
            return;
        }
        for (JournalEntries.AlertEntry e : alerts) {
            metrics.decided(e.alert(), e.quietedBy() != null);
            e.outbox().stream().filter(o -> o.skipped() != null).forEach(o -> metrics.finished(o.channel(), "skipped"));
            LOG.infof("alert id=%s rule=%s severity=%s kind=%s subject=%s: %s", e.alert().id(), e.alert().rule(),
                    e.alert().severity().name().toLowerCase(java.util.Locale.ROOT),
                    e.alert().kind().label(), e.alert().subject(), e.quietedBy() == null ? "queued" : "held back (" + e.quietedBy() + ")");
        }
        dispatcher.wake();
    }

    @Override
    public synchronized void rebuild() {
        state.reload();
        AlertEngine fresh = new AlertEngine(policies.policy().alerts());
        for (AlertHistory.StoredAlert a : history.latestPerEpisode()) {
            if (a.alert().kind() == Alert.Kind.CLOSING || a.episodeSince() == null) {
                continue;
            }
            fresh.restore(a.alert().rule(), a.subject(), new AlertEngine.Episode(a.episodeSince(), a.alert().createdAt(), a.notice()));
        }
        engine = fresh;
        silenceAcknowledged();
    }

    /** Reads what people set again if it changed on any instance, and silences the open episodes acknowledged meanwhile. */
    private void refresh() {
        if (state.refresh()) {
            silenceAcknowledged();
        }
    }

    private void silenceAcknowledged() {
        for (Map.Entry<String, AlertEngine.Episode> e : engine.openEpisodes().entrySet()) {
            String[] key = e.getKey().split("\\|", 2);
            if (state.acknowledged(key[0], key[1], e.getValue().since())) {
                engine.silence(key[0], key[1]);
            }
        }
    }

    /**
     * Acknowledges an alert: its episode sends no more standing notices (a closing notice still comes).
     *
     * @return the alert as it stands, or empty when there is no such alert
     */
    public synchronized Optional<AlertHistory.AlertView> acknowledge(String alertId, String by, String note) {
        AlertHistory.AlertView view = history.find(alertId);
        if (view == null) {
            return Optional.empty();
        }
        acks.ack(alertId, by, note);
        engine.silence(view.stored().alert().rule(), view.stored().subject());
        LOG.infof("alert %s acknowledged by %s%s", alertId, by, note == null || note.isBlank() ? "" : ": " + note);
        return Optional.ofNullable(history.find(alertId));
    }

    /** Sets a quiet period on a rule or a spread until a time; journalled with who set it and why. */
    public synchronized QuietPeriodBook.QuietPeriod setQuietPeriod(String kind, String target, Instant until, String note, String setBy) {
        QuietPeriodBook.QuietPeriod q = quietPeriodBook.add(kind, target, until, note, setBy);
        refresh();
        LOG.infof("quiet period %d on %s %s set by %s until %s: %s", q.id(), kind, target, setBy, until, note);
        return q;
    }

    /** Lifts a quiet period early; false when there is no such quiet period or it was lifted already. */
    public synchronized boolean lift(long periodId, String liftedBy) {
        boolean lifted = quietPeriodBook.lift(periodId, liftedBy);
        refresh();
        if (lifted) {
            LOG.infof("quiet period %d lifted by %s", periodId, liftedBy);
        }
        return lifted;
    }

    /** Every quiet period, newest first, as the journal holds them now (set through any instance). */
    public synchronized List<QuietPeriodBook.QuietPeriod> quietPeriods() {
        refresh();
        return state.quietPeriods();
    }

    /** The episodes whose condition holds now, by {@code rule|subject}, silenced if acknowledged through any instance. */
    public synchronized Map<String, AlertEngine.Episode> openEpisodes() {
        refresh();
        return engine.openEpisodes();
    }
}
