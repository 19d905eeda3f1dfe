package dev.quern.load;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * A SQLite database's tables as the loader needs them: columns with their declarations, the primary key,
 * the indexes and the columns that reference other tables, and what each column's values really are.
 * SQLite keeps any value in any column, so the values, not the declarations, decide the target types.
 */
final class SqliteTables {

    /** A table to copy. */
    record Table(String name, List<Column> columns, List<String> primaryKey, List<Index> indexes,
                 List<String> references, long rows) {
    }

    /** A column, and the kind its values turned out to be. */
    record Column(String name, String declaredType, boolean notNull, ColumnKind kind, boolean fractionalSeconds,
                  int longestText) {
    }

    /** An index SQLite has on plain columns. */
    record Index(String name, boolean unique, List<String> columns) {
    }

    private final Connection sqlite;

    SqliteTables(Connection sqlite) {
        this.sqlite = sqlite;
    }

    /** Every table but SQLite's own, in name order. */
    List<Table> read() throws SQLException {
        List<String> names = new ArrayList<>();
        try (Statement s = sqlite.createStatement();
             ResultSet rs = s.executeQuery("select name from sqlite_schema where type = 'table'"
                     + " and name not like 'sqlite\\_%' escape '\\' order by name")) {
            while (rs.next()) {
                names.add(rs.getString(1));
            }
        }
        List<Table> tables = new ArrayList<>();
        for (String name : names) {
            tables.add(table(name));
        }
        return tables;
    }

    private Table table(String name) throws SQLException {
        List<String[]> declared = new ArrayList<>();
        Map<Integer, String> keyParts = new TreeMap<>();
        try (PreparedStatement p = sqlite.prepareStatement("select name, type, \"notnull\", pk from pragma_table_info(?)")) {
            p.setString(1, name);
            try (ResultSet rs = p.executeQuery()) {
                while (rs.next()) {
                    declared.add(new String[] {rs.getString(1), rs.getString(2) == null ? "" : rs.getString(2),
                            rs.getString(3)});
                    if (rs.getInt(4) > 0) {
                        keyParts.put(rs.getInt(4), rs.getString(1));
                    }
                }
            }
        }
        List<String> references = new ArrayList<>();
        try (PreparedStatement p = sqlite.prepareStatement("select distinct \"from\" from pragma_foreign_key_list(?)")) {
            p.setString(1, name);
            try (ResultSet rs = p.executeQuery()) {
                while (rs.next()) {
                    references.add(rs.getString(1));
                }
            }
        }
        Profile profile = profile(name, declared);
        List<Column> columns = new ArrayList<>();
        for (int i = 0; i < declared.size(); i++) {
            String[] d = declared.get(i);
            columns.add(new Column(d[0], d[1], "1".equals(d[2]), profile.kind(i, d[1]), profile.fraction(i),
                    profile.longestText(i)));
        }
        return new Table(name, columns, List.copyOf(keyParts.values()), indexes(name), references, profile.rows);
    }

    /** Indexes made by CREATE INDEX or UNIQUE, on plain columns; expression indexes are left out. */
    private List<Index> indexes(String table) throws SQLException {
        List<Index> indexes = new ArrayList<>();
        try (PreparedStatement p = sqlite.prepareStatement(
                "select name, \"unique\" from pragma_index_list(?) where origin in ('c', 'u') and partial = 0"
                        + " order by name")) {
            p.setString(1, table);
            try (ResultSet rs = p.executeQuery()) {
                while (rs.next()) {
                    String index = rs.getString(1);
                    List<String> columns = indexColumns(index);
                    if (!columns.isEmpty()) {
                        indexes.add(new Index(index, rs.getInt(2) == 1, columns));
                    }
                }
            }
        }
        return indexes;
    }

    private List<String> indexColumns(String index) throws SQLException {
        List<String> columns = new ArrayList<>();
        try (PreparedStatement p = sqlite.prepareStatement("select name from pragma_index_info(?) order by seqno")) {
            p.setString(1, index);
            try (ResultSet rs = p.executeQuery()) {
                while (rs.next()) {
                    String column = rs.getString(1);
                    if (column == null) {
                        return List.of();
                    }
                    columns.add(column);
                }
            }
        }
        return columns;
    }

