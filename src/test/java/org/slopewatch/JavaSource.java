package org.slopewatch;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * A Java source file split just enough to find string literals and the call each one is an
 * argument of: {@link #code()} is the text with comments and literal contents blanked (same
 * length, newlines kept), so that brackets inside strings or comments do not count.
 */
final class JavaSource {

    /** A string literal's content as written (escapes not processed) and where its quotes are. */
    record Literal(String text, int start, int end) {
    }

    private final String text;
    private final String code;
    private final List<Literal> literals;

    private JavaSource(String text, String code, List<Literal> literals) {
        this.text = text;
        this.code = code;
        this.literals = literals;
    }

    static JavaSource of(String text) {
        StringBuilder code = new StringBuilder(text.length());
        List<Literal> literals = new ArrayList<>();
        int i = 0;
        int n = text.length();
        while (i < n) {
            char c = text.charAt(i);
            if (c == '/' && i + 1 < n && text.charAt(i + 1) == '/') {
                int end = text.indexOf('\n', i);
                end = end < 0 ? n : end;
                blank(text, i, end, code);
                i = end;
            } else if (c == '/' && i + 1 < n && text.charAt(i + 1) == '*') {
                int end = text.indexOf("*/", i + 2);
                end = end < 0 ? n : end + 2;
                blank(text, i, end, code);
                i = end;
            } else if (c == '"' && text.startsWith("\"\"\"", i)) {
                int end = text.indexOf("\"\"\"", i + 3);
                end = end < 0 ? n : end + 3;
                blank(text, i, end, code);
                i = end;
            } else if (c == '"' || c == '\'') {
                int j = i + 1;
                while (j < n && text.charAt(j) != c && text.charAt(j) != '\n') {
                    j += text.charAt(j) == '\\' ? 2 : 1;
                }
                int end = Math.min(j + 1, n);
                if (c == '"') {
                    literals.add(new Literal(text.substring(i + 1, Math.min(j, n)), i, end));
                }
                code.append(c);
                blank(text, i + 1, end - 1, code);
                code.append(c);
                i = end;
            } else {
                code.append(c);
                i++;
            }
        }
        return new JavaSource(text, code.toString(), List.copyOf(literals));
    }

    private static void blank(String text, int from, int to, StringBuilder into) {
        for (int k = from; k < to; k++) {
            into.append(text.charAt(k) == '\n' ? '\n' : ' ');
        }
    }

    String code() {
        return code;
    }

    List<Literal> literals() {
        return literals;
    }

    Optional<Literal> literalAt(int start) {
        return literals.stream().filter(l -> l.start() == start).findFirst();
    }

    int line(int offset) {
        int line = 1;
        for (int k = 0; k < offset; k++) {
            if (text.charAt(k) == '\n') {
                line++;
            }
        }
        return line;
    }

    /**
     * The name of the method or annotation whose argument list holds {@code offset}
     * ({@code getBoolean}, {@code ConfigProperty}), or "" when it is in none, such as a field's
     * initialiser.
     */
    String enclosingCall(int offset) {
        int depth = 0;
        for (int k = offset - 1; k >= 0; k--) {
            char c = code.charAt(k);
            if (c == ')') {
                depth++;
            } else if (c == '(') {
                if (depth == 0) {
                    int end = k;
                    while (end > 0 && Character.isWhitespace(code.charAt(end - 1))) {
                        end--;
                    }
                    int begin = end;
                    while (begin > 0 && Character.isJavaIdentifierPart(code.charAt(begin - 1))) {
                        begin--;
                    }
                    return code.substring(begin, end);
                }
                depth--;
            } else if (depth == 0 && (c == ';' || c == '{' || c == '}')) {
                return "";
            }
        }
        return "";
    }
}
