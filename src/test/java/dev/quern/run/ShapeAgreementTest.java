package dev.quern.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import dev.quern.sql.BlockShape;
import dev.quern.testing.TestDatabase;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The ordered scan and the range join must write the same matrix, byte for byte, on the rows where they
 * could part ways: keys that sort differently as UTF-16 and as UTF-8, keys in the source that are not in the
 * cohort, entities without rows, empty values, mixed whole and decimal numbers, text measures, rule
 * exclusions, filters, a dangling hop and a derived column over block columns.
 */
class ShapeAgreementTest {

    @TempDir
    Path folder;

    @Test
    void textKeysInEveryOrderAndAwkwardValuesGiveTheSameMatrix() throws IOException {
        // U+FFFD sorts after U+1F6B2 in UTF-16 (a surrogate pair starts with U+D83D) but before it as code
        // points, the order SQLite's binary collation uses: a merge that followed String.compareTo would lose
        // rows here.
        List<String> keys = List.of("a", "B", "b", "é", "\uFFFD", "\uD83D\uDEB2", "z9", "z10", "");
        List<List<Object>> riders = new ArrayList<>();
        List<List<Object>> rides = new ArrayList<>();
        for (int i = 0; i < keys.size(); i++) {
            riders.add(List.of(keys.get(i), "2024-01-01", i % 3 == 0 ? "north" : "south"));
            for (int r = 0; r < i * 3; r++) {
                int month = 1 + (r * 5 + i) % 12;
                int day = 1 + (r * 7 + i) % 28;
                Object distance = r % 4 == 0 ? (Object) (long) r : (Object) (r + 0.25 * i);
                rides.add(list(rides.size() + 1, keys.get(i), String.format("2024-%02d-%02d %02d:15:00", month, day, r % 24),
                        r % 5 == 0 ? null : distance, r % 3 == 0 ? "s1" : r % 3 == 1 ? "s2" : "gone",
                        r % 2 == 0 ? "ok" : "late"));
            }
        }
        // Rows of riders who are not in the cohort, sorting between, before and after those who are.
        rides.add(list(900, "A", "2024-06-01 10:00:00", 5.0, "s1", "ok"));
        rides.add(list(901, "b0", "2024-06-01 10:00:00", 5.0, "s1", "ok"));
        rides.add(list(902, "\uD83D\uDEB3", "2024-06-01 10:00:00", 5.0, "s1", "ok"));
        rides.add(list(903, null, "2024-06-01 10:00:00", 5.0, "s1", "ok"));
        rides.add(list(904, "a", null, 5.0, "s1", "ok"));
        rides.add(list(905, "a", "2024-06-01T07:00:00", 12345.5, "s2", "ok"));  // excluded by the rule
        try (TestDatabase db = TestDatabase.create(folder.resolve("club.sqlite"))) {
            db.execute("create table riders (rider_id text primary key, joined_on text, zone text)",
                    "create table rides (ride_id integer primary key, rider_id text, started_at text,"
                            + " distance real, station_id text, status text)",
                    "create table stations (station_id text primary key, zone text)");
            db.insert("riders", riders).insert("rides", rides)
                    .insert("stations", List.of(List.of("s1", "hills"), List.of("s2", "river")));
        }
        String recipe = """
                recipe: shapes
                source: jdbc:sqlite:club.sqlite
                entity: { table: riders, key: rider_id, since: joined_on }
                cutoffs: { dates: [2024-03-31, 2024-06-30, 2024-09-30, 2024-12-31] }
                tables:
                  rides: { key: ride_id, time: started_at, links: { rider_id: riders, station_id: stations } }
                  stations: { key: station_id }
                rules:
                  - table: rides
                    check: "distance is null or distance < 1000"
                    reason: "no ride is a thousand kilometres"
                features:
                  - from: rides
                    windows: [30d, 90d, 1y]
                    measures: [count, sum(distance), mean(distance), stddev(distance), min(distance), max(distance),
                               distinct(distance), min(status), max(status), days_since_first, days_since_last]
                  - from: rides
                    windows: [90d]
                    measures: [count, sum(distance)]
                    where: "status = 'late'"
                    prefix: late
                  - from: rides.station_id -> stations
                    windows: [1y]
                    measures: [distinct(zone), count]
                    prefix: station
                  - name: late_share
                    expr: "late_count_90d / nullif(rides_count_90d * 1.0, 0)"
                  - lookup: riders.zone
                    name: home_zone
                audit:
                  acknowledge:
                    - { check: current-state, column: station_distinct_zone_1y, reason: "stations never change zone" }
                    - { check: current-state, column: home_zone, reason: "riders never change zone" }
                """;
        Path recipeFile = folder.resolve("shapes.yaml");
        Files.writeString(recipeFile, recipe);
        String scanned = build(recipeFile, BlockShape.ORDERED_SCAN);
        String joined = build(recipeFile, BlockShape.RANGE_JOIN);
        assertTrue(scanned.lines().count() > keys.size() * 3L, "the matrix holds a row per rider and cutoff");
        assertEquals(joined, scanned);
    }

    @Test
    void integerKeysWithNegativesAndGapsGiveTheSameMatrix() throws IOException {
        List<List<Object>> riders = new ArrayList<>();
        List<List<Object>> rides = new ArrayList<>();
        long[] keys = {-40, -3, 0, 7, 8, 1_000_000_000_000L};
        for (int i = 0; i < keys.length; i++) {
            riders.add(List.of(keys[i], "2024-01-01"));
        }
        long[] riding = {-41, -40, -3, -2, 7, 9, 1_000_000_000_000L, 1_000_000_000_001L};
        for (int i = 0; i < riding.length; i++) {
            for (int r = 0; r < 5 + i; r++) {
                rides.add(List.of(rides.size() + 1, riding[i], String.format("2024-%02d-%02d", 1 + r % 6, 1 + (r * 3) % 28),
                        r * 10 + i));
            }
        }
        try (TestDatabase db = TestDatabase.create(folder.resolve("club.sqlite"))) {
            db.execute("create table riders (rider_id integer primary key, joined_on text)",
                    "create table rides (ride_id integer primary key, rider_id integer, started_at text, minutes integer)");
            db.insert("riders", riders).insert("rides", rides);
        }
        String recipe = """
                recipe: shapes
                source: jdbc:sqlite:club.sqlite
                entity: { table: riders, key: rider_id, since: joined_on }
                cutoffs: { every: month-end, from: 2024-01-31, to: 2024-07-31 }
                tables:
                  rides: { key: ride_id, time: started_at, links: { rider_id: riders } }
                features:
                  - from: rides
                    windows: [7d, 1m, 90d]
                    measures: [count, sum(minutes), mean(minutes), stddev(minutes), max(minutes), days_since_last]
                """;
        Path recipeFile = folder.resolve("shapes.yaml");
        Files.writeString(recipeFile, recipe);
        assertEquals(build(recipeFile, BlockShape.RANGE_JOIN), build(recipeFile, BlockShape.ORDERED_SCAN));
    }

    private String build(Path recipe, BlockShape shape) throws IOException {
        Path out = folder.resolve("out-" + shape.spelling());
        Quern.load(recipe).withShape(shape).build(out, Progress.SILENT);
        return Files.readString(out.resolve(Quern.MATRIX)) + Files.readString(out.resolve(Quern.DICTIONARY_CSV));
    }

    private static List<Object> list(Object... values) {
        return java.util.Arrays.asList(values);
    }
}
