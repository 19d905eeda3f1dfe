package dev.quern.recipe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Diagnostic;
import dev.quern.Diagnostics;
import dev.quern.Position;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class PathParserTest {

    /** The value starts at line 4, column 11, as after {@code   - from: }. */
    private static final Position START = new Position("p.yaml", 4, 11);

    private static Position col(int column) {
        return new Position("p.yaml", 4, column);
    }

    private static PathSpec ok(String text) {
        Diagnostics d = new Diagnostics();
        Optional<PathSpec> path = PathParser.parse(text, Locator.from(START), d);
        assertTrue(d.isEmpty(), () -> d.all().toString());
        return path.orElseThrow();
    }

    private static List<String> errors(String text) {
        Diagnostics d = new Diagnostics();
        assertEquals(Optional.empty(), PathParser.parse(text, Locator.from(START), d));
        return d.all().stream().map(Diagnostic::render).toList();
    }

    @Test
    void oneTable() {
        assertEquals(new PathSpec(List.of(new Hop(new Name("rides", col(11)), Optional.empty())), col(11)),
                ok("rides"));
    }

    @Test
    void hopsWithAndWithoutALinkColumnPointInsideTheText() {
        PathSpec path = ok("rides.end_station_id -> stations -> zones");
        assertEquals(List.of(
                new Hop(new Name("rides", col(11)), Optional.empty()),
                new Hop(new Name("stations", col(35)), Optional.of(new Name("end_station_id", col(17)))),
                new Hop(new Name("zones", col(47)), Optional.empty())), path.hops());
        assertEquals("rides.end_station_id -> stations -> zones", path.text());
        assertEquals("rides_stations_zones", path.defaultPrefix());
    }

    @Test
    void spacesAroundArrowsAreOptional() {
        PathSpec tight = ok("rides->stations");
        PathSpec loose = ok("rides   ->   stations");
        assertEquals(tight.text(), loose.text());
        assertEquals(col(18), tight.last().table().position());
        assertEquals(col(24), loose.last().table().position());
    }

    @Test
    void aLocatorWithoutInnerPlacesPutsEveryNameAtTheValue() {
        Diagnostics d = new Diagnostics();
        PathSpec path = PathParser.parse("rides -> stations", Locator.fixed(START), d).orElseThrow();
        assertEquals(START, path.last().table().position());
    }

    @Test
    void emptyPaths() {
        assertEquals(List.of("p.yaml:4:11: a path needs a table, e.g. rides or rides -> stations"), errors(""));
        assertEquals(List.of("p.yaml:4:11: a path needs a table, e.g. rides or rides -> stations"), errors("   "));
    }

    @Test
    void aMissingTableBesideAnArrowIsReportedAtTheArrow() {
        assertEquals(List.of("p.yaml:4:17: 'rides ->' is not a path: write a table on both sides of each '->'"),
                errors("rides ->"));
        assertEquals(List.of("p.yaml:4:11: '-> stations' is not a path: write a table on both sides of each '->'"),
                errors("-> stations"));
        assertEquals(List.of("p.yaml:4:20: 'rides -> -> stations' is not a path: write a table on both sides of"
                + " each '->'"), errors("rides -> -> stations"));
    }

    @Test
    void aPathEndsAtATable() {
        assertEquals(List.of("p.yaml:4:20: a path ends at a table, not at 'stations.zone': a link column goes"
                + " before '->'"), errors("rides -> stations.zone"));
        assertEquals(List.of("p.yaml:4:11: a path ends at a table, not at 'rides.distance_km': a link column goes"
                + " before '->'"), errors("rides.distance_km"));
    }

    @Test
    void stepsWithTooManyDotsOrEmptyParts() {
        assertEquals(List.of("p.yaml:4:11: 'a.b.c' is not a path step: write table, table -> table or"
                + " table.link_column -> table"), errors("a.b.c -> d"));
        assertEquals(List.of("p.yaml:4:11: '' is not a plain table name: use letters, digits and _, not starting"
                + " with a digit"), errors(".member_id -> members"));
        assertEquals(List.of("p.yaml:4:17: '' is not a plain link column name: use letters, digits and _, not"
                + " starting with a digit"), errors("rides. -> members"));
    }

    @Test
    void wordsNotJoinedByArrowsAreNotAPath() {
        assertEquals(List.of("p.yaml:4:11: 'rides > stations' is not a path: write table, table -> table or"
                + " table.link_column -> table"), errors("rides > stations"));
        assertEquals(List.of("p.yaml:4:11: 'rides stations' is not a path: write table, table -> table or"
                + " table.link_column -> table"), errors("rides stations"));
    }

    @Test
    void namesThatCouldCarrySqlAreRejectedWhereTheyStand() {
        assertEquals(List.of("p.yaml:4:20: 'stations;' is not a plain table name: use letters, digits and _, not"
                + " starting with a digit"), errors("rides -> stations;"));
        assertEquals(List.of("p.yaml:4:11: 'ride\"s' is not a plain table name: use letters, digits and _, not"
                + " starting with a digit"), errors("ride\"s -> stations"));
        assertEquals(List.of("p.yaml:4:11: 'my-rides' is not a plain table name: use letters, digits and _, not"
                + " starting with a digit"), errors("my-rides"));
    }

    @Test
    void everyBrokenStepIsReported() {
        assertEquals(List.of(
                "p.yaml:4:11: 'ri-des' is not a plain table name: use letters, digits and _, not starting with a digit",
                "p.yaml:4:21: 'sta-tions' is not a plain table name: use letters, digits and _, not starting with a"
                        + " digit"), errors("ri-des -> sta-tions"));
    }
}
