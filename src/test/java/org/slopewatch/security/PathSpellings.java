package org.slopewatch.security;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.UnaryOperator;

/**
 * Ways of spelling a path that one layer of an HTTP server may read as another path than the
 * next layer does: matrix parameters on each segment, doubled slashes, percent escapes of plain
 * letters and of the slash, dot segments (plain, escaped, and with an empty matrix parameter as
 * in {@code ..;}), other letter case, a trailing slash, a backslash, a path that starts as one of
 * the dashboard's open files and climbs out of it, and the absolute form of the request target
 * (RFC 9112 section 3.2.2). Sources for the kinds: RFC 3986 sections 2.1 (percent-encoding),
 * 3.3 (path segments, where {@code ;} is a sub-delimiter often used for parameters) and 5.2.4
 * (dot segments); the {@code ..;} form is the well-known Tomcat/Spring matrix trick (from memory).
 */
final class PathSpellings {

    /** One spelling: what it is called in a failure message and how it turns a canonical path into its own. */
    record Spelling(String name, UnaryOperator<String> apply) {
    }

    private PathSpellings() {
    }

    /** @param port the daemon's port, for the absolute form */
    static List<Spelling> all(int port) {
        List<Spelling> s = new ArrayList<>();
        s.add(new Spelling("canonical", p -> p));
        s.add(new Spelling("matrix on the first segment", p -> "/" + first(p) + ";x/" + rest(p)));
        s.add(new Spelling("matrix on the last segment", p -> p + ";x"));
        s.add(new Spelling("empty matrix on the first segment", p -> "/" + first(p) + ";/" + rest(p)));
        s.add(new Spelling("escaped semicolon", p -> "/" + first(p) + "%3Bx/" + rest(p)));
        s.add(new Spelling("leading double slash", p -> "/" + p));
        s.add(new Spelling("inner double slash", p -> "/" + first(p) + "//" + rest(p)));
        s.add(new Spelling("escaped first letter", p -> "/" + escape(first(p).charAt(0)) + first(p).substring(1) + "/" + rest(p)));
        s.add(new Spelling("escaped slash", p -> "/" + first(p) + "%2F" + rest(p)));
        s.add(new Spelling("escaped letter of the second segment", p -> "/" + first(p) + "/" + escape(rest(p).charAt(0)) + rest(p).substring(1)));
        s.add(new Spelling("climb out of the health path", p -> "/q/health/../.." + p));
        s.add(new Spelling("climb out of a made-up segment", p -> "/x/.." + p));
        s.add(new Spelling("dot segment", p -> "/" + first(p) + "/./" + rest(p)));
        s.add(new Spelling("leading dot segment", p -> "/." + p));
        s.add(new Spelling("escaped dot segments", p -> "/q/health/%2e%2e/%2E%2E" + p));
        s.add(new Spelling("dot segments with empty matrix", p -> "/q/health/..;/..;" + p));
        s.add(new Spelling("upper case", p -> p.toUpperCase(Locale.ROOT)));
        s.add(new Spelling("capitalised segments", PathSpellings::capitalised));
        s.add(new Spelling("trailing slash", p -> p + "/"));
        s.add(new Spelling("backslash", p -> "/" + first(p) + "\\" + rest(p)));
        s.add(new Spelling("climb out of the dashboard page", p -> "/index.html/.." + p));
        s.add(new Spelling("climb out of a dashboard file with a matrix", p -> "/dashboard.js;/.." + p));
        s.add(new Spelling("climb out of a dashboard file with an escaped dot segment", p -> "/dashboard.js/%2e%2e" + p));
        s.add(new Spelling("absolute form", p -> "http://127.0.0.1:" + port + p));
        s.add(new Spelling("absolute form with a matrix", p -> "http://127.0.0.1:" + port + "/" + first(p) + ";x/" + rest(p)));
        s.add(new Spelling("fragment", p -> p + "#x"));
        return s;
    }

    private static String first(String path) {
        String[] segments = path.substring(1).split("/", 2);
        if (segments.length < 2) {
            throw new IllegalArgumentException("the spellings need a path of two segments or more: " + path);
        }
        return segments[0];
    }

    private static String rest(String path) {
        return path.substring(1).split("/", 2)[1];
    }

    private static String escape(char c) {
        return String.format(Locale.ROOT, "%%%02X", (int) c);
    }

    private static String capitalised(String path) {
        StringBuilder out = new StringBuilder();
        for (String segment : path.substring(1).split("/")) {
            out.append('/').append(segment.isEmpty() ? "" : Character.toUpperCase(segment.charAt(0)) + segment.substring(1));
        }
        return out.toString();
    }
}
