package org.tufa.analysis.trends.sql;

import static org.junit.jupiter.api.Assertions.fail;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Locale;
import java.util.Properties;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Assumptions;

/**
 * The PostgreSQL server the historian tests use: the one {@code .ci/postgres.sh start} runs (127.0.0.1:54329,
 * database and user tufa_test), or the one the variables TUFA_TEST_PG_URL, TUFA_TEST_PG_USER and
 * TUFA_TEST_PG_PASSWORD name. Outside CI a missing server skips the test with a message; in CI (CI=true) it fails it.
 * Each test class gets a schema of its own, dropped at the end.
 */
public final class TestDatabase implements AutoCloseable {

    private static final AtomicInteger SCHEMAS = new AtomicInteger();

    public final String url;
    public final String user;
    public final String password;
    public final String schema;
    private final Connection admin;

    private TestDatabase(String url, String user, String password, String schema, Connection admin) {
        this.url = url;
        this.user = user;
        this.password = password;
        this.schema = schema;
        this.admin = admin;
    }

    /** Connects and creates a fresh schema, or skips (outside CI) / fails (in CI) when no server answers. */
    public static TestDatabase connectOrSkip(String purpose) {
        String url = env("TUFA_TEST_PG_URL", "jdbc:postgresql://127.0.0.1:54329/tufa_test");
        String user = env("TUFA_TEST_PG_USER", "tufa_test");
        String password = env("TUFA_TEST_PG_PASSWORD", "tufa-test-only");
        Properties p = new Properties();
        p.setProperty("user", user);
        p.setProperty("password", password);
        p.setProperty("connectTimeout", "5");
        Connection c;
        try {
            c = DriverManager.getConnection(url, p);
        } catch (SQLException e) {
            String why = "no PostgreSQL server for the historian tests at " + url + " (" + e.getMessage().lines()
                    .findFirst().orElse("") + "); start one with .ci/postgres.sh start";
            if ("true".equalsIgnoreCase(System.getenv("CI"))) {
                fail("CI must run the historian tests: " + why);
            }
            Assumptions.abort(purpose + " skipped: " + why);
            throw new IllegalStateException("unreachable");
        }
        String schema = String.format(Locale.ROOT, "tufa_t%d_%d_%d", ProcessHandle.current().pid(),
                System.nanoTime() % 1_000_000, SCHEMAS.incrementAndGet());
        try (Statement s = c.createStatement()) {
            s.execute("CREATE SCHEMA " + schema);
            s.execute("SET search_path TO " + schema);
        } catch (SQLException e) {
            throw new IllegalStateException("cannot create a test schema: " + e.getMessage(), e);
        }
        return new TestDatabase(url, user, password, schema, c);
    }

    private static String env(String name, String fallback) {
        String v = System.getenv(name);
        return v == null || v.isBlank() ? fallback : v;
    }

    /** The JDBC URL that reads this test's schema. */
    public String schemaUrl() {
        return url + (url.contains("?") ? "&" : "?") + "currentSchema=" + schema;
    }

    /** A connection whose search path is this test's schema, for loading data. */
    public Connection admin() {
        return admin;
    }

    public void execute(String sql) throws SQLException {
        try (Statement s = admin.createStatement()) {
            s.execute(sql);
        }
    }

    public DatabaseLogin login() {
        return new DatabaseLogin(user, password);
    }

    @Override
    public void close() throws SQLException {
        try (Statement s = admin.createStatement()) {
            s.execute("DROP SCHEMA " + schema + " CASCADE");
        } finally {
            admin.close();
        }
    }
}
