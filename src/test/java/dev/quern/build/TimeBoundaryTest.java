package dev.quern.build;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import dev.quern.testing.Matrix;
import dev.quern.testing.TestDatabase;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The time boundaries of DESIGN.md, one rider per edge: a cutoff date means the end of that day; a
 * window of w is the w days (or calendar months) that end with the cutoff day; the label horizon starts
 * the day after the cutoff. Each rider has one ride placed just inside or just outside an edge.
 */
class TimeBoundaryTest {

    @TempDir
    static Path folder;

    static Matrix matrix;

    /** Rider number, when they joined, and the one ride that tests an edge. */
    private static final List<List<Object>> RIDES = new ArrayList<>();
    private static final List<List<Object>> RIDERS = new ArrayList<>();
    private static final List<List<Object>> LEAVERS = new ArrayList<>();

    private static void rider(int id, String joined, String... rides) {
        RIDERS.add(List.of(id, joined));
        for (String ride : rides) {
            RIDES.add(List.of(RIDES.size() + 1, id, ride));
        }
    }

    @BeforeAll
    static void build() {
        rider(1, "2024-01-01", "2025-03-31 23:59:59");       // last second of the cutoff day: in
        rider(2, "2024-01-01", "2025-04-01 00:00:00");       // first second after it: out
        rider(3, "2024-01-01", "2025-03-02 00:00:00");       // first second of a 30d window: in
        rider(4, "2024-01-01", "2025-03-01 23:59:59");       // exactly 30 days before the cutoff's end: out
        rider(5, "2024-01-01", "2025-02-01 00:00:00");       // Feb 2025 is the 1m window at 2025-02-28: in
        rider(6, "2024-01-01", "2025-01-31 23:59:59");       // ... and January is not
        rider(7, "2024-01-01", "2024-02-29 12:00:00");       // leap day inside the 1m window at 2024-02-29
        rider(8, "2025-03-31");                               // joined on the cutoff day: in the cohort
        rider(9, "2025-04-01");                               // joined the day after: not yet
        rider(10, "2024-01-01");                              // cancelled on the cutoff day: out
        LEAVERS.add(List.of(1, 10, "2025-03-31 08:00:00"));
        rider(11, "2024-01-01");                              // cancelled the day after: in, and labelled 1
        LEAVERS.add(List.of(2, 11, "2025-04-01 00:00:00"));
        rider(12, "2024-01-01");                              // cancels on the last day of the horizon: 1
        LEAVERS.add(List.of(3, 12, "2025-04-30 23:59:59"));
        rider(13, "2024-01-01");                              // cancels the day after the horizon: 0
        LEAVERS.add(List.of(4, 13, "2025-05-01 00:00:00"));
        rider(14, "2024-01-01", "2025-12-31 10:00:00");       // the source's last day of data

        try (TestDatabase db = TestDatabase.create(folder.resolve("club.sqlite"))) {
            db.execute("create table riders (rider_id integer primary key, joined_on text)",
                    "create table rides (ride_id integer primary key, rider_id integer, started_at text)",
                    "create table leavers (leaver_id integer primary key, rider_id integer, left_at text)");
            db.insert("riders", RIDERS).insert("rides", RIDES).insert("leavers", LEAVERS);
        }
        String recipe = """
                recipe: boundaries
                source: jdbc:sqlite:club.sqlite
                entity: { table: riders, key: rider_id, since: joined_on, until: leavers }
                cutoffs: { dates: [2024-02-29, 2025-02-28, 2025-03-31, 2025-11-30, 2025-12-02] }
                tables:
                  rides: { key: ride_id, time: started_at, links: { rider_id: riders } }
                  leavers: { key: leaver_id, time: left_at, links: { rider_id: riders } }
                label: { name: leaves_in_30d, from: leavers, horizon: 30d, value: exists }
                features:
                  - from: rides
                    windows: [30d, 1m]
                    measures: [count, days_since_last]
                """;
        Quern.of(RecipeReader.parse("boundaries.yaml", recipe), folder).build(folder.resolve("out"), Progress.SILENT);
        matrix = Matrix.read(folder.resolve("out/matrix.csv"));
    }

