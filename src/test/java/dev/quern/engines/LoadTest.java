package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Failure;
import dev.quern.QuernException;
import dev.quern.cli.Main;
import dev.quern.load.ColumnKind;
import dev.quern.load.DatabaseLoader;
import dev.quern.load.LoadSummary;
import dev.quern.load.LoadedColumn;
import dev.quern.load.LoadedTable;
import dev.quern.run.Progress;
import dev.quern.testing.TestDatabase;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DatabaseMetaData;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.sql.Types;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/** {@code quern load}: the sample copied into each engine with its types, keys and indexes. */
@ExtendWith(Databases.Extension.class)
class LoadTest {

    @ParameterizedTest(name = "{0}")
    @EnumSource(value = Target.class, names = {"POSTGRES", "MARIADB", "DUCKDB"})
    void everyTableArrivesWithItsRowsAndTypedColumns(Target target, Databases db) throws SQLException {
        String url = db.sample(target);
        try (Connection c = Server.connect(url)) {
            assertEquals(62522, count(c, "rides"));
            assertEquals(1800, count(c, "members"));
            Map<String, Integer> rides = columnTypes(c, "rides");
            assertEquals(Types.BIGINT, rides.get("ride_id"));
            assertEquals(Types.TIMESTAMP, rides.get("started_at"));
            assertEquals(Types.DOUBLE, rides.get("distance_km"));
            Map<String, Integer> plans = columnTypes(c, "plans");
            assertEquals(Types.DATE, plans.get("valid_from"));
            assertEquals(Types.DATE, plans.get("valid_to"), "a date column with empty values is still a date");
            assertTrue(List.of(Types.VARCHAR, Types.LONGVARCHAR).contains(plans.get("plan")), "plan: " + plans);
            if (target != Target.DUCKDB) {
                TreeSet<String> indexed = indexedColumns(c, "rides");
                assertTrue(indexed.containsAll(List.of("ride_id", "member_id", "started_at", "start_station_id",
                        "end_station_id", "ended_at")), "indexes on keys, links and times: " + indexed);
            }
        }
        assertEquals(db.checksumsAtLoad(Target.SQLITE), db.checksumsAtLoad(target), "every value arrives unchanged");
    }

    @ParameterizedTest(name = "{0}")
    @EnumSource(value = Target.class, names = {"POSTGRES", "MARIADB", "DUCKDB"})
    void anExistingTableStopsTheLoadBeforeAnythingIsWrittenUnlessReplaced(Target target, Databases db)
            throws SQLException {
        Path file = small(db, "existing-" + target);
        String url = db.empty(target);
        DatabaseLoader.load(file, url, false, Progress.SILENT);
        try (Connection c = Server.connect(url); Statement s = c.createStatement()) {
            s.execute("delete from events where id = 2");
        }

        QuernException e = assertThrows(QuernException.class,
                () -> DatabaseLoader.load(file, url, false, Progress.SILENT));

        assertEquals(Failure.DATA, e.failure());
        assertTrue(e.getMessage().contains("already has tables events, people; nothing was written"), e.getMessage());
        assertTrue(e.getMessage().contains("--replace"), e.getMessage());
        try (Connection c = Server.connect(url)) {
            assertEquals(2, count(c, "events"), "the refused load changed the table");
        }
        LoadSummary replaced = DatabaseLoader.load(file, url, true, Progress.SILENT);
        assertEquals(5, replaced.rows());
        try (Connection c = Server.connect(url)) {
            assertEquals(3, count(c, "events"));
        }
    }

