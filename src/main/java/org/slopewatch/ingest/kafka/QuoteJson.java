package org.slopewatch.ingest.kafka;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Map;
import org.slopewatch.curve.Tenor;
import org.slopewatch.pipeline.QuoteMessage;

/** Writes an accepted message back as a quote message in the canonical form (snapshot, basis points). */
public final class QuoteJson {

    private static final ObjectMapper JSON = new ObjectMapper();

    private QuoteJson() {
    }

    public static String encode(QuoteMessage m) {
        ObjectNode node = JSON.createObjectNode();
        node.put("curve", m.curve());
        node.put("date", m.date().toString());
        node.put("unit", "bp");
        ObjectNode yields = node.putObject("yields");
        for (Map.Entry<Tenor, Double> e : m.yieldsBp().entrySet()) {
            yields.put(e.getKey().toString(), e.getValue());
        }
        if (m.id() != null) {
            node.put("id", m.id());
        }
        if (m.source() != null) {
            node.put("source", m.source());
        }
        if (m.time() != null) {
            node.put("time", m.time().toString());
        }
        return node.toString();
    }
}
