package org.slopewatch.delivery;

import java.net.URI;
import java.net.URLDecoder;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * Removes secrets (webhook URLs and the tokens inside them, passwords) from any text a channel
 * puts in an outcome reason or a log line. Channels pass every foreign string through it: a
 * response body, an exception message, an SMTP reply.
 *
 * <p>For a URL it removes the whole URL and also its parts that may be tokens (path segments of
 * six characters or more, query values, user info), because receivers echo parts of the path in
 * their error bodies. Over-redacting a word like {@code webhooks} is harmless; leaking a token is
 * not.
 */
public final class Redactor {

    /** What a secret is replaced with. */
    public static final String MASK = "[redacted]";

    private static final int MIN_SEGMENT = 6;
    private static final Redactor NONE = new Redactor(List.of());

    private final List<String> secrets;

    private Redactor(Collection<String> secrets) {
        Set<String> unique = new LinkedHashSet<>();
        for (String s : secrets) {
            if (s != null && !s.isBlank()) {
                unique.add(s);
                unique.add(decoded(s));
            }
        }
        List<String> sorted = new ArrayList<>(unique);
        // longest first, so that a URL goes before the token inside it
        sorted.sort(Comparator.comparingInt(String::length).reversed());
        this.secrets = List.copyOf(sorted);
    }

    private static String decoded(String s) {
        try {
            return URLDecoder.decode(s.replace("+", "%2B"), StandardCharsets.UTF_8);
        } catch (IllegalArgumentException e) {
            return s;
        }
    }

    /** Nothing to hide. */
    public static Redactor none() {
        return NONE;
    }

    /** The given strings (passwords, tokens); blank or absent ones are ignored. */
    public static Redactor of(Collection<String> secrets) {
        return new Redactor(secrets);
    }

    /** A URL that carries a token somewhere in its path, query or user info. */
    public static Redactor forUrl(String url) {
        List<String> parts = new ArrayList<>();
        parts.add(url);
        try {
            URI uri = new URI(url);
            parts.add(uri.getRawUserInfo());
            parts.add(uri.getRawQuery());
            String path = uri.getRawPath();
            if (path != null && path.length() > 1) {
                parts.add(path);
                for (String segment : path.split("/")) {
                    if (segment.length() >= MIN_SEGMENT) {
                        parts.add(segment);
                    }
                }
            }
            if (uri.getRawQuery() != null) {
                for (String pair : uri.getRawQuery().split("&")) {
                    int eq = pair.indexOf('=');
                    String value = eq < 0 ? pair : pair.substring(eq + 1);
                    if (value.length() >= 4) {
                        parts.add(value);
                    }
                }
            }
        } catch (java.net.URISyntaxException e) {
            // the whole string is already listed; a URL that does not parse is refused at start-up anyway
        }
        return new Redactor(parts);
    }

    /** This redactor and another one together. */
    public Redactor and(Redactor other) {
        List<String> all = new ArrayList<>(secrets);
        all.addAll(other.secrets);
        return new Redactor(all);
    }

    /** The text with every secret replaced by {@link #MASK}; null stays null. */
    public String redact(String text) {
        if (text == null) {
            return null;
        }
        String out = text;
        for (String s : secrets) {
            out = out.replace(s, MASK);
        }
        return out;
    }

    /**
     * Redacted first and cut afterwards, so that a cut never leaves the start of a secret that
     * redaction would no longer recognise; line breaks become spaces to keep a reason on one line.
     */
    /** A failure as {@code ClassName: message}, the message redacted and cut: what channels put in a reason. */
    public String describe(Throwable t, int maxChars) {
        String message = t.getMessage() == null ? "" : ": " + redactAndTruncate(t.getMessage(), maxChars);
        return t.getClass().getSimpleName() + message;
    }

    public String redactAndTruncate(String text, int maxChars) {
        String clean = redact(text);
        if (clean == null) {
            return "";
        }
        clean = clean.replaceAll("\\s+", " ").strip();
        return clean.length() <= maxChars ? clean : clean.substring(0, maxChars) + "…";
    }

    /** How many secrets it knows, never which. */
    @Override
    public String toString() {
        return "Redactor[" + secrets.size() + " secrets]";
    }
}
