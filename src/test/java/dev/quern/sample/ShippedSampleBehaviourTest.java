package dev.quern.sample;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.apache.commons.math3.stat.inference.MannWhitneyUTest;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The realism that features and labels of the demo recipe lean on, measured on the shipped sample
 * (which {@link ShippedSampleTest} proves is what the generator makes). Thresholds are loose: they catch a
 * behaviour that has gone, not a shifted decimal.
 */
class ShippedSampleBehaviourTest {

    static SampleDb db;

    @BeforeAll
    static void open() throws Exception {
        db = SampleDb.open(ShippedSampleTest.SHIPPED);
    }

    @AfterAll
    static void close() throws Exception {
        db.close();
    }

    @Test
    void aFifthToAThirdOfMembersCancelOverTheTwoYears() throws Exception {
        double share = db.number("SELECT avg(status = 'cancelled') FROM members");
        assertTrue(share >= 0.20 && share <= 0.30, "cancelled share " + share);
    }

    @Test
    void aboutFourPercentOfPaymentsFail() throws Exception {
        double share = db.number("SELECT avg(status = 'failed') FROM payments");
        assertTrue(share >= 0.03 && share <= 0.05, "failed share " + share);
    }

    @Test
    void moreMembersJoinInSpringAndSummerThanInWinter() throws Exception {
        long warm = db.count("SELECT count(*) FROM members WHERE substr(joined_on, 6, 2) IN ('04', '05', '06')");
        long cold = db.count("SELECT count(*) FROM members WHERE substr(joined_on, 6, 2) IN ('11', '12', '01')");
        assertTrue(warm > 2 * cold, warm + " warm against " + cold + " cold");
    }

    @Test
    void summerBringsMoreRidesThanWinterAmongTheSameMembers() throws Exception {
        String veterans = "member_id IN (SELECT member_id FROM members WHERE joined_on < '2024-12-01' AND status <> 'cancelled')";
        long january = db.count("SELECT count(*) FROM rides WHERE started_at GLOB '2025-01-*' AND " + veterans);
        long july = db.count("SELECT count(*) FROM rides WHERE started_at GLOB '2025-07-*' AND " + veterans);
        assertTrue(july > 1.5 * january, july + " in July against " + january + " in January");
    }

    @Test
    void weekdaysPeakAtCommutingHoursAndWeekendsAtMidday() throws Exception {
        String weekday = "strftime('%w', started_at) NOT IN ('0', '6')";
        String weekend = "strftime('%w', started_at) IN ('0', '6')";
        long weekdayMorning = db.count("SELECT count(*) FROM rides WHERE " + weekday + " AND substr(started_at, 12, 2) = '08'");
        long weekdayNoon = db.count("SELECT count(*) FROM rides WHERE " + weekday + " AND substr(started_at, 12, 2) = '12'");
        long weekendMorning = db.count("SELECT count(*) FROM rides WHERE " + weekend + " AND substr(started_at, 12, 2) = '08'");
        long weekendAfternoon = db.count("SELECT count(*) FROM rides WHERE " + weekend + " AND substr(started_at, 12, 2) = '14'");
        assertTrue(weekdayMorning > 2 * weekdayNoon, weekdayMorning + " at 8h against " + weekdayNoon + " at noon");
        assertTrue(weekendAfternoon > 2 * weekendMorning, weekendAfternoon + " at 14h against " + weekendMorning + " at 8h");
    }

    @Test
    void aFewHeavyRidersMakeALargeShareOfTheRides() throws Exception {
        double topTenth = db.number("WITH per AS (SELECT m.member_id, count(r.ride_id) AS n FROM members m"
                + " LEFT JOIN rides r USING (member_id) GROUP BY m.member_id),"
                + " ranked AS (SELECT n, row_number() OVER (ORDER BY n DESC) AS rk, count(*) OVER () AS total FROM per)"
                + " SELECT 1.0 * sum(CASE WHEN rk <= total / 10 THEN n ELSE 0 END) / sum(n) FROM ranked");
        assertTrue(topTenth > 0.30, "the busiest tenth ride " + topTenth + " of all rides");
    }

    @Test
    void ridingFadesBeforeMembersCancel() throws Exception {
        String longStayers = "SELECT c.member_id, julianday(c.cancelled_at) AS left_at FROM cancellations c"
                + " JOIN members m USING (member_id) WHERE julianday(c.cancelled_at) - julianday(m.joined_on) >= 240";
        String ridesBetween = "SELECT count(*) FROM rides r JOIN (" + longStayers + ") c USING (member_id)"
                + " WHERE julianday(r.started_at) > c.left_at - %d AND julianday(r.started_at) <= c.left_at - %d";
        long lastTwoMonths = db.count(String.format(ridesBetween, 60, 0));
        long halfAYearBefore = db.count(String.format(ridesBetween, 240, 180));
        assertTrue(lastTwoMonths < 0.8 * halfAYearBefore, lastTwoMonths + " rides in the last 60 days against "
                + halfAYearBefore + " in 60 days half a year earlier");
    }

    @Test
    void membersWithFailedPaymentsCancelMoreOften() throws Exception {
        String rate = "SELECT avg(status = 'cancelled') FROM members m WHERE %s EXISTS"
                + " (SELECT 1 FROM payments p WHERE p.member_id = m.member_id AND p.status = 'failed')";
        double withFailures = db.number(String.format(rate, ""));
        double without = db.number(String.format(rate, "NOT"));
        assertTrue(withFailures > 1.3 * without, withFailures + " against " + without);
    }

    /** Mann-Whitney U from Apache Commons Math, as an independent reference for "lower". */
    @Test
    void membersWhoCancelRatedTheirTicketsLower() throws Exception {
        double[] leavers = scores("m.status = 'cancelled'");
        double[] stayers = scores("m.status <> 'cancelled'");
        double meanLeavers = java.util.Arrays.stream(leavers).average().orElseThrow();
        double meanStayers = java.util.Arrays.stream(stayers).average().orElseThrow();
        double p = new MannWhitneyUTest().mannWhitneyUTest(leavers, stayers);
        assertTrue(meanLeavers < meanStayers && p < 0.001,
                "leavers " + meanLeavers + " stayers " + meanStayers + " p=" + p);
    }

    private static double[] scores(String who) throws Exception {
        List<List<Object>> rows = db.rows("SELECT satisfaction FROM tickets t JOIN members m USING (member_id)"
                + " WHERE satisfaction IS NOT NULL AND " + who);
        return rows.stream().mapToDouble(r -> ((Number) r.get(0)).doubleValue()).toArray();
    }
}