    @Test
    void typesComeFromTheValuesNotTheDeclarations(Databases db) {
        Path file = db.folder().resolve("kinds.sqlite");
        try (TestDatabase t = TestDatabase.create(file)) {
            t.execute("create table kinds (id integer primary key, whole, mixed_numbers real, day text,"
                    + " moment text, t_moment text, fraction text, not_a_day text, day_or_word text,"
                    + " day_and_moment text, empty_int integer, empty_text text, blob_col blob)",
                    "insert into kinds values (1, 5, 1, '2025-01-31', '2025-01-31 08:00:00', '2025-01-31T08:00:00',"
                            + " '2025-01-31 08:00:00.250', '2025-02-30', '2025-01-31', '2025-01-31', null, null, x'00ff')",
                    "insert into kinds values (2, 7, 2.5, null, '2025-02-01 23:59:59', '2025-02-01T00:00:00',"
                            + " '2025-02-01 00:00:00.5', '2025-01-01', 'soon', '2025-01-31 10:00:00', null, null, x'01')");
        }
        LoadSummary s = DatabaseLoader.load(file, db.empty(Target.DUCKDB), false, Progress.SILENT);
        Map<String, ColumnKind> kinds = new HashMap<>();
        LoadedTable table = s.tables().get(0);
        table.columns().forEach(c -> kinds.put(c.name(), c.kind()));
        assertEquals(Map.ofEntries(Map.entry("id", ColumnKind.INTEGER), Map.entry("whole", ColumnKind.INTEGER),
                Map.entry("mixed_numbers", ColumnKind.DOUBLE), Map.entry("day", ColumnKind.DATE),
                Map.entry("moment", ColumnKind.TIMESTAMP), Map.entry("t_moment", ColumnKind.TIMESTAMP),
                Map.entry("fraction", ColumnKind.TIMESTAMP), Map.entry("not_a_day", ColumnKind.TEXT),
                Map.entry("day_or_word", ColumnKind.TEXT), Map.entry("day_and_moment", ColumnKind.TEXT),
                Map.entry("empty_int", ColumnKind.INTEGER), Map.entry("empty_text", ColumnKind.TEXT),
                Map.entry("blob_col", ColumnKind.BLOB)), kinds);
        assertEquals(List.of("id"), table.primaryKey());
        assertEquals("timestamp", table.columns().stream().filter(c -> c.name().equals("fraction"))
                .map(LoadedColumn::targetType).findFirst().orElseThrow());
    }

    @Test
    void theCommandLoadsAndThenRefusesToOverwrite(Databases db) {
        Path file = small(db, "cli");
        String url = db.empty(Target.DUCKDB);
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();

        int loaded = Main.run(new PrintWriter(out, true), new PrintWriter(err, true), "load", file.toString(),
                "--to", url);

        assertEquals(0, loaded, err.toString());
        assertTrue(out.toString().startsWith("2 tables, 5 rows loaded into " + url), out.toString());
        assertTrue(out.toString().contains("  events: 3 rows, 3 columns; times: at timestamp; key id"), out.toString());

        StringWriter err2 = new StringWriter();
        int again = Main.run(new PrintWriter(new StringWriter(), true), new PrintWriter(err2, true), "load",
                file.toString(), "--to", url);

        assertEquals(Failure.DATA.exitCode(), again);
        assertTrue(err2.toString().contains("already has tables events, people"), err2.toString());
        assertEquals(0, Main.run(new PrintWriter(new StringWriter(), true), new PrintWriter(err2, true), "load",
                file.toString(), "--to", url, "--replace"), err2.toString());
    }

    @Test
    void aSqliteTargetIsRefused(Databases db) {
        Path file = small(db, "to-sqlite");
        QuernException e = assertThrows(QuernException.class,
                () -> DatabaseLoader.load(file, "jdbc:sqlite:/tmp/x.sqlite", false, Progress.SILENT));
        assertTrue(e.getMessage().contains("copy the file instead"), e.getMessage());
    }

    /** Two tables, five rows: people (2) and events (3, with a time and a link to people). */
    private static Path small(Databases db, String name) {
        Path file = db.folder().resolve(name + ".sqlite");
        try (TestDatabase t = TestDatabase.create(file)) {
            t.execute("create table people (id integer primary key, name text not null)",
                    "create table events (id integer primary key, person_id integer references people (id),"
                            + " at text)",
                    "insert into people values (1, 'Ann'), (2, 'Bo')",
                    "insert into events values (1, 1, '2025-01-01 10:00:00'), (2, 1, '2025-01-02 11:00:00'),"
                            + " (3, 2, '2025-01-03 12:00:00')");
        }
        return file;
    }

    private static long count(Connection c, String table) throws SQLException {
        try (Statement s = c.createStatement(); ResultSet rs = s.executeQuery("select count(*) from " + table)) {
            rs.next();
            return rs.getLong(1);
        }
    }

    private static Map<String, Integer> columnTypes(Connection c, String table) throws SQLException {
        Map<String, Integer> types = new HashMap<>();
        DatabaseMetaData meta = c.getMetaData();
        try (ResultSet rs = meta.getColumns(c.getCatalog(), c.getSchema(), table, "%")) {
            while (rs.next()) {
                types.put(rs.getString("COLUMN_NAME"), rs.getInt("DATA_TYPE"));
            }
        }
        return types;
    }

    private static TreeSet<String> indexedColumns(Connection c, String table) throws SQLException {
        TreeSet<String> columns = new TreeSet<>();
        try (ResultSet rs = c.getMetaData().getIndexInfo(c.getCatalog(), c.getSchema(), table, false, false)) {
            while (rs.next()) {
                if (rs.getShort("ORDINAL_POSITION") == 1 && rs.getString("COLUMN_NAME") != null) {
                    columns.add(rs.getString("COLUMN_NAME"));
                }
            }
        }
        return columns;
    }
}
