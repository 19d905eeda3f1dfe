package dev.quern.sample;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;

/** A read-only look into a generated database for the tests, through plain JDBC. */
final class SampleDb implements AutoCloseable {

    /** Every table with its key, as the schema in the design fixes them. */
    static final List<String[]> TABLES = List.of(
            new String[] {"stations", "station_id"},
            new String[] {"members", "member_id"},
            new String[] {"plans", "plan_row_id"},
            new String[] {"rides", "ride_id"},
            new String[] {"payments", "payment_id"},
            new String[] {"tickets", "ticket_id"},
            new String[] {"cancellations", "cancellation_id"});

    private final Connection connection;

    private SampleDb(Connection connection) {
        this.connection = connection;
    }

    static SampleDb open(Path file) throws SQLException {
        org.sqlite.SQLiteConfig config = new org.sqlite.SQLiteConfig();
        config.setReadOnly(true);
        return new SampleDb(DriverManager.getConnection("jdbc:sqlite:" + file, config.toProperties()));
    }

    long count(String sql) throws SQLException {
        Object value = rows(sql).get(0).get(0);
        return value == null ? 0 : ((Number) value).longValue();
    }

    double number(String sql) throws SQLException {
        return ((Number) rows(sql).get(0).get(0)).doubleValue();
    }

    List<List<Object>> rows(String sql) throws SQLException {
        List<List<Object>> rows = new ArrayList<>();
        try (Statement statement = connection.createStatement(); ResultSet rs = statement.executeQuery(sql)) {
            int columns = rs.getMetaData().getColumnCount();
            while (rs.next()) {
                List<Object> row = new ArrayList<>(columns);
                for (int i = 1; i <= columns; i++) {
                    row.add(rs.getObject(i));
                }
                rows.add(row);
            }
        }
        return rows;
    }

    List<List<Object>> table(String[] tableAndKey) throws SQLException {
        return rows("SELECT * FROM " + tableAndKey[0] + " ORDER BY " + tableAndKey[1]);
    }

    @Override
    public void close() throws SQLException {
        connection.close();
    }
}
