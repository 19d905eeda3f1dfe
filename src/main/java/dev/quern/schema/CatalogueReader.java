package dev.quern.schema;

import java.sql.Connection;
import java.sql.DatabaseMetaData;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Types;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeSet;

/** Reads table and column descriptions from the source's JDBC catalogue. */
final class CatalogueReader {

    private final Connection connection;
    private final Engine engine;

    CatalogueReader(Connection connection, Engine engine) {
        this.connection = connection;
        this.engine = engine;
    }

    /** Every table and view name visible in the current schema, for "did you mean" hints. */
    TreeSet<String> tableNames() throws SQLException {
        TreeSet<String> names = new TreeSet<>();
        DatabaseMetaData meta = connection.getMetaData();
        try (ResultSet rs = meta.getTables(connection.getCatalog(), currentSchema(), "%",
                new String[] {"TABLE", "VIEW", "BASE TABLE"})) {
            while (rs.next()) {
                names.add(rs.getString("TABLE_NAME"));
            }
        }
        return names;
    }

    Optional<TableInfo> table(String name) throws SQLException {
        Map<String, ColumnInfo> columns = new LinkedHashMap<>();
        DatabaseMetaData meta = connection.getMetaData();
        try (ResultSet rs = meta.getColumns(connection.getCatalog(), currentSchema(), escape(meta, name), "%")) {
            while (rs.next()) {
                if (!name.equals(rs.getString("TABLE_NAME"))) {
                    continue;
                }
                String column = rs.getString("COLUMN_NAME");
                String declared = Optional.ofNullable(rs.getString("TYPE_NAME")).orElse("");
                columns.put(column, new ColumnInfo(column, typeOf(rs.getInt("DATA_TYPE"), declared), declared));
            }
        }
        return columns.isEmpty() ? Optional.empty() : Optional.of(new TableInfo(name, columns));
    }

    private String currentSchema() throws SQLException {
        return engine == Engine.SQLITE ? null : connection.getSchema();
    }

    private static String escape(DatabaseMetaData meta, String name) throws SQLException {
        String escape = meta.getSearchStringEscape();
        if (escape == null || escape.isEmpty()) {
            return name;
        }
        return name.replace(escape, escape + escape).replace("_", escape + "_").replace("%", escape + "%");
    }

    private ValueType typeOf(int jdbcType, String declared) {
        if (engine == Engine.SQLITE) {
            return sqliteAffinity(declared);
        }
        return switch (jdbcType) {
            case Types.TINYINT, Types.SMALLINT, Types.INTEGER, Types.BIGINT -> ValueType.INTEGER;
            case Types.REAL, Types.FLOAT, Types.DOUBLE, Types.DECIMAL, Types.NUMERIC -> ValueType.DECIMAL;
            case Types.CHAR, Types.VARCHAR, Types.LONGVARCHAR, Types.NCHAR, Types.NVARCHAR, Types.LONGNVARCHAR,
                 Types.CLOB -> ValueType.TEXT;
            case Types.DATE -> ValueType.DATE;
            case Types.TIMESTAMP, Types.TIMESTAMP_WITH_TIMEZONE -> ValueType.TIMESTAMP;
            case Types.BOOLEAN, Types.BIT -> ValueType.BOOLEAN;
            default -> ValueType.OTHER;
        };
    }

    /**
     * SQLite keeps any value in any column; the declared type only gives an affinity (rules of section 3.1
     * of SQLite's "Datatypes In SQLite"). Dates are declared freely and stored as text, so a column
     * declared DATE or TIMESTAMP is reported as such and its storage is sampled separately.
     */
    static ValueType sqliteAffinity(String declared) {
        String t = declared.toUpperCase(Locale.ROOT);
        if (t.contains("INT")) {
            return ValueType.INTEGER;
        }
        if (t.contains("DATETIME") || t.contains("TIMESTAMP")) {
            return ValueType.TIMESTAMP;
        }
        if (t.contains("DATE")) {
            return ValueType.DATE;
        }
        if (t.contains("CHAR") || t.contains("CLOB") || t.contains("TEXT")) {
            return ValueType.TEXT;
        }
        if (t.contains("BOOL")) {
            return ValueType.BOOLEAN;
        }
        if (t.contains("REAL") || t.contains("FLOA") || t.contains("DOUB") || t.contains("NUM")
                || t.contains("DEC")) {
            return ValueType.DECIMAL;
        }
        return t.isEmpty() ? ValueType.OTHER : ValueType.DECIMAL;
    }
}
