package org.slopewatch.text;

/** Escaping for text and attribute values in HTML: the reports' pages and the alert emails. */
public final class Html {

    private Html() {
    }

    public static String escape(String text) {
        if (text == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(text.length() + 16);
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '&' -> b.append("&amp;");
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> b.append(c);
            }
        }
        return b.toString();
    }
}
