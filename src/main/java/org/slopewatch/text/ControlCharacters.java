package org.slopewatch.text;

/**
 * The characters that must not travel as they are into a log line, a journal column or a
 * message: the Unicode control characters (U+0000 to U+001F, U+007F to U+009F, among them tab,
 * line feed, carriage return and escape) and the line and paragraph separators U+2028 and
 * U+2029. Any of them can start a new line or rewrite one on a terminal, so a text holding one
 * could forge a log line; PostgreSQL's text columns cannot hold U+0000 at all.
 */
public final class ControlCharacters {

    private ControlCharacters() {
    }

    /** True for a character this class refuses or escapes. */
    public static boolean isRefused(char c) {
        return Character.isISOControl(c) || c == '\u2028' || c == '\u2029';
    }

    /** The index of the first such character, or -1. */
    public static int first(CharSequence text) {
        for (int i = 0; i < text.length(); i++) {
            if (isRefused(text.charAt(i))) {
                return i;
            }
        }
        return -1;
    }

    /** How a message names the character: {@code the control character U+000A} or {@code the line separator U+2028}. */
    public static String describe(char c) {
        String kind = c == '\u2028' ? "the line separator" : c == '\u2029' ? "the paragraph separator" : "the control character";
        return String.format("%s U+%04X", kind, (int) c);
    }

    /**
     * The text with every such character written as an escape a reader recognises: {@code \n},
     * {@code \r}, {@code \t}, otherwise {@code \}{@code uXXXX}. Backslashes are left alone, so the result
     * is for reading, not for decoding back. The same string is returned when there is nothing to escape.
     */
    public static String escape(String text) {
        int first = first(text);
        if (first < 0) {
            return text;
        }
        StringBuilder out = new StringBuilder(text.length() + 16).append(text, 0, first);
        for (int i = first; i < text.length(); i++) {
            char c = text.charAt(i);
            if (!isRefused(c)) {
                out.append(c);
            } else if (c == '\n') {
                out.append("\\n");
            } else if (c == '\r') {
                out.append("\\r");
            } else if (c == '\t') {
                out.append("\\t");
            } else {
                out.append(String.format("\\u%04X", (int) c));
            }
        }
        return out.toString();
    }
}
