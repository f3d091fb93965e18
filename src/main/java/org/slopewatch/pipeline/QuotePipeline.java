package org.slopewatch.pipeline;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.Set;
import org.jboss.logging.Logger;
import org.slopewatch.alerting.AlertStage;
import org.slopewatch.curve.CurveBook;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.journal.CurveCheckpoints;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.journal.JournalWriter;
import org.slopewatch.journal.StepWrite;
import org.slopewatch.monitor.MonitorEvent;
import org.slopewatch.monitor.Revision;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpellRestatement;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.SpreadTrack;
import org.slopewatch.monitor.Transition;
import org.slopewatch.monitor.Watch;
import org.slopewatch.spread.SpreadKey;

/**
 * The daemon's path for accepted quotes: drop duplicates, merge into the curve book, run the
 * spreads and monitors, journal everything of the step in one transaction, then tell the
 * listeners. One writer: calls are serialised.
 *
 * <p>If a step fails before its transaction is committed (deciding or writing), the in-memory
 * state is rebuilt from the journal before the failure is passed on, so memory never runs ahead
 * of what was recorded (an id is taken as seen only with its quote); if the journal cannot be
 * read either, the rebuild is done before the next step, which fails until it can.
 */
public final class QuotePipeline {

    private static final Logger LOG = Logger.getLogger(TransitionLog.CATEGORY);

    private List<Watch> watches;
    private final JournalWriter writer;
    private final JournalReader reader;
    private final PipelineListener listener;
    private final AlertStage alerts;
    private final Clock clock;

    private SignalEngine engine;
    private CurveBook book;
    private final SeenIds seenIds;
    private final Memory memory;
    private HeldCurves held;
    private long sequence;
    private boolean recovered;
    // concurrent: the metrics read one curve's entry at scrape time without waiting for a step's lock
    private final Map<String, Instant> lastReceived = new ConcurrentHashMap<>();

    public QuotePipeline(List<Watch> watches, JournalWriter writer, JournalReader reader, PipelineListener listener, Clock clock) {
        this(watches, writer, reader, listener, AlertStage.NONE, clock);
    }

    public QuotePipeline(List<Watch> watches, JournalWriter writer, JournalReader reader, PipelineListener listener, AlertStage alerts,
                         Clock clock) {
        this(watches, writer, reader, listener, alerts, clock, SeenIds.DEFAULT_CAPACITY);
    }

    /**
     * @param seenIdsCache the most message ids kept in memory for de-duplication; older ones are
     *                     looked up in the journal ({@code slopewatch.ingest.seen-ids-cache})
     */
    public QuotePipeline(List<Watch> watches, JournalWriter writer, JournalReader reader, PipelineListener listener, AlertStage alerts,
                         Clock clock, int seenIdsCache) {
        this(watches, writer, reader, listener, alerts, clock, new Memory(seenIdsCache, Memory.WHOLE_HISTORY, null));
    }

    /**
     * How much the pipeline holds in memory, and where it keeps checkpoints.
     *
     * @param seenIdsCache the most message ids kept for de-duplication ({@code slopewatch.ingest.seen-ids-cache})
     * @param days         calendar days of snapshots and spread values held for revisions, older ones read from
     *                     the journal ({@code slopewatch.ingest.memory-days}); {@link #WHOLE_HISTORY} holds everything
     * @param checkpoints  where curve checkpoints are written and read, or null for none
     */
    public record Memory(int seenIdsCache, int days, CurveCheckpoints checkpoints) {

        public static final int WHOLE_HISTORY = Integer.MAX_VALUE;

        /** The daemon's default of message ids held ({@code slopewatch.ingest.seen-ids-cache}). */
        public static final String DEFAULT_SEEN_IDS = "100000";

        /** The daemon's default days held: a year and a month, so that the revisions of a year-end restatement stay in memory. */
        public static final String DEFAULT_DAYS = "400";

