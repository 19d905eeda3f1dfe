package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import dev.quern.testing.Matrix;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The target mean is fitted out of time: a row at cutoff c is encoded only from training rows whose label
 * horizon had ended by the end of c's day, so never from its own label (Prokhorenkova et al. 2018, arXiv
 * 1706.09516, on the leak of fitting target statistics on the rows they encode). Two builds differ only in
 * member 1's label at 2025-03-31: its encoding at that cutoff is the same in both, where an in-time fit
 * (every training row, its own included) would differ; at 2025-04-30, when that label is known, it differs.
 *
 * <p>Six members, zones A (1, 2, 3) and B (4, 5, 6); horizon 30 days after each month end. Complaints:
 * member 2 on 2025-02-10 and member 3 on 2025-02-20 (labels 1 at 2025-01-31), member 4 on 2025-03-15
 * (label 1 at 2025-02-28), and in the second build member 1 on 2025-04-10 (label 1 at 2025-03-31).
 */
class OutOfTimeTargetMeanTest {

    @TempDir
    static Path folder;

    static Matrix without;
    static Matrix with;

    private static final Map<String, String> ZONE = Map.of("1", "A", "2", "A", "3", "A", "4", "B", "5", "B",
            "6", "B");

    @BeforeAll
    static void build() throws Exception {
        without = build("without", false);
        with = build("with", true);
    }

    private static Matrix build(String name, boolean memberOneComplains) throws Exception {
        Path dir = Files.createDirectories(folder.resolve(name));
        Club club = new Club();
        for (int id = 1; id <= 6; id++) {
            club.member(id, "2024-06-01", ZONE.get(Integer.toString(id)), "basic", 10.0);
        }
        club.complaint(2, "2025-02-10 12:00:00").complaint(3, "2025-02-20 12:00:00")
                .complaint(4, "2025-03-15 12:00:00");
        if (memberOneComplains) {
            club.complaint(1, "2025-04-10 12:00:00");
        }
        club.ride(5, "2025-06-10 08:00:00", 3.0); // the data reach past the last horizon: every label observed
        club.writeTo(dir);
        return Club.build(Club.recipe(dir, Club.RECIPE + "encode:\n  zone: target-mean\n"), dir.resolve("out"));
    }

    private static String encoded(Matrix m, int member, String cutoff) {
        return m.row(Integer.toString(member), cutoff).get("zone_target_mean");
    }

    @Test
    void aRowsOwnLabelNeverChangesItsEncoding() {
        assertEquals("0", without.row("1", "2025-03-31").get("complains_in_30d"));
        assertEquals("1", with.row("1", "2025-03-31").get("complains_in_30d"));
        assertEquals(encoded(without, 1, "2025-03-31"), encoded(with, 1, "2025-03-31"));
        // An in-time fit over every training row, member 1's own label included, would not be the same.
        assertNotEquals(inTime(without, "A"), inTime(with, "A"), 0.0);
        // Once the label is known (its horizon ended 2025-04-30), later rows may learn from it.
        assertNotEquals(encoded(without, 1, "2025-04-30"), encoded(with, 1, "2025-04-30"));
    }

    @Test
    void workedValuesAtTheThirdCutoff() {
        // At 2025-03-31 the labels of 2025-01-31 and 2025-02-28 are known (horizons ended 2025-03-02 and
        // 2025-03-30): 12 rows, 3 positive, prior 0.25. Zone A: 6 rows, 2 positive: (2 + 10 * 0.25) / (6 + 10).
        assertEquals(4.5 / 16, Double.parseDouble(encoded(with, 1, "2025-03-31")), 1e-15);
        // Zone B: 6 rows, 1 positive: (1 + 2.5) / 16.
        assertEquals(3.5 / 16, Double.parseDouble(encoded(with, 5, "2025-03-31")), 1e-15);
    }

    @Test
    void noLabelKnownYetGivesAnEmptyEncoding() {
        // At 2025-01-31 and 2025-02-28 no training horizon has ended: there is nothing to learn from.
        for (String cutoff : List.of("2025-01-31", "2025-02-28")) {
            for (int member = 1; member <= 6; member++) {
                assertEquals("", encoded(with, member, cutoff), member + " at " + cutoff);
            }
        }
    }

    @Test
    void everyTrainingRowMatchesAPlainOutOfTimeRecomputation() {
        for (Matrix m : List.of(without, with)) {
            for (Map<String, String> row : m.rows()) {
                LocalDate cutoff = LocalDate.parse(row.get("cutoff"));
                String zone = ZONE.get(row.get("member_id"));
                // Known by the end of the cutoff day: rows whose horizon (c', c' + 30d] ended by then.
                List<Map<String, String>> known = m.rows().stream().filter(r -> !LocalDate.parse(r.get("cutoff"))
                        .plusDays(1).plusDays(30).isAfter(cutoff.plusDays(1))).toList();
                if (known.isEmpty()) {
                    assertEquals("", row.get("zone_target_mean"));
                    continue;
                }
                double prior = known.stream().mapToDouble(r -> Double.parseDouble(r.get("complains_in_30d")))
                        .average().orElseThrow();
                List<Map<String, String>> same = known.stream().filter(r -> ZONE.get(r.get("member_id"))
                        .equals(zone)).toList();
                double sum = same.stream().mapToDouble(r -> Double.parseDouble(r.get("complains_in_30d"))).sum();
                double expected = (sum + 10 * prior) / (same.size() + 10);
                assertEquals(expected, Double.parseDouble(row.get("zone_target_mean")), 1e-12,
                        row.get("member_id") + " at " + cutoff);
            }
        }
    }

    /** What an in-time fit would give zone {@code zone}: every training row's label, m = 10. */
    private static double inTime(Matrix m, String zone) {
        double prior = m.rows().stream().mapToDouble(r -> Double.parseDouble(r.get("complains_in_30d")))
                .average().orElseThrow();
        List<Map<String, String>> same = m.rows().stream().filter(r -> ZONE.get(r.get("member_id")).equals(zone))
                .toList();
        double sum = same.stream().mapToDouble(r -> Double.parseDouble(r.get("complains_in_30d"))).sum();
        return (sum + 10 * prior) / (same.size() + 10);
    }
}
