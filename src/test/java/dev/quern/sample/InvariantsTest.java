package dev.quern.sample;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Rules every generated database keeps, whatever the seed; checked over every row of a small club. */
class InvariantsTest {

    private static final int MEMBERS = 300;
    private static final String LAST_INSTANT = "2025-12-31 23:59:59";
    private static final String TIMESTAMP_GLOB =
            "[0-9][0-9][0-9][0-9]-[0-9][0-9]-[0-9][0-9] [0-9][0-9]:[0-9][0-9]:[0-9][0-9]";
    private static final String DATE_GLOB = "[0-9][0-9][0-9][0-9]-[0-9][0-9]-[0-9][0-9]";

    /** Table, column, nullable: every time column of the schema. */
    private static final List<String[]> TIMESTAMPS = List.of(
            new String[] {"members", "updated_at"},
            new String[] {"rides", "started_at"},
            new String[] {"rides", "ended_at"},
            new String[] {"payments", "paid_at"},
            new String[] {"tickets", "opened_at"},
            new String[] {"tickets", "closed_at"},
            new String[] {"cancellations", "cancelled_at"});
    private static final List<String[]> DATES = List.of(
            new String[] {"members", "joined_on"},
            new String[] {"plans", "valid_from"},
            new String[] {"plans", "valid_to"});

    @TempDir
    static Path dir;
    static SampleDb db;

    @BeforeAll
    static void generate() throws Exception {
        Path file = dir.resolve("club.sqlite");
        new CycleClubGenerator(MEMBERS, 42L).writeTo(file);
        db = SampleDb.open(file);
    }

    @AfterAll
    static void close() throws Exception {
        db.close();
    }

    @Test
    void theSchemaIsExactlyTheAgreedOne() throws Exception {
        Map<String, String> expected = Map.of(
                "stations", "CREATE TABLE stations (station_id INTEGER PRIMARY KEY, name TEXT NOT NULL, zone TEXT NOT NULL, docks INTEGER NOT NULL)",
                "members", "CREATE TABLE members (member_id INTEGER PRIMARY KEY, joined_on TEXT NOT NULL, home_zone TEXT NOT NULL, birth_year INTEGER, referral_channel TEXT NOT NULL, status TEXT NOT NULL, updated_at TEXT NOT NULL)",
                "plans", "CREATE TABLE plans (plan_row_id INTEGER PRIMARY KEY, member_id INTEGER NOT NULL REFERENCES members(member_id), plan TEXT NOT NULL, monthly_fee REAL NOT NULL, valid_from TEXT NOT NULL, valid_to TEXT)",
                "rides", "CREATE TABLE rides (ride_id INTEGER PRIMARY KEY, member_id INTEGER NOT NULL REFERENCES members(member_id), started_at TEXT NOT NULL, ended_at TEXT NOT NULL, start_station_id INTEGER NOT NULL REFERENCES stations(station_id), end_station_id INTEGER NOT NULL REFERENCES stations(station_id), distance_km REAL NOT NULL, duration_min REAL NOT NULL)",
                "payments", "CREATE TABLE payments (payment_id INTEGER PRIMARY KEY, member_id INTEGER NOT NULL REFERENCES members(member_id), paid_at TEXT NOT NULL, amount REAL NOT NULL, status TEXT NOT NULL)",
                "tickets", "CREATE TABLE tickets (ticket_id INTEGER PRIMARY KEY, member_id INTEGER NOT NULL REFERENCES members(member_id), opened_at TEXT NOT NULL, closed_at TEXT, topic TEXT NOT NULL, satisfaction INTEGER)",
                "cancellations", "CREATE TABLE cancellations (cancellation_id INTEGER PRIMARY KEY, member_id INTEGER NOT NULL REFERENCES members(member_id), cancelled_at TEXT NOT NULL, reason TEXT NOT NULL)");
        var tables = db.rows("SELECT name, sql FROM sqlite_master WHERE type = 'table'");
        assertEquals(expected.size(), tables.size(), "tables: " + tables);
        for (List<Object> table : tables) {
            assertEquals(expected.get((String) table.get(0)), table.get(1));
        }
    }

