package dev.quern.engines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.quern.Position;
import dev.quern.recipe.Name;
import dev.quern.schema.Source;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.List;
import org.junit.jupiter.api.extension.ExtendWith;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * A build changes nothing in its source on any engine: every table's checksum after building the demo
 * recipe is the one taken right after the sample was loaded; and the connection Quern reads through
 * refuses writes itself, so that even a faulty query could not change a row.
 */
@ExtendWith(Databases.Extension.class)
class ReadOnlyTest {

    @ParameterizedTest(name = "{0}")
    @EnumSource(Target.class)
    void buildingChangesNoRowOfTheSource(Target target, Databases db) throws SQLException {
        String url = db.sample(target);

        db.built(Databases.DEMO, target);

        assertEquals(db.checksumsAtLoad(target), Checksums.of(url, Databases.SAMPLE_TABLES));
        assertEquals(db.checksumsAtLoad(Target.SQLITE), db.checksumsAtLoad(target),
                "the loaded tables hold SQLite's values");
    }

    @ParameterizedTest(name = "{0}")
    @EnumSource(Target.class)
    void theSourceConnectionRefusesWrites(Target target, Databases db) throws SQLException {
        String url = db.sample(target);
        try (Connection c = Source.of(new Name(url, Position.NONE), Path.of("").toAbsolutePath()).open()) {
            for (String write : List.of("delete from stations", "update members set home_zone = 'x'",
                    "insert into stations (station_id, name, zone, docks) values (999, 'x', 'x', 1)",
                    "create table quern_probe (x integer)", "drop table tickets")) {
                assertThrows(SQLException.class, () -> {
                    try (Statement s = c.createStatement()) {
                        s.execute(write);
                    }
                }, target + " ran '" + write + "' on a read-only connection");
            }
        }
        assertEquals(db.checksumsAtLoad(target), Checksums.of(url, Databases.SAMPLE_TABLES));
    }
}
