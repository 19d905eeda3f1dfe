package dev.quern.reference;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import dev.quern.sql.BlockShape;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.RecipeReader;
import dev.quern.run.Progress;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.api.io.TempDir;

/**
 * The matrix built through the SQL path against the plain-Java {@link ReferenceEvaluator}, cell for cell:
 * the demo recipe on the shipped sample database, and a hand-made database full of boundary cases.
 */
class ReferenceMatrixTest {

    private static final Path DEMO_RECIPE = Path.of("recipes/member-churn.yaml");
    private static final Path DEMO_DB = Path.of("sample-db/cycle-club.sqlite");

    @TempDir
    static Path folder;

    @ParameterizedTest
    @EnumSource(BlockShape.class)
    void demoMatrixMatchesTheReferenceEvaluatorCellForCell(BlockShape shape) {
        Path out = folder.resolve("demo-" + shape.spelling());
        Quern.load(DEMO_RECIPE).withShape(shape).build(out, Progress.SILENT);
        MatrixComparison.Csv actual = MatrixComparison.Csv.read(out.resolve(Quern.MATRIX));
        ReferenceEvaluator.Result expected = ReferenceEvaluator.evaluate(RecipeReader.read(DEMO_RECIPE), DEMO_DB);

        assertTrue(expected.rows().size() > 10_000, "the demo cohort is large: " + expected.rows().size());
        MatrixComparison.assertMatches(expected, actual);
    }

    // ------------------------------------------------------------------ boundary cases on hand-made rows