    @Test
    void theAgreedIndexesExist() throws Exception {
        List<List<String>> wanted = List.of(
                List.of("rides", "member_id", "started_at"),
                List.of("rides", "started_at"),
                List.of("payments", "member_id", "paid_at"),
                List.of("tickets", "member_id", "opened_at"),
                List.of("cancellations", "member_id", "cancelled_at"),
                List.of("plans", "member_id", "valid_from"));
        for (List<String> index : wanted) {
            String columns = String.join(",", index.subList(1, index.size()));
            long found = db.count("SELECT count(*) FROM pragma_index_list('" + index.get(0) + "') l"
                    + " WHERE (SELECT group_concat(name, ',') FROM (SELECT name FROM pragma_index_info(l.name)"
                    + " ORDER BY seqno)) = '" + columns + "'");
            assertEquals(1, found, "index on " + index);
        }
    }

    @Test
    void everyReferenceResolves() throws Exception {
        assertEquals(List.of(), db.rows("SELECT * FROM pragma_foreign_key_check"));
    }

    @Test
    void rowCountsAreInSaneRanges() throws Exception {
        assertEquals(MEMBERS, db.count("SELECT count(*) FROM members"));
        assertBetween(20, 80, db.count("SELECT count(*) FROM stations"), "stations");
        assertBetween(MEMBERS, 2 * MEMBERS, db.count("SELECT count(*) FROM plans"), "plans");
        assertBetween(5_000, 25_000, db.count("SELECT count(*) FROM rides"), "rides");
        assertBetween(1_500, 5_000, db.count("SELECT count(*) FROM payments"), "payments");
        assertBetween(60, 600, db.count("SELECT count(*) FROM tickets"), "tickets");
        assertBetween(MEMBERS / 7, MEMBERS * 2 / 5, db.count("SELECT count(*) FROM cancellations"), "cancellations");
    }

    @Test
    void everyTimestampIsWrittenAsDateSpaceTimeWithoutZoneOrFraction() throws Exception {
        for (String[] column : TIMESTAMPS) {
            String c = column[1];
            long bad = db.count("SELECT count(*) FROM " + column[0] + " WHERE " + c + " IS NOT NULL AND ("
                    + "typeof(" + c + ") <> 'text' OR length(" + c + ") <> 19 OR " + c + " NOT GLOB '" + TIMESTAMP_GLOB
                    + "' OR datetime(" + c + ") IS NOT " + c + ")");
            assertEquals(0, bad, column[0] + "." + c);
        }
    }

    @Test
    void everyDateIsWrittenAsIsoDate() throws Exception {
        for (String[] column : DATES) {
            String c = column[1];
            long bad = db.count("SELECT count(*) FROM " + column[0] + " WHERE " + c + " IS NOT NULL AND ("
                    + "typeof(" + c + ") <> 'text' OR length(" + c + ") <> 10 OR " + c + " NOT GLOB '" + DATE_GLOB
                    + "' OR date(" + c + ") IS NOT " + c + ")");
            assertEquals(0, bad, column[0] + "." + c);
        }
    }

    @Test
    void noEventFallsOutsideTheTwoYearsTheDataCovers() throws Exception {
        for (String[] column : TIMESTAMPS) {
            long outside = db.count("SELECT count(*) FROM " + column[0] + " WHERE " + column[1] + " > '"
                    + LAST_INSTANT + "' OR " + column[1] + " < '2024-01-01 00:00:00'");
            assertEquals(0, outside, column[0] + "." + column[1]);
        }
        assertEquals(0, db.count("SELECT count(*) FROM members WHERE joined_on NOT BETWEEN '2024-01-01' AND '2025-11-30'"));
        assertEquals(0, db.count("SELECT count(*) FROM plans WHERE valid_from > '2025-12-31'"));
    }

    @Test
    void noEventComesBeforeTheMemberJoined() throws Exception {
        for (String[] column : TIMESTAMPS) {
            long early = db.count("SELECT count(*) FROM " + column[0] + " t JOIN members m USING (member_id)"
                    + " WHERE t." + column[1] + " < m.joined_on");
            assertEquals(0, early, column[0] + "." + column[1]);
        }
        assertEquals(0, db.count("SELECT count(*) FROM plans p JOIN members m USING (member_id) WHERE p.valid_from < m.joined_on"));
        assertEquals(0, db.count("SELECT count(*) FROM members m WHERE (SELECT min(valid_from) FROM plans p"
                + " WHERE p.member_id = m.member_id) IS NOT m.joined_on"), "the first plan starts on joining");
    }

