package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import dev.quern.cli.Main;
import dev.quern.testing.Matrix;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.stat.descriptive.moment.Mean;
import org.apache.commons.math3.stat.descriptive.moment.StandardDeviation;
import org.apache.commons.math3.stat.descriptive.rank.Percentile;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A training build, then a later month scored with its fitted file: a new member with levels never seen in
 * training, and rides far longer than any in training. The scoring matrix has the training matrix's columns in
 * the same order, unseen levels go to "other" (or frequency 0), and every value is computed with the training
 * fit, checked against Apache Commons Math 3.6.1 on the raw training values (mean, bias-corrected standard
 * deviation, and {@code Percentile} R_7, the quantile definition Quern uses).
 */
class ScoringRunTest {

    @TempDir
    static Path folder;

    static final String ENCODE = """
            encode:
              zone: { one-hot: { top: 2 } }
              tier: frequency
              rides_sum_km_30d: [log1p, standardise]
              rides_count_30d: { bins: 3 }
              fee: [missing, { impute: median }]
            """;

    static Matrix raw;
    static Matrix training;
    static Matrix scoring;
    static Path recipe;

    @BeforeAll
    static void buildTrainingThenScoring() throws Exception {
        Club club = new Club()
                .member(1, "2024-06-01", "A", "basic", 10.0)
                .member(2, "2024-06-01", "A", "basic", 10.0)
                .member(3, "2024-06-01", "A", "basic", 20.0)
                .member(4, "2024-06-01", "A", "basic", 20.0)
                .member(5, "2024-06-01", "B", "basic", 30.0)
                .member(6, "2024-06-01", "B", "plus", null)
                .member(7, "2024-06-01", "B", "plus", 40.0)
                .member(8, "2024-06-01", "C", null, 50.0);
        String[] days = {"2025-01-10", "2025-02-10", "2025-03-10", "2025-04-10"};
        for (int member = 1; member <= 8; member++) {
            for (int month = 0; month < days.length; month++) {
                for (int ride = 0; ride < (member + month) % 4; ride++) {
                    club.ride(member, days[month] + " 0" + ride + ":00:00", member * 1.5 + month + ride);
                }
            }
        }
        club.complaint(2, "2025-02-15 10:00:00").complaint(7, "2025-04-02 10:00:00");
        club.ride(1, "2025-06-10 08:00:00", 2.0); // the data reach past the last training horizon
        club.writeTo(folder);
        recipe = folder.resolve("club.yaml");
        Files.writeString(recipe, Club.RECIPE + ENCODE);
        raw = Club.build(Club.recipe(folder, Club.RECIPE), folder.resolve("raw"));
        training = Club.build(Quern.load(recipe), folder.resolve("training"));

        // July: a new member with a zone, a tier and no fee never seen in training, and much longer rides.
        club.member(9, "2025-07-01", "Z", "gold", null)
                .ride(9, "2025-07-20 10:00:00", 400.0)
                .ride(1, "2025-07-21 10:00:00", 250.0)
                .ride(1, "2025-07-22 10:00:00", 260.0);
        club.writeTo(folder);
        scoring = Club.build(Quern.load(recipe).withCutoffs(List.of(LocalDate.parse("2025-07-31")))
                .withFitted(folder.resolve("training/fitted.json")), folder.resolve("scoring"));
    }

    @Test
    void theScoringMatrixHasTheTrainingColumnsInTheSameOrder() {
        assertEquals(training.columns(), scoring.columns());
        assertEquals(List.of("member_id", "cutoff", "rides_count_30d_bin", "rides_sum_km_30d", "zone_a", "zone_b",
                "zone_other", "zone_missing", "tier_frequency", "fee_missing", "fee", "complains_in_30d"),
                scoring.columns());
        assertEquals(9, scoring.rows().size(), "every member at the one scoring cutoff");
    }

    @Test
    void anUnseenLevelGoesToOther() {
        Map<String, String> newcomer = scoring.row("9", "2025-07-31");
        assertEquals(List.of("0", "0", "1", "0"), List.of(newcomer.get("zone_a"), newcomer.get("zone_b"),
                newcomer.get("zone_other"), newcomer.get("zone_missing")));
        // C was seen in training but is not in the top 2: other too, in both runs.
        assertEquals("1", scoring.row("8", "2025-07-31").get("zone_other"));
        assertEquals("1", training.row("8", "2025-01-31").get("zone_other"));
        assertEquals("1", scoring.row("5", "2025-07-31").get("zone_b"));
    }

    @Test
    void frequencyIsTheTrainingShareAndZeroForAnUnseenLevel() {
        // 8 members at 4 training cutoffs: 32 rows, 20 of them basic, 4 without a tier.
        assertEquals(20.0 / 32, number(scoring.row("1", "2025-07-31").get("tier_frequency")), 1e-15);
        assertEquals(4.0 / 32, number(scoring.row("8", "2025-07-31").get("tier_frequency")), 1e-15);
        assertEquals(0.0, number(scoring.row("9", "2025-07-31").get("tier_frequency")), 0.0);
    }

