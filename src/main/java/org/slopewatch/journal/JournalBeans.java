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
        AgroalDataSource ds = JournalDatabase.open(config.url(), config.username().orElse(null), config.password().orElse(null),
                config.maxConnections());
        LOG.infof("journal ready at %s", JournalDatabase.withoutCredentials(config.url()));
        return ds;
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
    AlertStore alertStore(AgroalDataSource ds, Clock clock) {
        return new AlertStore(ds, clock);
    }
}
