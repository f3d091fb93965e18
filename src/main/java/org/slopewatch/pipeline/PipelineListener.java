package org.slopewatch.pipeline;

import java.time.Duration;
import java.util.Set;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.Transition;

/** Side outputs of the pipeline (metrics, logs): told what happened, never a second path for the data. */
public interface PipelineListener {

    PipelineListener NONE = new PipelineListener() {
    };

    default void accepted(String origin, int messages) {
    }

    default void rejected(String origin, RejectReason reason) {
    }

    default void duplicates(String origin, int messages) {
    }

    default void transition(Transition t) {
    }

    default void spreadChanged(SpreadStatus status) {
    }

    /** After a rebuild (start-up, a new policy, a journal back): the spreads watched from now on; what is kept about others may go. */
    default void watching(Set<String> spreadIds) {
    }

    default void processed(Duration processing, Duration journalWrite) {
    }
}
