package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import jakarta.enterprise.context.ApplicationScoped;
import jakarta.enterprise.inject.Disposes;
import jakarta.enterprise.inject.Produces;
import jakarta.inject.Singleton;
import java.time.Clock;
import org.jboss.logging.Logger;

/** The journal's objects for the daemon, built once from {@link JournalConfig}. */
@ApplicationScoped
public class JournalBeans {

    private static final Logger LOG = Logger.getLogger(JournalBeans.class);

    @Produces
    @Singleton
    AgroalDataSource journalDataSource(JournalConfig config) {
        String where = JournalDatabase.withoutCredentials(config.url());
        long deadline = System.nanoTime() + config.startWait().toNanos();
        long pause = 1_000;
        while (true) {
            try {
                AgroalDataSource ds = JournalDatabase.open(config.url(), config.username().orElse(null), config.password().orElse(null),
                        config.maxConnections());
                LOG.infof("journal ready at %s", where);
                return ds;
            } catch (JournalException e) {
                if (System.nanoTime() + pause * 1_000_000 > deadline) {
                    throw e;
                }
                LOG.warnf("journal at %s not reachable at start (%s); trying again in %d s, for up to %s (slopewatch.journal.start-wait)",
                        where, rootMessage(e), pause / 1000, config.startWait());
                sleep(pause);
                pause = Math.min(pause * 2, 10_000);
            }
        }
    }

    private static String rootMessage(Throwable t) {
        Throwable root = t;
        while (root.getCause() != null && root.getCause() != root) {
            root = root.getCause();
        }
        return root.getMessage() == null ? root.toString() : root.getMessage();
    }

    private static void sleep(long millis) {
        try {
            Thread.sleep(millis);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new JournalException("interrupted while waiting for the journal", e);
        }
    }

    void close(@Disposes AgroalDataSource ds) {
        ds.close();
    }

    @Produces
    @Singleton
    JournalWriter journalWriter(AgroalDataSource ds, Clock clock) {
        return new JournalWriter(ds, clock);
    }

    @Produces
    @Singleton
    JournalReader journalReader(AgroalDataSource ds) {
        return new JournalReader(ds);
    }

    @Produces
    @Singleton
    CurveCheckpoints curveCheckpoints(AgroalDataSource ds, Clock clock) {
        return new CurveCheckpoints(ds, clock);
    }

    @Produces
    @Singleton
    AlertHistory alertHistory(AgroalDataSource ds) {
        return new AlertHistory(ds);
    }

    @Produces
    @Singleton
    DeliveryOutbox deliveryOutbox(AgroalDataSource ds, Clock clock) {
        return new DeliveryOutbox(ds, clock);
    }

    @Produces
    @Singleton
    DeliveryAttempts deliveryAttempts(AgroalDataSource ds) {
        return new DeliveryAttempts(ds);
    }

    @Produces
    @Singleton
    Acknowledgements acknowledgements(AgroalDataSource ds, Clock clock) {
        return new Acknowledgements(ds, clock);
    }

    @Produces
    @Singleton
    QuietPeriodBook quietPeriodBook(AgroalDataSource ds, Clock clock) {
        return new QuietPeriodBook(ds, clock);
    }

    @Produces
    @Singleton
    DeskChanges deskChanges(AgroalDataSource ds) {
        return new DeskChanges(ds);
    }

    @Produces
    @Singleton
    WhatIfRows whatIfRows(AgroalDataSource ds, Clock clock) {
        return new WhatIfRows(ds, clock);
    }

    @Produces
    @Singleton
    PolicyVersions policyVersions(AgroalDataSource ds, Clock clock) {
        return new PolicyVersions(ds, clock);
    }

    @Produces
    @Singleton
    PolicyInForce policyInForce(AgroalDataSource ds, Clock clock) {
        return new PolicyInForce(ds, clock);
    }

    @Produces
    @Singleton
    NewestAlerts newestAlerts(AgroalDataSource ds) {
        return new NewestAlerts(ds);
    }

    @Produces
    @Singleton
    TimelineRows timelineRows(AgroalDataSource ds) {
        return new TimelineRows(ds);
    }

    @Produces
    @Singleton
    SourceFetches sourceFetches(AgroalDataSource ds, Clock clock) {
        return new SourceFetches(ds, clock);
    }
}
