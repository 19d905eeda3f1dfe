package dev.quern.load;

import dev.quern.Position;
import dev.quern.QuernException;
import dev.quern.recipe.Name;
import dev.quern.run.Progress;
import dev.quern.schema.ConnectionUrl;
import dev.quern.schema.DuckDb;
import dev.quern.schema.Engine;
import dev.quern.schema.Source;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Duration;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Properties;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * Copies every table of a SQLite database into a PostgreSQL, MariaDB, MySQL or DuckDB database: the
 * only place Quern writes to a database, and only to the target the user names.
 *
 * <p>Types come from the values, which SQLite does not constrain: integers become {@code bigint}, numbers
 * {@code double precision}, text that is a valid date (or date and time) in every row becomes DATE (or
 * TIMESTAMP), other text stays text. Primary keys, SQLite's own indexes, and indexes on every column that
 * references another table and every time column are created. A table that exists already stops the load
 * before anything is written, unless {@code replace} is given.
 *
 * <pre>{@code
 * LoadSummary s = DatabaseLoader.load(Path.of("sample-db/cycle-club.sqlite"),
 *         "jdbc:postgresql://127.0.0.1:5432/demo?user=me&password=${PGPASSWORD}", false, Progress.SILENT);
 * }</pre>
 */
public final class DatabaseLoader {

    /** Bind values per INSERT statement: below every engine's limit (PostgreSQL's is 65535). */
    private static final int VALUES_PER_INSERT = 20_000;
    private static final int MAX_ROWS_PER_INSERT = 1_000;
    private static final int MAX_NAME = 63;

    private final Path sqliteFile;
    private final ConnectionUrl target;
    private final LoadTarget dialect;
    private final boolean replace;
    private final Progress progress;

    private DatabaseLoader(Path sqliteFile, ConnectionUrl target, boolean replace, Progress progress) {
        this.sqliteFile = sqliteFile;
        this.target = target;
        this.replace = replace;
        this.progress = progress;
        if (target.engine() == Engine.SQLITE) {
            throw QuernException.data("the target " + target.display() + " is SQLite: copy the file instead;"
                    + " load into PostgreSQL, MariaDB, MySQL or DuckDB");
        }
        if (target.engine() == Engine.SPARK) {
            throw QuernException.usage("the target " + target.display() + " is Spark, which Quern only reads:"
                    + " export the tables as Parquet files (for instance with DuckDB's COPY) and point"
                    + " spark:parquet:FOLDER at them");
        }
        this.dialect = LoadTarget.of(target.engine());
    }

    /**
     * Copies every table of {@code sqliteFile} into the database {@code targetUrl} names (in its current
     * schema). The URL may name {@code ${VARIABLES}}; it never holds a credential itself.
     */
    public static LoadSummary load(Path sqliteFile, String targetUrl, boolean replace, Progress progress) {
        ConnectionUrl target = ConnectionUrl.target(targetUrl);
        try {
            return new DatabaseLoader(sqliteFile, target, replace, progress).load();
        } finally {
            progress.done();
        }
    }

    private LoadSummary load() {
        long started = System.nanoTime();
        Source source = Source.of(new Name("jdbc:sqlite:" + sqliteFile.toAbsolutePath(), Position.NONE),
                Path.of("").toAbsolutePath());
        try (Connection sqlite = source.open()) {
            progress.stage("reading " + sqliteFile);
            List<SqliteTables.Table> tables = readTables(sqlite);
            try (Connection out = openTarget()) {
                List<LoadedTable> loaded = copy(sqlite, out, tables);
                return new LoadSummary(target.display(), loaded, Duration.ofNanos(System.nanoTime() - started));
            }
        } catch (SQLException e) {
            throw QuernException.data("loading into " + target.display() + " failed: " + target.safeMessage(e), e);
        }
    }

    private List<SqliteTables.Table> readTables(Connection sqlite) throws SQLException {
        try {
            return new SqliteTables(sqlite).read();
        } catch (IllegalArgumentException e) {
            throw QuernException.data("cannot load " + sqliteFile + ": " + e.getMessage(), e);
        }
    }

    private Connection openTarget() throws SQLException {
        String url = target.expand();
        Properties properties = new Properties();
        if (target.engine() == Engine.DUCKDB) {
            Path base = Path.of("").toAbsolutePath();
            var file = Source.databaseFile(Engine.DUCKDB, url, base);
            properties = DuckDb.offline();
            if (file.isPresent()) {
                createParent(file.get());
                url = Engine.DUCKDB.urlPrefix() + file.get();
            }
        }
        return target.engine() == Engine.DUCKDB ? DriverManager.getConnection(url, properties)
                : target.connect(properties);
    }

