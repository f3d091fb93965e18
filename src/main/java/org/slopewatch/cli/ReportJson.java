package org.slopewatch.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.PropertyNamingStrategies;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.datatype.jsr310.JavaTimeModule;
import com.fasterxml.jackson.core.JsonProcessingException;
import java.io.PrintWriter;

/** Reports as JSON for scripts: snake-case keys, ISO-8601 dates, indented. */
final class ReportJson {

    private static final ObjectMapper MAPPER = new ObjectMapper()
            .registerModule(new JavaTimeModule())
            .setPropertyNamingStrategy(PropertyNamingStrategies.SNAKE_CASE)
            .disable(SerializationFeature.WRITE_DATES_AS_TIMESTAMPS)
            .enable(SerializationFeature.INDENT_OUTPUT);

    private ReportJson() {
    }

    static void write(Object report, PrintWriter out) {
        try {
            // Jackson would close its target, and standard output must stay open: write a string
            out.println(MAPPER.writeValueAsString(report));
            out.flush();
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("cannot write the report as JSON", e);
        }
    }
}