    @Test
    void nothingHappensAfterAMemberCancelled() throws Exception {
        List<String[]> events = List.of(
                new String[] {"rides", "started_at"}, new String[] {"rides", "ended_at"},
                new String[] {"payments", "paid_at"},
                new String[] {"tickets", "opened_at"}, new String[] {"tickets", "closed_at"});
        for (String[] column : events) {
            long late = db.count("SELECT count(*) FROM " + column[0] + " t JOIN cancellations c USING (member_id)"
                    + " WHERE t." + column[1] + " > c.cancelled_at");
            assertEquals(0, late, column[0] + "." + column[1]);
        }
        assertEquals(0, db.count("SELECT count(*) FROM tickets t JOIN cancellations c USING (member_id)"
                + " WHERE t.closed_at IS NULL"), "a departing member's tickets are closed with the account");
    }

    @Test
    void aMemberCancelsAtMostOnceAndTheMemberRowSaysSo() throws Exception {
        assertEquals(0, db.count("SELECT count(*) FROM (SELECT member_id FROM cancellations GROUP BY member_id HAVING count(*) > 1)"));
        assertEquals(0, db.count("SELECT count(*) FROM members m LEFT JOIN cancellations c USING (member_id)"
                + " WHERE (m.status = 'cancelled') <> (c.member_id IS NOT NULL)"));
        assertEquals(0, db.count("SELECT count(*) FROM members m JOIN cancellations c USING (member_id)"
                + " WHERE m.updated_at <> c.cancelled_at"), "a cancelled member was last changed by cancelling");
        assertEquals(0, db.count("SELECT count(*) FROM members WHERE status NOT IN ('active', 'paused', 'cancelled')"));
        assertTrue(db.count("SELECT count(*) FROM members WHERE status = 'paused'") > 0, "someone is paused");
        assertTrue(db.count("SELECT count(*) FROM cancellations WHERE reason NOT IN"
                + " ('moved away', 'too expensive', 'bought own bike', 'rarely used', 'other')") == 0);
    }

    @Test
    void updatedAtIsACurrentStateColumnOftenLaterThanEarlyCutoffs() throws Exception {
        assertTrue(db.count("SELECT count(*) FROM members WHERE status <> 'cancelled' AND updated_at >= '2025-10-01'") > 0);
        assertTrue(db.count("SELECT count(*) FROM members WHERE joined_on > '2025-01-31'") > MEMBERS / 3,
                "many members join after an early cutoff");
    }

    @Test
    void planHistoriesChainWithoutGapsOrOverlaps() throws Exception {
        String chained = "SELECT p.*, lead(valid_from) OVER (PARTITION BY member_id ORDER BY valid_from) AS next_from,"
                + " row_number() OVER (PARTITION BY member_id ORDER BY valid_from DESC) AS from_end FROM plans p";
        assertEquals(0, db.count("SELECT count(*) FROM (" + chained + ") WHERE next_from IS NOT NULL AND valid_to IS NOT next_from"),
                "valid_to is the next row's valid_from");
        assertEquals(0, db.count("SELECT count(*) FROM plans WHERE valid_to IS NOT NULL AND valid_to <= valid_from"));
        assertEquals(0, db.count("SELECT count(*) FROM (" + chained + ") h LEFT JOIN cancellations c USING (member_id)"
                + " WHERE h.from_end = 1 AND h.valid_to IS NOT (CASE WHEN c.cancelled_at IS NULL THEN NULL"
                + " ELSE date(c.cancelled_at, '+1 day') END)"),
                "the last plan is open unless the member cancelled; then it ends the day after");
        assertEquals(0, db.count("SELECT count(*) FROM (SELECT member_id FROM plans GROUP BY member_id HAVING count(*) > 4)"),
                "at most three switches");
        assertTrue(db.count("SELECT count(*) FROM (SELECT member_id FROM plans GROUP BY member_id HAVING count(*) > 1)") > 0);
        assertEquals(0, db.count("SELECT count(*) FROM (SELECT plan FROM plans GROUP BY plan HAVING count(DISTINCT monthly_fee) > 1)"),
                "each plan has one fixed fee");
    }

    @Test
    void ridesAreConsistentInTimeDistanceAndSpeed() throws Exception {
        assertEquals(0, db.count("SELECT count(*) FROM rides WHERE"
                + " unixepoch(ended_at) - unixepoch(started_at) <> round(duration_min * 60)"), "ended_at = started_at + duration");
        assertEquals(0, db.count("SELECT count(*) FROM rides WHERE distance_km < 0.3 OR distance_km > 25"
                + " OR round(distance_km, 2) <> distance_km OR round(duration_min, 1) <> duration_min OR duration_min <= 0"));
        assertEquals(0, db.count("SELECT count(*) FROM rides WHERE distance_km / (duration_min / 60.0) <= 45"
                + " AND distance_km / (duration_min / 60.0) NOT BETWEEN 7 AND 25"), "ridden at 8-22 km/h, give or take rounding");
        assertEquals(0, db.count("SELECT count(*) FROM rides a JOIN rides b ON a.member_id = b.member_id"
                + " AND a.ride_id <> b.ride_id AND b.started_at >= a.started_at AND b.started_at < a.ended_at"),
                "nobody rides two bikes at once");
    }

