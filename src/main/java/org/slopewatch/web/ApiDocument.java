package org.slopewatch.web;

import io.quarkus.smallrye.openapi.OpenApiFilter;
import java.util.List;
import java.util.Map;
import org.eclipse.microprofile.openapi.OASFactory;
import org.eclipse.microprofile.openapi.OASFilter;
import org.eclipse.microprofile.openapi.models.OpenAPI;
import org.eclipse.microprofile.openapi.models.Operation;
import org.eclipse.microprofile.openapi.models.PathItem;
import org.eclipse.microprofile.openapi.models.media.Content;
import org.eclipse.microprofile.openapi.models.media.MediaType;
import org.eclipse.microprofile.openapi.models.media.Schema;
import org.eclipse.microprofile.openapi.models.responses.APIResponse;

/**
 * What the OpenAPI document of {@code /api} says that the resources' annotations cannot: every
 * error answer is a {@link Problem} ({@value Problem#MEDIA_TYPE}), any operation may fail with a
 * 500, and the JSON form of an export has the columns of its {@link ExportTable}, which stream
 * from the journal rather than from a class the scanner could read.
 */
@OpenApiFilter(OpenApiFilter.RunStage.BUILD)
public class ApiDocument implements OASFilter {

    static final String API = "/api/";
    private static final String PROBLEM_SCHEMA = "#/components/schemas/Problem";
    private static final Map<String, ExportTable<?>> EXPORTS = Map.of("/api/export/observations", ExportTable.OBSERVATIONS,
            "/api/export/transitions", ExportTable.TRANSITIONS, "/api/export/alerts", ExportTable.ALERTS);

    @Override
    public void filterOpenAPI(OpenAPI openAPI) {
        if (openAPI.getPaths() == null) {
            return;
        }
        openAPI.getPaths().getPathItems().forEach((path, item) -> {
            if (!path.startsWith(API)) {
                return;
            }
            for (Operation operation : item.getOperations().values()) {
                problems(operation);
            }
            ExportTable<?> table = EXPORTS.get(path);
            if (table != null && item.getGET() != null) {
                export(openAPI, item, table);
            }
        });
    }

    /** An error answer with a problem document; a filter of another package adds its own through this. */
    public static APIResponse problem(String description) {
        return OASFactory.createAPIResponse().description(description).content(problemContent());
    }

    private static Content problemContent() {
        return OASFactory.createContent().addMediaType(Problem.MEDIA_TYPE,
                OASFactory.createMediaType().schema(OASFactory.createSchema().ref(PROBLEM_SCHEMA)));
    }

    private static void problems(Operation operation) {
        if (!operation.getResponses().hasAPIResponse("500")) {
            operation.getResponses().addAPIResponse("500", problem("internal: a failure of the daemon; the detail is generic and the "
                    + "failure is in its log"));
        }
        for (Map.Entry<String, APIResponse> e : operation.getResponses().getAPIResponses().entrySet()) {
            boolean error = e.getKey().startsWith("4") || e.getKey().startsWith("5");
            if (error) {
                // whatever the scanner or an annotation gave, an error answer is a problem document and nothing else
                e.getValue().setContent(problemContent());
            }
        }
    }

    /** The JSON export's shape: the request's head, then {@code items}, one object per row keyed by the table's columns. */
    private static void export(OpenAPI openAPI, PathItem item, ExportTable<?> table) {
        String name = "Export" + Character.toUpperCase(table.name().charAt(0)) + table.name().substring(1);
        Schema row = OASFactory.createSchema().addType(Schema.SchemaType.OBJECT)
                .description("one row; a value that is not a finite number is null");
        for (String column : table.names()) {
            row.addProperty(column, OASFactory.createSchema().type(List.of(Schema.SchemaType.STRING, Schema.SchemaType.NUMBER,
                    Schema.SchemaType.BOOLEAN, Schema.SchemaType.NULL)));
        }
        Schema document = OASFactory.createSchema().addType(Schema.SchemaType.OBJECT)
                .description("the " + table.name() + " export as JSON, written as it streams from the journal")
                .addProperty("export", OASFactory.createSchema().addType(Schema.SchemaType.STRING))
                .addProperty("spread", nullable(Schema.SchemaType.STRING, null))
                .addProperty("from", nullable(Schema.SchemaType.STRING, "date"))
                .addProperty("to", nullable(Schema.SchemaType.STRING, "date"))
                .addProperty("as_of", nullable(Schema.SchemaType.STRING, "date-time"))
                .addProperty("policy_hash", nullable(Schema.SchemaType.STRING, null))
                .addProperty("items", OASFactory.createSchema().addType(Schema.SchemaType.ARRAY).items(row));
        if (openAPI.getComponents() == null) {
            openAPI.components(OASFactory.createComponents());
        }
        openAPI.getComponents().addSchema(name, document);
        APIResponse ok = item.getGET().getResponses().getAPIResponse("200");
        if (ok != null && ok.getContent() != null) {
            MediaType json = ok.getContent().getMediaType(jakarta.ws.rs.core.MediaType.APPLICATION_JSON);
            if (json != null) {
                json.setSchema(OASFactory.createSchema().ref("#/components/schemas/" + name));
            }
            MediaType csv = ok.getContent().getMediaType(ExportResource.CSV);
            if (csv != null) {
                csv.setSchema(OASFactory.createSchema().addType(Schema.SchemaType.STRING)
                        .description("RFC 4180 CSV, a header row of the columns first"));
            }
        }
    }

    private static Schema nullable(Schema.SchemaType type, String format) {
        Schema s = OASFactory.createSchema().type(List.of(type, Schema.SchemaType.NULL));
        return format == null ? s : s.format(format);
    }
}
