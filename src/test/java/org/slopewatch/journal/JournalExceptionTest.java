package org.slopewatch.journal;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.SQLException;
import java.sql.SQLTransientConnectionException;
import org.junit.jupiter.api.Test;

/** SQL states from the SQL standard's class 08 (connection exception), as PostgreSQL reports them (its "Appendix A. PostgreSQL Error Codes"). */
class JournalExceptionTest {

    @Test
    void aLostOrRefusedConnectionIsWorthWaitingOut() {
        assertThat(JournalException.isConnectionFailure(new JournalException("cannot write",
                new SQLException("This connection has been closed.", "08003")))).isTrue();
        assertThat(JournalException.isConnectionFailure(new JournalException("cannot write",
                new RuntimeException("wrapped", new SQLException("Connection refused", "08001"))))).isTrue();
        assertThat(JournalException.isConnectionFailure(new SQLTransientConnectionException("no connection within 10 s"))).isTrue();
    }

    @Test
    void aRefusedStatementIsNot() {
        // 22001 string data right truncation, 23505 unique violation: the same write would fail again
        assertThat(JournalException.isConnectionFailure(new JournalException("cannot write", new SQLException("too long", "22001")))).isFalse();
        assertThat(JournalException.isConnectionFailure(new JournalException("cannot write", new SQLException("duplicate", "23505")))).isFalse();
        assertThat(JournalException.isConnectionFailure(new IllegalStateException("no SQL at all"))).isFalse();
    }
}
