package org.slopewatch.ops;

import static io.restassured.RestAssured.given;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.restassured.response.Response;
import java.io.IOException;
import java.io.UncheckedIOException;

/**
 * One answer of a SmallRye Health endpoint, read as the MicroProfile Health protocol lays it out
 * (MicroProfile Health 4.0, "Protocol and wire format", from memory): HTTP 200 when the overall
 * status is UP, 503 when it is DOWN; a JSON object with {@code status} and a {@code checks} array
 * of objects with {@code name}, {@code status} and an optional {@code data} object.
 */
record HealthAnswer(int httpStatus, JsonNode body) {

    private static final ObjectMapper JSON = new ObjectMapper();

    static HealthAnswer of(String path) {
        Response r = given().get(path);
        try {
            return new HealthAnswer(r.statusCode(), JSON.readTree(r.asString()));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    String status() {
        return body.path("status").asText();
    }

    /** The named check, or a missing node when the endpoint has none of that name. */
    JsonNode check(String name) {
        for (JsonNode c : body.path("checks")) {
            if (name.equals(c.path("name").asText())) {
                return c;
            }
        }
        return com.fasterxml.jackson.databind.node.MissingNode.getInstance();
    }

    String checkStatus(String name) {
        return check(name).path("status").asText("(no check named '" + name + "')");
    }

    String data(String check, String key) {
        return check(check).path("data").path(key).asText("");
    }

    @Override
    public String toString() {
        return httpStatus + " " + body;
    }
}
