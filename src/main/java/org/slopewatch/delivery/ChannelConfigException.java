package org.slopewatch.delivery;

/** The channel configuration cannot be used; start-up stops with this message, which never holds a secret. */
public final class ChannelConfigException extends RuntimeException {

    public ChannelConfigException(String message) {
        super(message);
    }
}
