package org.slopewatch.web;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.quarkus.test.junit.QuarkusTest;
import io.restassured.http.ContentType;
import io.swagger.v3.parser.OpenAPIV3Parser;
import io.swagger.v3.parser.core.models.ParseOptions;
import io.swagger.v3.parser.core.models.SwaggerParseResult;
import java.io.IOException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.slopewatch.security.ApiRoutes;

/**
 * The OpenAPI document at {@code /q/openapi}, read by an outside parser and by hand. swagger-parser
 * (io.swagger.parser.v3:swagger-parser-v3), the parser of the OpenAPI Initiative's Swagger tools,
 * reads it as an OpenAPI 3 document and reports no problem. By hand, against the OpenAPI
 * Specification 3.1.0: {@code openapi} is a 3.x version (section 4.8.1), every {@code $ref}
 * resolves to a schema under {@code components/schemas} (4.8.23), the {@code bearer} scheme is
 * declared as type {@code http} with scheme {@code bearer} (4.8.27, RFC 6750) and required by every
 * operation, every error answer is {@code application/problem+json} with the Problem schema, and no
 * schema an operation of {@code /api} reaches is a bare object with nothing said of its members.
 * Every route of the resources ({@link ApiRoutes}) is documented, and the documented property
 * names are those the API writes: the keys of real answers are checked against them.
 */
