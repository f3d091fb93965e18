package org.slopewatch.ingest;

import java.time.Duration;
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

    default void processed(Duration processing, Duration journalWrite) {
    }
}
