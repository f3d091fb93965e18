package org.slopewatch.delivery;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Locale;
import org.slopewatch.rules.Alert;

/**
 * The alert as JSON, for the chat webhook's {@code alert-json} body and the stream's event data:
 * snake_case keys, ISO-8601 dates, enums in lower case, the caution as its own field. Written
 * field by field so that the wire format does not change when a record component is renamed.
 */
public final class AlertJson {

    static final ObjectMapper MAPPER = new ObjectMapper();

    private AlertJson() {
    }

    public static ObjectNode toJson(Alert a) {
        ObjectNode node = MAPPER.createObjectNode();
        node.put("id", a.id());
        node.put("rule", a.rule());
        node.put("severity", a.severity().name().toLowerCase(Locale.ROOT));
        node.put("kind", a.kind().name().toLowerCase(Locale.ROOT));
        node.put("spread_id", a.spreadId());
        node.put("market_date", a.marketDate() == null ? null : a.marketDate().toString());
        node.put("state", a.state());
        node.put("subject", a.subject());
        node.put("text", a.text());
        ArrayNode facts = node.putArray("facts");
        for (Alert.Fact f : a.facts()) {
            facts.addObject().put("label", f.label()).put("value", f.value());
        }
        node.put("dashboard", a.dashboard());
        node.put("created_at", a.createdAt() == null ? null : a.createdAt().toString());
        node.put("caution", Alert.CAUTION);
        return node;
    }
}
