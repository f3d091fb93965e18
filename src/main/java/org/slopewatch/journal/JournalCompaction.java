package org.slopewatch.journal;

import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.concurrent.atomic.AtomicInteger;
import org.h2.engine.Session;
import org.h2.engine.SessionLocal;
import org.h2.jdbc.JdbcConnection;
import org.h2.mvstore.MVStore;
import org.jboss.logging.Logger;

/**
 * Rewrites the sparsely used parts of an embedded H2 journal's file now and then, as H2's own
 * background writer would if {@link JournalDurability} had not turned it off.
 *
 * <p>H2 2.x (MVStore) appends each commit to the file as a chunk and frees a chunk only once none
 * of its pages is live. Its background writer, which also rewrites the live pages of sparse
 * chunks, runs only with a write delay; with {@code WRITE_DELAY=0} nothing does, and a journal
 * written in small steps grows with the number of commits rather than with what it holds. So
 * every {@code every} commits this rewrites up to {@value #WRITE_LIMIT} bytes of chunks filled
 * below {@value #TARGET_FILL_RATE} % (the bounds H2's housekeeping uses while the store is busy),
 * through H2's {@code MVStore.compact}; the next commit's fsync covers what it wrote.
 *
 * <p>Only for an H2 database in this process with a file: PostgreSQL, an H2 server and an
 * in-memory H2 are left alone. Should H2's internals not be reachable, it says so once and stops;
 * the commits stay durable, the file only grows faster.
 */
final class JournalCompaction {

    private static final Logger LOG = Logger.getLogger(JournalCompaction.class);
    static final int TARGET_FILL_RATE = 81;
    static final int WRITE_LIMIT = 1 << 20;

    private final int every;
    private final AtomicInteger commits = new AtomicInteger();
    private volatile boolean off;

    /** @param every commits between two compactions; 0 never */
    JournalCompaction(int every) {
        this.every = every;
        this.off = every <= 0;
    }

    /** After a commit on {@code c}: compacts if this is the {@code every}-th commit. */
    void afterCommit(Connection c) {
        if (off || commits.incrementAndGet() % every != 0) {
            return;
        }
        try {
            MVStore store = fileStore(c);
            if (store == null) {
                off = true;
                return;
            }
            if (store.compact(TARGET_FILL_RATE, WRITE_LIMIT)) {
                try (Statement s = c.createStatement()) {
                    s.execute("CHECKPOINT"); // writes the rewritten pages now rather than with the next step
                }
            }
        } catch (SQLException | RuntimeException | LinkageError e) {
            off = true;
            LOG.warnf("the H2 journal's file is no longer compacted (%s): commits stay durable, but the file grows faster", e.toString());
        }
    }

    /** The MVStore of an H2 file database open in this process, or null. */
    private static MVStore fileStore(Connection c) throws SQLException {
        if (!c.isWrapperFor(JdbcConnection.class)) {
            return null;
        }
        Session session = c.unwrap(JdbcConnection.class).getSession();
        if (!(session instanceof SessionLocal local) || local.getDatabase().getStore() == null) {
            return null;
        }
        MVStore store = local.getDatabase().getStore().getMvStore();
        return store.getFileStore() == null ? null : store;
    }
}
