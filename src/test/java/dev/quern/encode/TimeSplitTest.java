package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.testing.Matrix;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.stat.descriptive.moment.Mean;
import org.apache.commons.math3.stat.descriptive.moment.StandardDeviation;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A recipe with a time split: a {@code split} column right after the cutoff, encodings fitted on the train
 * part's rows only, and every other row (validation, test, in no part) encoded with that frozen fit.
 *
 * <p>Members 1 and 2 live in zone A, 3 in B; members 4 (zone A) and 5 (zone C, never seen in training) join
 * on 2025-03-15, after the train part, with much higher fees. Member 2 complains on 2025-02-10.
 */
class TimeSplitTest {

    @TempDir
    static Path folder;

    static Matrix matrix;
    static String fitted;
    static String dictionary;

    @BeforeAll
    static void build() throws Exception {
        new Club().member(1, "2024-06-01", "A", "basic", 10.0)
                .member(2, "2024-06-01", "A", "basic", 20.0)
                .member(3, "2024-06-01", "B", "basic", 30.0)
                .member(4, "2025-03-15", "A", "basic", 100.0)
                .member(5, "2025-03-15", "C", "basic", 200.0)
                .complaint(2, "2025-02-10 09:00:00")
                .ride(1, "2025-07-10 08:00:00", 2.0)
                .writeTo(folder);
        String recipe = Club.RECIPE.replace("2025-04-30]", "2025-04-30, 2025-05-31]") + """
                encode:
                  fee: standardise
                  zone: target-mean
                split:
                  train: { to: 2025-02-28 }
                  validation: { from: 2025-03-31, to: 2025-03-31 }
                  test: { from: 2025-04-30, to: 2025-04-30 }
                """;
        matrix = Club.build(Club.recipe(folder, recipe), folder.resolve("out"));
        fitted = Files.readString(folder.resolve("out/fitted.json"));
        dictionary = Files.readString(folder.resolve("out/dictionary.csv"));
    }

    @Test
    void theSplitColumnFollowsTheCutoff() {
        assertEquals(List.of("member_id", "cutoff", "split"), matrix.columns().subList(0, 3));
        assertEquals("complains_in_30d", matrix.columns().get(matrix.columns().size() - 1));
        Map<String, String> parts = Map.of("2025-01-31", "train", "2025-02-28", "train", "2025-03-31", "validation",
                "2025-04-30", "test", "2025-05-31", "");
        for (Map<String, String> row : matrix.rows()) {
            assertEquals(parts.get(row.get("cutoff")), row.get("split"), row.toString());
        }
        assertTrue(dictionary.contains("\nsplit,split,text,\"The part of the time split the row's cutoff is in: "
                + "train (first cutoff to 2025-02-28), validation (2025-03-31 to 2025-03-31), test (2025-04-30 to "
                + "2025-04-30)."), dictionary);
    }

    @Test
    void encodingsAreFittedOnTrainRowsOnly() {
        assertTrue(fitted.contains("\"training_cutoffs\": [\"2025-01-31\", \"2025-02-28\"]"), fitted);
        assertTrue(fitted.contains("\"training_rows\": 6"), fitted);
        // Train rows: members 1-3 at two cutoffs, fees 10, 20, 30 twice (Commons Math: mean, n - 1 sd).
        double[] train = {10, 20, 30, 10, 20, 30};
        double mean = new Mean().evaluate(train);
        double sd = new StandardDeviation().evaluate(train);
        assertEquals((10 - mean) / sd, Double.parseDouble(matrix.row("1", "2025-01-31").get("fee")), 1e-12);
        assertEquals((100 - mean) / sd, Double.parseDouble(matrix.row("4", "2025-04-30").get("fee")), 1e-12);
        assertEquals((200 - mean) / sd, Double.parseDouble(matrix.row("5", "2025-05-31").get("fee")), 1e-12);
    }

    @Test
    void rowsOutsideTrainingUseTheFrozenTargetMean() {
        // Frozen over the 6 labelled train rows, one positive: prior 1/6; zone A has 4 rows with 1 positive,
        // zone B 2 rows with none; C was never seen and gets the prior. m = 10 (Cestnik 1990).
        double prior = 1.0 / 6;
        double a = (1 + 10 * prior) / (4 + 10);
        double b = (0 + 10 * prior) / (2 + 10);
        for (String cutoff : List.of("2025-03-31", "2025-04-30", "2025-05-31")) {
            assertEquals(a, Double.parseDouble(matrix.row("1", cutoff).get("zone_target_mean")), 1e-15);
            assertEquals(a, Double.parseDouble(matrix.row("4", cutoff).get("zone_target_mean")), 1e-15);
            assertEquals(b, Double.parseDouble(matrix.row("3", cutoff).get("zone_target_mean")), 1e-15);
            assertEquals(prior, Double.parseDouble(matrix.row("5", cutoff).get("zone_target_mean")), 1e-15);
        }
        // Train rows are encoded out of time; no train label is known by 2025-02-28 (2025-01-31's runs to
        // 2025-03-02), so both train cutoffs are empty.
        assertTrue(matrix.rows().stream().filter(r -> r.get("split").equals("train"))
                .allMatch(r -> r.get("zone_target_mean").isEmpty()));
    }
}
