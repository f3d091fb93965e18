package org.slopewatch.pipeline;

import java.util.List;

/**
 * What processing did with one or more batches.
 *
 * @param rejects the rejects, in input order (the HTTP answer spells out the first ones)
 */
public record BatchOutcome(int accepted, int duplicates, int rejected, int transitions, List<Reject> rejects) {

    public BatchOutcome {
        rejects = List.copyOf(rejects);
    }
}