    private static String rides(int rider, String cutoff, String window) {
        return matrix.row(Integer.toString(rider), cutoff).get("rides_count_" + window);
    }

    @Test
    void theLastSecondOfTheCutoffDayIsSeen() {
        assertEquals("1", rides(1, "2025-03-31", "30d"));
        assertEquals("0", matrix.row("1", "2025-03-31").get("rides_days_since_last_30d"));
    }

    @Test
    void theFirstSecondAfterTheCutoffDayIsNot() {
        assertEquals("0", rides(2, "2025-03-31", "30d"));
        assertEquals("", matrix.row("2", "2025-03-31").get("rides_days_since_last_30d"));
    }

    @Test
    void aThirtyDayWindowHoldsExactlyThirtyWholeDays() {
        assertEquals("1", rides(3, "2025-03-31", "30d"));
        assertEquals("29", matrix.row("3", "2025-03-31").get("rides_days_since_last_30d"));
        assertEquals("0", rides(4, "2025-03-31", "30d"));
    }

    @Test
    void aCalendarMonthAtTheEndOfFebruaryIsFebruary() {
        assertEquals("1", rides(5, "2025-02-28", "1m"));
        assertEquals("0", rides(6, "2025-02-28", "1m"));
        assertEquals("1", rides(7, "2024-02-29", "1m"));
        // March 2025 has 31 days: 1m at 2025-03-31 starts 2025-03-01, so the 2025-03-02 ride is in.
        assertEquals("1", rides(3, "2025-03-31", "1m"));
        assertEquals("0", rides(5, "2025-03-31", "1m"));
    }

    @Test
    void anEntityJoinsTheCohortOnItsSinceDay() {
        assertTrue(matrix.has("8", "2025-03-31"));
        assertEquals("0", rides(8, "2025-03-31", "30d"));
        assertFalse(matrix.has("9", "2025-03-31"));
        assertTrue(matrix.has("9", "2025-11-30"));
    }

    @Test
    void anEntityLeavesTheCohortOnTheDayItExits() {
        assertFalse(matrix.has("10", "2025-03-31"));
        assertTrue(matrix.has("10", "2025-02-28"));
        assertTrue(matrix.has("11", "2025-03-31"));
        assertFalse(matrix.has("11", "2025-11-30"));
    }

    @Test
    void theLabelHorizonIsTheDaysAfterTheCutoff() {
        assertEquals("1", matrix.row("11", "2025-03-31").get("leaves_in_30d"));
        assertEquals("1", matrix.row("12", "2025-03-31").get("leaves_in_30d"));
        assertEquals("0", matrix.row("13", "2025-03-31").get("leaves_in_30d"));
        assertEquals("0", matrix.row("1", "2025-03-31").get("leaves_in_30d"));
    }

    @Test
    void aHorizonNotYetObservedGivesAnEmptyLabel() {
        // The data ends 2025-12-31. The horizon of 2025-11-30 runs to 2025-12-30: observed, never empty.
        // The horizon of 2025-12-02 runs to 2026-01-01, one day past the data: empty for every row.
        assertTrue(matrix.rows().stream().filter(r -> r.get("cutoff").equals("2025-11-30"))
                .noneMatch(r -> r.get("leaves_in_30d").isEmpty()));
        assertTrue(matrix.rows().stream().filter(r -> r.get("cutoff").equals("2025-12-02"))
                .allMatch(r -> r.get("leaves_in_30d").isEmpty()));
        assertTrue(matrix.has("1", "2025-12-02"));
    }

    @Test
    void rowsAreOrderedByCutoffThenKey() {
        List<String> order = matrix.rows().stream().map(r -> r.get("cutoff") + "/" + String.format("%03d",
                Integer.parseInt(r.get("rider_id")))).toList();
        assertEquals(order.stream().sorted().toList(), order);
    }
}
