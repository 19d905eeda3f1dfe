package dev.quern.engines;

import dev.quern.Quern;
import dev.quern.load.DatabaseLoader;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import dev.quern.testing.Matrix;
import dev.quern.testing.TestDatabase;
import java.nio.file.Path;
import java.util.TimeZone;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Times are kept as written whatever the JVM's time zone: in Europe/Amsterdam 2025-03-30 02:30 does not
 * exist (clocks jump from 02:00 to 03:00) and 2025-10-26 02:30 happens twice. Loaded into each engine and
 * built back out, both come out as they went in, as SQLite's text does.
 */
@ExtendWith(Databases.Extension.class)
class DaylightSavingTest {

    private static final String RECIPE = """
            recipe: clocks
            source: jdbc:sqlite:none.sqlite
            entity: { table: people, key: id }
            cutoffs: { dates: [2025-03-31, 2025-10-31] }
            tables:
              events: { key: id, time: at, links: { person_id: people } }
            features:
              - from: events
                windows: [30d]
                measures: [count, max(at), min(at), days_since_last]
            """;

    private static TimeZone original;

    @BeforeAll
    static void amsterdam() {
        original = TimeZone.getDefault();
        TimeZone.setDefault(TimeZone.getTimeZone("Europe/Amsterdam"));
    }

    @AfterAll
    static void restore() {
        TimeZone.setDefault(original);
    }

    @ParameterizedTest(name = "{0}")
    @EnumSource(value = Target.class, names = {"POSTGRES", "MARIADB", "DUCKDB"})
    void timesInAClockChangeComeOutAsTheyWentIn(Target target, Databases db) {
        Path file = db.folder().resolve("clocks.sqlite");
        synchronized (DaylightSavingTest.class) {
            if (!file.toFile().exists()) {
                try (TestDatabase t = TestDatabase.create(file)) {
                    t.execute("create table people (id integer primary key)",
                            "create table events (id integer primary key, person_id integer, at text)",
                            "insert into people values (1), (2)",
                            "insert into events values (1, 1, '2025-03-30 02:30:00'), (2, 1, '2025-03-30 01:59:59'),"
                                    + " (3, 2, '2025-10-26 02:30:00'), (4, 2, '2025-10-26 02:00:00'),"
                                    + " (5, 2, '2025-03-30 03:00:00')");
                }
            }
        }
        Built sqlite = build(db, "jdbc:sqlite:" + file, "clocks-sqlite-" + target);
        String url = db.empty(target);
        DatabaseLoader.load(file, url, false, Progress.SILENT);

        sqlite.assertSameMatrix(build(db, url, "clocks-" + target), "clock changes on " + target);
    }

    private static Built build(Databases db, String url, String name) {
        Path out = db.folder().resolve(name);
        var summary = Quern.of(RecipeReader.parse("clocks.yaml", RECIPE), db.folder()).withSource(url)
                .build(out, Progress.SILENT);
        return new Built(summary, Matrix.read(out.resolve(Quern.MATRIX)), out);
    }
}
