package dev.quern.testing;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;

/** A small SQLite database written by a test, for recipes over hand-made rows. */
public final class TestDatabase implements AutoCloseable {

    private final Path file;
    private final Connection connection;

    private TestDatabase(Path file) throws SQLException {
        this.file = file;
        this.connection = DriverManager.getConnection("jdbc:sqlite:" + file);
        this.connection.setAutoCommit(false);
    }

    public static TestDatabase create(Path file) {
        try {
            return new TestDatabase(file);
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
    }

    public Path file() {
        return file;
    }

    public TestDatabase execute(String... statements) {
        try (Statement s = connection.createStatement()) {
            for (String sql : statements) {
                s.execute(sql);
            }
            connection.commit();
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
        return this;
    }

    /** Inserts rows with a prepared statement, so values keep their Java types. */
    public TestDatabase insert(String table, List<List<Object>> rows) {
        if (rows.isEmpty()) {
            return this;
        }
        String marks = String.join(", ", java.util.Collections.nCopies(rows.get(0).size(), "?"));
        try (PreparedStatement p = connection.prepareStatement("insert into " + table + " values (" + marks + ")")) {
            for (List<Object> row : rows) {
                for (int i = 0; i < row.size(); i++) {
                    p.setObject(i + 1, row.get(i));
                }
                p.addBatch();
            }
            p.executeBatch();
            connection.commit();
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
        return this;
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
