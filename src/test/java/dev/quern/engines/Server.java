package dev.quern.engines;

import dev.quern.Position;
import dev.quern.schema.ConnectionUrl;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Assertions;
import org.junit.jupiter.api.Assumptions;

/**
 * A database server the tests use, found through an environment variable with a default for this
 * machine's servers. Each test run makes its own schema (PostgreSQL) or database (MariaDB) named
 * {@code quern_test_<random>} and drops it afterwards. An unreachable server skips the tests that need it,
 * unless {@code QUERN_REQUIRE_SERVERS=1}, under which it fails them.
 */
enum Server {
    POSTGRES("QUERN_TEST_POSTGRES_URL", "jdbc:postgresql://127.0.0.1:5432/test?user=postgres"),
    MARIADB("QUERN_TEST_MARIADB_URL", "jdbc:mariadb://127.0.0.1:3306/test?user=root");

    static final String REQUIRE = "QUERN_REQUIRE_SERVERS";
    private static final Pattern MARIADB_URL = Pattern.compile("^(jdbc:(?:mariadb|mysql)://[^/?]*)(/[^?]*)?(\\?.*)?$");

    private final String variable;
    private final String fallback;
    private Boolean reachable;
    private String unreachableBecause;

    Server(String variable, String fallback) {
        this.variable = variable;
        this.fallback = fallback;
    }

    /** The administrative URL, as configured (it may name ${VARIABLES} for a password). */
    String url() {
        String configured = System.getenv(variable);
        return configured == null || configured.isBlank() ? fallback : configured;
    }

    /** Skips the calling test when the server cannot be reached, or fails it when servers are required. */
    synchronized void require() {
        if (reachable == null) {
            try (Connection c = connect(url())) {
                reachable = c.isValid(5);
            } catch (SQLException | RuntimeException e) {
                reachable = false;
                unreachableBecause = e.getMessage();
            }
        }
        if (!reachable) {
            String why = this + " at " + ConnectionUrl.of(url(), Position.NONE).display() + " is not reachable ("
                    + unreachableBecause + "); set " + variable + " to point at one";
            if ("1".equals(System.getenv(REQUIRE))) {
                Assertions.fail(why + ". " + REQUIRE + "=1, so a missing server fails the run instead of skipping");
            }
            Assumptions.abort(why + " (set " + REQUIRE + "=1 to fail instead of skipping)");
        }
    }

    /** Creates an empty schema or database of that name; returns the URL that reads and writes it. */
    String create(String name) throws SQLException {
        execute(this == POSTGRES ? "create schema " + name : "create database " + name
                + " character set utf8mb4 collate utf8mb4_nopad_bin");
        return urlFor(name);
    }

    void drop(String name) throws SQLException {
        execute(this == POSTGRES ? "drop schema if exists " + name + " cascade" : "drop database if exists " + name);
    }

    /** The URL of the schema (PostgreSQL's currentSchema) or database (MariaDB's path) {@code name}. */
    String urlFor(String name) {
        String url = url();
        if (this == POSTGRES) {
            return url + (url.contains("?") ? "&" : "?") + "currentSchema=" + name;
        }
        Matcher m = MARIADB_URL.matcher(url);
        if (!m.matches()) {
            throw new IllegalStateException(variable + " is not a jdbc:mariadb://host:port/database URL");
        }
        return m.group(1) + "/" + name + (m.group(3) == null ? "" : m.group(3));
    }

    static Connection connect(String url) throws SQLException {
        return DriverManager.getConnection(ConnectionUrl.of(url, Position.NONE).expand());
    }

    private void execute(String sql) throws SQLException {
        try (Connection c = connect(url()); Statement s = c.createStatement()) {
            s.execute(sql);
        }
    }

    @Override
    public String toString() {
        return this == POSTGRES ? "PostgreSQL" : "MariaDB";
    }
}