    private static void createParent(Path file) {
        try {
            Path parent = file.toAbsolutePath().getParent();
            if (parent != null) {
                Files.createDirectories(parent);
            }
        } catch (IOException e) {
            throw QuernException.output("cannot create the folder for " + file + ": " + e.getMessage(), e);
        }
    }

    private List<LoadedTable> copy(Connection sqlite, Connection out, List<SqliteTables.Table> tables)
            throws SQLException {
        List<String> existing = new ArrayList<>();
        for (SqliteTables.Table t : tables) {
            if (exists(out, t.name())) {
                existing.add(t.name());
            }
        }
        if (!existing.isEmpty() && !replace) {
            throw QuernException.data("the target " + target.display() + " already has "
                    + (existing.size() == 1 ? "a table " : "tables ") + String.join(", ", existing)
                    + "; nothing was written. Load into an empty schema or database, or pass --replace to drop"
                    + " and load " + (existing.size() == 1 ? "it" : "them") + " again");
        }
        List<String> created = new ArrayList<>();
        List<LoadedTable> loaded = new ArrayList<>();
        boolean autoCommit = out.getAutoCommit();
        out.setAutoCommit(false);
        try {
            for (SqliteTables.Table t : tables) {
                progress.stage("loading " + t.name());
                if (existing.contains(t.name())) {
                    execute(out, "drop table " + dialect.quote(t.name()));
                }
                execute(out, createTable(t));
                created.add(t.name());
                insertRows(sqlite, out, t);
                List<String> indexes = new ArrayList<>();
                for (String[] index : indexes(t)) {
                    execute(out, index[1]);
                    indexes.add(index[0]);
                }
                loaded.add(new LoadedTable(t.name(), t.rows(), columns(t), t.primaryKey(), indexes));
            }
            out.commit();
        } catch (SQLException | RuntimeException e) {
            undo(out, created);
            throw e;
        } finally {
            out.setAutoCommit(autoCommit);
        }
        progress.stage("analysing");
        for (SqliteTables.Table t : tables) {
            for (String statement : dialect.afterLoad(t.name())) {
                execute(out, statement);
            }
        }
        return loaded;
    }

    /** Rolls back, and where DDL committed itself, drops the tables this load created. */
    private void undo(Connection out, List<String> created) {
        try {
            out.rollback();
            if (!dialect.transactionalDdl()) {
                out.setAutoCommit(true);
                for (String table : created) {
                    execute(out, "drop table if exists " + dialect.quote(table));
                }
            }
        } catch (SQLException ignored) {
            // The load's own failure is the one to report.
        }
    }

    /** Asks the engine itself, so that its own rules for identifier case and schemas decide. */
    private boolean exists(Connection out, String table) {
        try (Statement s = out.createStatement()) {
            s.executeQuery("select 1 from " + dialect.quote(table) + " where 1 = 0").close();
            return true;
        } catch (SQLException e) {
            return false;
        }
    }

    private String createTable(SqliteTables.Table t) {
        List<String> parts = new ArrayList<>();
        for (SqliteTables.Column c : t.columns()) {
            parts.add(dialect.quote(c.name()) + " " + dialect.type(c) + (c.notNull() ? " not null" : ""));
        }
        if (!t.primaryKey().isEmpty()) {
            parts.add("primary key (" + quoted(t.primaryKey()) + ")");
        }
        return "create table " + dialect.quote(t.name()) + " (" + String.join(", ", parts) + ")"
                + dialect.tableOptions();
    }

    /**
     * SQLite's own indexes, then one on each column that references another table or holds a time, unless
     * an index already starts with it: pairs of (name, statement).
     */
    private List<String[]> indexes(SqliteTables.Table t) {
        if (!dialect.secondaryIndexes()) {
            return List.of();
        }
        Set<String> leading = new LinkedHashSet<>();
        if (!t.primaryKey().isEmpty()) {
            leading.add(t.primaryKey().get(0));
        }
        Set<String> names = new LinkedHashSet<>();
        List<String[]> out = new ArrayList<>();
        for (SqliteTables.Index index : t.indexes()) {
            if (index.columns().stream().allMatch(c -> indexable(t, c))) {
                out.add(index(t.name(), index.name(), index.unique(), index.columns(), names));
                leading.add(index.columns().get(0));
            }
        }
        Set<String> wanted = new LinkedHashSet<>(t.references());
        t.columns().stream().filter(c -> c.kind() == ColumnKind.DATE || c.kind() == ColumnKind.TIMESTAMP)
                .forEach(c -> wanted.add(c.name()));
        for (String column : wanted) {
            if (!leading.contains(column) && indexable(t, column)) {
                out.add(index(t.name(), t.name() + "_" + column + "_idx", false, List.of(column), names));
                leading.add(column);
            }
        }
        return out;
    }

