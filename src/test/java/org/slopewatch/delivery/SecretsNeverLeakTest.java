package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.quarkus.test.junit.QuarkusTest;
import jakarta.inject.Inject;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Base64;
import java.util.List;
import java.util.Map;
import java.util.function.Supplier;
import org.eclipse.microprofile.reactive.messaging.Channel;
import org.eclipse.microprofile.reactive.messaging.Emitter;
import org.junit.jupiter.api.Test;
import org.slopewatch.rules.Alert;

/**
 * The contract every channel type must pass: given a configuration with a recognisable secret
 * (a token in the webhook URL's path and query, the SMTP password), no outcome reason, no
 * channel description and no log line of any logger, slopewatch's or a library's (slopewatch,
 * the mailer and the SMTP client down to the finest level), as the console writes it, contains
 * the secret, whether the attempt succeeds or fails. A new channel type must add its cases here
 * and list them in {@link #CONTRACT}; {@link #everyChannelTypeIsCovered} fails until it does.
 */
@QuarkusTest
class SecretsNeverLeakTest {

    private static final String PATH_TOKEN = "T0KEN-path-9f3KXq2Lr7";
    private static final String QUERY_TOKEN = "QK-3s8dPq1VzXy";
    /** Each channel type and the test that holds its cases. */
    private static final Map<String, String> CONTRACT = Map.of(
            ChatWebhookChannel.TYPE, "chatWebhookKeepsTheTokenInItsUrlToItself",
            EmailChannel.TYPE, "emailKeepsTheSmtpPasswordToItself",
            LogChannel.TYPE, "logAndStreamChannelsShowNoConfiguredSecret",
            StreamChannel.TYPE, "logAndStreamChannelsShowNoConfiguredSecret");

    @Inject
    TestMailers mailers;

    @Inject
    ChannelRegistry registry;

    @Inject
    @Channel(StreamChannel.CHANNEL)
    Emitter<String> stream;

    /** One attempt under log capture; the outcome must be of the expected kind and nothing may show the secrets. */
    private static List<LogCapture.Line> attemptKeepsSecrets(String scenario, AlertChannel channel, Supplier<DeliveryOutcome> attempt,
                                                             Class<? extends DeliveryOutcome> expected, String... secrets) {
        assertThat(CONTRACT).as("the contract lists the channel's type").containsKey(channel.type());
        DeliveryOutcome outcome;
        List<LogCapture.Line> lines;
        try (LogCapture logs = LogCapture.channels()) {
            outcome = attempt.get();
            lines = logs.lines();
        }
        assertThat(outcome).as("%s: outcome", scenario).isInstanceOf(expected);
        for (String secret : secrets) {
            assertThat(outcome.toString()).as("%s: the outcome must not show the secret", scenario).doesNotContain(secret);
            assertThat(channel.toString()).as("%s: the channel's description must not show the secret", scenario).doesNotContain(secret);
            for (LogCapture.Line line : lines) {
                assertThat(line.all()).as("%s: log line must not show the secret", scenario).doesNotContain(secret);
            }
        }
        return lines;
    }

    private static String withToken(TestHttpReceiver receiver) {
        return receiver.url("/hooks/" + PATH_TOKEN + "?key=" + QUERY_TOKEN);
    }

    private static ChatWebhookChannel webhook(String url, Duration timeout) {
        return new ChatWebhookChannel("desk-chat", url, ChatWebhookChannel.Format.TEXT, timeout);
    }

