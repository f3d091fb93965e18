package org.slopewatch.ops;

import io.quarkus.logging.LoggingFilter;
import java.util.IdentityHashMap;
import java.util.Map;
import java.util.logging.Filter;
import java.util.logging.LogRecord;
import java.util.logging.SimpleFormatter;
import org.eclipse.microprofile.config.ConfigProvider;
import org.jboss.logmanager.ExtLogRecord;
import org.slopewatch.delivery.Redactor;
import org.slopewatch.text.ControlCharacters;

/**
 * Every log record of every logger (slopewatch's and every library's: the mail client, the HTTP
 * client, the database driver) passes here before a handler writes it (console, file, syslog:
 * {@code quarkus.log.*.filter} in application.properties): each configured secret
 * ({@link SecretSettings}) is replaced by {@link Redactor#MASK}, and each control character
 * ({@link ControlCharacters}: line feed, carriage return, escape…) is written as an escape such as
 * {@code \n}, in the message and in the messages of anything thrown with it. A record is therefore
 * one line whatever text it repeats, and no library can print a password, a token or a webhook
 * URL, not even at DEBUG. Records are never dropped; a record with nothing to change is left as it is.
 *
 * <p>The stack trace of a thrown exception keeps its lines; only its messages are rewritten, into
 * a copy of the exception ({@link GuardedThrowable}) that keeps the original's class name, frames,
 * causes and suppressed exceptions.
 */
@LoggingFilter(name = LogGuard.NAME)
public final class LogGuard implements Filter {

    /** The name application.properties gives the handlers' filter. */
    public static final String NAME = "slopewatch-log-guard";

    private final Redactor secrets;

    /** As Quarkus makes it when it sets up logging: the secrets of the configuration in force. */
    public LogGuard() {
        this(SecretSettings.redactor(ConfigProvider.getConfig()));
    }

    LogGuard(Redactor secrets) {
        this.secrets = secrets;
    }

    @Override
    public boolean isLoggable(LogRecord record) {
        String message = formatted(record);
        String clean = clean(message);
        if (clean != null && !clean.equals(message)) {
            if (record instanceof ExtLogRecord ext) {
                ext.setMessage(clean, ExtLogRecord.FormatStyle.NO_FORMAT);
            } else {
                record.setMessage(clean);
                record.setResourceBundle(null);
            }
            record.setParameters(null);
        }
        Throwable thrown = record.getThrown();
        if (thrown != null && needsGuard(thrown, new IdentityHashMap<>())) {
            record.setThrown(GuardedThrowable.of(thrown, this::clean));
        }
        return true;
    }

    /** A text as a log line may carry it: secrets masked, control characters escaped; null stays null. */
    String clean(String text) {
        return text == null ? null : ControlCharacters.escape(secrets.redact(text));
    }

    private boolean needsGuard(Throwable t, Map<Throwable, Boolean> seen) {
        if (t == null || seen.put(t, Boolean.TRUE) != null) {
            return false;
        }
        String m = t.getMessage();
        if (m != null && !m.equals(clean(m))) {
            return true;
        }
        for (Throwable s : t.getSuppressed()) {
            if (needsGuard(s, seen)) {
                return true;
            }
        }
        return needsGuard(t.getCause(), seen);
    }

    private static String formatted(LogRecord record) {
        if (record instanceof ExtLogRecord ext) {
            return ext.getFormattedMessage();
        }
        return record.getMessage() == null ? null : new SimpleFormatter().formatMessage(record);
    }

    @Override
    public String toString() {
        return "LogGuard[" + secrets + "]";
    }
}
