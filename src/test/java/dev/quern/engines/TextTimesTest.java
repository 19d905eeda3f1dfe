package dev.quern.engines;

import dev.quern.Quern;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import dev.quern.testing.Matrix;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Times kept as ISO text (not loaded by Quern, as a user's own tables might be) compare with the cutoffs'
 * day boundaries as text on every engine: '2025-01-31T23:59:59' and '2025-01-31' count on the cutoff day,
 * '2025-02-01' on the next. The tables are made with plain SQL in each engine and the matrix compared
 * with SQLite's.
 */
@ExtendWith(Databases.Extension.class)
class TextTimesTest {

    private static final List<String> TABLES = List.of(
            "create table people (id integer primary key, since varchar(30))",
            "create table ev (id integer primary key, person_id integer, happened varchar(30), v double precision)",
            "insert into people values (1, '2024-01-01'), (2, '2024-06-01 10:00:00')",
            "insert into ev values (1, 1, '2025-01-15 10:00:00', 1.5), (2, 1, '2025-01-31T23:59:59', 2.5),"
                    + " (3, 1, '2025-02-01', 9), (4, 2, '2025-01-02', 4), (5, 2, '2024-12-01 00:00:00', 3),"
                    + " (6, 2, '2025-01-31', 0.25)");

    private static final String RECIPE = """
            recipe: text-times
            source: jdbc:sqlite:none.sqlite
            entity: { table: people, key: id, since: since }
            cutoffs: { dates: [2025-01-31, 2025-02-28] }
            tables:
              ev: { key: id, time: happened, links: { person_id: people } }
            features:
              - from: ev
                windows: [30d, 365d]
                measures: [count, sum(v), mean(v), stddev(v), days_since_last, days_since_first, max(happened)]
              - lookup: ev.v
                name: last_v
            """;

    @ParameterizedTest(name = "{0}")
    @EnumSource(value = Target.class, names = {"POSTGRES", "MARIADB", "DUCKDB"})
    void textTimesGiveSqlitesMatrix(Target target, Databases db) throws SQLException {
        Built sqlite = build(db, Target.SQLITE);
        Built other = build(db, target);

        sqlite.assertSameMatrix(other, "text times on " + target);
    }

    private static Built build(Databases db, Target target) throws SQLException {
        String url = db.empty(target);
        if (target == Target.SQLITE) {
            try (Connection c = java.sql.DriverManager.getConnection(url); Statement s = c.createStatement()) {
                for (String sql : TABLES) {
                    s.execute(sql);
                }
            }
        } else {
            try (Connection c = Server.connect(url); Statement s = c.createStatement()) {
                for (String sql : TABLES) {
                    s.execute(sql);
                }
            }
        }
        Path out = db.folder().resolve("text-times-" + target + "-" + System.nanoTime());
        var summary = Quern.of(RecipeReader.parse("text-times.yaml", RECIPE), db.folder()).withSource(url)
                .build(out, Progress.SILENT);
        if (!Files.exists(out.resolve(Quern.MATRIX))) {
            throw new AssertionError("no matrix");
        }
        return new Built(summary, Matrix.read(out.resolve(Quern.MATRIX)), out);
    }
}