    @Test
    void chatWebhookKeepsTheTokenInItsUrlToItself() {
        try (TestHttpReceiver receiver = TestHttpReceiver.start()) {
            String url = withToken(receiver);
            ChatWebhookChannel channel = webhook(url, Duration.ofSeconds(5));
            ChatWebhookChannel impatient = webhook(url, Duration.ofMillis(300));
            Alert alert = TestAlerts.confirmed();

            receiver.answer(200, r -> "accepted " + r.path());
            attemptKeepsSecrets("200", channel, () -> channel.deliver(alert), DeliveryOutcome.Delivered.class, PATH_TOKEN, QUERY_TOKEN);

            // receivers like to say which hook they could not find
            receiver.answer(404, r -> "Cannot POST " + r.path() + "?" + r.query());
            attemptKeepsSecrets("404 echoing the path", channel, () -> channel.deliver(alert), DeliveryOutcome.FailedForGood.class,
                    PATH_TOKEN, QUERY_TOKEN, url);
            receiver.answer(403, r -> "forbidden: " + url);
            attemptKeepsSecrets("403 echoing the URL", channel, () -> channel.deliver(alert), DeliveryOutcome.FailedForGood.class,
                    PATH_TOKEN, QUERY_TOKEN, url);
            receiver.answer(500, r -> "error at " + url);
            attemptKeepsSecrets("500 echoing the URL", channel, () -> channel.deliver(alert), DeliveryOutcome.RetryLater.class,
                    PATH_TOKEN, QUERY_TOKEN, url);
            receiver.hang();
            attemptKeepsSecrets("time-out", impatient, () -> impatient.deliver(alert), DeliveryOutcome.RetryLater.class,
                    PATH_TOKEN, QUERY_TOKEN, url);

            ChatWebhookChannel refused = webhook("http://127.0.0.1:" + ClosedPort.find() + "/hooks/" + PATH_TOKEN + "?key=" + QUERY_TOKEN,
                    Duration.ofSeconds(5));
            attemptKeepsSecrets("refused", refused, () -> refused.deliver(alert), DeliveryOutcome.RetryLater.class, PATH_TOKEN, QUERY_TOKEN);

            receiver.answer(404, r -> "Cannot POST " + r.path() + "?" + r.query());
            DeliveryOutcome echoed = channel.deliver(alert);
            assertThat(echoed.toString()).as("the body is kept, the path and query masked").contains("Cannot POST " + Redactor.MASK + "?" + Redactor.MASK);
        }
    }

    @Test
    void chatWebhookConfigurationErrorsDoNotQuoteTheUrl() {
        ChannelFactory factory = ChannelFactory.standard(() -> null, Redactor.none(), stream,
                new HostAllowlist(List.of("chat.example.org")));
        String url = "https://chat.example.org/hooks/" + PATH_TOKEN + "?key=" + QUERY_TOKEN;
        ChannelSettings elsewhere = ChannelSettings.ofType("chat-webhook").withUrl("https://collector.example.net/hooks/" + PATH_TOKEN
                + "?key=" + QUERY_TOKEN);
        ChannelSettings badFormat = ChannelSettings.ofType("chat-webhook").withUrl(url).withFormat("markdown");
        ChannelSettings badUrl = ChannelSettings.ofType("chat-webhook").withUrl("htps:// chat.example.org/" + PATH_TOKEN);
        ChannelSettings noHost = ChannelSettings.ofType("chat-webhook").withUrl("mailto:" + PATH_TOKEN);

        for (ChannelSettings settings : List.of(badFormat, badUrl, noHost, elsewhere)) {
            assertThatThrownBy(() -> factory.create("desk-chat", settings)).isInstanceOf(ChannelConfigException.class)
                    .message().contains("desk-chat").doesNotContain(PATH_TOKEN).doesNotContain(QUERY_TOKEN);
            assertThat(settings.toString()).doesNotContain(PATH_TOKEN);
        }
        assertThat(factory.create("desk-chat", ChannelSettings.ofType("chat-webhook").withUrl(url)).toString())
                .doesNotContain(PATH_TOKEN).doesNotContain(QUERY_TOKEN);
    }

    @Test
    void emailKeepsTheSmtpPasswordToItself() {
        Alert alert = TestAlerts.confirmed();
        String plainAuth = Base64.getEncoder().encodeToString(("\0" + SmtpTestResource.USER + "\0" + SmtpTestResource.PASSWORD)
                .getBytes(StandardCharsets.UTF_8));
        String wrongPlainAuth = Base64.getEncoder().encodeToString(("\0" + SmtpTestResource.USER + "\0" + SmtpTestResource.WRONG_PASSWORD)
                .getBytes(StandardCharsets.UTF_8));

        AlertChannel configured = registry.channel("desk-mail").orElseThrow();
        attemptKeepsSecrets("delivered after logging in", configured, () -> configured.deliver(alert), DeliveryOutcome.Delivered.class,
                SmtpTestResource.PASSWORD, plainAuth);

        AlertChannel wrong = emailVia(mailers.wrongPasswordForSecrets(),
                SmtpTestResource.WRONG_PASSWORD);
        attemptKeepsSecrets("password refused", wrong, () -> wrong.deliver(alert), DeliveryOutcome.FailedForGood.class,
                SmtpTestResource.WRONG_PASSWORD, wrongPlainAuth);

        AlertChannel refused = emailVia(mailers.refused(), SmtpTestResource.PASSWORD);
        attemptKeepsSecrets("connection refused", refused, () -> refused.deliver(alert), DeliveryOutcome.RetryLater.class,
                SmtpTestResource.PASSWORD);

        // a server that repeats the password in its rejection: the reason keeps the reply, masked
        AlertChannel scripted = emailVia(mailers.scriptedEcho(), SmtpTestResource.PASSWORD);
        SmtpTestResource.scripted.answerRcptWith("550 5.7.1 relaying denied for " + SmtpTestResource.USER + ":" + SmtpTestResource.PASSWORD);
        try {
            DeliveryOutcome[] echoed = new DeliveryOutcome[1];
            attemptKeepsSecrets("rejection echoing the password", scripted, () -> echoed[0] = scripted.deliver(alert),
                    DeliveryOutcome.FailedForGood.class, SmtpTestResource.PASSWORD);
            assertThat(echoed[0].toString()).as("the reply is kept, the password masked")
                    .contains("relaying denied for slopewatch:" + Redactor.MASK);
        } finally {
            SmtpTestResource.scripted.answerRcptWith("250 2.1.5 OK");
        }
    }

