package org.slopewatch.delivery;

import java.time.Duration;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One channel's configuration as plain values, so that {@link ChannelFactory} can be driven
 * without a running application.
 *
 * @param origin where the type was set (a file or the environment), for start-up messages
 */
public record ChannelSettings(String type, Optional<String> url, Optional<String> format, List<String> to, Duration timeout,
                              String origin) {

    public static final Duration DEFAULT_TIMEOUT = Duration.ofSeconds(10);

    public ChannelSettings {
        Objects.requireNonNull(type, "type");
        url = url == null ? Optional.empty() : url;
        format = format == null ? Optional.empty() : format;
        to = to == null ? List.of() : List.copyOf(to);
        timeout = timeout == null ? DEFAULT_TIMEOUT : timeout;
        origin = origin == null ? "configuration" : origin;
    }

    /** Settings of the given type and nothing else. */
    public static ChannelSettings ofType(String type) {
        return new ChannelSettings(type, Optional.empty(), Optional.empty(), List.of(), DEFAULT_TIMEOUT, null);
    }

    public ChannelSettings withUrl(String newUrl) {
        return new ChannelSettings(type, Optional.ofNullable(newUrl), format, to, timeout, origin);
    }

    public ChannelSettings withFormat(String newFormat) {
        return new ChannelSettings(type, url, Optional.ofNullable(newFormat), to, timeout, origin);
    }

    public ChannelSettings withTo(List<String> recipients) {
        return new ChannelSettings(type, url, format, recipients, timeout, origin);
    }

    public ChannelSettings withTimeout(Duration newTimeout) {
        return new ChannelSettings(type, url, format, to, newTimeout, origin);
    }

    public ChannelSettings withOrigin(String newOrigin) {
        return new ChannelSettings(type, url, format, to, timeout, newOrigin);
    }

    /** The URL is a secret, so it is shown only as present or absent. */
    @Override
    public String toString() {
        return "ChannelSettings[type=" + type + ", url=" + (url.isPresent() ? Redactor.MASK : "none") + ", format="
                + format.orElse("default") + ", to=" + to + ", timeout=" + timeout + ", origin=" + origin + "]";
    }
}
