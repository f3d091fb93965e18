package org.slopewatch.text;

/**
 * Input as a message or a log line repeats it: control characters escaped
 * ({@link ControlCharacters#escape}) and anything longer than {@link #MAX_CHARS} cut, with an
 * ellipsis and the original length, so that an answer or a log line that quotes what it was sent
 * stays small however large that was. Every message that quotes input goes through here.
 */
public final class Excerpt {

    /** Enough to recognise a value; a name, a date or a number is far shorter. */
    public static final int MAX_CHARS = 200;

    private Excerpt() {
    }

    /** The text as a message repeats it: {@code GOVT-A}, or {@code CCCC…… (20000 characters)}; null stays {@code null}. */
    public static String of(String text) {
        if (text == null) {
            return "null";
        }
        String clean = ControlCharacters.escape(text);
        return clean.length() <= MAX_CHARS ? clean : head(clean, MAX_CHARS) + "… (" + text.length() + " characters)";
    }

    /** The text in single quotes: {@code 'GOVT-A'}, or {@code 'CCCC…' (20000 characters)}. */
    public static String quoted(String text) {
        if (text == null) {
            return "null";
        }
        String clean = ControlCharacters.escape(text);
        return clean.length() <= MAX_CHARS ? "'" + clean + "'" : "'" + head(clean, MAX_CHARS) + "…' (" + text.length() + " characters)";
    }

    /**
     * A whole message (which may quote several values) cut to {@code max} characters with an
     * ellipsis and the original length; control characters escaped.
     */
    public static String cut(String message, int max) {
        if (message == null) {
            return null;
        }
        String clean = ControlCharacters.escape(message);
        return clean.length() <= max ? clean : head(clean, max) + "… (" + message.length() + " characters)";
    }

    /** The first {@code n} characters, one fewer when the cut would split a surrogate pair. */
    private static String head(String s, int n) {
        int end = Character.isHighSurrogate(s.charAt(n - 1)) ? n - 1 : n;
        return s.substring(0, end);
    }
}
