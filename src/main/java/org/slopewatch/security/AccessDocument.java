package org.slopewatch.security;

import io.quarkus.smallrye.openapi.OpenApiFilter;
import org.eclipse.microprofile.openapi.OASFactory;
import org.eclipse.microprofile.openapi.OASFilter;
import org.eclipse.microprofile.openapi.models.OpenAPI;
import org.eclipse.microprofile.openapi.models.Operation;
import org.eclipse.microprofile.openapi.models.PathItem;
import org.eclipse.microprofile.openapi.models.responses.APIResponse;
import org.eclipse.microprofile.openapi.models.responses.APIResponses;
import org.eclipse.microprofile.openapi.models.security.SecurityScheme;
import org.slopewatch.web.ApiDocument;

/**
 * The access rule in the OpenAPI document: the bearer scheme ({@value #SCHEME}), required by
 * every operation that {@link AccessRule} says needs a token, with the refusals the access filter
 * answers (401, 403 for an operation that writes, 400 for a matrix parameter). It documents the
 * daemon as it starts by default, security on and no open reads; with open reads, reads go
 * without a token.
 */
@OpenApiFilter(OpenApiFilter.RunStage.BUILD)
public class AccessDocument implements OASFilter {

    static final String SCHEME = "bearer";
    private static final AccessRule DEFAULT = new AccessRule(false, true);

    @Override
    public void filterOpenAPI(OpenAPI openAPI) {
        if (openAPI.getComponents() == null) {
            openAPI.components(OASFactory.createComponents());
        }
        openAPI.getComponents().addSecurityScheme(SCHEME, OASFactory.createSecurityScheme().type(SecurityScheme.Type.HTTP)
                .scheme("bearer").description("a token with the read role (GET, HEAD, OPTIONS) or the write role (anything else; "
                        + "a write token also reads), as configured in slopewatch.security.read-tokens and write-tokens"));
        if (openAPI.getPaths() == null) {
            return;
        }
        openAPI.getPaths().getPathItems().forEach((path, item) -> {
            for (var e : item.getOperations().entrySet()) {
                document(e.getKey(), path, e.getValue());
            }
        });
    }

    private static void document(PathItem.HttpMethod method, String path, Operation operation) {
        if (!(DEFAULT.needed(method.name(), path) instanceof Access.Token token)) {
            return;
        }
        operation.addSecurityRequirement(OASFactory.createSecurityRequirement().addScheme(SCHEME));
        APIResponses responses = operation.getResponses();
        add(responses, "401", "unauthorized: no bearer token, or one that is not valid");
        if (token.role() == Role.WRITE) {
            add(responses, "403", "forbidden: a token with the read role only");
        }
        add(responses, "400", "malformed-path: a path with a matrix parameter (';'), refused whatever the token");
    }

    /** Adds the refusal, or its description to the operation's own answer with that status. */
    private static void add(APIResponses responses, String status, String description) {
        APIResponse own = responses.getAPIResponse(status);
        if (own == null) {
            responses.addAPIResponse(status, ApiDocument.problem(description));
        } else {
            own.setDescription(own.getDescription() + "; or " + description);
        }
    }
}