    @Test
    void theMailClientsLoginRefusalNeverShowsThePassword() {
        // The SMTP client (Vert.x mail, io.vertx.ext.mail.impl.SMTPAuthentication) logs a refused login at
        // WARN, with the server's reply, before it tries its next method; a server that repeats the
        // credentials in that reply put the password in the log. Nothing of slopewatch is involved.
        Alert alert = TestAlerts.confirmed();
        String plainAuth = Base64.getEncoder().encodeToString(("\0" + SmtpTestResource.USER + "\0" + SmtpTestResource.PASSWORD)
                .getBytes(StandardCharsets.UTF_8));
        AlertChannel login = emailVia(mailers.scriptedLogin(), SmtpTestResource.PASSWORD);

        // an operator has turned that logger up: the record is written, the password masked by the log guard
        List<LogCapture.Line> lines = attemptKeepsSecrets("login refused, reply echoing the password", login, () -> login.deliver(alert),
                DeliveryOutcome.FailedForGood.class, SmtpTestResource.PASSWORD, plainAuth);
        assertThat(lines).as("the client's warning is written, masked")
                .anySatisfy(l -> assertThat(l.message()).contains("authentication failed for slopewatch with password " + Redactor.MASK));

        // at the configured levels the authentication logger says nothing at all (a mailer of its own: after a
        // refused login the mail client sometimes leaves the next message waiting until its time-out)
        AlertChannel quiet = emailVia(mailers.scriptedLoginQuiet(), SmtpTestResource.PASSWORD);
        List<LogCapture.Line> asConfigured;
        try (LogCapture logs = LogCapture.everything()) {
            assertThat(quiet.deliver(alert)).isInstanceOf(DeliveryOutcome.FailedForGood.class);
            asConfigured = logs.lines();
        }
        assertThat(asConfigured).noneMatch(l -> l.category().startsWith("io.vertx.ext.mail.impl.SMTPAuthentication"));
        assertThat(asConfigured).allSatisfy(l -> assertThat(l.all()).doesNotContain(SmtpTestResource.PASSWORD));
    }

    /** An email channel made the way the registry makes one, with the given mailer and its password. */
    private AlertChannel emailVia(io.quarkus.mailer.Mailer mailer, String password) {
        return ChannelFactory.standard(() -> mailer, Redactor.of(List.of(password)), stream, new HostAllowlist(List.of("127.0.0.1")))
                .create("desk-mail", ChannelSettings.ofType("email").withTo(List.of(SmtpTestResource.DESK)));
    }

    @Test
    void logAndStreamChannelsShowNoConfiguredSecret() {
        Alert alert = TestAlerts.confirmed();
        for (String name : List.of("log", "alerts-topic")) {
            AlertChannel channel = registry.channel(name).orElseThrow();
            attemptKeepsSecrets(name, channel, () -> channel.deliver(alert), DeliveryOutcome.Delivered.class,
                    SmtpTestResource.PASSWORD, PATH_TOKEN, QUERY_TOKEN);
        }
    }

    @Test
    void everyChannelTypeIsCovered() throws Exception {
        assertThat(CONTRACT.keySet()).as("every type the factory knows has its cases in this contract")
                .containsAll(ChannelFactory.standard(() -> null, Redactor.none(), null, HostAllowlist.NONE).knownTypes());
        for (String method : CONTRACT.values()) {
            assertThat(SecretsNeverLeakTest.class.getDeclaredMethod(method).isAnnotationPresent(Test.class))
                    .as("%s is a test", method).isTrue();
        }
    }
}
