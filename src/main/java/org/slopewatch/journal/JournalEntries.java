package org.slopewatch.journal;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.SortedMap;
import org.slopewatch.curve.Tenor;
import org.slopewatch.monitor.Observation;
import org.slopewatch.monitor.Revision;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpellRestatement;
import org.slopewatch.monitor.Transition;
import org.slopewatch.rules.Alert;
import org.slopewatch.spread.SpreadKey;

/**
 * Everything one processing step wants journalled, written in one transaction so that the
 * journal never holds a transition without the quote that caused it.
 */
public final class JournalEntries {

    /** An accepted quote message (one or more tenors of a curve on a date) with its input sequence number. */
    public record AcceptedQuote(long seq, String origin, String messageId, String source, Instant sentAt, String curve,
                                LocalDate date, SortedMap<Tenor, Double> yieldsBp) {
    }

    /** A rejected item and where it came from; {@code reason} is the reason's code. */
    public record RejectedQuote(String origin, String reason, String detail, int item, String raw) {
    }

    /** A computed spread value. */
    public record SpreadValue(SpreadKey spread, Observation observation) {
    }

    /**
     * What the monitors concluded, kept in the order they reported it: a revision supersedes what
     * was journalled before it, including earlier conclusions of the same step, and nothing after;
     * a restatement writes over spells reported before it, in this step or earlier.
     */
    sealed interface Conclusion permits TransitionEntry, SpellEntry, RevisionEntry, RestatementEntry {
    }

    record TransitionEntry(Transition transition) implements Conclusion {
    }

    record SpellEntry(Spell spell) implements Conclusion {
    }

    /** A revision: the transitions it supersedes and replaces, and the spells it writes again ({@link Revision#spells()}). */
    public record RevisionEntry(Revision revision) implements Conclusion {
    }

    /** Spells written over under their ids, their figures restated. */
    record RestatementEntry(SpellRestatement restatement) implements Conclusion {
    }

    /**
     * A notice and its outbox rows: one per channel, pending unless {@code skipped} gives a
     * reason not to deliver (channel not configured, notice held back by a quiet period).
     *
     * @param episodeSince the market date the rule's condition started to hold (names the episode)
     * @param quietedBy    the quiet period that held it back, described, or null
     */
    public record AlertEntry(Alert alert, String subject, LocalDate episodeSince, int notice, String quietedBy, String policyHash,
                             Long seq, List<Outbox> outbox) {
        public AlertEntry {
            outbox = List.copyOf(outbox);
        }
    }

    /** One channel an alert goes to; {@code skipped} is null for a delivery to make, else why none is made. */
    public record Outbox(String channel, String skipped) {
    }

    final List<AcceptedQuote> quotes = new ArrayList<>();
    final List<RejectedQuote> rejects = new ArrayList<>();
    final List<SpreadValue> observations = new ArrayList<>();
    final List<Conclusion> conclusions = new ArrayList<>();
    int transitionCount;
    final List<AlertEntry> alerts = new ArrayList<>();

    public void quote(AcceptedQuote quote) {
        quotes.add(quote);
    }

    public void reject(RejectedQuote reject) {
        rejects.add(reject);
    }

    public void observation(SpreadKey spread, Observation observation) {
        observations.add(new SpreadValue(spread, observation));
    }

    public void transition(Transition t) {
        conclusions.add(new TransitionEntry(t));
        transitionCount++;
    }

    public void spell(Spell s) {
        conclusions.add(new SpellEntry(s));
    }

    public void revision(Revision r) {
        conclusions.add(new RevisionEntry(r));
        transitionCount += r.after().size();
    }

    public void restatement(SpellRestatement r) {
        conclusions.add(new RestatementEntry(r));
    }

    public void alert(AlertEntry alert) {
        alerts.add(alert);
    }

    /** The alerts of this step, in the order they were decided. */
    public List<AlertEntry> alerts() {
        return List.copyOf(alerts);
    }

    /** The quote and spread-value rows held: what a step may write ahead of its end ({@link StepWrite}). */
    int rowCount() {
        return quotes.size() + observations.size();
    }

    /** The quote and spread-value rows so far, handed over and no longer held here. */
    JournalEntries takeRows() {
        JournalEntries part = new JournalEntries();
        part.quotes.addAll(quotes);
        part.observations.addAll(observations);
        quotes.clear();
        observations.clear();
        return part;
    }

    public boolean isEmpty() {
        return quotes.isEmpty() && rejects.isEmpty() && observations.isEmpty() && conclusions.isEmpty() && alerts.isEmpty();
    }
}
