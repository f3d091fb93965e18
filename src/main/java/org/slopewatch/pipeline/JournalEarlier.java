package org.slopewatch.pipeline;

import java.time.LocalDate;
import java.util.List;
import org.jboss.logging.Logger;
import org.slopewatch.curve.CurveBook;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.EarlierSnapshots;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.journal.JournalReader;
import org.slopewatch.monitor.EarlierObservations;
import org.slopewatch.monitor.Observation;
import org.slopewatch.spread.SpreadKey;

/**
 * The journal as the memory of what the pipeline let go of: a date's snapshot merged again from
 * its quotes, a spread's values before its window read from its observations. Each read is
 * bounded by the input being processed, so a rebuild reads what stood before it, and logged,
 * since it is the slow path a revision older than the window takes.
 */
final class JournalEarlier implements EarlierObservations, EarlierSnapshots {

    private static final Logger LOG = Logger.getLogger(JournalEarlier.class);

    private final JournalReader reader;
    private final int memoryDays;

    JournalEarlier(JournalReader reader, int memoryDays) {
        this.reader = reader;
        this.memoryDays = memoryDays;
    }

    @Override
    public List<Observation> through(SpreadKey spread, LocalDate through, long beforeSequence) {
        List<Observation> read = reader.standingObservations(spread.id(), through, beforeSequence).stream()
                .map(p -> new Observation(p.date(), p.valueBp(), p.seq())).toList();
        LOG.infof("revision of %s before the %d days held in memory: re-run on %d earlier value(s) read from the journal", spread.id(),
                memoryDays, read.size());
        return read;
    }

    @Override
    public CurveSnapshot onOrBefore(String curve, LocalDate date, long beforeSequence) {
        List<JournalEntries.AcceptedQuote> quotes = reader.quotesOnOrBefore(curve, date, beforeSequence);
        if (quotes.isEmpty()) {
            return null;
        }
        CurveSnapshot snapshot = null;
        for (JournalEntries.AcceptedQuote q : quotes) {
            snapshot = CurveBook.merged(snapshot, curve, q.date(), q.yieldsBp());
        }
        return snapshot;
    }
}
