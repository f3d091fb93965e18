package org.slopewatch.pipeline;

import java.io.IOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.function.Predicate;
import org.jboss.logging.Logger;
import org.slopewatch.curve.CurveBook;
import org.slopewatch.journal.CurveCheckpoints;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.monitor.Watch;

/**
 * What the pipeline holds of each curve (its snapshots in the curve book, its spreads' tracks in
 * the engine) and how that is kept and got back: bounded to the days held, checkpointed, restored
 * from checkpoints and the quotes after them, and which curves the journal has moved on from it.
 * Not thread-safe: the pipeline's lock guards it.
 */
final class HeldCurves {

    private static final Logger LOG = Logger.getLogger("org.slopewatch.transitions");

    private final JournalReader reader;
    private final QuotePipeline.Memory memory;
    private final SignalEngine engine;
    private final CurveBook book;
    private final CurveImages images;
    /** Curves whose state changed since their last checkpoint. */
    private final Set<String> unsaved = new HashSet<>();
    /** The highest sequence number of each curve's quotes memory has taken (replayed, restored or processed). */
    private final Map<String, Long> lastSeq = new HashMap<>();
    private long highestSeq;

    HeldCurves(List<Watch> watches, JournalReader reader, QuotePipeline.Memory memory) {
        this.reader = reader;
        this.memory = memory;
        JournalEarlier earlier = new JournalEarlier(reader, memory.days());
        this.engine = new SignalEngine(watches, earlier);
        this.book = new CurveBook(earlier);
        this.images = new CurveImages(watches);
    }

    SignalEngine engine() {
        return engine;
    }

    CurveBook book() {
        return book;
    }

    /** The highest sequence number restored or replayed: a new step numbers above it. */
    long highestSeq() {
        return highestSeq;
    }

    /** A quote of the curve taken in a step (before its commit). */
    void took(String curve, long seq) {
        lastSeq.put(curve, seq);
    }

    /** After a step's commit: the curve moved on, and what it holds is bounded again. */
    void committed(String curve) {
        unsaved.add(curve);
        letGo(curve);
    }

    /** The curves among the journal's (curve → its latest quote) that {@code which} picks and memory is behind on. */
    Set<String> behind(Map<String, JournalReader.LastQuote> journal, Predicate<String> which) {
        Set<String> moved = new TreeSet<>();
        journal.forEach((curve, last) -> {
            if (which.test(curve) && !Long.valueOf(last.seq()).equals(lastSeq.get(curve))) {
                moved.add(curve);
            }
        });
        return moved;
    }

    /** Drops what is held of these curves (before they are restored). */
    void forget(Set<String> curves) {
        for (String curve : curves) {
            engine.forget(curve);
            book.forget(curve);
            unsaved.remove(curve);
            lastSeq.remove(curve);
        }
    }

    /**
     * Reads the curves' checkpoints and replays the quotes after them; nothing of them is held yet.
     *
     * @param curves     the curves to restore: every curve with quotes in the journal, or some of them
     * @param onlyThese  whether other curves are held (and left alone), or none is
     * @param logged     whether to log how the curves were rebuilt
     * @return the quote messages replayed
     */
    long restore(Set<String> curves, boolean onlyThese, boolean logged) {
        Set<String> only = onlyThese ? curves : null;
        Map<String, Long> restored = restoreCheckpoints(only);
        // the tail after the oldest checkpoint is enough only when every curve has one
        long after = !restored.isEmpty() && restored.keySet().containsAll(curves)
                ? restored.values().stream().mapToLong(Long::longValue).min().orElseThrow() : Long.MIN_VALUE;
        long[] count = {0};
        reader.replayQuotesAfter(after, only, q -> {
            Long included = restored.get(q.curve());
            if (included != null && q.seq() <= included) {
                return;
            }
            count[0]++;
            highestSeq = Math.max(highestSeq, q.seq());
            lastSeq.put(q.curve(), q.seq());
            engine.onSnapshot(book.apply(q.curve(), q.date(), q.yieldsBp(), q.seq()), q.seq());
            unsaved.add(q.curve());
            letGo(q.curve());
        });
        engine.orderByFirstSeen();
        if (memory.checkpoints() != null && logged) {
            LOG.infof("rebuilt %d curve(s) from checkpoints and %d journalled quote message(s) after them or without one", restored.size(),
                    count[0]);
        }
        return count[0];
    }

    /** Reads the usable checkpoints (of the given curves; null: all) into memory; curve → the sequence number it includes quotes up to. */
    private Map<String, Long> restoreCheckpoints(Set<String> only) {
        Map<String, Long> restored = new HashMap<>();
        if (memory.checkpoints() == null) {
            return restored;
        }
        memory.checkpoints().each(only, stored -> {
            try {
                images.read(stored, book, engine);
                restored.put(stored.curve(), stored.seq());
                lastSeq.merge(stored.curve(), stored.seq(), Math::max);
                highestSeq = Math.max(highestSeq, stored.seq());
            } catch (IOException e) {
                LOG.warnf("checkpoint of curve %s not used (%s): the curve is rebuilt from all its journalled quotes", stored.curve(),
                        e.getMessage());
            }
        });
        return restored;
    }

    /** Bounds what a curve holds in memory to the configured days (nothing when the whole history is kept). */
    private void letGo(String curve) {
        if (memory.days() != QuotePipeline.Memory.WHOLE_HISTORY) {
            book.letGoBefore(curve, memory.days());
            engine.letGoBefore(curve, memory.days());
        }
    }

    /**
     * Writes the checkpoints of the curves that changed since theirs, among those {@code owned}
     * picks. A failure is logged and the curves stay due: a checkpoint is a cache, never a reason to stop.
     *
     * @return the number of curves written
     */
    int checkpoint(Predicate<String> owned) {
        if (memory.checkpoints() == null || unsaved.isEmpty()) {
            return 0;
        }
        List<CurveCheckpoints.Stored> due = new ArrayList<>();
        for (String curve : unsaved) {
            Long seq = lastSeq.get(curve);
            if (seq != null && owned.test(curve)) {
                // the curve's own last number: what the journal's latest quote of it says, so a start from
                // the checkpoint knows memory is current on the curve and a takeover rebuilds only what moved
                due.add(images.image(curve, seq, book, engine));
            }
        }
        try {
            memory.checkpoints().write(due);
        } catch (RuntimeException e) {
            LOG.warnf("checkpoint of %d curve(s) not written (%s); a start replays more quotes until one is", due.size(), e.getMessage());
            return 0;
        }
        due.forEach(d -> unsaved.remove(d.curve()));
        return due.size();
    }

    /** The most snapshots of one curve, or values of one spread, held in memory now. */
    int mostHeld() {
        int most = 0;
        for (var t : engine.tracks()) {
            most = Math.max(most, Math.max(t.size(), book.held(t.spread().curve())));
        }
        return most;
    }
}
