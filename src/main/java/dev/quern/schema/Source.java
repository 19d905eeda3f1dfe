package dev.quern.schema;

import dev.quern.QuernException;
import dev.quern.recipe.Name;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Arrays;
import java.util.Objects;
import java.util.Optional;
import java.util.Properties;
import java.util.function.UnaryOperator;
import org.sqlite.SQLiteConfig;
import org.sqlite.SQLiteOpenMode;

/**
 * The database a recipe reads, opened read-only on every engine. The URL as written may name environment
 * variables ({@code ${PGPASSWORD}}) and holds no credential of its own (see {@link ConnectionUrl}); they are
 * expanded only when connecting, so no secret is ever kept in a value that might be printed.
 * {@link #display()} is the safe form for messages and provenance.
 */
public final class Source {

    private static final byte[] SQLITE_HEADER = "SQLite format 3\0".getBytes(StandardCharsets.US_ASCII);
    private static final String DUCKDB_MEMORY = ":memory:";

    private final ConnectionUrl url;
    private final Path baseDirectory;

    private Source(ConnectionUrl url, Path baseDirectory) {
        this.url = url;
        this.baseDirectory = baseDirectory;
    }

    /** The source named by {@code url}; relative SQLite and DuckDB paths are read from {@code baseDirectory}. */
    public static Source of(Name url, Path baseDirectory) {
        return of(url, baseDirectory, System::getenv);
    }

    static Source of(Name url, Path baseDirectory, UnaryOperator<String> environment) {
        Objects.requireNonNull(baseDirectory, "baseDirectory");
        return new Source(ConnectionUrl.of(url.text(), url.position(), "source", environment), baseDirectory);
    }

    public Engine engine() {
        return url.engine();
    }

    /** The URL as written, with any password in it masked: safe to print. */
    public String display() {
        return url.display();
    }

    static String display(String url) {
        return ConnectionUrl.display(url);
    }

    /** The database file, for SQLite sources and DuckDB sources that are one (not a folder of files). */
    public Optional<Path> file() {
        return databaseFile(url.engine(), url.expand(), baseDirectory).filter(p -> !Files.isDirectory(p));
    }

    /**
     * The file a SQLite or DuckDB URL names, resolved from {@code baseDirectory}; empty for servers and for
     * DuckDB's in-memory database.
     */
    public static Optional<Path> databaseFile(Engine engine, String expandedUrl, Path baseDirectory) {
        if (engine != Engine.SQLITE && engine != Engine.DUCKDB) {
            return Optional.empty();
        }
        String rest = expandedUrl.substring(engine.urlPrefix().length());
        if (engine == Engine.SQLITE && rest.startsWith("file:")) {
            rest = rest.substring("file:".length());
        }
        // SQLite's URL options follow '?', DuckDB's follow ';'.
        int options = rest.indexOf(engine == Engine.SQLITE ? '?' : ';');
        if (options >= 0) {
            rest = rest.substring(0, options);
        }
        if (engine == Engine.DUCKDB && (rest.isEmpty() || rest.equals(DUCKDB_MEMORY))) {
            return Optional.empty();
        }
        return Optional.of(baseDirectory.resolve(rest).normalize());
    }

    /**
     * Opens a connection on which the engine itself refuses every write. A missing database file is an
     * error here, never a new empty database.
     */
    public Connection open() {
        try {
            return switch (url.engine()) {
                case SQLITE -> openSqlite();
                case DUCKDB -> openDuckDb();
                // PostgreSQL: every later transaction of the session, including each autocommitted statement,
                // is READ ONLY on the server, whatever the driver's readOnlyMode does with setReadOnly.
                case POSTGRES -> readOnly(url.connect(new Properties()),
                        "set session characteristics as transaction read only");
                // MariaDB and MySQL: the session's transaction access mode; writes then fail with
                // "Cannot execute statement in a READ ONLY transaction". The driver's setReadOnly is only a hint.
                case MYSQL -> readOnly(url.connect(new Properties()),
                        "set session transaction read only");
                // MariaDB's split-materialized optimisation computes a grouped block again for every cohort row
                // it is joined to (all cutoffs each time): the demo recipe took minutes instead of seconds.
                case MARIADB -> readOnly(url.connect(new Properties()),
                        "set session transaction read only",
                        "set session optimizer_switch = 'split_materialized=off'");
                case SPARK -> openSpark();
            };
        } catch (SQLException e) {
            // Driver messages may quote the URL, and the URL may hold a secret: say only what is safe.
            throw QuernException.data("cannot connect to " + display() + ": " + url.safeMessage(e), e);
        }
    }