    /**
     * Customers: 1 has every boundary case; 2 joins on the cutoff 2025-03-30 (joined_on that date, signed_up_at
     * 18:30 that day); 3 leaves on 2025-03-30 at 10:00; 4 has one visit; 5 joins after every cutoff; 10 sorts
     * after 4 as a number (before it as text).
     */
    @BeforeAll
    static void writeEdgeDatabase() throws SQLException {
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + folder.resolve("edges.sqlite"))) {
            try (Statement s = c.createStatement()) {
                s.execute("create table customers (customer_id integer primary key, joined_on text not null, "
                        + "signed_up_at text not null, name text)");
                s.execute("create table shops (shop_id integer primary key, region text, opened_on text)");
                s.execute("create table visits (visit_id integer primary key, customer_id integer not null, "
                        + "visited_at text not null, shop_id integer, spend real, item text, paid_on text)");
                s.execute("create table tiers (tier_row_id integer primary key, customer_id integer not null, "
                        + "tier text, valid_from text not null, valid_to text)");
                s.execute("create table notes (note_id integer primary key, customer_id integer not null, "
                        + "noted_at text not null, mood text)");
                s.execute("create table exits (exit_id integer primary key, customer_id integer not null, "
                        + "exited_at text not null)");
                s.execute("create table orders (order_id integer primary key, customer_id integer not null, "
                        + "ordered_at text not null, amount real)");
            }
            insert(c, "customers",
                    row(1, "2024-01-10", "2024-01-10 09:00:00", "Ada"),
                    row(2, "2025-03-30", "2025-03-30 18:30:00", "Bo"),
                    row(3, "2025-01-01", "2025-01-01 00:00:00", "Cy"),
                    row(4, "2024-06-01", "2024-06-01 12:00:00", "Di"),
                    row(5, "2026-01-01", "2026-01-01 08:00:00", "Ed"),
                    row(10, "2024-02-01", "2024-02-01 23:59:59", "Jo"));
            insert(c, "shops",
                    row(1, "north", "2020-05-01"),
                    row(2, "south", "2021-07-15"),
                    row(3, null, "2022-01-01"));
            insert(c, "visits",
                    // customer 1, around the windows of cutoff 2025-03-30 (next day N = 2025-03-31)
                    row(101, 1, "2024-03-30 12:00:00", 1, 1.0, "apple", "2024-03-30"),   // before 1y start 2024-03-31
                    row(102, 1, "2024-03-31 00:00:00", 1, 2.0, "pear", "2024-04-02"),    // first day of 1y
                    row(103, 1, "2024-09-29 22:00:00", 2, 3.0, "fig", "2024-09-29"),     // before 6m start 2024-09-30
                    row(104, 1, "2024-09-30 08:00:00", 99, 4.0, "kiwi", "2024-10-01"),   // first day of 6m; no shop 99
                    row(105, 1, "2025-01-05 23:59:59", null, 5.0, "lime", "2025-01-05"), // before 12w start 2025-01-06
                    row(106, 1, "2025-01-06 00:00:00", 2, 9.5, "date", "2025-01-07"),    // first instant of 12w
                    row(107, 1, "2025-03-10 09:00:00", 1, 100.0, "apple", "2025-03-12"),
                    row(108, 1, "2025-03-30 23:59:59", 2, 10.0, "banana", null),         // last second of the cutoff day
                    row(109, 1, "2025-03-31 00:00:00", 1, 50.0, "zucchini", "2025-03-31"), // first second after it
                    // customer 3: two equal values (standard deviation 0), one at a shop without a region
                    row(301, 3, "2025-03-20 10:00:00", 3, 7.0, "pear", "2025-03-20"),
                    row(302, 3, "2025-03-22 18:00:00", 1, 7.0, "pear", "2025-03-22"),
                    // customer 4: one visit (standard deviation empty)
                    row(401, 4, "2025-02-14 13:00:00", 1, 12.25, "melon", "2025-02-14"),
                    // customer 5 is never in the cohort
                    row(501, 5, "2025-03-01 12:00:00", 1, 1.0, "apple", "2025-03-01"),
                    // customer 10: a leap-year boundary and an empty amount
                    row(1000, 10, "2023-02-28 12:00:00", 2, 8.0, "nut", "2023-02-28"),
                    row(1001, 10, "2024-12-31 23:59:59", 2, null, "nut", null),
                    row(1002, 10, "2025-01-01 00:00:00", 2, 3.0, "nut", "2025-01-02"));
            insert(c, "tiers",
                    row(1, 1, "bronze", "2024-01-10", "2025-02-01"),
                    row(2, 1, "silver", "2025-01-15", null),
                    row(3, 1, "gold", "2025-01-15", "2025-06-01"),   // same from as silver: the greater key wins
                    row(4, 1, "platinum", "2025-03-31", null),       // in force from the day after 2025-03-30
                    row(5, 1, "expired", "2025-03-01", "2025-03-30"), // ends on the cutoff day: not in force then
                    row(6, 4, "bronze", "2024-06-01", null),
                    row(7, 10, "silver", "2025-03-30", null));       // starts on the cutoff day: in force then
            insert(c, "notes",
                    row(9, 1, "2025-01-02 08:00:00", "grumpy"),
                    row(10, 1, "2025-03-20 12:00:00", "zesty"),
                    row(11, 1, "2025-03-20 12:00:00", "calm"),       // same time as note 10: the greater key wins
                    row(12, 1, "2025-03-31 00:00:00", "late"),
                    row(13, 10, "2025-03-30 23:59:59", "sleepy"),
                    row(14, 4, "2025-05-08 09:00:00", "final")); // the latest time of any event table: O = 2025-05-08
            insert(c, "exits", row(1, 3, "2025-03-30 10:00:00"));
            insert(c, "orders",
                    row(1, 1, "2025-04-06 23:59:59", 1.0),
                    row(2, 1, "2025-04-07 00:00:00", 10.0),
                    row(3, 1, "2025-05-06 23:59:59", 100.0),
                    row(4, 1, "2025-05-07 00:00:00", 1000.0),   // the latest order, a day before the latest note
                    row(5, 4, "2025-02-20 09:00:00", 5.5),
                    row(6, 10, "2025-03-01 10:00:00", null));
        }
    }

    private static final String EDGE_RECIPE = """
            recipe: edges
            source: jdbc:sqlite:edges.sqlite
            entity: { table: customers, key: customer_id, since: %s, until: [exits] }
            cutoffs: %s
            tables:
              visits: { key: visit_id, time: visited_at, links: { customer_id: customers, shop_id: shops } }
              shops: { key: shop_id }
              tiers: { key: tier_row_id, history: { from: valid_from, to: valid_to }, links: { customer_id: customers } }
              notes: { key: note_id, time: noted_at, links: { customer_id: customers } }
              exits: { key: exit_id, time: exited_at, links: { customer_id: customers } }
              orders: { key: order_id, time: ordered_at, links: { customer_id: customers } }
            label: %s
            features:
              - from: visits
                windows: [12w, 6m, 1y]
                measures: [count, sum(spend), mean(spend), stddev(spend), min(spend), max(spend), min(item), max(item),
                           min(paid_on), max(paid_on), distinct(item), days_since_first, days_since_last]
              - from: visits -> shops
                windows: [1y]
                measures: [count, distinct(region), min(region), max(opened_on), sum(spend)]
              - from: visits
                windows: [30d]
                measures: [{ measure: count, name: "recent_visits_{window}" }]
              - lookup: tiers.tier
              - lookup: notes.mood
                name: last_mood
              - lookup: customers.name
            audit:
              acknowledge:
                - { check: current-state, column: visits_shops_distinct_region_1y, reason: "test data: fixed" }
                - { check: current-state, column: visits_shops_min_region_1y, reason: "test data: fixed" }
                - { check: current-state, column: visits_shops_max_opened_on_1y, reason: "test data: fixed" }
                - { check: current-state, column: customers_name, reason: "test data: fixed" }
            """;

    /** Builds one variant of the edge recipe and recomputes it with the evaluator. */
    private static Built buildEdges(BlockShape shape, String variant, String since, String cutoffs, String label) {
        Recipe recipe = RecipeReader.parse(variant + ".yaml", EDGE_RECIPE.formatted(since, cutoffs, label));
        Path out = folder.resolve(variant + "-" + shape.spelling());
        Quern.of(recipe, folder).withShape(shape).build(out, Progress.SILENT);
        MatrixComparison.Csv actual = MatrixComparison.Csv.read(out.resolve(Quern.MATRIX));
        ReferenceEvaluator.Result expected = ReferenceEvaluator.evaluate(recipe, folder.resolve("edges.sqlite"));
        return new Built(expected, actual);
    }

    private record Built(ReferenceEvaluator.Result expected, MatrixComparison.Csv actual) {

        void assertMatches() {
            MatrixComparison.assertMatches(expected, actual);
        }

        /** Asserts the hand-worked value on both the matrix and the evaluator ("" is empty). */
        void check(List<Executable> checks, String key, String cutoff, String column, String value) {
            checks.add(() -> assertEquals(value, actual.cell(key, cutoff, column),
                    "matrix " + column + " of " + key + " at " + cutoff));
            checks.add(() -> {
                int c = expected.columns().indexOf(column);
                Object v = expected.rows().stream()
                        .filter(r -> r.get(0).toString().equals(key) && r.get(1).equals(cutoff))
                        .findFirst().orElseThrow(() -> new AssertionError("evaluator: no row " + key + " " + cutoff))
                        .get(c);
                assertTrue(MatrixComparison.same(v, value),
                        "evaluator " + column + " of " + key + " at " + cutoff + ": " + v + ", worked out " + value);
            });
        }
    }

    @ParameterizedTest
    @EnumSource(BlockShape.class)
    void weeklyEdgeCasesMatchTheReferenceEvaluatorAndHandWorkedValues(BlockShape shape) {
        Built built = buildEdges(shape, "edges-weekly", "joined_on", "{ every: week-end, from: 2025-01-01, to: 2025-03-31 }",
                "{ name: orders_next_30d, from: orders, horizon: 30d, gap: 7d, value: count }");
        List<Executable> checks = new ArrayList<>();
        checks.add(built::assertMatches);

        // Sundays from 2025-01-01 to 2025-03-31: the first is 2025-01-05, the last 2025-03-30.
        checks.add(() -> assertEquals(List.of("2025-01-05", "2025-03-30"), List.of(built.actual().rows().get(0).get(1),
                built.actual().rows().get(built.actual().rows().size() - 1).get(1))));
        // Cohort at 2025-03-30, in key order 1, 2, 4, 10: customer 2 joined that day (in), customer 3 left at
        // 10:00 that day (out), customer 5 joins in 2026 (out); 10 follows 4 as a number.
        checks.add(() -> assertEquals(List.of("1", "2", "4", "10"), built.actual().rows().stream()
                .filter(r -> r.get(1).equals("2025-03-30")).map(r -> r.get(0)).toList()));
        checks.add(() -> assertTrue(built.actual().has("3", "2025-03-23"), "3 is still in the cohort the week before"));
        checks.add(() -> assertFalse(built.actual().has("2", "2025-03-23"), "2 has not joined yet"));

        // Customer 1 at D = 2025-03-30, N = 2025-03-31.
        // 12w starts at N - 84 days = 2025-01-06: visits 106 (00:00:00 that day), 107 and 108 (23:59:59 on D);
        // 105 (2025-01-05 23:59:59) is before it and 109 (2025-03-31 00:00:00) after D.
        String d = "2025-03-30";
        built.check(checks, "1", d, "visits_count_12w", "3");
        built.check(checks, "1", d, "visits_sum_spend_12w", "119.5");          // 9.5 + 100 + 10
        built.check(checks, "1", d, "visits_max_spend_12w", "100");            // numerically; as text 9.5 would win
        built.check(checks, "1", d, "visits_min_spend_12w", "9.5");
        built.check(checks, "1", d, "visits_min_item_12w", "apple");           // date, apple, banana
        built.check(checks, "1", d, "visits_max_item_12w", "date");
        built.check(checks, "1", d, "visits_min_paid_on_12w", "2025-01-07");
        built.check(checks, "1", d, "visits_max_paid_on_12w", "2025-03-12");   // 108 has no paid_on
        built.check(checks, "1", d, "visits_days_since_first_12w", "83");      // 2025-01-06 to 2025-03-30
        built.check(checks, "1", d, "visits_days_since_last_12w", "0");        // 108 on the cutoff day itself
        // 6m starts at N - 6 months = 2024-09-30: visits 104 to 108 (103 is on 2024-09-29).
        built.check(checks, "1", d, "visits_count_6m", "5");
        built.check(checks, "1", d, "visits_max_item_6m", "lime");
        // 1y starts at N - 1 year = 2024-03-31: visits 102 to 108 (101 is on 2024-03-30).
        built.check(checks, "1", d, "visits_count_1y", "7");
        built.check(checks, "1", d, "visits_max_item_1y", "pear");
        built.check(checks, "1", d, "visits_min_paid_on_1y", "2024-04-02");
        // Through shops over 1y: all 7 visits count (104's shop 99 does not exist, 105 has none: left join);
        // regions north (102, 107) and south (103, 106, 108); spend comes from visits, shops has none:
        // 2 + 3 + 4 + 5 + 9.5 + 100 + 10 = 133.5.
        built.check(checks, "1", d, "visits_shops_count_1y", "7");
        built.check(checks, "1", d, "visits_shops_distinct_region_1y", "2");
        built.check(checks, "1", d, "visits_shops_min_region_1y", "north");
        built.check(checks, "1", d, "visits_shops_max_opened_on_1y", "2021-07-15");
        built.check(checks, "1", d, "visits_shops_sum_spend_1y", "133.5");
        built.check(checks, "1", d, "recent_visits_30d", "2");                 // from 2025-03-01: 107, 108
        // Tiers in force at the end of 2025-03-30: silver and gold (both from 2025-01-15: gold has the greater
        // key); expired ended on 2025-03-30 itself and platinum starts the next day.
        built.check(checks, "1", d, "tiers_tier", "gold");
        // Notes 10 and 11 share a time: 11 has the greater key; note 12 is at 00:00:00 the next day.
        built.check(checks, "1", d, "last_mood", "calm");
        built.check(checks, "1", d, "customers_name", "Ada");
        // Label: N + 7d = 2025-04-07 <= day < 2025-05-07: orders 2 and 3 (1 is a second early, 4 on the end).
        built.check(checks, "1", d, "orders_next_30d", "2");
        // Customer 10 at 2025-03-30: a tier from the cutoff day and a note at 23:59:59 on it both count.
        built.check(checks, "10", d, "tiers_tier", "silver");
        built.check(checks, "10", d, "last_mood", "sleepy");
        // Customer 2 on its first day: nothing yet.
        built.check(checks, "2", d, "visits_count_12w", "0");
        built.check(checks, "2", d, "visits_sum_spend_12w", "0");
        built.check(checks, "2", d, "visits_mean_spend_12w", "");
        built.check(checks, "2", d, "tiers_tier", "");
        // Customer 3 at 2025-03-23: two equal spends of 7 give a standard deviation of 0.
        built.check(checks, "3", "2025-03-23", "visits_stddev_spend_12w", "0");
        // Customer 4 at 2025-03-30: one visit, so no standard deviation; its mean is that visit's spend.
        built.check(checks, "4", d, "visits_stddev_spend_12w", "");
        built.check(checks, "4", d, "visits_mean_spend_12w", "12.25");
        assertAll(checks);
    }

    @ParameterizedTest
    @EnumSource(BlockShape.class)
    void datedEdgeCasesMatchTheReferenceEvaluatorAndHandWorkedValues(BlockShape shape) {
        Built built = buildEdges(shape, "edges-dated", "signed_up_at",
                "{ dates: [2025-03-31, 2024-02-28, 2025-02-28, 2025-03-23, 2025-03-24, 2025-03-25, 2025-03-26,"
                        + " 2025-03-30] }",
                "{ name: spend_after_2w, from: orders, horizon: 1m, gap: 2w, value: sum(amount) }");
        List<Executable> checks = new ArrayList<>();
        checks.add(built::assertMatches);

        // Label: from L1 = N + 2w to L2 = L1 + 1m, empty when L2 is after O + 1 day = 2025-05-09, where O is the
        // latest day in any event table: 2025-05-08 from notes (the last order is on 2025-05-07).
        // D = 2025-03-23: [2025-04-07, 2025-05-07): orders 2 and 3, 10 + 100.
        built.check(checks, "1", "2025-03-23", "spend_after_2w", "110");
        // D = 2025-03-24: [2025-04-08, 2025-05-08): orders 3 and 4.
        built.check(checks, "1", "2025-03-24", "spend_after_2w", "1100");
        // D = 2025-03-25: [2025-04-09, 2025-05-09): orders 3 and 4; L2 = O + 1 day exactly: still observed.
        built.check(checks, "1", "2025-03-25", "spend_after_2w", "1100");
        // D = 2025-03-26: L2 = 2025-05-10, after O + 1 day: not wholly observed, empty.
        built.check(checks, "1", "2025-03-26", "spend_after_2w", "");
        // Customer 4 at 2025-03-24: no orders in the horizon: a sum of nothing is 0.
        built.check(checks, "4", "2025-03-24", "spend_after_2w", "0");
        // D = 2025-03-31: platinum starts 2025-03-31 (latest from); the note at 2025-03-31 00:00:00 now counts.
        built.check(checks, "1", "2025-03-31", "tiers_tier", "platinum");
        built.check(checks, "1", "2025-03-31", "last_mood", "late");
        // 12w from N - 84 days = 2025-01-07: visits 107, 108, 109 (106 on 2025-01-06 has dropped out).
        built.check(checks, "1", "2025-03-31", "visits_count_12w", "3");
        // D = 2024-02-28 (a leap year): N = 2024-02-29, 1y starts 2023-02-28 (no 2023-02-29): visit 1000 counts.
        built.check(checks, "10", "2024-02-28", "visits_count_1y", "1");
        built.check(checks, "10", "2024-02-28", "visits_days_since_first_1y", "365");
        // 6m from 2023-08-29: visit 1000 is outside.
        built.check(checks, "10", "2024-02-28", "visits_count_6m", "0");
        // D = 2025-02-28: N = 2025-03-01; 12w from 2024-12-07: visits 1001 (no spend) and 1002 (3.0).
        built.check(checks, "10", "2025-02-28", "visits_count_12w", "2");
        built.check(checks, "10", "2025-02-28", "visits_sum_spend_12w", "3");
        built.check(checks, "10", "2025-02-28", "visits_mean_spend_12w", "3");
        built.check(checks, "10", "2025-02-28", "visits_distinct_item_12w", "1");
        // Here the cohort starts at a time, signed_up_at: customer 2 signed up at 18:30 on 2025-03-30 and is in
        // from that cutoff on.
        checks.add(() -> assertEquals(List.of("2025-03-30", "2025-03-31"),
                built.actual().rows().stream().filter(r -> r.get(0).equals("2")).map(r -> r.get(1)).toList()));
        // Customer 3 is in the cohort on 2025-02-28 and 2025-03-23 to 03-26 but not from 2025-03-30 (left that day).
        checks.add(() -> assertEquals(List.of("2025-02-28", "2025-03-23", "2025-03-24", "2025-03-25", "2025-03-26"),
                built.actual().rows().stream().filter(r -> r.get(0).equals("3")).map(r -> r.get(1)).toList()));
        assertAll(checks);
    }

    // ------------------------------------------------------------------ helpers

    private static Object[] row(Object... values) {
        return values;
    }

    private static void insert(Connection c, String table, Object[]... rows) throws SQLException {
        String marks = String.join(", ", Collections.nCopies(rows[0].length, "?"));
        try (PreparedStatement p = c.prepareStatement("insert into " + table + " values (" + marks + ")")) {
            for (Object[] r : rows) {
                for (int i = 0; i < r.length; i++) {
                    p.setObject(i + 1, r[i]);
                }
                p.addBatch();
            }
            p.executeBatch();
        }
    }
}
