package org.slopewatch.web;

import jakarta.ws.rs.container.ContainerRequestContext;
import java.net.URI;
import java.net.URLDecoder;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.jboss.resteasy.reactive.server.ServerRequestFilter;

/**
 * Old spellings of query parameters, still taken: before a request is matched, each is renamed
 * to the name the API uses now (snake_case, like the JSON fields; docs/api.md, "Names"), so that
 * a resource knows one name and a {@code next} link carries the current one. A request that gives
 * both spellings of one parameter is refused rather than one of them silently winning.
 */
public class QueryAliases {

    /** Old name to current name; each old name is deprecated and documented as such. */
    static final Map<String, String> CURRENT_NAME = Map.of("asOf", "as_of");

    @ServerRequestFilter(preMatching = true)
    public void rename(ContainerRequestContext request) {
        URI uri = request.getUriInfo().getRequestUri();
        String raw = uri.getRawQuery();
        if (raw == null || raw.isEmpty()) {
            return;
        }
        List<String> pairs = new ArrayList<>();
        List<String> names = new ArrayList<>();
        boolean renamed = false;
        for (String pair : raw.split("&", -1)) {
            String[] nameAndValue = pair.split("=", 2);
            String name = decode(nameAndValue[0]);
            String current = CURRENT_NAME.get(name);
            if (current != null) {
                renamed = true;
                name = current;
                pair = current + (nameAndValue.length == 2 ? "=" + nameAndValue[1] : "");
            }
            names.add(name);
            pairs.add(pair);
        }
        if (!renamed) {
            return;
        }
        for (Map.Entry<String, String> alias : CURRENT_NAME.entrySet()) {
            if (names.stream().filter(alias.getValue()::equals).count() > 1) {
                throw QueryParams.bad("give " + alias.getValue() + " once (" + alias.getKey() + " is its old spelling)");
            }
        }
        request.setRequestUri(URI.create(uri.getScheme() + "://" + uri.getRawAuthority() + uri.getRawPath() + "?" + String.join("&", pairs)));
    }

    private static String decode(String name) {
        try {
            return URLDecoder.decode(name, StandardCharsets.UTF_8);
        } catch (IllegalArgumentException e) {
            return name; // a broken escape names no parameter we rename
        }
    }
}
