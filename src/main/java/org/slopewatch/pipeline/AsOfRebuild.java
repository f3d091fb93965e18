package org.slopewatch.pipeline;

import java.time.Instant;
import java.util.List;
import org.slopewatch.curve.CurveBook;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.monitor.SignalEngine;
import org.slopewatch.monitor.Spell;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.SpreadTrack;
import org.slopewatch.monitor.Watch;
import org.slopewatch.spread.SpreadKey;

/**
 * The monitors' state at a past moment, rebuilt the way {@link QuotePipeline#recover()} rebuilds
 * it on start: the journal's quotes recorded at or before that moment, in recorded order, through
 * a fresh engine. Nothing of the live pipeline is touched, so it runs beside the writer.
 *
 * <p>The watches are the caller's choice (the daemon passes those in force now): the answer is
 * what those rules make of what was known at the moment, which equals what the monitor held then
 * whenever the rules have not changed since.
 */
public final class AsOfRebuild {

    /**
     * A spread's rebuilt status (null when it had no value yet), its ended spells (the engine holds
     * every value, so all of them), and how many quote messages went into it.
     */
    public record Rebuilt(SpreadStatus status, List<Spell> endedSpells, long quotes) {
        public Rebuilt {
            endedSpells = List.copyOf(endedSpells);
        }
    }

    private final JournalReader reader;

    public AsOfRebuild(JournalReader reader) {
        this.reader = reader;
    }

    /** One spread as of {@code asOf}; only its curve's quotes are replayed, as a curve's monitors depend on nothing else. */
    public Rebuilt spread(SpreadKey key, Instant asOf, List<Watch> watches) {
        SignalEngine engine = new SignalEngine(watches);
        CurveBook book = new CurveBook();
        long[] count = {0};
        reader.replayQuotes(asOf, key.curve(), q -> {
            count[0]++;
            engine.onSnapshot(book.apply(q.curve(), q.date(), q.yieldsBp()), q.seq());
        });
        SpreadTrack track = engine.track(key);
        return track == null ? new Rebuilt(null, List.of(), count[0]) : new Rebuilt(SpreadStatus.of(track), track.endedSpells(), count[0]);
    }
}
