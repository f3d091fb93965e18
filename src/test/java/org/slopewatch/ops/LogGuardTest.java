package org.slopewatch.ops;

import static org.assertj.core.api.Assertions.assertThat;

import io.smallrye.config.PropertiesConfigSource;
import io.smallrye.config.SmallRyeConfig;
import io.smallrye.config.SmallRyeConfigBuilder;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.Map;
import java.util.logging.Level;
import java.util.logging.LogRecord;
import org.jboss.logmanager.ExtLogRecord;
import org.junit.jupiter.api.Test;
import org.slopewatch.delivery.Redactor;

/**
 * The log guard on records as the JBoss log manager and plain {@code java.util.logging} make them:
 * secrets of the configuration masked, control characters escaped, in the message (however it is
 * formatted) and in the messages of what was thrown, the rest left as it was.
 */
class LogGuardTest {

    private static final String PASSWORD = "smtp-pw-Qz7Kx2Lm9Vw";
    private static final String TOKEN = "T0KEN-path-9f3KXq2Lr7";
    private static final String WRITE_TOKEN = "write-token-0123456789abcdef";

    private static SmallRyeConfig config(Map<String, String> properties) {
        return new SmallRyeConfigBuilder().withSources(new PropertiesConfigSource(properties, "test", 100)).build();
    }

    private static final LogGuard GUARD = new LogGuard(SecretSettings.redactor(config(Map.of(
            "quarkus.mailer.password", PASSWORD,
            "QUARKUS_MAILER_SCRIPTED_LOGIN_PASSWORD", PASSWORD + "-2",
            "slopewatch.channels.desk-chat.url", "https://chat.example.org/hooks/" + TOKEN + "?key=QK-3s8dPq1VzXy",
            "slopewatch.security.write-tokens", "read-token-fedcba9876543210," + WRITE_TOKEN,
            "slopewatch.journal.password", "sw",
            "quarkus.mailer.host", "smtp.example.org"))));

    @Test
    void theSecretSettingsAreFoundInEverySpelling() {
        assertThat(SecretSettings.isSecret("quarkus.mailer.password")).isTrue();
        assertThat(SecretSettings.isSecret("quarkus.mailer.\"desk-mail\".password")).isTrue();
        assertThat(SecretSettings.isSecret("QUARKUS_MAILER_PASSWORD")).isTrue();
        assertThat(SecretSettings.isSecret("slopewatch.channels.desk-chat.url")).isTrue();
        assertThat(SecretSettings.isSecret("SLOPEWATCH_CHANNELS_DESK_CHAT_URL")).isTrue();
        assertThat(SecretSettings.isSecret("slopewatch.security.read-tokens")).isTrue();
        assertThat(SecretSettings.isSecret("kafka.sasl.jaas.config")).isTrue();
        assertThat(SecretSettings.isSecret("quarkus.mailer.host")).isFalse();
        assertThat(SecretSettings.isSecret("quarkus.mailer.wrong-password.host")).isFalse();
        assertThat(SecretSettings.isSecret("slopewatch.alerts.dashboard-url")).isFalse();
    }

    @Test
    void aLibrarysMessageLosesTheSecretsWhateverItsFormat() {
        ExtLogRecord printf = new ExtLogRecord(Level.WARNING, "AUTH PLAIN failed 535 %s:%s", ExtLogRecord.FormatStyle.PRINTF,
                "io.vertx.ext.mail.impl.SMTPAuthentication");
        printf.setParameters(new Object[] {"slopewatch", PASSWORD});
        assertThat(GUARD.isLoggable(printf)).as("never dropped").isTrue();
        assertThat(printf.getFormattedMessage()).isEqualTo("AUTH PLAIN failed 535 slopewatch:" + Redactor.MASK);

        LogRecord jul = new LogRecord(Level.FINE, "POST {0} -> 404");
        jul.setParameters(new Object[] {"https://chat.example.org/hooks/" + TOKEN + "?key=QK-3s8dPq1VzXy"});
        GUARD.isLoggable(jul);
        assertThat(new java.util.logging.SimpleFormatter().formatMessage(jul)).doesNotContain(TOKEN).doesNotContain("QK-3s8dPq1VzXy")
                .endsWith(" -> 404");

        ExtLogRecord tokens = new ExtLogRecord(Level.INFO, "tokens " + WRITE_TOKEN, ExtLogRecord.FormatStyle.NO_FORMAT, "x");
        GUARD.isLoggable(tokens);
        assertThat(tokens.getFormattedMessage()).isEqualTo("tokens " + Redactor.MASK);
    }