        /** Fewest days: two calendar months, what the probability's month averages read off a track. */
        public static final int MIN_DAYS = 62;

        /** The daemon's defaults, with checkpoints kept in {@code checkpoints}. */
        public static Memory defaults(CurveCheckpoints checkpoints) {
            return new Memory(Integer.parseInt(DEFAULT_SEEN_IDS), Integer.parseInt(DEFAULT_DAYS), checkpoints);
        }

        public Memory {
            if (days < MIN_DAYS) {
                throw new IllegalArgumentException("slopewatch.ingest.memory-days must be at least " + MIN_DAYS
                        + " (two calendar months, what the probability's month averages read), got " + days);
            }
        }
    }

    /** Without alerting (a backfill: history is not news), holding {@code memory}. */
    public QuotePipeline(List<Watch> watches, JournalWriter writer, JournalReader reader, PipelineListener listener, Clock clock,
                         Memory memory) {
        this(watches, writer, reader, listener, AlertStage.NONE, clock, memory);
    }

    public QuotePipeline(List<Watch> watches, JournalWriter writer, JournalReader reader, PipelineListener listener, AlertStage alerts,
                         Clock clock, Memory memory) {
        this.memory = memory;
        this.seenIds = new SeenIds(memory.seenIdsCache(), reader::seenAmong);
        this.watches = List.copyOf(watches);
        this.writer = writer;
        this.reader = reader;
        this.listener = listener;
        this.alerts = alerts;
        this.clock = clock;
        reset();
    }

    private void reset() {
        held = new HeldCurves(watches, reader, memory);
        engine = held.engine();
        book = held.book();
        seenIds.clear();
        sequence = 0;
    }

    /**
     * Rebuilds curves and monitors from the journal, so that a restart continues exactly where an
     * uninterrupted run would be: each curve from its checkpoint, if it has one written under the
     * watches in force, and the quotes recorded after it; a curve without one (or with one that
     * cannot be read) from all its quotes, in recorded order. The seen message ids are not loaded:
     * the journal answers for them when a step asks ({@link SeenIds}).
     *
     * @return the number of quote messages replayed
     */
    public synchronized long recover() {
        // until the replay has finished, memory is not what the journal says: nothing may be decided on it
        recovered = false;
        reset();
        Map<String, JournalReader.LastQuote> last = reader.lastQuotes();
        long replayed = restore(last.keySet(), false, true);
        lastReceived.clear();
        last.forEach((curve, q) -> lastReceived.put(curve, q.recorded()));
        alerts.rebuild();
        recovered = true;
        return replayed;
    }

    /**
     * Rebuilds, from their checkpoints and the quotes after them, the curves this instance owns now
     * whose journalled quotes moved on since memory last saw them: those another instance processed
     * while it held them. Curves memory is current on are left as they are, so an assignment right
     * after a start replays nothing twice, and a takeover rebuilds only the curves it moves.
     *
     * @return the curves rebuilt
     */
    public synchronized Set<String> takeOver(CurveOwnership owned) {
        if (!recovered) {
            recover();
            return Set.of();
        }
        // every curve the journal has: one the previous owner never checkpointed must not be missed
        Map<String, JournalReader.LastQuote> last = reader.lastQuotes();
        Set<String> moved = held.behind(last, owned::owns);
        if (moved.isEmpty()) {
            // the curves may be current from following their owner, but the desk's memory of their notices is not
            alerts.rebuild();
        } else {
            rebuild(moved, last, true);
            LOG.infof("took over %d curve(s) moved on by another instance: %s", moved.size(), moved);
        }
        return moved;
    }

