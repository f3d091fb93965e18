package org.slopewatch.alerting;

import java.time.LocalDate;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import org.slopewatch.journal.JournalEntries;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.rules.Policy;

/**
 * What the pipeline asks of the alerting side. Called under the pipeline's lock, so that alerts
 * are decided in the order of the steps that cause them, and their notices join the step's
 * journal transaction: a transition is never stored without the alert it calls for, nor an alert
 * without its transition.
 */
public interface AlertStage {

    /**
     * Adds the notices that the spreads one message changed call for to the step's journal entries.
     * Called after each accepted message, with the status that message left, so that what is
     * decided does not depend on how messages were batched.
     */
    void onStep(Collection<SpreadStatus> changed, long sequence, JournalEntries journal);

    /**
     * Adds the notices due by the clock alone: repeats while a condition holds, and stale feeds.
     *
     * @param staleCurves every watched curve → the date its feed went quiet, or null while it is fresh
     */
    void onTick(Collection<SpreadStatus> all, Map<String, LocalDate> staleCurves, JournalEntries journal);

    /** The notices of a step are stored: they may be delivered. */
    void written(List<JournalEntries.AlertEntry> alerts);

    /** Forgets what it decided in memory and reads it back from the journal (on start, and after a failed write). */
    void rebuild();

    /** What stops {@code policy} from running with this configuration, one line each; a reload asks before it puts a policy in force. */
    default List<String> checkChannels(Policy policy) {
        return List.of();
    }

    /** A reload put {@code policy} in force with the same watch list: its alert rules replace the old ones. */
    default void replaceRules(Policy policy) {
    }

    /** No alerting: the offline tools and benchmarks of the pipeline alone. */
    AlertStage NONE = new AlertStage() {
        @Override
        public void onStep(Collection<SpreadStatus> changed, long sequence, JournalEntries journal) {
        }

        @Override
        public void onTick(Collection<SpreadStatus> all, Map<String, LocalDate> staleCurves, JournalEntries journal) {
        }

        @Override
        public void written(List<JournalEntries.AlertEntry> alerts) {
        }

        @Override
        public void rebuild() {
        }
    };
}
