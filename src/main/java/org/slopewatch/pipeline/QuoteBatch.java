package org.slopewatch.pipeline;

import java.util.List;

/**
 * What one request or one stream record decoded into: the messages that passed validation and
 * the rejects, in input order. The unit that travels on the {@code quotes} channel.
 *
 * @param origin where it came from, e.g. {@code http}, {@code kafka}, {@code demo}
 */
public record QuoteBatch(String origin, List<QuoteMessage> messages, List<Reject> rejects) {

    public QuoteBatch {
        messages = List.copyOf(messages);
        rejects = List.copyOf(rejects);
    }

    public int size() {
        return messages.size() + rejects.size();
    }
}