@QuarkusTest
class OpenApiDocumentTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    /**
     * A quote long before any other test's, every spread positive: it gives the read API something to answer without
     * moving what the other tests of this profile, which share the daemon's journal, see as latest or as a transition.
     */
    private static final String QUOTE = "{\"curve\":\"GOVT-B\",\"date\":\"2001-06-01\",\"yields\":{\"3M\":1.00,\"2Y\":2.00,\"10Y\":3.00}}";
    private static final String SCHEMAS = "#/components/schemas/";

    private static String text;
    private static JsonNode doc;

    /** The document, fetched once the application is up (a static @BeforeAll would run before it listens). */
    @BeforeEach
    void fetch() throws IOException {
        if (doc == null) {
            text = given().get("/q/openapi?format=json").then().statusCode(200).extract().asString();
            doc = JSON.readTree(text);
        }
    }

    @Test
    void anOutsideParserReadsItWithoutProblems() {
        ParseOptions options = new ParseOptions();
        options.setResolve(true);
        options.setValidateInternalRefs(true);
        SwaggerParseResult result = new OpenAPIV3Parser().readContents(text, null, options);
        assertThat(result.getMessages()).as("swagger-parser's messages about /q/openapi").isEmpty();
        assertThat(result.getOpenAPI()).isNotNull();
        assertThat(result.getOpenAPI().getPaths()).as("paths as swagger-parser read them").containsKey("/api/spreads");
        assertThat(result.getOpenAPI().getComponents().getSecuritySchemes()).containsKey("bearer");
    }

    @Test
    void itIsAnOpenApi3DocumentWhoseReferencesResolve() {
        assertThat(doc.path("openapi").asText()).as("OpenAPI 3.1.0 section 4.8.1").startsWith("3.");
        assertThat(doc.path("info").path("title").asText()).isEqualTo("slopewatch");
        assertThat(doc.path("paths").size()).isPositive();
        List<String> refs = new ArrayList<>();
        collectRefs(doc, refs);
        assertThat(refs).as("the document uses references").isNotEmpty();
        for (String ref : refs) {
            assertThat(ref).as("a reference into components/schemas").startsWith(SCHEMAS);
            assertThat(doc.path("components").path("schemas").has(ref.substring(SCHEMAS.length()))).as(ref + " resolves").isTrue();
        }
    }

    @Test
    void everyRouteIsDocumentedWithBearerAndProblemAnswers() {
        JsonNode scheme = doc.path("components").path("securitySchemes").path("bearer");
        assertThat(scheme.path("type").asText()).isEqualTo("http");
        assertThat(scheme.path("scheme").asText()).isEqualTo("bearer");
        List<String> wrong = new ArrayList<>();
        for (ApiRoutes.Route route : ApiRoutes.scan().routes()) {
            JsonNode operation = doc.path("paths").path(route.template()).path(route.method().toLowerCase(Locale.ROOT));
            String where = route.method() + " " + route.template();
            if (operation.isMissingNode()) {
                wrong.add(where + ": not documented");
                continue;
            }
            if (!operation.path("security").toString().equals("[{\"bearer\":[]}]")) {
                wrong.add(where + ": security " + operation.path("security") + " instead of the bearer scheme");
            }
            JsonNode responses = operation.path("responses");
            List<String> needed = new ArrayList<>(List.of("401", "500"));
            if (!route.reads()) {
                needed.add("403");
            }
            for (String status : needed) {
                if (!responses.has(status)) {
                    wrong.add(where + ": no " + status + " answer");
                }
            }
            if (fieldNames(responses).stream().noneMatch(s -> s.startsWith("2"))) {
                wrong.add(where + ": no success answer");
            }
            for (String status : fieldNames(responses)) {
                JsonNode content = responses.path(status).path("content");
                if (status.startsWith("4") || status.startsWith("5")) {
                    String schema = content.path(Problem.MEDIA_TYPE).path("schema").path("$ref").asText();
                    if (content.size() != 1 || !schema.equals(SCHEMAS + "Problem")) {
                        wrong.add(where + " " + status + ": content " + content + " instead of the Problem schema as " + Problem.MEDIA_TYPE);
                    }
                }
            }
        }
        assertThat(wrong).isEmpty();
        JsonNode problem = doc.path("components").path("schemas").path("Problem");
        assertThat(fieldNames(problem.path("properties"))).as("RFC 9457 section 3.1").contains("type", "title", "status", "detail", "instance");
    }

    @Test
    void noSchemaAnOperationReachesIsABareObject() {
        List<String> bare = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        int operations = 0;
        for (String path : fieldNames(doc.path("paths"))) {
            if (!path.startsWith("/api/")) {
                continue;
            }
            for (String method : fieldNames(doc.path("paths").path(path))) {
                JsonNode operation = doc.path("paths").path(path).path(method);
                operations++;
                String where = method.toUpperCase(Locale.ROOT) + " " + path;
                for (JsonNode parameter : operation.path("parameters")) {
                    walk(parameter.path("schema"), where + " parameter " + parameter.path("name").asText(), seen, bare);
                }
                for (String type : fieldNames(operation.path("requestBody").path("content"))) {
                    walk(operation.path("requestBody").path("content").path(type).path("schema"), where + " body " + type, seen, bare);
                }
                for (String status : fieldNames(operation.path("responses"))) {
                    JsonNode content = operation.path("responses").path(status).path("content");
                    for (String type : fieldNames(content)) {
                        walk(content.path(type).path("schema"), where + " " + status + " " + type, seen, bare);
                    }
                }
            }
        }
        assertThat(operations).isGreaterThan(20);
        assertThat(seen).as("named schemas reached").contains("SpreadView", "Problem", "TimelineItem", "ExportTransitions");
        assertThat(bare).as("schemas that say nothing of their members (an Object or a Map of anything in the code)").isEmpty();
    }

    @Test
    void theDocumentNamesPropertiesAsTheApiWritesThem() throws IOException {
        given().contentType(ContentType.JSON).body(QUOTE).post("/api/quotes").then().statusCode(200);
        checkKeys(JSON.readTree(given().get("/api/spreads").asString()), "SpreadView");
        checkKeys(JSON.readTree(given().get("/api/curves").asString()), "CurveView");
        checkKeys(JSON.readTree(given().get("/api/alerts").asString()), "AlertsView");
        JsonNode instances = JSON.readTree(given().get("/api/policy/instances").asString());
        checkKeys(instances, "InstancesView");
        checkKeys(instances.get("items"), "InstanceView");
        checkKeys(JSON.readTree(given().get("/api/spreads/GOVT-B:10Y-3M?asOf=2100-01-01T00:00:00Z").asString()), "SpreadAsOfView");
    }

    /** Every key of a real answer (of each element of an array) is a property of the schema documented for it. */
    private static void checkKeys(JsonNode answer, String schemaName) {
        assertThat(answer.size()).as(schemaName + ": a non-empty answer to compare").isPositive();
        JsonNode schema = doc.path("components").path("schemas").path(schemaName);
        for (JsonNode element : answer.isArray() ? answer : List.of(answer)) {
            assertThat(fieldNames(schema.path("properties"))).as("the properties documented for " + schemaName)
                    .containsAll(fieldNames(element));
        }
    }

    /** Walks a schema and every schema it names; a schema is bare when it may be any object and says nothing of its members. */
    private static void walk(JsonNode schema, String where, Set<String> seen, List<String> bare) {
        if (schema.isMissingNode() || schema.isBoolean()) {
            return;
        }
        String ref = schema.path("$ref").asText(null);
        if (ref != null) {
            String name = ref.substring(SCHEMAS.length());
            if (seen.add(name)) {
                walk(doc.path("components").path("schemas").path(name), name, seen, bare);
            }
            return;
        }
        JsonNode type = schema.path("type");
        boolean object = type.isMissingNode() || type.asText().equals("object") || type.toString().contains("\"object\"");
        boolean saysSomething = schema.has("properties") || schema.has("oneOf") || schema.has("anyOf") || schema.has("allOf")
                || schema.path("additionalProperties").isObject();
        if (object && !saysSomething) {
            bare.add(where + ": " + schema);
        }
        for (JsonNode property : iterable(schema.path("properties").elements())) {
            walk(property, where, seen, bare);
        }
        walk(schema.path("items"), where + "[]", seen, bare);
        walk(schema.path("additionalProperties"), where + "{}", seen, bare);
        for (String combinator : List.of("oneOf", "anyOf", "allOf")) {
            for (JsonNode alternative : schema.path(combinator)) {
                walk(alternative, where, seen, bare);
            }
        }
    }

    private static void collectRefs(JsonNode node, List<String> refs) {
        if (node.isObject()) {
            if (node.has("$ref")) {
                refs.add(node.get("$ref").asText());
            }
            node.elements().forEachRemaining(child -> collectRefs(child, refs));
        } else if (node.isArray()) {
            node.forEach(child -> collectRefs(child, refs));
        }
    }

    private static Set<String> fieldNames(JsonNode node) {
        Set<String> names = new TreeSet<>();
        node.fieldNames().forEachRemaining(names::add);
        return names;
    }

    private static <T> Iterable<T> iterable(Iterator<T> iterator) {
        return () -> iterator;
    }
}
