package org.slopewatch.web;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import java.io.IOException;
import java.io.OutputStream;
import java.util.List;
import java.util.Map;

/**
 * A JSON export, written as it streams: the head's fields, then {@code items}, one object per
 * row keyed by the column names. Dates and instants are ISO-8601 strings as in the CSV; a value
 * that is not a finite number is null.
 */
final class JsonTableWriter implements TableWriter {

    private final JsonGenerator json;
    private final List<String> columns;

    JsonTableWriter(OutputStream out, JsonFactory factory, Map<String, Object> head, List<String> columns) throws IOException {
        this.json = factory.createGenerator(out, JsonEncoding.UTF8);
        json.disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET); // the response stream belongs to the server
        this.columns = columns;
        json.writeStartObject();
        for (Map.Entry<String, Object> e : head.entrySet()) {
            json.writeFieldName(e.getKey());
            value(e.getValue());
        }
        json.writeArrayFieldStart("items");
    }

    @Override
    public void row(Object[] values) throws IOException {
        json.writeStartObject();
        for (int i = 0; i < values.length; i++) {
            json.writeFieldName(columns.get(i));
            value(values[i]);
        }
        json.writeEndObject();
    }

    @Override
    public void finish() throws IOException {
        json.writeEndArray();
        json.writeEndObject();
        json.flush();
    }

    private void value(Object v) throws IOException {
        if (v == null) {
            json.writeNull();
        } else if (v instanceof Double d) {
            if (Double.isFinite(d)) {
                json.writeNumber(d);
            } else {
                json.writeNull();
            }
        } else if (v instanceof Long n) {
            json.writeNumber(n);
        } else if (v instanceof Integer n) {
            json.writeNumber(n);
        } else if (v instanceof Boolean b) {
            json.writeBoolean(b);
        } else {
            json.writeString(v.toString());
        }
    }
}
