package dev.quern.spark;

import dev.quern.load.DatabaseLoader;
import dev.quern.run.Progress;
import dev.quern.schema.DuckDb;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import org.apache.spark.sql.classic.SparkSession;

/**
 * What the Spark tests share in one test JVM: a local Spark (two threads, no web UI; starting one takes
 * seconds) and the shipped sample exported to Parquet, one file per table, typed as {@code quern load}
 * types it (dates as DATE, times as TIMESTAMP) and written by DuckDB's COPY.
 */
public final class SparkSample {

    static final Path SAMPLE = Path.of("sample-db", "cycle-club.sqlite").toAbsolutePath();
    static final Path DEMO = Path.of("recipes", "member-churn.yaml");
    static final List<String> TABLES =
            List.of("cancellations", "members", "payments", "plans", "rides", "stations", "tickets");

    private static SparkSession session;
    private static Path parquet;

    private SparkSample() {
    }

    /** The local Spark every Quern connection in these tests opens its own session of. */
    public static synchronized SparkSession spark() {
        if (session == null) {
            session = SparkSession.builder().master("local[2]").appName("quern-tests")
                    .config("spark.ui.enabled", "false")
                    // The sample is small: Spark's default of 200 shuffle partitions would mostly schedule empty tasks.
                    .config("spark.sql.shuffle.partitions", "4")
                    .config("spark.sql.datetime.java8API.enabled", "true")
                    .getOrCreate();
        }
        return session;
    }

    /** A folder of {@code TABLE.parquet} files holding the shipped sample. */
    static synchronized Path parquetFolder() {
        spark();
        if (parquet == null) {
            try {
                Path folder = Files.createDirectories(Path.of("target", "spark-tests"));
                parquet = parquetCopy(SAMPLE, TABLES, Files.createTempDirectory(folder, "sample-"));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return parquet;
    }

    /**
     * {@code tables} of a SQLite file as {@code TABLE.parquet} files in {@code work}/parquet, typed as
     * {@code quern load} types them (by way of a DuckDB file in {@code work}).
     */
    public static Path parquetCopy(Path sqlite, List<String> tables, Path work) {
        try {
            Path duckdb = work.resolve("copy.duckdb");
            DatabaseLoader.load(sqlite, "jdbc:duckdb:" + duckdb, false, Progress.SILENT);
            Path out = Files.createDirectories(work.resolve("parquet"));
            try (Connection c = DriverManager.getConnection("jdbc:duckdb:" + duckdb, DuckDb.offline());
                 Statement s = c.createStatement()) {
                for (String table : tables) {
                    s.execute("copy " + table + " to '" + out.resolve(table + ".parquet") + "' (format parquet)");
                }
            }
            return out.toAbsolutePath();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (SQLException e) {
            throw new IllegalStateException("exporting " + sqlite + " to Parquet failed", e);
        }
    }

    /** The same tables as CSV files with a header line, as DuckDB's COPY writes them. */
    static synchronized Path csvFolder() {
        Path parquetFolder = parquetFolder();
        Path out = parquetFolder.resolveSibling("csv");
        if (!Files.isDirectory(out)) {
            try (Connection c = DriverManager.getConnection("jdbc:duckdb:", DuckDb.offline());
                 Statement s = c.createStatement()) {
                Files.createDirectories(out);
                for (String table : TABLES) {
                    s.execute("copy (select * from read_parquet('" + parquetFolder.resolve(table + ".parquet")
                            + "')) to '" + out.resolve(table + ".csv") + "' (header)");
                }
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            } catch (SQLException e) {
                throw new IllegalStateException("exporting the sample to CSV failed", e);
            }
        }
        return out;
    }

    static String source() {
        return "spark:parquet:" + parquetFolder();
    }
}
