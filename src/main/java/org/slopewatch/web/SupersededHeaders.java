package org.slopewatch.web;

import jakarta.ws.rs.container.ContainerRequestContext;
import jakarta.ws.rs.container.ContainerResponseContext;
import jakarta.ws.rs.container.ContainerResponseFilter;
import jakarta.ws.rs.ext.Provider;

/**
 * Tells a client of {@code /api/mutes} that the path is deprecated and where its successor is:
 * {@code Deprecation} (RFC 9745: a structured-field date, here the day the quiet-period path
 * replaced it) and {@code Link} with {@code rel="successor-version"} (RFC 8288, relation from
 * RFC 5829). A paging {@code Link rel="next"} the answer already has is kept beside it.
 */
@Provider
@Superseded
public class SupersededHeaders implements ContainerResponseFilter {

    /** 2026-12-05T00:00:00Z, as RFC 9745's {@code @seconds} since the epoch. */
    static final String DEPRECATED_SINCE = "@1796428800";
    static final String SUCCESSOR = "</api/quiet-periods>; rel=\"successor-version\"";

    @Override
    public void filter(ContainerRequestContext request, ContainerResponseContext response) {
        response.getHeaders().putSingle("Deprecation", DEPRECATED_SINCE);
        response.getHeaders().add("Link", SUCCESSOR);
    }
}
