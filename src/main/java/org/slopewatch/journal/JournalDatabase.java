package org.slopewatch.journal;

import io.agroal.api.AgroalDataSource;
import io.agroal.api.configuration.AgroalConnectionPoolConfiguration;
import io.agroal.api.configuration.supplier.AgroalDataSourceConfigurationSupplier;
import io.agroal.api.security.NamePrincipal;
import io.agroal.api.security.SimplePassword;
import java.sql.SQLException;
import java.time.Duration;
import org.flywaydb.core.Flyway;

/**
 * Opens the journal database (H2 embedded or PostgreSQL shared, told apart by the JDBC URL),
 * configured so that a commit is on disk when it returns ({@link JournalDurability}), and brings
 * its schema up to date with the Flyway migrations in {@code db/journal}.
 */
public final class JournalDatabase {

    private JournalDatabase() {
    }

    /**
     * A pooled data source on a migrated journal whose commits are durable. The URL is never logged
     * with its credentials.
     *
     * @throws IllegalArgumentException for a URL of another database, or one that asks for commits
     *         that are not durable (H2's {@code WRITE_DELAY} other than 0)
     * @throws IllegalStateException when the opened database would not make commits durable
     */
    public static AgroalDataSource open(String jdbcUrl, String username, String password, int maxConnections) {
        String url = JournalDurability.url(jdbcUrl);
        AgroalDataSource ds;
        try {
            ds = AgroalDataSource.from(new AgroalDataSourceConfigurationSupplier()
                    .connectionPoolConfiguration(pool -> pool
                            .minSize(1)
                            .maxSize(maxConnections)
                            .acquisitionTimeout(Duration.ofSeconds(10))
                            // after the database was away, pooled connections are dead: a connection
                            // error retires the connection it came from, and one idle for a while is
                            // checked before it is lent again
                            .exceptionSorter(JournalException::isConnectionFailure)
                            .connectionValidator(AgroalConnectionPoolConfiguration.ConnectionValidator.defaultValidatorWithTimeout(5))
                            .idleValidationTimeout(Duration.ofSeconds(5))
                            .connectionFactoryConfiguration(cf -> {
                                cf.jdbcUrl(url).connectionProviderClass(driverFor(url));
                                String sessionSql = JournalDurability.sessionSql(url);
                                if (sessionSql != null) {
                                    cf.initialSql(sessionSql);
                                }
                                if (username != null && !username.isBlank()) {
                                    cf.principal(new NamePrincipal(username));
                                }
                                if (password != null && !password.isEmpty()) {
                                    cf.credential(new SimplePassword(password));
                                }
                                return cf;
                            })));
        } catch (SQLException e) {
            throw new JournalException("cannot open the journal at " + withoutCredentials(jdbcUrl), e);
        }
        try {
            migrate(ds, url);
            JournalDurability.check(ds, url);
        } catch (RuntimeException e) {
            ds.close();
            throw e;
        }
        return ds;
    }

    /**
     * The driver named explicitly: looking it up through {@code DriverManager} depends on which
     * class loader registered it, which differs between the launcher, Quarkus and the tests.
     */
    static Class<?> driverFor(String jdbcUrl) {
        if (jdbcUrl.startsWith("jdbc:h2:")) {
            return org.h2.Driver.class;
        }
        if (jdbcUrl.startsWith("jdbc:postgresql:")) {
            return org.postgresql.Driver.class;
        }
        throw new IllegalArgumentException("unsupported journal URL " + withoutCredentials(jdbcUrl)
                + " (supported: jdbc:h2:… for the embedded journal, jdbc:postgresql:… for a shared one)");
    }

    static void migrate(javax.sql.DataSource ds, String jdbcUrl) {
        try {
            Flyway.configure(JournalDatabase.class.getClassLoader())
                    .dataSource(ds)
                    .locations("classpath:db/journal")
                    .load()
                    .migrate();
        } catch (RuntimeException e) {
            throw new JournalException("cannot bring the journal schema at " + withoutCredentials(jdbcUrl) + " up to date", e);
        }
    }

    /** The URL without anything after {@code ?} or {@code ;} where drivers accept passwords. */
    static String withoutCredentials(String jdbcUrl) {
        int cut = jdbcUrl.length();
        for (char c : new char[] {'?', ';'}) {
            int at = jdbcUrl.indexOf(c);
            if (at >= 0) {
                cut = Math.min(cut, at);
            }
        }
        return jdbcUrl.substring(0, cut);
    }
}
