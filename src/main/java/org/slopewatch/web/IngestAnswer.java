package org.slopewatch.web;

import java.util.List;
import org.slopewatch.pipeline.BatchOutcome;
import org.slopewatch.pipeline.Reject;

/**
 * The answer to a quote submission.
 *
 * @param processed true when the quotes went through the monitor before this answer (embedded);
 *                  false when they were queued on the topic (Kafka)
 * @param errors    the first rejects, spelt out
 */
public record IngestAnswer(boolean processed, int accepted, int duplicates, int rejected, int transitions, List<Error> errors) {

    static final int MAX_ERRORS = 20;

    /** One rejected item. */
    public record Error(Integer item, String reason, String detail) {
        static Error of(Reject r) {
            return new Error(r.item() < 0 ? null : r.item(), r.reason().code(), r.detail());
        }
    }

    static IngestAnswer of(boolean processed, BatchOutcome o) {
        return new IngestAnswer(processed, o.accepted(), o.duplicates(), o.rejected(), o.transitions(),
                o.rejects().stream().limit(MAX_ERRORS).map(Error::of).toList());
    }
}