    @Test
    void standardisationUsesTheTrainingMeanAndSampleSd() {
        double[] logs = raw.rows().stream().mapToDouble(r -> Math.log1p(number(r.get("rides_sum_km_30d"))))
                .toArray();
        double mean = new Mean().evaluate(logs);
        double sd = new StandardDeviation().evaluate(logs); // bias-corrected: n - 1
        double july = 250.0 + 260.0;
        assertEquals((Math.log1p(july) - mean) / sd, number(scoring.row("1", "2025-07-31").get("rides_sum_km_30d")),
                1e-12);
        for (Map<String, String> row : training.rows()) {
            double value = number(raw.row(row.get("member_id"), row.get("cutoff")).get("rides_sum_km_30d"));
            assertEquals((Math.log1p(value) - mean) / sd, number(row.get("rides_sum_km_30d")), 1e-12);
        }
        assertTrue(number(scoring.row("1", "2025-07-31").get("rides_sum_km_30d")) > 3,
                "a shifted month stays shifted: it is not standardised on itself");
    }

    @Test
    void binsUseTheTrainingEdges() {
        double[] counts = raw.rows().stream().mapToDouble(r -> number(r.get("rides_count_30d"))).toArray();
        Percentile r7 = new Percentile().withEstimationType(Percentile.EstimationType.R_7);
        double low = r7.evaluate(counts, 100.0 / 3);
        double high = r7.evaluate(counts, 200.0 / 3);
        for (Matrix m : List.of(training, scoring)) {
            for (Map<String, String> row : m.rows()) {
                String member = row.get("member_id");
                double count = m == training ? number(raw.row(member, row.get("cutoff")).get("rides_count_30d"))
                        : member.equals("1") ? 2 : member.equals("9") ? 1 : 0;
                int expected = count <= low ? 1 : count <= high ? 2 : 3;
                assertEquals(Integer.toString(expected), row.get("rides_count_30d_bin"), member + " " + row);
            }
        }
    }

    @Test
    void aMissingFeeIsFlaggedAndFilledWithTheTrainingMedian() {
        List<Double> fees = raw.rows().stream().filter(r -> !r.get("fee").isEmpty())
                .map(r -> number(r.get("fee"))).toList();
        double median = new Percentile().withEstimationType(Percentile.EstimationType.R_7)
                .evaluate(fees.stream().mapToDouble(Double::doubleValue).toArray(), 50.0);
        Map<String, String> newcomer = scoring.row("9", "2025-07-31");
        assertEquals("1", newcomer.get("fee_missing"));
        assertEquals(median, number(newcomer.get("fee")), 0.0);
        assertEquals(20.0, median, 0.0, "10 x8, 20 x8, 30, 40 and 50 x4 each: the middle two are 20");
        assertEquals("0", scoring.row("7", "2025-07-31").get("fee_missing"));
        assertEquals(40.0, number(scoring.row("7", "2025-07-31").get("fee")), 0.0);
    }

    @Test
    void scoringCutoffsNeedNoLabel() {
        assertTrue(scoring.rows().stream().allMatch(r -> r.get("complains_in_30d").isEmpty()));
        assertTrue(training.rows().stream().noneMatch(r -> r.get("complains_in_30d").isEmpty()));
    }

    @Test
    void theFittedFileIsWrittenAgainUnchanged() throws Exception {
        assertEquals(Files.readString(folder.resolve("training/fitted.json")),
                Files.readString(folder.resolve("scoring/fitted.json")));
        String fitted = Files.readString(folder.resolve("training/fitted.json"));
        assertTrue(fitted.contains("\"training_cutoffs\": [\"2025-01-31\", \"2025-02-28\", \"2025-03-31\", "
                + "\"2025-04-30\"]"), fitted);
        assertTrue(fitted.contains("\"sha256\": \"" + sha256(Files.readString(recipe)) + "\""), fitted);
    }

    @Test
    void aFittedFileOfAnotherRecipeIsRefused() throws Exception {
        Path changed = folder.resolve("changed.yaml");
        Files.writeString(changed, Files.readString(recipe).replace("top: 2", "top: 3"));
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int exit = Main.run(new PrintWriter(out, true), new PrintWriter(err, true), "build", changed.toString(),
                "--out", folder.resolve("refused").toString(), "--cutoffs", "2025-07-31", "--fitted",
                folder.resolve("training/fitted.json").toString());
        assertEquals(65, exit, err.toString());
        String fitted = folder.resolve("training/fitted.json").toString();
        assertEquals(fitted + ": was fitted for another recipe text (recipe club, sha256 "
                + sha256(Files.readString(recipe)).substring(0, 12) + "...), not this recipe (sha256 "
                + sha256(Files.readString(changed)).substring(0, 12) + "...): its columns and values may not fit."
                + " Rebuild the training table with this recipe to fit again, or score with the recipe file it was"
                + " fitted with", err.toString().strip());
        assertTrue(Files.notExists(folder.resolve("refused/matrix.csv")));
    }

    @Test
    void theCommandLineTakesCutoffsAndAFittedFile() throws Exception {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int exit = Main.run(new PrintWriter(out, true), new PrintWriter(err, true), "build", recipe.toString(),
                "--out", folder.resolve("cli").toString(), "--cutoffs", "2025-07-31,2025-06-30", "--fitted",
                folder.resolve("training/fitted.json").toString());
        assertEquals(0, exit, err.toString());
        assertTrue(out.toString().startsWith("17 rows x 12 columns (2 cutoffs)"), out.toString());
        assertEquals(2, Main.run(new PrintWriter(out, true), new PrintWriter(err, true), "build", recipe.toString(),
                "--out", folder.resolve("cli").toString(), "--cutoffs", "2025-07-32"));
    }

    private static double number(String text) {
        return Double.parseDouble(text);
    }

    private static String sha256(String text) throws Exception {
        return java.util.HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256")
                .digest(text.getBytes(java.nio.charset.StandardCharsets.UTF_8)));
    }
}
