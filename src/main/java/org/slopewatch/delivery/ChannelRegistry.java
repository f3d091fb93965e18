package org.slopewatch.delivery;

import io.quarkus.mailer.Mailer;
import io.quarkus.runtime.Startup;
import jakarta.inject.Inject;
import jakarta.inject.Singleton;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;
import org.eclipse.microprofile.config.Config;
import org.eclipse.microprofile.config.ConfigValue;
import org.eclipse.microprofile.config.inject.ConfigProperty;
import org.eclipse.microprofile.reactive.messaging.Channel;
import org.eclipse.microprofile.reactive.messaging.Emitter;
import org.jboss.logging.Logger;

/**
 * The channels of this daemon, made once at start-up from {@link ChannelsConfig}; a bad channel
 * configuration stops start-up with the {@link ChannelFactory}'s message. The rule engine checks
 * the channel names its rules use against {@link #names()}; the dispatcher looks channels up by
 * name.
 */
@Startup
@Singleton
public class ChannelRegistry {

    private static final Logger LOG = Logger.getLogger(ChannelRegistry.class);

    private final Map<String, AlertChannel> channels;
    private final StreamTransport streamTransport;

    @Inject
    ChannelRegistry(ChannelsConfig config, DeliveryConfig delivery, Config rawConfig, Mailer mailer,
                    @ConfigProperty(name = "quarkus.mailer.password") Optional<String> smtpPassword,
                    @Channel(StreamChannel.CHANNEL) Emitter<String> stream) {
        Map<String, ChannelSettings> settings = new LinkedHashMap<>();
        for (Map.Entry<String, ChannelsConfig.Channel> e : config.channels().entrySet()) {
            ChannelsConfig.Channel c = e.getValue();
            settings.put(e.getKey(), new ChannelSettings(c.type(), c.url(), c.format(), c.to().orElse(List.of()), c.timeout(),
                    origin(rawConfig, "slopewatch.channels." + e.getKey() + ".type")));
        }
        ChannelFactory factory = ChannelFactory.standard(() -> mailer, Redactor.of(smtpPassword.stream().toList()), stream,
                new HostAllowlist(delivery.allowedHosts().orElse(List.of())), delivery.cloudEventsSource());
        this.channels = factory.createAll(settings);
        this.streamTransport = new StreamTransport(rawConfig.getOptionalValue(StreamTransport.CONNECTOR_KEY, String.class).orElse(null));
        LOG.infof("delivery channels: %s", summary(channels.values()));
    }

    /** Where a key was set, e.g. the properties file or the environment. */
    private static String origin(Config config, String key) {
        ConfigValue value = config.getConfigValue(key);
        return value == null || value.getSourceName() == null ? "configuration" : value.getSourceName();
    }

    /** Names and types, never settings: {@code desk-chat (chat-webhook), log (log)}. */
    static String summary(Collection<AlertChannel> channels) {
        return channels.stream().map(c -> c.name() + " (" + c.type() + ")").collect(Collectors.joining(", "));
    }

    public Optional<AlertChannel> channel(String name) {
        return Optional.ofNullable(channels.get(name));
    }

    /** The configured names, sorted. */
    public Set<String> names() {
        return channels.keySet();
    }

    /** What the events of stream channels travel on. */
    public StreamTransport streamTransport() {
        return streamTransport;
    }

    public Collection<AlertChannel> all() {
        return channels.values();
    }
}
