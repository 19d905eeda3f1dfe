package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Position;
import dev.quern.recipe.Name;
import dev.quern.schema.DuckDb;
import dev.quern.schema.Source;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.HexFormat;
import java.util.Map;
import java.util.Properties;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;

/**
 * DuckDB reads a folder of CSV and Parquet files as its source: the sample exported table by table (every
 * other one as CSV) builds SQLite's matrix, and the build leaves every file as it was.
 */
@ExtendWith(Databases.Extension.class)
class FilesFolderTest {

    @Test
    void aFolderOfCsvAndParquetFilesBuildsTheSameMatrix(Databases db) throws SQLException, IOException {
        Path folder = export(db);
        Map<String, String> before = fingerprints(folder);

        Built built = Built.build(Databases.DEMO, "jdbc:duckdb:" + folder, db.folder().resolve("files-build"));

        db.built(Databases.DEMO, Target.SQLITE).assertSameMatrix(built, "the sample as files");
        assertEquals(before, fingerprints(folder));
    }

    @Test
    void theFolderCannotBeWrittenThroughTheConnection(Databases db) throws SQLException, IOException {
        Path folder = export(db);
        Map<String, String> before = fingerprints(folder);
        try (Connection c = Source.of(new Name("jdbc:duckdb:" + folder, Position.NONE), folder).open()) {
            for (String write : new String[] {"copy (select 1 as station_id) to '" + folder.resolve("stations.csv") + "'",
                    "copy (select 1) to '" + folder.resolve("new.csv") + "'", "set enable_external_access = true"}) {
                SQLException e = assertThrows(SQLException.class, () -> {
                    try (Statement s = c.createStatement()) {
                        s.execute(write);
                    }
                }, write);
                assertTrue(e.getMessage().contains("disabled by configuration") || e.getMessage().contains("locked"),
                        e.getMessage());
            }
        }
        assertEquals(before, fingerprints(folder));
    }

    private static synchronized Path export(Databases db) throws SQLException, IOException {
        Path folder = db.folder().resolve("sample-files");
        if (Files.isDirectory(folder)) {
            return folder;
        }
        Files.createDirectories(folder);
        Properties readOnly = DuckDb.offline();
        readOnly.setProperty(DuckDb.READ_ONLY, "true");
        try (Connection c = DriverManager.getConnection(db.sample(Target.DUCKDB), readOnly);
             Statement s = c.createStatement()) {
            int i = 0;
            for (String table : Databases.SAMPLE_TABLES) {
                String file = folder.resolve(table + (i++ % 2 == 0 ? ".parquet" : ".csv")).toString();
                s.execute("copy " + table + " to '" + file + "' " + (file.endsWith(".csv") ? "(header)" : "(format parquet)"));
            }
        }
        return folder;
    }

    private static Map<String, String> fingerprints(Path folder) throws IOException {
        Map<String, String> sums = new TreeMap<>();
        try (Stream<Path> files = Files.list(folder)) {
            for (Path f : files.toList()) {
                sums.put(f.getFileName().toString(), HexFormat.of().formatHex(sha256().digest(Files.readAllBytes(f))));
            }
        }
        return sums;
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