    /**
     * Brings the curves other instances own up to date from the journal (each from its checkpoint
     * and the quotes after it), so that this instance answers reads of them as their owner would,
     * behind it by at most the time between two calls. Finds them with a few index seeks per curve,
     * not by reading every quote.
     *
     * @return the curves rebuilt
     */
    public synchronized Set<String> follow(CurveOwnership owned) {
        if (!recovered) {
            return Set.of();
        }
        // every curve the journal has (a walk of the (curve, seq) index, two seeks a curve): one the owner has
        // not checkpointed yet is followed too
        Map<String, JournalReader.LastQuote> last = reader.lastQuotes();
        Set<String> moved = held.behind(last, curve -> !owned.owns(curve));
        if (!moved.isEmpty()) {
            rebuild(moved, last, false);
        }
        return moved;
    }

    /**
     * Rebuilds these curves alone from their checkpoints and the quotes after them; the others stay
     * as they are. The alert desk is rebuilt too: it decides only for owned curves, but answers reads
     * of every open episode, those of followed curves as their owner journalled them.
     *
     * @param last   each curve's latest quote in the journal, as read just before
     * @param logged whether to log how the curves were rebuilt
     */
    private void rebuild(Set<String> curves, Map<String, JournalReader.LastQuote> last, boolean logged) {
        recovered = false;
        held.forget(curves);
        restore(curves, true, logged);
        curves.forEach(curve -> lastReceived.put(curve, last.get(curve).recorded()));
        alerts.rebuild();
        recovered = true;
    }

    /** Restores the curves ({@link HeldCurves#restore}) and tells the listener where they stand. */
    private long restore(Set<String> curves, boolean onlyThese, boolean logged) {
        long replayed = held.restore(curves, onlyThese, logged);
        sequence = Math.max(sequence, held.highestSeq());
        listener.watching(engine.tracks().stream().map(t -> t.spread().id()).collect(java.util.stream.Collectors.toUnmodifiableSet()));
        for (SpreadTrack t : engine.tracks()) {
            if (!onlyThese || curves.contains(t.spread().curve())) {
                listener.spreadChanged(SpreadStatus.of(t));
            }
        }
        return replayed;
    }

    /**
     * Writes the checkpoints of the curves that changed since theirs, among those this instance
     * owns (another instance's curves are checkpointed by their owner, whose numbering they follow).
     * A failure is logged and the curves stay due: a checkpoint is a cache, never a reason to stop.
     *
     * @return the number of curves written
     */
    public synchronized int checkpoint(CurveOwnership owned) {
        return recovered ? held.checkpoint(owned::owns) : 0;
    }

    /**
     * Before a step: if a journal failure left memory behind the journal (the rebuild after it
     * failed too, e.g. while the database was unreachable), rebuild it now. Throws while the
     * journal still cannot be read, so nothing is decided on a partial state.
     */
    private void recoverIfNeeded() {
        if (!recovered) {
            long replayed = recover();
            LOG.infof("journal reachable again: monitors rebuilt from %d journalled quote message(s)", replayed);
        }
    }

    /** After a failed step: memory goes back to what the journal holds, now or, if it cannot be read, before the next step. */
    private void recoverAfterFailedStep(RuntimeException failure) {
        try {
            recover();
        } catch (RuntimeException again) {
            failure.addSuppressed(again);
        }
    }

    /**
     * Watches other spreads or rules from now on: the monitors are rebuilt from the journalled
     * quotes under the new definitions (as a restart with the new policy would), without
     * journalling again what was concluded under the old ones.
     */
    public synchronized long reconfigure(List<Watch> newWatches) {
        this.watches = List.copyOf(newWatches);
        return recover();
    }

    /**
     * Decides the notices due by the clock alone (standing notices, stale feeds) and journals them, for the
     * curves this instance owns.
     *
     * @param staleCurves every owned curve → the date its feed went quiet, or null while fresh
     */
    public synchronized void tick(Map<String, LocalDate> staleCurves, CurveOwnership owned) {
        recoverIfNeeded();
        JournalEntries journal = new JournalEntries();
        try {
            List<SpreadStatus> ownSpreads = engine.tracks().stream().filter(t -> owned.owns(t.spread().curve())).map(SpreadStatus::of)
                    .toList();
            alerts.onTick(ownSpreads, staleCurves, journal);
            if (journal.isEmpty()) {
                return;
            }
            writer.write(journal);
        } catch (RuntimeException e) {
            recoverAfterFailedStep(e);
            throw e;
        }
        alerts.written(journal.alerts());
    }

