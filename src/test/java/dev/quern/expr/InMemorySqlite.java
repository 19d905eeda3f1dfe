package dev.quern.expr;

import dev.quern.schema.Engine;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.util.Collections;
import java.util.List;
import org.jooq.DSLContext;

/** A private in-memory SQLite database for one test, filled with prepared statements. */
final class InMemorySqlite implements AutoCloseable {

    private final Connection connection;

    private InMemorySqlite(Connection connection) {
        this.connection = connection;
    }

    static InMemorySqlite open() {
        try {
            return new InMemorySqlite(DriverManager.getConnection("jdbc:sqlite::memory:"));
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Runs our own fixed set-up statements (never text from an expression). */
    InMemorySqlite execute(String... statements) {
        try (var s = connection.createStatement()) {
            for (String sql : statements) {
                s.execute(sql);
            }
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
        return this;
    }

    InMemorySqlite insert(String table, List<List<Object>> rows) {
        String marks = String.join(", ", Collections.nCopies(rows.get(0).size(), "?"));
        try (PreparedStatement p = connection.prepareStatement("insert into " + table + " values (" + marks + ")")) {
            for (List<Object> row : rows) {
                for (int i = 0; i < row.size(); i++) {
                    p.setObject(i + 1, row.get(i));
                }
                p.addBatch();
            }
            p.executeBatch();
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
        return this;
    }

    DSLContext sql() {
        return Engine.SQLITE.sql(connection);
    }

    @Override
    public void close() {
        try {
            connection.close();
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
    }
}
