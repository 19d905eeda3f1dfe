package dev.quern.schema;

import dev.quern.QuernException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Properties;
import java.util.stream.Stream;
import org.jooq.impl.DSL;

/** Connection settings every DuckDB connection of Quern's gets, and DuckDB reading a folder of files. */
public final class DuckDb {

    /** The driver's property for opening a file database read-only. */
    public static final String READ_ONLY = "duckdb.read_only";

    private DuckDb() {
    }

    /**
     * DuckDB installs a missing extension from the network on first use; Quern never wants a build to
     * download code, and offline machines would wait for a timeout. Built-in readers (CSV, Parquet) need none.
     */
    public static Properties offline() {
        Properties p = new Properties();
        p.setProperty("autoinstall_known_extensions", "false");
        return p;
    }

    /**
     * For connections Quern reads a source through: offline, and streaming results, without which the
     * driver materialises a whole result before handing over its first row.
     */
    static Properties reading() {
        Properties p = offline();
        p.setProperty("jdbc_stream_results", "true");
        return p;
    }

    /**
     * An in-memory DuckDB in which each file of {@code folder} is a table named after it: {@code rides.csv}
     * (also {@code .tsv}, {@code .csv.gz}) through read_csv, with types detected from every row;
     * {@code rides.parquet}, or a subfolder {@code rides/} of Parquet files, through read_parquet. The files
     * are read once, into memory; then every file system operation is switched off and the configuration
     * locked. Views over the files would leave the folder writable: DuckDB's allowed_directories lets
     * {@code COPY ... TO} overwrite a file in it, which this way no statement can.
     */
    static Connection openFolder(Path folder) throws SQLException {
        Map<String, String> views = views(folder.toAbsolutePath().normalize());
        if (views.isEmpty()) {
            throw QuernException.data("the folder " + folder + " holds no .csv, .tsv, .csv.gz or .parquet file"
                    + " (nor a subfolder of .parquet files) to read as a table");
        }
        Connection c = DriverManager.getConnection(Engine.DUCKDB.urlPrefix(), reading());
        try (Statement s = c.createStatement()) {
            for (Map.Entry<String, String> view : views.entrySet()) {
                s.execute("create table " + Engine.DUCKDB.sql().render(DSL.name(view.getKey())) + " as select * from "
                        + view.getValue());
            }
            return sealed(c);
        } catch (SQLException | RuntimeException e) {
            c.close();
            throw e;
        }
    }

    /**
     * Switches off every file system operation of an open connection ({@code COPY ... TO}, read_csv,
     * ATTACH) and locks the configuration so that no statement can switch it back. The databases the
     * connection has open stay readable.
     */
    static Connection sealed(Connection c) throws SQLException {
        try (Statement s = c.createStatement()) {
            s.execute("set enable_external_access = false");
            s.execute("set lock_configuration = true");
            return c;
        } catch (SQLException e) {
            c.close();
            throw e;
        }
    }

    private static Map<String, String> views(Path folder) {
        Map<String, String> views = new LinkedHashMap<>();
        List<Path> entries;
        try (Stream<Path> list = Files.list(folder)) {
            entries = list.sorted().toList();
        } catch (IOException e) {
            throw QuernException.data("cannot list the folder " + folder + ": " + e.getMessage(), e);
        }
        for (Path p : entries) {
            String file = p.getFileName().toString();
            String lower = file.toLowerCase(Locale.ROOT);
            String name = null;
            String reader = null;
            if (Files.isRegularFile(p)) {
                for (String ending : List.of(".csv.gz", ".csv", ".tsv")) {
                    if (name == null && lower.endsWith(ending)) {
                        name = file.substring(0, file.length() - ending.length());
                        reader = "read_csv(" + literal(p.toString()) + ", header = true, sample_size = -1)";
                    }
                }
                if (lower.endsWith(".parquet")) {
                    name = file.substring(0, file.length() - ".parquet".length());
                    reader = "read_parquet(" + literal(p.toString()) + ")";
                }
            } else if (Files.isDirectory(p) && hasParquet(p)) {
                name = file;
                reader = "read_parquet(" + literal(p.resolve("*.parquet").toString()) + ")";
            }
            if (name != null) {
                String earlier = views.put(name, reader);
                if (earlier != null) {
                    throw QuernException.data("the folder " + folder + " holds two files for the table '" + name
                            + "'; keep one");
                }
            }
        }
        return views;
    }

    private static boolean hasParquet(Path folder) {
        try (Stream<Path> list = Files.list(folder)) {
            return list.anyMatch(f -> f.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".parquet"));
        } catch (IOException e) {
            return false;
        }
    }

    private static String literal(String text) {
        return "'" + text.replace("'", "''") + "'";
    }
}