    /** Returns once the step in progress, if any, has been journalled (or failed). */
    public synchronized void awaitStep() {
        // the lock is the point: process() holds it for a whole step
    }

    /** Processes batches in order and journals the step; returns what happened. */
    public synchronized BatchOutcome process(Collection<QuoteBatch> batches) {
        recoverIfNeeded();
        long started = System.nanoTime();
        JournalEntries journal = new JournalEntries();
        List<Reject> rejects = new ArrayList<>();
        List<Transition> transitions = new ArrayList<>();
        Map<SpreadKey, SpreadTrack> touched = new LinkedHashMap<>();
        List<SpreadTrack> stepSpreads = new ArrayList<>();
        int accepted = 0;
        int duplicates = 0;
        Map<String, int[]> acceptedByOrigin = new HashMap<>();
        Map<String, int[]> duplicatesByOrigin = new HashMap<>();
        List<SpreadStatus> changed = new ArrayList<>();
        // ids this step takes: a second copy within the step is a duplicate though the journal has not got the first yet
        Set<String> takenNow = new HashSet<>();
        Set<String> curvesMoved = new HashSet<>();
        long beforeWrite;
        long written;
        // a large step's rows are written on the journal's writer thread while the rest is decided
        StepWrite write = writer.begin();
        // the whole step or nothing: a failure anywhere before the commit (deciding as well as
        // writing) leaves memory ahead of the journal (ids taken as seen, monitors moved on), so it
        // goes back to what the journal holds; otherwise the quotes sent again would be dropped as
        // duplicates of quotes that were never journalled
        try {
            // one lookup for the whole step: what memory has let go of, the journal answers
            Set<String> takenBefore = seenIds.takenBefore(messageIds(batches));
            for (QuoteBatch batch : batches) {
                for (Reject r : batch.rejects()) {
                    journal.reject(new JournalEntries.RejectedQuote(batch.origin(), r.reason().code(), r.detail(), r.item(), r.raw()));
                    rejects.add(r);
                }
                for (QuoteMessage m : batch.messages()) {
                    if (m.id() != null && (takenBefore.contains(m.id()) || !takenNow.add(m.id()))) {
                        duplicates++;
                        duplicatesByOrigin.computeIfAbsent(batch.origin(), o -> new int[1])[0]++;
                        continue;
                    }
                    long seq = ++sequence;
                    accepted++;
                    curvesMoved.add(m.curve());
                    held.took(m.curve(), seq);
                    acceptedByOrigin.computeIfAbsent(batch.origin(), o -> new int[1])[0]++;
                    lastReceived.put(m.curve(), Instant.now(clock));
                    journal.quote(new JournalEntries.AcceptedQuote(seq, batch.origin(), m.id(), m.source(), m.time(), m.curve(),
                            m.date(), m.yieldsBp()));
                    CurveSnapshot snapshot = book.apply(m.curve(), m.date(), m.yieldsBp(), seq);
                    stepSpreads.clear();
                    List<MonitorEvent> events = engine.onSnapshot(snapshot, seq, (key, observation) -> {
                        journal.observation(key, observation);
                        SpreadTrack track = touched.computeIfAbsent(key, engine::track);
                        if (track != null && !stepSpreads.contains(track)) {
                            stepSpreads.add(track);
                        }
                    });
                    for (MonitorEvent e : events) {
                        record(e, journal, transitions);
                    }
                    // alerts are decided after each message, on the status it left, not once per batch: a
                    // notice must not depend on how many messages a poll happened to bring (a backlog after
                    // a restart comes in large batches, live quotes in small ones)
                    if (!stepSpreads.isEmpty()) {
                        alerts.onStep(stepSpreads.stream().map(SpreadStatus::of).toList(), seq, journal);
                    }
                    write.progress(journal);
                }
            }
            for (SpreadTrack t : touched.values()) {
                if (t != null) {
                    changed.add(SpreadStatus.of(t));
                }
            }
            beforeWrite = System.nanoTime();
            write.finish(journal);
            written = System.nanoTime();
        } catch (RuntimeException e) {
            write.abandon();
            recoverAfterFailedStep(e);
            throw e;
        }
        seenIds.remember(takenNow);
        // only now, with the step on disk: a date let go of is read back from the journal, which did not hold this step before
        curvesMoved.forEach(held::committed);
        acceptedByOrigin.forEach((origin, n) -> listener.accepted(origin, n[0]));
        duplicatesByOrigin.forEach((origin, n) -> listener.duplicates(origin, n[0]));
        for (QuoteBatch batch : batches) {
            batch.rejects().forEach(r -> listener.rejected(batch.origin(), r.reason()));
        }
        for (Transition t : transitions) {
            TransitionLog.transition(t);
            listener.transition(t);
        }
        changed.forEach(listener::spreadChanged);
        alerts.written(journal.alerts());
        listener.processed(Duration.ofNanos(beforeWrite - started), Duration.ofNanos(written - beforeWrite));
        return new BatchOutcome(accepted, duplicates, rejects.size(), transitions.size(), rejects);
    }

