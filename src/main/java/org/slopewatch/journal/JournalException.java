package org.slopewatch.journal;

import java.sql.SQLException;
import java.sql.SQLTransientConnectionException;

/** The journal could not be read or written; the message says what was attempted. */
public final class JournalException extends RuntimeException {

    public JournalException(String message, Throwable cause) {
        super(message + ": " + cause.getMessage(), cause);
    }

    /**
     * Whether the database could not be reached (SQL state class 08, connection exception, or no
     * connection within the pool's time-out) rather than refusing what was asked: the first is
     * worth waiting out, the second would fail the same way again.
     */
    public static boolean isConnectionFailure(Throwable failure) {
        for (Throwable t = failure; t != null; t = t.getCause() == t ? null : t.getCause()) {
            if (t instanceof SQLTransientConnectionException) {
                return true;
            }
            if (t instanceof SQLException sql && sql.getSQLState() != null && sql.getSQLState().startsWith("08")) {
                return true;
            }
        }
        return false;
    }
}
