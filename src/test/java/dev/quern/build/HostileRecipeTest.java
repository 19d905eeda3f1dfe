package dev.quern.build;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Failure;
import dev.quern.Quern;
import dev.quern.QuernException;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import dev.quern.testing.Matrix;
import dev.quern.testing.TestDatabase;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Recipes written to break out of their SQL: quotes, semicolons, comments, {@code union select}, stacked
 * statements and look-alike letters in names, literals and expressions. Names must be refused before any
 * SQL exists; literals must stay data. After each, a sentinel table in the source is unchanged and the
 * matrix holds only the rows the recipe asks for.
 */
class HostileRecipeTest {

    @TempDir
    Path folder;

    private static final String TEMPLATE = """
            recipe: hostile
            source: jdbc:sqlite:club.sqlite
            entity: { table: members, key: member_id }
            cutoffs: { dates: [2025-03-31] }
            tables:
              rides: { key: ride_id, time: started_at, links: { member_id: members } }
            features:
              - from: rides
                windows: [30d]
                measures: [count]
                where: "%s"
            """;

    @BeforeEach
    void database() {
        try (TestDatabase db = TestDatabase.create(folder.resolve("club.sqlite"))) {
            db.execute("create table members (member_id integer primary key, note text)",
                    "create table rides (ride_id integer primary key, member_id integer, started_at text, kind text)",
                    "create table sentinel (secret text)",
                    "insert into sentinel values ('untouched')");
            db.insert("members", List.of(List.of(1, "a"), List.of(2, "b")));
            db.insert("rides", List.of(List.of(1, 1, "2025-03-30 10:00:00", "x'; drop table sentinel; --"),
                    List.of(2, 1, "2025-03-30 11:00:00", "plain"), List.of(3, 2, "2025-03-30 12:00:00", "plain")));
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {
        "kind = 'x''; drop table sentinel; --'",
        "kind = 'plain'' union select secret from sentinel --'",
        "kind = 'plain'; delete from sentinel",
        "kind = 'plain' /* comment */ or 1 = 1",
        "kind = 'plain' -- or 1 = 1",
        "ｋｉｎｄ = 'plain'",
        "kind = \\\"plain\\\"",
    })
    void expressionsNeverBecomeSqlText(String where) throws Exception {
        String recipe = TEMPLATE.formatted(where);
        try {
            Quern.of(RecipeReader.parse("hostile.yaml", recipe), folder).build(folder.resolve("out"), Progress.SILENT);
            Matrix m = Matrix.read(folder.resolve("out/matrix.csv"));
            assertEquals(2, m.rows().size(), "one row per member, no extra rows: " + where);
            int counted = m.rows().stream().mapToInt(r -> Integer.parseInt(r.get("rides_count_30d"))).sum();
            assertTrue(counted <= 3, "a filter can only drop rides: " + where);
        } catch (QuernException e) {
            assertEquals(Failure.RECIPE, e.failure(), "refused as a recipe mistake: " + e.getMessage());
            assertTrue(e.getMessage().startsWith("hostile.yaml:11:"), e.getMessage());
        }
        assertSentinelUntouched();
    }

    @Test
    void aQuotedLiteralMatchesOnlyItsOwnText() throws Exception {
        String recipe = TEMPLATE.formatted("kind = 'x''; drop table sentinel; --'");
        Quern.of(RecipeReader.parse("hostile.yaml", recipe), folder).build(folder.resolve("out"), Progress.SILENT);
        Matrix m = Matrix.read(folder.resolve("out/matrix.csv"));
        assertEquals("1", m.row("1", "2025-03-31").get("rides_count_30d"));
        assertEquals("0", m.row("2", "2025-03-31").get("rides_count_30d"));
        assertSentinelUntouched();
    }

    @ParameterizedTest
    @ValueSource(strings = {
        "rides; drop table sentinel",
        "\\\"rides\\\"",
        "rides--",
        "rides union select secret from sentinel",
        "ｒｉｄｅｓ",
    })
    void tableAndColumnNamesMustBePlainIdentifiers(String name) throws Exception {
        String recipe = TEMPLATE.formatted("kind = 'plain'").replace("from: rides", "from: \"" + name + "\"");
        QuernException e = assertThrows(QuernException.class, () -> Quern.of(RecipeReader.parse("hostile.yaml", recipe),
                folder).build(folder.resolve("out"), Progress.SILENT));
        assertEquals(Failure.RECIPE, e.failure());
        assertTrue(!Files.exists(folder.resolve("out/matrix.csv")));
        assertSentinelUntouched();
    }

    private void assertSentinelUntouched() throws Exception {
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + folder.resolve("club.sqlite"));
             ResultSet rs = c.createStatement().executeQuery("select count(*), min(secret) from sentinel")) {
            rs.next();
            assertEquals(1, rs.getInt(1));
            assertEquals("untouched", rs.getString(2));
        }
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + folder.resolve("club.sqlite"));
             ResultSet rs = c.createStatement().executeQuery("select count(*) from rides")) {
            rs.next();
            assertEquals(3, rs.getInt(1), "no ride deleted");
        }
    }
}