    private static List<String> messageIds(Collection<QuoteBatch> batches) {
        List<String> ids = new ArrayList<>();
        for (QuoteBatch batch : batches) {
            for (QuoteMessage m : batch.messages()) {
                if (m.id() != null) {
                    ids.add(m.id());
                }
            }
        }
        return ids;
    }

    /** The most snapshots of one curve, or values of one spread, held in memory now. */
    synchronized int mostHeld() {
        return held.mostHeld();
    }

    /** Message ids held in memory for de-duplication now (never more than the configured cache). */
    synchronized int seenIdsInMemory() {
        return seenIds.size();
    }

    private void record(MonitorEvent e, JournalEntries journal, List<Transition> transitions) {
        if (e instanceof Transition t) {
            journal.transition(t);
            transitions.add(t);
        } else if (e instanceof Spell s) {
            journal.spell(s);
        } else if (e instanceof Revision r) {
            journal.revision(r);
            transitions.addAll(r.after());
            TransitionLog.revision(r);
        } else if (e instanceof SpellRestatement r) {
            journal.restatement(r);
            TransitionLog.restatement(r);
        }
    }

    public synchronized List<CurveSnapshot> latestCurves() {
        return List.copyOf(book.latest());
    }

    /** A curve's snapshot on a market date, or null. */
    public synchronized CurveSnapshot curve(String curve, LocalDate date) {
        return book.snapshot(curve, date);
    }

    /** A curve's snapshot on the latest market date on or before a date, or null. */
    public synchronized CurveSnapshot curveOnOrBefore(String curve, LocalDate date) {
        return book.snapshotOnOrBefore(curve, date);
    }

    public synchronized List<SpreadStatus> spreads() {
        return engine.tracks().stream().map(SpreadStatus::of).toList();
    }

    public synchronized SpreadStatus spread(SpreadKey key) {
        SpreadTrack t = engine.track(key);
        return t == null ? null : SpreadStatus.of(t);
    }

    /** When a quote for each curve was last journalled: by this process, or as the journal said at the last rebuild. */
    public synchronized Map<String, Instant> lastReceived() {
        return Map.copyOf(lastReceived);
    }

    /** When a quote for this curve was last journalled, or null; without waiting for a step in progress. */
    public Instant lastReceived(String curve) {
        return lastReceived.get(curve);
    }

    public List<Watch> watches() {
        return watches;
    }
}
