package org.slopewatch.delivery;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Channels are chosen by type name; a bad configuration is refused with a message a person can act on. */
class ChannelFactoryTest {

    private static final String FILE = "PropertiesConfigSource[source=file:config/application.properties]";

    private final ChannelFactory factory = ChannelFactory.standard(() -> {
        throw new AssertionError("no mailer is needed unless an email channel is made");
    }, Redactor.none(), null, new HostAllowlist(List.of("chat.example.org")));

    @Test
    void theFourTypesAreKnown() {
        assertThat(factory.knownTypes()).containsExactly("chat-webhook", "email", "log", "stream");
    }

    @Test
    void aTypeNameChoosesTheClass() {
        Map<String, ChannelSettings> settings = new LinkedHashMap<>();
        settings.put("log", ChannelSettings.ofType("log"));
        settings.put("desk-chat", ChannelSettings.ofType(" Chat-Webhook ").withUrl("https://chat.example.org/hooks/abc")
                .withFormat("alert-json").withTimeout(Duration.ofSeconds(3)));

        Map<String, AlertChannel> channels = factory.createAll(settings);

        assertThat(channels.keySet()).as("in name order").containsExactly("desk-chat", "log");
        assertThat(channels.get("log")).isInstanceOf(LogChannel.class);
        assertThat(channels.get("desk-chat")).isInstanceOf(ChatWebhookChannel.class);
        assertThat(((ChatWebhookChannel) channels.get("desk-chat")).format()).isEqualTo(ChatWebhookChannel.Format.ALERT_JSON);
        assertThat(channels.get("desk-chat").name()).isEqualTo("desk-chat");
    }

    @Test
    void anUnknownTypeNamesTheChannelTheTypeWhereItWasSetAndTheKnownTypes() {
        assertThatThrownBy(() -> factory.create("desk-chat", ChannelSettings.ofType("slack").withOrigin(FILE)))
                .isInstanceOf(ChannelConfigException.class)
                .hasMessage("channel 'desk-chat' has unknown type 'slack' (slopewatch.channels.desk-chat.type in " + FILE
                        + "); known types: chat-webhook, email, log, stream");
    }

    /** CloudEvents 1.0 (the specification's "source" attribute): a non-empty URI reference (RFC 3986). */
    @Test
    void aStreamChannelsEventSourceMustBeAUriReference() {
        for (String bad : new String[] {"", " ", "desk one", "urn:desk:%zz"}) {
            ChannelFactory withSource = ChannelFactory.standard(() -> null, Redactor.none(), null, HostAllowlist.NONE, bad);
            assertThatThrownBy(() -> withSource.create("alerts-topic", ChannelSettings.ofType("stream").withOrigin(FILE)))
                    .as("source '%s'", bad)
                    .isInstanceOf(ChannelConfigException.class)
                    .hasMessageContaining("CloudEvents source")
                    .hasMessageContaining("(configured in " + FILE + ")");
        }
    }

    @Test
    void settingsATypeCannotUseAreRefused() {
        assertThatThrownBy(() -> factory.create("desk-chat", ChannelSettings.ofType("chat-webhook").withOrigin(FILE)))
                .hasMessage("channel 'desk-chat': type chat-webhook needs a url (slopewatch.channels.desk-chat.url, e.g. "
                        + "${SLOPEWATCH_CHAT_URL}) (configured in " + FILE + ")");
        assertThatThrownBy(() -> factory.create("desk-chat", ChannelSettings.ofType("chat-webhook").withUrl("https://chat.example.org/h")
                .withFormat("markdown"))).hasMessageStartingWith("channel 'desk-chat': unknown format 'markdown'; known formats: text, alert-json");
        ChannelFactory withMailer = ChannelFactory.standard(() -> mails -> { }, Redactor.none(), null, HostAllowlist.NONE);
        assertThatThrownBy(() -> withMailer.create("desk-mail", ChannelSettings.ofType("email")))
                .hasMessageStartingWith("channel 'desk-mail': no recipients (set slopewatch.channels.desk-mail.to)");
        assertThatThrownBy(() -> withMailer.create("desk-mail", ChannelSettings.ofType("email").withTo(List.of("desk"))))
                .hasMessageStartingWith("channel 'desk-mail': 'desk' is not an email address");
    }

    /*
     * Safe outbound calls: a webhook may only point at an allowed host, named exactly or under an
     * allowed domain; the refusal names the host but never the path, which carries the token.
     */
    @Test
    void aWebhookOutsideTheAllowedHostsStopsStartUpWithoutShowingItsPath() {
        ChannelFactory strict = ChannelFactory.standard(() -> null, Redactor.none(), null,
                new HostAllowlist(List.of("chat.example.org", "*.desk.example.org")));
        assertThat(strict.create("desk-chat", ChannelSettings.ofType("chat-webhook").withUrl("https://chat.example.org/hooks/T0K3N")))
                .isInstanceOf(ChatWebhookChannel.class);
        assertThat(strict.create("desk-chat", ChannelSettings.ofType("chat-webhook").withUrl("https://hooks.desk.example.org/x")))
                .as("under an allowed domain").isInstanceOf(ChatWebhookChannel.class);
        for (String elsewhere : List.of("https://collector.example.net/hooks/T0K3N", "https://desk.example.org/hooks/T0K3N",
                "https://chat.example.org.evil.example.net/hooks/T0K3N")) {
            assertThatThrownBy(() -> strict.create("desk-chat", ChannelSettings.ofType("chat-webhook").withUrl(elsewhere).withOrigin(FILE)))
                    .isInstanceOf(ChannelConfigException.class)
                    .hasMessageContaining("is not among the allowed webhook hosts: chat.example.org, *.desk.example.org")
                    .hasMessageNotContaining("T0K3N");
        }
        assertThatThrownBy(() -> ChannelFactory.standard(() -> null, Redactor.none(), null, HostAllowlist.NONE)
                .create("desk-chat", ChannelSettings.ofType("chat-webhook").withUrl("https://chat.example.org/hooks/T0K3N")))
                .as("an empty list allows nothing").hasMessageContaining("none configured (slopewatch.delivery.allowed-hosts)");
    }

    @Test
    void everyProblemIsReportedAtOnce() {
        Map<String, ChannelSettings> settings = new LinkedHashMap<>();
        settings.put("log", ChannelSettings.ofType("log"));
        settings.put("b-chat", ChannelSettings.ofType("chat-webhook"));
        settings.put("a-pager", ChannelSettings.ofType("pager"));

        assertThatThrownBy(() -> factory.createAll(settings)).isInstanceOf(ChannelConfigException.class)
                .hasMessageStartingWith("the channel configuration has 2 problems:\n  channel 'a-pager' has unknown type 'pager'")
                .hasMessageContaining("\n  channel 'b-chat': type chat-webhook needs a url");
    }
}
