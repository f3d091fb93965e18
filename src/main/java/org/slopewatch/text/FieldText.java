package org.slopewatch.text;

/**
 * The one check of a text the journal keeps as it was sent (a quote's id, a quiet period's note, who
 * acknowledged): it must fit its column and hold no character of {@link ControlCharacters} and no
 * half of a surrogate pair (which PostgreSQL would store as {@code ?}). The message names the field
 * and never repeats the text.
 */
public final class FieldText {

    private FieldText() {
    }

    /**
     * @param field    the field's name as the sender wrote it, e.g. {@code reason}
     * @param maxChars what its journal column holds
     * @return what is wrong, or null when the text may be kept; null text passes (absent)
     */
    public static String problem(String field, String text, int maxChars) {
        if (text == null) {
            return null;
        }
        if (text.length() > maxChars) {
            return "'" + field + "' is " + text.length() + " characters long; at most " + maxChars;
        }
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            if (ControlCharacters.isRefused(c)) {
                return "'" + field + "' contains " + ControlCharacters.describe(c);
            }
            boolean paired = Character.isHighSurrogate(c) ? i + 1 < text.length() && Character.isLowSurrogate(text.charAt(++i))
                    : !Character.isLowSurrogate(c);
            if (!paired) {
                return String.format("'%s' contains an unpaired surrogate U+%04X", field, (int) c);
            }
        }
        return null;
    }
}
