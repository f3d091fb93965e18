package org.slopewatch.journal;

/** The journal could not be read or written; the message says what was attempted. */
public final class JournalException extends RuntimeException {

    public JournalException(String message, Throwable cause) {
        super(message + ": " + cause.getMessage(), cause);
    }
}
