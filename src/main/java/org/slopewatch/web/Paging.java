package org.slopewatch.web;

import jakarta.ws.rs.core.UriInfo;
import java.net.URLDecoder;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;
import org.jboss.resteasy.reactive.RestResponse;
import org.slopewatch.text.Excerpt;

/**
 * The one paging contract of the API's lists (docs/api.md, "Lists"). {@code limit} caps a page
 * (each list has a default and a maximum); {@code after}, a cursor, continues after the last item
 * of the previous page. Every list answer says whether more items follow in the header
 * {@value #TRUNCATED} and, when they do, where in a {@code Link} header with {@code rel="next"}
 * (RFC 8288); an answer that is a JSON object says both in its body too ({@code truncated},
 * {@code next}). Lists keep the shape they always had, so a client that reads one page as
 * before keeps working.
 */
final class Paging {

    static final String TRUNCATED = "X-Slopewatch-Truncated";

    private Paging() {
    }

    /**
     * One page of a list.
     *
     * @param after the cursor of the next page, null when nothing follows
     */
    record Page<T>(List<T> items, String after) {

        /**
         * A page from {@code fetched}, read with one item more than a page holds: that one only
         * tells that more follow, and the page ends at the item before it.
         */
        static <T> Page<T> of(List<T> fetched, int limit, Function<T, String> cursor) {
            if (fetched.size() <= limit) {
                return new Page<>(fetched, null);
            }
            List<T> items = List.copyOf(fetched.subList(0, limit));
            return new Page<>(items, cursor.apply(items.get(limit - 1)));
        }

        boolean truncated() {
            return after != null;
        }
    }

    /**
     * {@code limit}: a whole number from 1; absent, {@code otherwise}; above {@code max}, the
     * maximum (the answer then says that more follow and where).
     */
    static int limit(String text, int otherwise, int max) {
        if (text == null || text.isBlank()) {
            return otherwise;
        }
        String digits = text.strip();
        if (!digits.matches("[0-9]{1,18}") || Long.parseLong(digits) < 1) {
            throw QueryParams.bad("limit must be a whole number from 1 (at most " + max + " items a page), not " + Excerpt.quoted(text));
        }
        return (int) Math.min(Long.parseLong(digits), max);
    }

    /**
     * Where the page after {@code page} is: this request's path and query, {@code after} set to
     * the page's cursor (every other parameter as sent, in the spelling the request was matched
     * with); null when nothing follows.
     */
    static String next(UriInfo uri, Page<?> page) {
        if (!page.truncated()) {
            return null;
        }
        String raw = uri.getRequestUri().getRawQuery();
        List<String> kept = new ArrayList<>();
        if (raw != null && !raw.isEmpty()) {
            for (String pair : raw.split("&")) {
                if (!pair.isEmpty() && !"after".equals(name(pair))) {
                    kept.add(pair);
                }
            }
        }
        kept.add("after=" + encode(page.after()));
        return uri.getRequestUri().getRawPath() + "?" + String.join("&", kept);
    }

    /** A list answer: {@code body}, and whether more follow and where ({@code next} as {@link #next} gave it). */
    static <T> RestResponse<T> answer(T body, String next) {
        RestResponse.ResponseBuilder<T> r = RestResponse.ResponseBuilder.ok(body).header(TRUNCATED, next != null);
        if (next != null) {
            r.header("Link", "<" + next + ">; rel=\"next\"");
        }
        return r.build();
    }

    private static String name(String pair) {
        String name = pair.split("=", 2)[0];
        try {
            return URLDecoder.decode(name, StandardCharsets.UTF_8);
        } catch (IllegalArgumentException e) {
            return name; // a broken escape: not the name after, whatever it is
        }
    }

    /** Percent-encodes all but the unreserved characters of RFC 3986 and ':' (which a query may hold as it is). */
    private static String encode(String value) {
        StringBuilder out = new StringBuilder();
        for (byte b : value.getBytes(StandardCharsets.UTF_8)) {
            char c = (char) (b & 0xff);
            if (c < 0x80 && (Character.isLetterOrDigit(c) || "-._~:".indexOf(c) >= 0)) {
                out.append(c);
            } else {
                out.append('%').append(Character.toUpperCase(Character.forDigit((b >> 4) & 0xf, 16)))
                        .append(Character.toUpperCase(Character.forDigit(b & 0xf, 16)));
            }
        }
        return out.toString();
    }
}
