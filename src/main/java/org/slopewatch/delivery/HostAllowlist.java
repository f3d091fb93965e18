package org.slopewatch.delivery;

import java.net.URI;
import java.util.List;
import java.util.Locale;

/**
 * The hosts outbound webhooks may reach ({@code slopewatch.delivery.allowed-hosts}): exact names
 * or addresses, or {@code *.example.org} for any host under a domain. Alerts carry the desk's
 * positions in words; a misconfigured or tampered URL must not be able to send them anywhere
 * else, so an empty list allows nothing.
 */
public record HostAllowlist(List<String> patterns) {

    public static final HostAllowlist NONE = new HostAllowlist(List.of());

    public HostAllowlist {
        patterns = patterns.stream().map(p -> p.strip().toLowerCase(Locale.ROOT)).filter(p -> !p.isEmpty()).toList();
    }

    public boolean allows(URI url) {
        String host = url.getHost();
        if (host == null) {
            return false;
        }
        String h = host.toLowerCase(Locale.ROOT);
        for (String p : patterns) {
            if (p.startsWith("*.") ? h.endsWith(p.substring(1)) && h.length() > p.length() - 1 : h.equals(p)) {
                return true;
            }
        }
        return false;
    }

    /** For messages: the patterns, or a hint when there are none. The patterns are not secrets; webhook paths are. */
    public String describe() {
        return patterns.isEmpty() ? "none configured (slopewatch.delivery.allowed-hosts)" : String.join(", ", patterns);
    }
}
