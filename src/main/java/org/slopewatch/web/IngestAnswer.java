package org.slopewatch.web;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
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

    /** Nothing taken, for one reason about the whole request. */
    static IngestAnswer refused(String reason, String detail) {
        return new IngestAnswer(false, 0, 0, 0, 0, List.of(new Error(null, reason, detail)));
    }

    static IngestAnswer of(boolean processed, BatchOutcome o) {
        return new IngestAnswer(processed, o.accepted(), o.duplicates(), o.rejected(), o.transitions(),
                o.rejects().stream().limit(MAX_ERRORS).map(Error::of).toList());
    }

    /**
     * The answer's members under their JSON names, for a problem document that refuses the
     * submission: a client reads the counts and {@code errors} of a refusal as of a success.
     */
    Map<String, Object> members() {
        Map<String, Object> members = new LinkedHashMap<>();
        members.put("processed", processed);
        members.put("accepted", accepted);
        members.put("duplicates", duplicates);
        members.put("rejected", rejected);
        members.put("transitions", transitions);
        members.put("errors", errors);
        return members;
    }
}
