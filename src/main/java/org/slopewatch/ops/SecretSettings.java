package org.slopewatch.ops;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Pattern;
import org.eclipse.microprofile.config.Config;
import org.slopewatch.delivery.Redactor;

/**
 * The configuration settings whose values are secrets, whatever configured them (properties
 * file, environment, system property): passwords ({@code quarkus.mailer.password} and any other
 * {@code *.password}), tokens ({@code slopewatch.security.read-tokens}, {@code write-tokens}, any
 * {@code *.token}, {@code *.secret}, Kafka's {@code *.jaas.config}) and chat webhook URLs
 * ({@code slopewatch.channels.NAME.url}, which carry their token), and the URLs of pulled sources
 * ({@code slopewatch.sources.NAME.url}, which may). Keys are compared in one
 * spelling, lowercase with {@code _} and {@code -} read as {@code .}, so that
 * {@code QUARKUS_MAILER_PASSWORD} counts as well.
 *
 * <p>A value shorter than {@link #MIN_CHARS} is left out: it protects nothing, and masking every
 * occurrence of two letters would garble every log line.
 */
public final class SecretSettings {

    static final int MIN_CHARS = 6;

    private static final Pattern SECRET_KEY = Pattern.compile(".*\\.(password|secret|token|tokens|jaas\\.config)");
    private static final Pattern WEBHOOK_URL = Pattern.compile("slopewatch\\.(channels|sources)\\..+\\.url");

    private SecretSettings() {
    }

    /** Whether a setting's value is a secret. */
    static boolean isSecret(String key) {
        String k = spelling(key);
        return SECRET_KEY.matcher(k).matches() || WEBHOOK_URL.matcher(k).matches();
    }

    private static String spelling(String key) {
        return key.toLowerCase(Locale.ROOT).replace("\"", "").replace('_', '.').replace('-', '.');
    }

    /** A redactor of every secret value in the configuration. */
    public static Redactor redactor(Config config) {
        List<String> plain = new ArrayList<>();
        Redactor urls = Redactor.none();
        for (String key : config.getPropertyNames()) {
            if (!isSecret(key)) {
                continue;
            }
            Optional<String> value;
            try {
                value = config.getOptionalValue(key, String.class);
            } catch (RuntimeException unresolvable) {
                // e.g. ${SLOPEWATCH_CHAT_URL} with the variable unset: nothing to hide
                continue;
            }
            if (value.isEmpty() || value.get().strip().length() < MIN_CHARS) {
                continue;
            }
            String v = value.get().strip();
            if (WEBHOOK_URL.matcher(spelling(key)).matches()) {
                urls = urls.and(Redactor.forUrl(v));
            } else {
                plain.add(v);
                // token lists are comma-separated
                for (String part : v.split(",")) {
                    if (part.strip().length() >= MIN_CHARS) {
                        plain.add(part.strip());
                    }
                }
            }
        }
        return Redactor.of(plain).and(urls);
    }
}