    private boolean indexable(SqliteTables.Table t, String column) {
        return t.columns().stream().filter(c -> c.name().equals(column)).allMatch(dialect::indexable);
    }

    private String[] index(String table, String name, boolean unique, List<String> columns, Set<String> names) {
        String unclashed = name.length() > MAX_NAME ? name.substring(0, MAX_NAME) : name;
        for (int i = 2; !names.add(unclashed.toLowerCase(Locale.ROOT)); i++) {
            String suffix = "_" + i;
            unclashed = name.substring(0, Math.min(name.length(), MAX_NAME - suffix.length())) + suffix;
        }
        return new String[] {unclashed, "create " + (unique ? "unique " : "") + "index " + dialect.quote(unclashed)
                + " on " + dialect.quote(table) + " (" + quoted(columns) + ")"};
    }

    private void insertRows(Connection sqlite, Connection out, SqliteTables.Table t) throws SQLException {
        List<SqliteTables.Column> columns = t.columns();
        int perInsert = Math.max(1, Math.min(MAX_ROWS_PER_INSERT, VALUES_PER_INSERT / columns.size()));
        String select = "select " + columns.stream().map(c -> SqliteTables.quote(c.name()))
                .collect(Collectors.joining(", ")) + " from " + SqliteTables.quote(t.name());
        long copied = 0;
        try (Statement read = sqlite.createStatement(); ResultSet rs = read.executeQuery(select);
             PreparedStatement full = out.prepareStatement(insert(t, perInsert))) {
            List<Object[]> pending = new ArrayList<>(perInsert);
            while (rs.next()) {
                Object[] row = new Object[columns.size()];
                for (int i = 0; i < row.length; i++) {
                    row[i] = value(t, columns.get(i), rs, i + 1);
                }
                pending.add(row);
                if (pending.size() == perInsert) {
                    write(full, pending);
                    copied += pending.size();
                    pending.clear();
                    progress.rows(copied);
                }
            }
            if (!pending.isEmpty()) {
                try (PreparedStatement rest = out.prepareStatement(insert(t, pending.size()))) {
                    write(rest, pending);
                }
            }
        }
    }

    private String insert(SqliteTables.Table t, int rows) {
        String row = "(" + String.join(", ", Collections.nCopies(t.columns().size(), "?")) + ")";
        return "insert into " + dialect.quote(t.name()) + " ("
                + quoted(t.columns().stream().map(SqliteTables.Column::name).toList()) + ") values "
                + String.join(", ", Collections.nCopies(rows, row));
    }

    private static void write(PreparedStatement insert, List<Object[]> rows) throws SQLException {
        int p = 1;
        for (Object[] row : rows) {
            for (Object value : row) {
                insert.setObject(p++, value);
            }
        }
        insert.executeUpdate();
    }

    /** The value in the Java type its target column takes; SQLite converts between storage classes itself. */
    private Object value(SqliteTables.Table t, SqliteTables.Column c, ResultSet rs, int i) throws SQLException {
        Object raw = rs.getObject(i);
        if (raw == null) {
            return null;
        }
        try {
            return switch (c.kind()) {
                case INTEGER -> rs.getLong(i);
                case DOUBLE -> rs.getDouble(i);
                case TEXT -> rs.getString(i);
                case DATE -> LocalDate.parse(rs.getString(i));
                case TIMESTAMP -> LocalDateTime.parse(rs.getString(i).replace(' ', 'T'));
                case BLOB -> rs.getBytes(i);
            };
        } catch (DateTimeParseException e) {
            throw QuernException.data(t.name() + "." + c.name() + " holds '" + rs.getString(i)
                    + "', which is not a " + c.kind().name().toLowerCase(Locale.ROOT), e);
        }
    }

    private List<LoadedColumn> columns(SqliteTables.Table t) {
        return t.columns().stream().map(c -> new LoadedColumn(c.name(), c.declaredType(), c.kind(), dialect.type(c)))
                .toList();
    }

    private String quoted(List<String> names) {
        return names.stream().map(dialect::quote).collect(Collectors.joining(", "));
    }

    private static void execute(Connection c, String sql) throws SQLException {
        try (Statement s = c.createStatement()) {
            s.execute(sql);
        }
    }
}
