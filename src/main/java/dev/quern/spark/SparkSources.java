package dev.quern.spark;

import dev.quern.QuernException;
import dev.quern.recipe.Name;
import dev.quern.schema.ConnectionUrl;
import dev.quern.schema.Engine;
import dev.quern.schema.Source;
import java.io.IOException;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DatabaseMetaData;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Properties;
import java.util.TreeMap;
import java.util.regex.Pattern;
import org.apache.hadoop.fs.FileStatus;
import org.apache.hadoop.fs.FileSystem;
import org.apache.spark.sql.DataFrameReader;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.classic.SparkSession;

/**
 * Opens a {@code spark:} source: a session of Quern's own (sharing the cluster's Spark context) with each
 * recipe table registered as a temporary view, shown as a read-only connection.
 *
 * <ul>
 * <li>{@code spark:parquet:FOLDER}: each {@code NAME.parquet} file or folder, or {@code NAME/} folder, is the
 * table NAME;</li>
 * <li>{@code spark:csv:FOLDER}: each {@code NAME.csv} file or folder, with a header line, types inferred;</li>
 * <li>{@code spark:jdbc:JDBC-URL}: each table of the database's current schema, read through Spark's JDBC
 * data source (credentials as {@code ${VARIABLES}}, handed to Spark as options, never in the URL).</li>
 * </ul>
 * A FOLDER without a scheme is read from the recipe's folder; {@code hdfs://}, {@code s3a://} and other
 * Hadoop file systems are read as they are.
 */
public final class SparkSources {

    public static final String PARQUET = "spark:parquet:";
    public static final String CSV = "spark:csv:";
    public static final String JDBC = "spark:jdbc:";

    private static final Pattern SCHEME = Pattern.compile("^[A-Za-z][A-Za-z0-9+.-]+:.*");
    private static final Pattern TABLE_NAME = Pattern.compile("[A-Za-z_][A-Za-z0-9_]*");

    private SparkSources() {
    }

    public static Connection open(ConnectionUrl url, Path baseDirectory) {
        String written = url.display();
        String lowered = written.toLowerCase(Locale.ROOT);
        SparkSession session = QuernSession.fresh();
        Map<String, Dataset<Row>> tables;
        if (lowered.startsWith(PARQUET)) {
            tables = files(session, folder(url.expand().substring(PARQUET.length()), baseDirectory), ".parquet",
                    session.read());
        } else if (lowered.startsWith(CSV)) {
            // Types are inferred from the data (one extra pass); ISO dates and times become DATE and TIMESTAMP.
            tables = files(session, folder(url.expand().substring(CSV.length()), baseDirectory), ".csv",
                    session.read().format("csv").option("header", "true").option("inferSchema", "true"));
        } else if (lowered.startsWith(JDBC)) {
            tables = jdbc(session, url.inner(JDBC), baseDirectory);
        } else {
            throw QuernException.recipe(url.position(), "the source '" + written + "' names no Spark reader: write "
                    + PARQUET + "FOLDER, " + CSV + "FOLDER or " + JDBC + "JDBC-URL");
        }
        tables.forEach((name, data) -> data.createOrReplaceTempView(name));
        return SparkConnection.of(session, tables);
    }

    private static String folder(String written, Path baseDirectory) {
        if (SCHEME.matcher(written).matches()) {
            return written;
        }
        return baseDirectory.resolve(written).toAbsolutePath().normalize().toUri().toString();
    }

    private static Map<String, Dataset<Row>> files(SparkSession session, String folder, String extension,
                                                   DataFrameReader reader) {
        Map<String, Dataset<Row>> tables = new TreeMap<>();
        try {
            org.apache.hadoop.fs.Path root = new org.apache.hadoop.fs.Path(folder);
            FileSystem fs = root.getFileSystem(session.sparkContext().hadoopConfiguration());
            if (!fs.isDirectory(root)) {
                throw QuernException.data("the source folder " + folder + " does not exist or is not a folder;"
                        + " check the path, which is read from the recipe's folder");
            }
            for (FileStatus entry : fs.listStatus(root)) {
                String name = entry.getPath().getName();
                String table = name.endsWith(extension) ? name.substring(0, name.length() - extension.length())
                        : entry.isDirectory() && extension.equals(".parquet") ? name : null;
                if (table != null && TABLE_NAME.matcher(table).matches()) {
                    tables.put(table, reader.load(entry.getPath().toString()));
                }
            }
        } catch (IOException e) {
            throw QuernException.data("cannot list the source folder " + folder + ": " + e.getMessage(), e);
        } catch (RuntimeException e) {
            if (e instanceof QuernException q) {
                throw q;
            }
            throw QuernException.data("Spark cannot read the source folder " + folder + ": " + e.getMessage(), e);
        }
        if (tables.isEmpty()) {
            throw QuernException.data("the source folder " + folder + " holds no " + extension.substring(1)
                    + " tables (NAME" + extension + " files" + (extension.equals(".parquet") ? " or NAME/ folders" : "")
                    + ")");
        }
        return tables;
    }

    /**
     * The table names come from the database's own catalogue, through a plain read-only JDBC connection;
     * each table is then a Spark view that reads it through Spark's JDBC data source.
     */
    private static Map<String, Dataset<Row>> jdbc(SparkSession session, ConnectionUrl inner, Path baseDirectory) {
        if (inner.engine() == Engine.SQLITE || inner.engine() == Engine.DUCKDB) {
            // Spark's JDBC reader opens the database on every executor with the driver's defaults, which for
            // SQLite and DuckDB files means read-write (and SQLite creates a missing file).
            throw QuernException.recipe(inner.position(), "spark:jdbc: reads database servers; a " + inner.engine().label()
                    + " file is read by its own engine (" + inner.engine().urlPrefix() + "...), or export its tables"
                    + " as Parquet and use " + PARQUET + "FOLDER");
        }
        Map<String, Dataset<Row>> tables = new LinkedHashMap<>();
        ConnectionUrl.DriverArguments arguments = inner.driverArguments(new Properties());
        // The catalogue is read through Quern's own read-only connection to the server.
        try (Connection c = Source.of(new Name(inner.written(), inner.position()), baseDirectory).open()) {
            DatabaseMetaData meta = c.getMetaData();
            try (ResultSet rs = meta.getTables(c.getCatalog(), c.getSchema(), "%", new String[] {"TABLE", "VIEW"})) {
                while (rs.next()) {
                    String table = rs.getString("TABLE_NAME");
                    if (TABLE_NAME.matcher(table).matches()) {
                        // A TIMESTAMP without time zone stays one (TIMESTAMP_NTZ): read as Spark's TIMESTAMP it
                        // would pass through the JVM's time zone on its way in.
                        DataFrameReader reader = session.read().format("jdbc").option("url", arguments.url())
                                .option("dbtable", table).option("preferTimestampNTZ", "true");
                        for (String key : arguments.properties().stringPropertyNames()) {
                            reader = reader.option(key, arguments.properties().getProperty(key));
                        }
                        tables.put(table, reader.load());
                    }
                }
            }
        } catch (SQLException e) {
            throw QuernException.data("cannot read the tables of " + inner.display() + ": " + inner.safeMessage(e), e);
        }
        return tables;
    }
}
