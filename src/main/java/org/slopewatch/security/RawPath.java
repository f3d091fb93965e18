package org.slopewatch.security;

/**
 * A request path as it arrived on the wire: not decoded, not normalised, the query cut off. The
 * layers behind the access filter (the Vert.x router, the REST layer, the static file handler)
 * each read such a path their own way: they decode percent escapes, remove dot segments, drop
 * matrix parameters, fold slashes or not. A decision taken on any one reading can therefore be
 * dodged by a spelling that another layer reads differently. This class only says whether a raw
 * path is spelled in the one way that every reading leaves unchanged.
 */
final class RawPath {

    private RawPath() {
    }

    /**
     * True when the path is already in normal form (RFC 3986 section 6.2.2): it starts with a
     * slash; no segment is empty, {@code .} or {@code ..}; every character is unreserved
     * (ALPHA, DIGIT, {@code -._~}) or one of {@code :@!$&'()*+,=}; and a percent escape stands
     * only for a character outside the unreserved set, which normalisation does not decode (so
     * {@code %3A} for a colon passes, {@code %2e} for a dot and {@code %61} for an {@code a} do
     * not). A semicolon never passes: it starts a matrix parameter, which some layers drop.
     */
    static boolean isNormal(String path) {
        if (path == null || path.isEmpty() || path.charAt(0) != '/') {
            return false;
        }
        int segmentStart = 1;
        for (int i = 1; i <= path.length(); i++) {
            if (i == path.length() || path.charAt(i) == '/') {
                String segment = path.substring(segmentStart, i);
                if (segment.isEmpty() || segment.equals(".") || segment.equals("..")) {
                    return false;
                }
                segmentStart = i + 1;
                continue;
            }
            char c = path.charAt(i);
            if (c == '%') {
                if (i + 2 >= path.length()) {
                    return false;
                }
                int value = hex(path.charAt(i + 1)) * 16 + hex(path.charAt(i + 2));
                if (value < 0 || unreserved((char) value)) {
                    return false;
                }
                i += 2;
            } else if (!unreserved(c) && ":@!$&'()*+,=".indexOf(c) < 0) {
                return false;
            }
        }
        return true;
    }

    private static boolean unreserved(char c) {
        return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '-' || c == '.' || c == '_' || c == '~';
    }

    /** The value of a hex digit, or a large negative number so that a bad escape's value is negative. */
    private static int hex(char c) {
        int d = Character.digit(c, 16);
        return d < 0 ? -1_000 : d;
    }
}