    /**
     * Spark is a provided dependency: there when the jar runs under spark-submit (or in tests), absent from
     * quern.jar. Only {@code dev.quern.spark} names Spark's classes, and it is entered only for a Spark source:
     * here, and in {@code Quern.build} to have Spark write the matrix.
     */
    private Connection openSpark() {
        try {
            return dev.quern.spark.SparkSources.open(url, baseDirectory);
        } catch (NoClassDefFoundError e) {
            throw QuernException.usage("the source " + display() + " needs Apache Spark, which is not on the class"
                    + " path (missing " + e.getMessage() + "): run Quern with spark-submit --class dev.quern.cli.Main"
                    + " quern.jar ..., or put Spark's jars on the class path");
        }
    }

    private static Connection readOnly(Connection c, String... statements) throws SQLException {
        try (Statement s = c.createStatement()) {
            for (String statement : statements) {
                s.execute(statement);
            }
            c.setReadOnly(true);
            return c;
        } catch (SQLException e) {
            c.close();
            throw e;
        }
    }

    private Connection openSqlite() throws SQLException {
        Path file = existingFile();
        if (!hasSqliteHeader(file)) {
            throw QuernException.data("the source " + file + " is not a SQLite database file");
        }
        SQLiteConfig config = new SQLiteConfig();
        config.setReadOnly(true);
        config.setOpenMode(SQLiteOpenMode.READONLY);
        return DriverManager.getConnection("jdbc:sqlite:" + file, config.toProperties());
    }

    /**
     * DuckDB opens a file database with {@code duckdb.read_only}, which the engine enforces ("Cannot execute
     * statement of type INSERT ... in read-only mode"). An in-memory database cannot be opened read-only,
     * and holds nothing of the user's to protect. Read-only still lets {@code COPY ... TO} write files, so
     * file system access is then switched off ({@link DuckDb#sealed}). A folder is read as CSV and Parquet files, one view each
     * (see {@link DuckDb#openFolder}).
     */
    private Connection openDuckDb() throws SQLException {
        Optional<Path> path = databaseFile(Engine.DUCKDB, url.expand(), baseDirectory);
        Properties properties = DuckDb.reading();
        if (path.isEmpty()) {
            return DriverManager.getConnection(Engine.DUCKDB.urlPrefix(), properties);
        }
        if (Files.isDirectory(path.get())) {
            return DuckDb.openFolder(path.get());
        }
        Path existing = existingFile();
        properties.setProperty(DuckDb.READ_ONLY, "true");
        return DuckDb.sealed(DriverManager.getConnection(Engine.DUCKDB.urlPrefix() + existing, properties));
    }

    private Path existingFile() {
        Path file = file().orElseThrow();
        if (!Files.isRegularFile(file)) {
            throw QuernException.data("the source database " + file + " does not exist (source '"
                    + display() + "' at " + url.position()
                    + "); check the path, which is read from the recipe's folder");
        }
        return file;
    }

    private static boolean hasSqliteHeader(Path file) {
        try (InputStream in = Files.newInputStream(file)) {
            return Arrays.equals(in.readNBytes(SQLITE_HEADER.length), SQLITE_HEADER);
        } catch (IOException e) {
            throw QuernException.data("cannot read the source database " + file + ": " + e.getMessage(), e);
        }
    }

    @Override
    public String toString() {
        return display();
    }
}