    /**
     * Counts per column of each storage class and of texts shaped like dates and times, in one scan; the
     * shaped columns are then read once more and parsed strictly ('2025-02-30' is no date), which costs far
     * less than SQLite's date functions on every value.
     */
    private Profile profile(String table, List<String[]> columns) throws SQLException {
        StringBuilder sql = new StringBuilder("select count(*)");
        for (String[] column : columns) {
            String c = quote(column[0]);
            String text = "typeof(" + c + ") = 'text'";
            sql.append(", sum(typeof(").append(c).append(") = 'integer')")
                    .append(", sum(typeof(").append(c).append(") = 'real')")
                    .append(", sum(").append(text).append(")")
                    .append(", sum(typeof(").append(c).append(") = 'blob')")
                    .append(", sum(").append(text).append(" and ").append(c).append(" glob '").append(DATE_SHAPE)
                    .append("')")
                    .append(", sum(").append(text).append(" and ").append(c).append(" glob '").append(DATE_SHAPE)
                    .append("[ T][0-2][0-9]:[0-5][0-9]:[0-6][0-9]*')")
                    .append(", sum(").append(text).append(" and length(").append(c).append(") > 19)")
                    .append(", max(case when ").append(text).append(" then length(").append(c).append(") end)");
        }
        sql.append(" from ").append(quote(table));
        long rows;
        long[][] counts = new long[columns.size()][8];
        try (Statement s = sqlite.createStatement(); ResultSet rs = s.executeQuery(sql.toString())) {
            rs.next();
            rows = rs.getLong(1);
            for (int i = 0; i < columns.size(); i++) {
                for (int j = 0; j < 8; j++) {
                    counts[i][j] = rs.getLong(2 + i * 8 + j);
                }
            }
        }
        for (int i = 0; i < columns.size(); i++) {
            long filled = counts[i][0] + counts[i][1] + counts[i][2] + counts[i][3];
            boolean dates = filled > 0 && counts[i][4] == filled;
            boolean times = filled > 0 && counts[i][5] == filled;
            if ((dates || times) && !allParse(table, columns.get(i)[0], dates)) {
                counts[i][4] = 0;
                counts[i][5] = 0;
            }
        }
        return new Profile(table, columns, rows, counts);
    }

    private static final String DATE_SHAPE = "[0-9][0-9][0-9][0-9]-[0-1][0-9]-[0-3][0-9]";

    private boolean allParse(String table, String column, boolean dates) throws SQLException {
        try (Statement s = sqlite.createStatement();
             ResultSet rs = s.executeQuery("select " + quote(column) + " from " + quote(table)
                     + " where " + quote(column) + " is not null")) {
            while (rs.next()) {
                if (!(dates ? parsesAsDate(rs.getString(1)) : parsesAsTimestamp(rs.getString(1)))) {
                    return false;
                }
            }
        }
        return true;
    }

    /** {@code YYYY-MM-DD}, a day that exists. */
    static boolean parsesAsDate(String text) {
        try {
            LocalDate.parse(text);
            return text.length() == 10;
        } catch (DateTimeParseException e) {
            return false;
        }
    }

    /** {@code YYYY-MM-DD HH:MM:SS} or with a {@code T}, with up to nine digits of a second after a point. */
    static boolean parsesAsTimestamp(String text) {
        if (text.length() < 19 || text.length() > 29 || text.length() == 20 || text.charAt(10) == 'T'
                && text.indexOf(' ') >= 0) {
            return false;
        }
        try {
            LocalDateTime.parse(text.replace(' ', 'T'));
            return true;
        } catch (DateTimeParseException e) {
            return false;
        }
    }

    static String quote(String identifier) {
        return "\"" + identifier.replace("\"", "\"\"") + "\"";
    }

    private record Profile(String table, List<String[]> columns, long rows, long[][] counts) {

        ColumnKind kind(int i, String declared) {
            long integers = counts[i][0];
            long reals = counts[i][1];
            long texts = counts[i][2];
            long blobs = counts[i][3];
            long dates = counts[i][4];
            long timestamps = counts[i][5];
            long filled = integers + reals + texts + blobs;
            if (filled == 0) {
                return fromDeclaration(declared);
            }
            if (blobs > 0) {
                if (blobs < filled) {
                    throw new IllegalArgumentException(table + "." + columns.get(i)[0]
                            + " mixes blobs with other values; no target type holds both");
                }
                return ColumnKind.BLOB;
            }
            if (texts == 0) {
                return reals == 0 ? ColumnKind.INTEGER : ColumnKind.DOUBLE;
            }
            if (texts == filled && dates == texts) {
                return ColumnKind.DATE;
            }
            if (texts == filled && timestamps == texts) {
                return ColumnKind.TIMESTAMP;
            }
            return ColumnKind.TEXT;
        }

        boolean fraction(int i) {
            return counts[i][6] > 0;
        }

        int longestText(int i) {
            return (int) Math.min(Integer.MAX_VALUE, counts[i][7]);
        }

        /** An empty column keeps what its declaration says (SQLite's affinity rules, section 3.1). */
        private static ColumnKind fromDeclaration(String declared) {
            String t = declared.toUpperCase(Locale.ROOT);
            if (t.contains("INT")) {
                return ColumnKind.INTEGER;
            }
            if (t.contains("CHAR") || t.contains("CLOB") || t.contains("TEXT")) {
                return ColumnKind.TEXT;
            }
            if (t.contains("BLOB")) {
                return ColumnKind.BLOB;
            }
            if (t.contains("DATETIME") || t.contains("TIMESTAMP")) {
                return ColumnKind.TIMESTAMP;
            }
            if (t.contains("DATE")) {
                return ColumnKind.DATE;
            }
            if (t.contains("REAL") || t.contains("FLOA") || t.contains("DOUB") || t.contains("NUM")
                    || t.contains("DEC")) {
                return ColumnKind.DOUBLE;
            }
            return ColumnKind.TEXT;
        }
    }
}
