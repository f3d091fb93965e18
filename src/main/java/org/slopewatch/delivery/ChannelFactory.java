package org.slopewatch.delivery;

import io.quarkus.mailer.Mailer;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.function.Supplier;
import org.eclipse.microprofile.reactive.messaging.Emitter;

/**
 * Makes channels from their settings, choosing the class by the type name. An unknown type, or
 * settings a type cannot use, is a {@link ChannelConfigException} naming the channel, where it
 * was configured and what would be valid; all problems are reported together, so one start-up
 * shows them all. Adding a type means one class and one entry in {@link #standard}.
 */
public final class ChannelFactory {

    /** Makes one channel of a type from its settings; throws {@link IllegalArgumentException} on unusable settings. */
    @FunctionalInterface
    public interface Maker {
        AlertChannel make(String name, ChannelSettings settings);
    }

    private final Map<String, Maker> makers;

    public ChannelFactory(Map<String, Maker> makers) {
        this.makers = Collections.unmodifiableMap(new TreeMap<>(makers));
    }

    /**
     * The four types slopewatch ships. The mailer is asked for only when an email channel is made.
     *
     * @param smtpSecrets knows the SMTP password, so that no email reason repeats it
     * @param webhookHosts the hosts chat webhooks may point at
     */
    public static ChannelFactory standard(Supplier<Mailer> mailer, Redactor smtpSecrets, Emitter<String> stream,
                                          HostAllowlist webhookHosts) {
        return standard(mailer, smtpSecrets, stream, webhookHosts, StreamChannel.DEFAULT_SOURCE);
    }

    /** As {@link #standard(Supplier, Redactor, Emitter, HostAllowlist)}, with the CloudEvents source of stream channels. */
    public static ChannelFactory standard(Supplier<Mailer> mailer, Redactor smtpSecrets, Emitter<String> stream,
                                          HostAllowlist webhookHosts, String eventSource) {
        Map<String, Maker> makers = new LinkedHashMap<>();
        makers.put(ChatWebhookChannel.TYPE, (name, s) -> chatWebhook(name, s, webhookHosts));
        makers.put(EmailChannel.TYPE, (name, s) -> new EmailChannel(name, mailer.get(), s.to(), smtpSecrets));
        makers.put(LogChannel.TYPE, (name, s) -> new LogChannel(name));
        makers.put(StreamChannel.TYPE, (name, s) -> new StreamChannel(name, stream, s.timeout(), eventSource));
        return new ChannelFactory(makers);
    }

    private static AlertChannel chatWebhook(String name, ChannelSettings s, HostAllowlist webhookHosts) {
        String url = s.url().filter(u -> !u.isBlank()).orElseThrow(() -> new IllegalArgumentException("channel '" + name
                + "': type chat-webhook needs a url (slopewatch.channels." + name + ".url, e.g. ${SLOPEWATCH_CHAT_URL})"));
        String formatName = s.format().orElse(ChatWebhookChannel.Format.TEXT.configName());
        ChatWebhookChannel.Format format = ChatWebhookChannel.Format.byName(formatName);
        if (format == null) {
            List<String> known = new ArrayList<>();
            for (ChatWebhookChannel.Format f : ChatWebhookChannel.Format.values()) {
                known.add(f.configName());
            }
            throw new IllegalArgumentException("channel '" + name + "': unknown format '" + formatName + "'; known formats: "
                    + String.join(", ", known));
        }
        ChatWebhookChannel channel = new ChatWebhookChannel(name, url, format, s.timeout());
        if (!channel.pointsWithin(webhookHosts)) {
            // the host is named (it is not the secret part); the path and query are not
            throw new IllegalArgumentException("channel '" + name + "': the url's host " + channel.host()
                    + " is not among the allowed webhook hosts: " + webhookHosts.describe());
        }
        return channel;
    }

    /** The type names this factory knows, sorted. */
    public Set<String> knownTypes() {
        return makers.keySet();
    }

    /** One channel; a problem is a {@link ChannelConfigException}. */
    public AlertChannel create(String name, ChannelSettings settings) {
        String type = settings.type().strip().toLowerCase(Locale.ROOT);
        Maker maker = makers.get(type);
        if (maker == null) {
            throw new ChannelConfigException("channel '" + name + "' has unknown type '" + settings.type() + "' (slopewatch.channels."
                    + name + ".type in " + settings.origin() + "); known types: " + String.join(", ", makers.keySet()));
        }
        try {
            return maker.make(name, settings);
        } catch (IllegalArgumentException e) {
            throw new ChannelConfigException(e.getMessage() + " (configured in " + settings.origin() + ")");
        }
    }

    /** Every configured channel, in name order; every problem is reported at once. */
    public Map<String, AlertChannel> createAll(Map<String, ChannelSettings> settings) {
        Map<String, AlertChannel> channels = new LinkedHashMap<>();
        List<String> problems = new ArrayList<>();
        for (Map.Entry<String, ChannelSettings> e : new TreeMap<>(settings).entrySet()) {
            try {
                channels.put(e.getKey(), create(e.getKey(), e.getValue()));
            } catch (ChannelConfigException problem) {
                problems.add(problem.getMessage());
            }
        }
        if (!problems.isEmpty()) {
            throw new ChannelConfigException(problems.size() == 1 ? problems.get(0)
                    : "the channel configuration has " + problems.size() + " problems:\n  " + String.join("\n  ", problems));
        }
        return Collections.unmodifiableMap(channels);
    }
}
