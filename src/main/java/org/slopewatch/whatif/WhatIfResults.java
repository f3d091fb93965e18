package org.slopewatch.whatif;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.datatype.jsr310.JavaTimeModule;
import org.slopewatch.replay.WhatIfReport;

/**
 * A what-if's report as the journal keeps it: JSON of the record's components, dates in ISO-8601.
 * Its own mapper, so that the stored form does not follow the API's naming settings: a row written
 * by one version is read by the next.
 */
final class WhatIfResults {

    private static final ObjectMapper MAPPER = new ObjectMapper()
            .registerModule(new JavaTimeModule())
            .disable(SerializationFeature.WRITE_DATES_AS_TIMESTAMPS)
            .disable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);

    private WhatIfResults() {
    }

    static String write(WhatIfReport report) {
        try {
            return MAPPER.writeValueAsString(report);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("cannot write a what-if report as JSON", e);
        }
    }

    /** The report of a stored row; null for none. */
    static WhatIfReport read(String json) {
        if (json == null) {
            return null;
        }
        try {
            return MAPPER.readValue(json, WhatIfReport.class);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("cannot read a stored what-if report", e);
        }
    }
}
