package org.slopewatch.rules;

/**
 * A channel named in the policy with its type; where it points (URL, addresses, secrets) is
 * deployment configuration under {@code slopewatch.channels.<name>.*}, never in the policy.
 */
public record ChannelDeclaration(String name, String type) {

    /** The channel types slopewatch knows. */
    public static final java.util.List<String> TYPES = java.util.List.of("chat-webhook", "email", "stream", "log");

    /** Always there, so that alerts go somewhere without any configuration. */
    public static final ChannelDeclaration LOG = new ChannelDeclaration("log", "log");
}