    @Test
    void aShortSecretIsNotLookedFor() {
        // "sw" would turn "answer" into "an[redacted]er"
        ExtLogRecord r = new ExtLogRecord(Level.INFO, "the answer", ExtLogRecord.FormatStyle.NO_FORMAT, "x");
        GUARD.isLoggable(r);
        assertThat(r.getFormattedMessage()).isEqualTo("the answer");
    }

    @Test
    void inputNeverStartsALineOfItsOwn() {
        ExtLogRecord r = new ExtLogRecord(Level.INFO, "quiet period on spread %s set by %s: %s", ExtLogRecord.FormatStyle.PRINTF, "org.slopewatch.alerting.AlertDesk");
        r.setParameters(new Object[] {"10Y-3M", "ops", "maintenance\n2026-05-07 12:00:00,000 INFO  [org.slo.ale.AlertDesk] forged\r\u001b[2J"});
        GUARD.isLoggable(r);
        assertThat(r.getFormattedMessage())
                .isEqualTo("quiet period on spread 10Y-3M set by ops: maintenance\\n2026-05-07 12:00:00,000 INFO  [org.slo.ale.AlertDesk] forged\\r\\u001B[2J");
    }

    @Test
    void aRecordWithNothingToChangeIsLeftAsItWas() {
        ExtLogRecord r = new ExtLogRecord(Level.INFO, "policy %s in force", ExtLogRecord.FormatStyle.PRINTF, "x");
        Object[] parameters = {"alert-rules/default.yaml"};
        r.setParameters(parameters);
        IllegalStateException thrown = new IllegalStateException("plain");
        r.setThrown(thrown);
        GUARD.isLoggable(r);
        assertThat(r.getParameters()).isSameAs(parameters);
        assertThat(r.getThrown()).isSameAs(thrown);
    }

    @Test
    void thrownMessagesAreGuardedAndTheTraceKeepsItsShape() {
        Exception cause = new java.io.IOException("535 refused for slopewatch:" + PASSWORD);
        RuntimeException top = new RuntimeException("send failed\nsecond line", cause);
        top.addSuppressed(new IllegalArgumentException("suppressed " + PASSWORD));
        ExtLogRecord r = new ExtLogRecord(Level.SEVERE, "delivery failed", ExtLogRecord.FormatStyle.NO_FORMAT, "x");
        r.setThrown(top);
        GUARD.isLoggable(r);

        StringWriter trace = new StringWriter();
        r.getThrown().printStackTrace(new PrintWriter(trace));
        String printed = trace.toString();
        assertThat(printed).doesNotContain(PASSWORD)
                .startsWith("java.lang.RuntimeException: send failed\\nsecond line" + System.lineSeparator())
                .contains("Caused by: java.io.IOException: 535 refused for slopewatch:" + Redactor.MASK)
                .contains("Suppressed: java.lang.IllegalArgumentException: suppressed " + Redactor.MASK)
                .contains("at org.slopewatch.ops.LogGuardTest.thrownMessagesAreGuardedAndTheTraceKeepsItsShape");
        assertThat(r.getThrown().getStackTrace()).isEqualTo(top.getStackTrace());
    }

    @Test
    void aCycleOfCausesEnds() {
        RuntimeException a = new RuntimeException("a " + PASSWORD);
        RuntimeException b = new RuntimeException("b", a);
        a.initCause(b);
        ExtLogRecord r = new ExtLogRecord(Level.INFO, "loop", ExtLogRecord.FormatStyle.NO_FORMAT, "x");
        r.setThrown(a);
        GUARD.isLoggable(r);
        assertThat(r.getThrown().getMessage()).isEqualTo("a " + Redactor.MASK);
        assertThat(r.getThrown().getCause().getCause()).isSameAs(r.getThrown());
    }

    @Test
    void theGuardNamesNoSecret() {
        assertThat(GUARD.toString()).doesNotContain(PASSWORD).doesNotContain(TOKEN).startsWith("LogGuard[Redactor[");
    }
}
