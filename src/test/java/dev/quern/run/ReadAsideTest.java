package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Position;
import dev.quern.QuernException;
import dev.quern.recipe.Name;
import dev.quern.schema.Source;
import dev.quern.testing.TestDatabase;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** A read aside runs on a read-only connection of its own, closes it, and hands back its result or its failure. */
class ReadAsideTest {

    @TempDir
    Path folder;

    private Source source;

    @BeforeEach
    void club() {
        Path file = folder.resolve("club.sqlite");
        try (TestDatabase db = TestDatabase.create(file)) {
            db.execute("create table members (member_id integer primary key)")
                    .insert("members", List.of(List.of(1), List.of(2), List.of(3)));
        }
        source = Source.of(new Name("jdbc:sqlite:" + file, Position.NONE), folder);
    }

    @Test
    void readsOnAReadOnlyConnectionOfItsOwn() throws SQLException {
        AtomicReference<Connection> used = new AtomicReference<>();
        try (Connection main = source.open()) {
            ReadAside<Long> members = ReadAside.start(source, main, c -> {
                used.set(c);
                long n = count(c);
                assertThrows(SQLException.class, () -> write(c));
                return n;
            });
            assertEquals(3L, members.get());
            assertNotSame(main, used.get());
            assertTrue(used.get().isClosed(), "the read's connection is closed when its result is handed over");
            assertEquals(3L, count(main), "the build's connection stays open");
        }
    }

    @Test
    void aFailedReadThrowsItsOwnFailureWhenAskedFor() throws SQLException {
        QuernException failure = QuernException.data("the read failed");
        try (Connection main = source.open()) {
            ReadAside<Long> read = ReadAside.start(source, main, c -> {
                throw failure;
            });
            assertSame(failure, assertThrows(QuernException.class, read::get));
        }
    }

    private static long count(Connection c) {
        try (Statement s = c.createStatement(); ResultSet rs = s.executeQuery("select count(*) from members")) {
            rs.next();
            return rs.getLong(1);
        } catch (SQLException e) {
            throw new IllegalStateException(e);
        }
    }

    private static void write(Connection c) throws SQLException {
        try (Statement s = c.createStatement()) {
            s.executeUpdate("insert into members values (4)");
        }
    }
}
