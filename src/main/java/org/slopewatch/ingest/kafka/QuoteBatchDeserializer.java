package org.slopewatch.ingest.kafka;

import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.util.Arrays;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;
import org.apache.kafka.common.serialization.Deserializer;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.ingest.IngestRules;
import org.slopewatch.ingest.QuoteDecoder;
import org.slopewatch.pipeline.QuoteBatch;

/**
 * Decodes a quotes-topic record into a batch. It never throws: a bad record becomes a batch of
 * rejects, so that consumption never stops on a bad message and the reject reaches the journal
 * and the dead-letter topic. The rules come from the channel's configuration
 * ({@code slopewatch.curves}, {@code slopewatch.max-days-ahead}, {@code slopewatch.min-yield-bp},
 * {@code slopewatch.max-yield-bp}), which application.properties fills from the ingest settings.
 */
public final class QuoteBatchDeserializer implements Deserializer<QuoteBatch> {

    private QuoteDecoder decoder;

    @Override
    public void configure(Map<String, ?> configs, boolean isKey) {
        Set<String> curves = Arrays.stream(String.valueOf(setting(configs, "slopewatch.curves", "")).split(","))
                .map(String::strip).filter(s -> !s.isEmpty()).collect(Collectors.toSet());
        int maxDaysAhead = Integer.parseInt(String.valueOf(setting(configs, "slopewatch.max-days-ahead", "3")));
        YieldBounds bounds = new YieldBounds(Double.parseDouble(String.valueOf(setting(configs, "slopewatch.min-yield-bp", "-500"))),
                Double.parseDouble(String.valueOf(setting(configs, "slopewatch.max-yield-bp", "3000"))));
        decoder = new QuoteDecoder(new IngestRules(curves, bounds, maxDaysAhead, Clock.systemUTC()));
    }

    private static Object setting(Map<String, ?> configs, String key, String otherwise) {
        Object v = configs.get(key);
        return v == null ? otherwise : v;
    }

    @Override
    public QuoteBatch deserialize(String topic, byte[] data) {
        String text = data == null ? "" : new String(data, StandardCharsets.UTF_8);
        return decoder.decode("kafka", text);
    }
}
