package org.slopewatch.testsupport;

import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.HexFormat;
import java.util.Map;
import java.util.Properties;
import java.util.concurrent.ThreadLocalRandom;

/**
 * The real PostgreSQL server the tests talk to. CI starts it with {@code .ci/postgres.sh} and
 * names it in {@value #URL_ENV} (user and password {@code sw} unless {@value #USER_ENV} and
 * {@value #PASSWORD_ENV} say otherwise); without that variable (a developer's machine) the same
 * script starts a server on a free port for this JVM, stopped when the JVM exits.
 *
 * <p>Tests never share a database: {@link #freshDatabase()} creates an empty one each time.
 */
public final class PostgresServer {

    /** JDBC URL of a database whose user may create databases, e.g. {@code jdbc:postgresql://127.0.0.1:55432/sw}. */
    public static final String URL_ENV = "SLOPEWATCH_TEST_POSTGRES_URL";
    public static final String USER_ENV = "SLOPEWATCH_TEST_POSTGRES_USER";
    public static final String PASSWORD_ENV = "SLOPEWATCH_TEST_POSTGRES_PASSWORD";

    private static final String PROPERTY = "slopewatch.test.postgres.url";

    /** Where and as whom to connect. */
    public record Endpoint(String url, String user, String password) {
    }

    private PostgresServer() {
    }

    /** The server's admin database (the one named by the URL); starts a server for this JVM on first use if CI has not. */
    public static synchronized Endpoint server() {
        String user = orElse(LocalService.env(USER_ENV), "sw");
        String password = orElse(LocalService.env(PASSWORD_ENV), "sw");
        String fromEnv = LocalService.env(URL_ENV);
        if (fromEnv != null) {
            return new Endpoint(fromEnv, user, password);
        }
        String started = System.getProperty(PROPERTY);
        if (started != null) {
            return new Endpoint(started, "sw", "sw");
        }
        int port = LocalService.freePort();
        LocalService.startOnce("PostgreSQL server", "postgres.sh", dir -> Map.of(
                "SLOPEWATCH_POSTGRES_PORT", String.valueOf(port),
                "SLOPEWATCH_POSTGRES_DIR", dir.toString()),
                "Start one yourself with '.ci/postgres.sh start' (as root it installs Debian's postgresql if needed; "
                        + "otherwise 'apt-get install postgresql' first) and run the tests with "
                        + URL_ENV + "=jdbc:postgresql://127.0.0.1:55432/sw.");
        String url = "jdbc:postgresql://127.0.0.1:" + port + "/sw";
        System.setProperty(PROPERTY, url);
        return new Endpoint(url, "sw", "sw");
    }

    /** A new, empty database on the server; closing it drops it. */
    public static TestDatabase freshDatabase() {
        Endpoint admin = server();
        String name = "sw_" + HexFormat.of().toHexDigits(ThreadLocalRandom.current().nextLong());
        execute(admin, "CREATE DATABASE " + name);
        return new TestDatabase(new Endpoint(withDatabase(admin.url(), name), admin.user(), admin.password()), admin, name);
    }

    /** A database of its own for one test. */
    public static final class TestDatabase implements AutoCloseable {
        private final Endpoint endpoint;
        private final Endpoint admin;
        private final String name;

        private TestDatabase(Endpoint endpoint, Endpoint admin, String name) {
            this.endpoint = endpoint;
            this.admin = admin;
            this.name = name;
        }

        public String url() {
            return endpoint.url();
        }

        public String user() {
            return endpoint.user();
        }

        public String password() {
            return endpoint.password();
        }

        public String name() {
            return name;
        }

        /**
         * Drops the database, closing any connection still open to it. An autovacuum worker on it
         * belongs to the server's superuser, which the test role may not end ("must be a member of
         * the role whose process is being terminated"): such a worker is done within moments, so
         * the drop is tried again for up to ten seconds.
         */
        @Override
        public void close() {
            String drop = "DROP DATABASE IF EXISTS " + name + " WITH (FORCE)";
            for (int attempt = 1; ; attempt++) {
                try {
                    execute(admin, drop);
                    return;
                } catch (IllegalStateException e) {
                    boolean notOurs = e.getCause() instanceof SQLException sql && "42501".equals(sql.getSQLState());
                    if (!notOurs || attempt == 100) {
                        throw e;
                    }
                    try {
                        Thread.sleep(100);
                    } catch (InterruptedException interrupted) {
                        Thread.currentThread().interrupt();
                        throw e;
                    }
                }
            }
        }
    }

    /** The same URL naming another database: {@code jdbc:postgresql://host:port/db?params}. */
    static String withDatabase(String url, String database) {
        String prefix = "jdbc:postgresql://";
        if (!url.startsWith(prefix)) {
            throw new IllegalArgumentException(URL_ENV + " must look like jdbc:postgresql://host:port/database, got " + url);
        }
        int slash = url.indexOf('/', prefix.length());
        int query = url.indexOf('?', prefix.length());
        String hostPart = url.substring(0, slash >= 0 ? slash : query >= 0 ? query : url.length());
        String params = query >= 0 ? url.substring(query) : "";
        return hostPart + "/" + database + params;
    }

    private static void execute(Endpoint e, String sql) {
        Properties props = new Properties();
        props.setProperty("user", e.user());
        props.setProperty("password", e.password());
        // the driver named directly: DriverManager depends on which class loader registered it
        try (Connection c = new org.postgresql.Driver().connect(e.url(), props); Statement s = c.createStatement()) {
            s.execute(sql);
        } catch (SQLException ex) {
            throw new IllegalStateException("PostgreSQL at " + e.url() + " as " + e.user() + ": " + sql + ": " + ex.getMessage(), ex);
        }
    }

    private static String orElse(String v, String otherwise) {
        return v == null ? otherwise : v;
    }
}