    @Test
    void aFewRidesAreTooFastToHaveBeenRidden() throws Exception {
        double rides = db.count("SELECT count(*) FROM rides");
        long onATrain = db.count("SELECT count(*) FROM rides WHERE distance_km / (duration_min / 60.0) > 45");
        assertTrue(onATrain / rides >= 0.001 && onATrain / rides <= 0.01, onATrain + " of " + rides);
        assertEquals(0, db.count("SELECT count(*) FROM rides WHERE distance_km / (duration_min / 60.0) > 45"
                + " AND distance_km / (duration_min / 60.0) < 55"), "implausible rides are clearly implausible");
    }

    @Test
    void someRidesSitExactlyOnTheInstantsAroundMonthEnds() throws Exception {
        String monthEnd = "date(started_at) = date(started_at, 'start of month', '+1 month', '-1 day')";
        assertTrue(db.count("SELECT count(*) FROM rides WHERE time(started_at) = '23:59:59' AND " + monthEnd) > 0);
        assertTrue(db.count("SELECT count(*) FROM rides WHERE time(started_at) = '00:00:00' AND " + monthEnd) > 0);
        assertTrue(db.count("SELECT count(*) FROM rides WHERE started_at GLOB '*-01 00:00:00'") > 0);
    }

    @Test
    void ticketsAreRatedExactlyWhenClosed() throws Exception {
        assertEquals(0, db.count("SELECT count(*) FROM tickets WHERE (closed_at IS NULL) <> (satisfaction IS NULL)"));
        assertEquals(0, db.count("SELECT count(*) FROM tickets WHERE satisfaction NOT BETWEEN 1 AND 5"));
        assertEquals(0, db.count("SELECT count(*) FROM tickets WHERE closed_at < opened_at"));
        assertTrue(db.count("SELECT count(*) FROM tickets WHERE closed_at IS NULL") > 0, "some are still open");
        double closed = db.count("SELECT count(*) FROM tickets WHERE closed_at IS NOT NULL");
        long quick = db.count("SELECT count(*) FROM tickets WHERE julianday(closed_at) - julianday(opened_at) <= 10");
        assertTrue(quick / closed > 0.9, "most are closed within ten days");
        assertEquals(0, db.count("SELECT count(*) FROM tickets WHERE topic NOT IN"
                + " ('billing', 'bike fault', 'app', 'station full', 'other')"));
    }

    @Test
    void paymentsAreMonthlyFeesOrPerRideChargesAndAFewFail() throws Exception {
        assertEquals(0, db.count("SELECT count(*) FROM payments WHERE status NOT IN ('paid', 'failed', 'refunded')"));
        assertEquals(0, db.count("SELECT count(*) FROM payments WHERE amount NOT IN (19.0, 34.0, 49.0)"
                + " AND (amount <= 0 OR abs(amount / 1.5 - round(amount / 1.5)) > 1e-9)"), "a fee, or 1.50 per ride");
        double all = db.count("SELECT count(*) FROM payments");
        double failed = db.count("SELECT count(*) FROM payments WHERE status = 'failed'") / all;
        assertTrue(failed > 0.02 && failed < 0.07, "failed share " + failed);
        assertTrue(db.count("SELECT count(*) FROM payments WHERE status = 'refunded'") > 0);
    }

    @Test
    void membersAreDescribedWithInventedValuesInRange() throws Exception {
        assertEquals(0, db.count("SELECT count(*) FROM members WHERE birth_year NOT BETWEEN 1950 AND 2007"));
        assertTrue(db.count("SELECT count(*) FROM members WHERE birth_year IS NULL") > 0);
        assertEquals(0, db.count("SELECT count(*) FROM members WHERE home_zone NOT IN (SELECT zone FROM stations)"));
        assertEquals(0, db.count("SELECT count(*) FROM members WHERE referral_channel NOT IN"
                + " ('friend', 'poster', 'event', 'search', 'workplace')"));
        assertEquals(db.count("SELECT count(*) FROM stations"), db.count("SELECT count(DISTINCT name) FROM stations"));
    }

    private static void assertBetween(long low, long high, long actual, String what) {
        assertTrue(actual >= low && actual <= high, what + ": " + actual + " not in [" + low + ", " + high + "]");
    }
}
