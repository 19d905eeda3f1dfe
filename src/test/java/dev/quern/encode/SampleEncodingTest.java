package dev.quern.encode;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Quern;
import dev.quern.testing.Matrix;
import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The encoded example recipe on the shipped sample: a training build with a split, then the last month
 * scored again from its fitted file, which must give the very same rows (that month is in no part, so the
 * training build encoded it with the frozen fit too).
 */
class SampleEncodingTest {

    private static final Path RECIPE = Path.of("recipes/member-churn-encoded.yaml");
    private static final List<String> PLANS = List.of("plan_pay_as_you_go", "plan_commuter", "plan_unlimited",
            "plan_family", "plan_other", "plan_missing");

    @TempDir
    static Path folder;

    static Matrix training;
    static Matrix scoring;

    @BeforeAll
    static void build() {
        training = Club.build(Quern.load(RECIPE), folder.resolve("train"));
        scoring = Club.build(Quern.load(RECIPE).withCutoffs(List.of(LocalDate.parse("2025-12-31")))
                .withFitted(folder.resolve("train/fitted.json")), folder.resolve("score"));
    }

    @Test
    void theEncodedColumnsTakeTheirSourcesPlaces() {
        List<String> columns = training.columns();
        assertEquals(List.of("member_id", "cutoff", "split", "rides_count_30d"), columns.subList(0, 4));
        assertEquals(PLANS, columns.subList(columns.indexOf("plan_pay_as_you_go"),
                columns.indexOf("plan_pay_as_you_go") + PLANS.size()));
        assertEquals(List.of("tickets_days_since_last_1y_missing", "tickets_days_since_last_1y"),
                columns.subList(columns.indexOf("tickets_days_since_last_1y_missing"),
                        columns.indexOf("tickets_days_since_last_1y_missing") + 2));
        assertEquals(List.of("monthly_fee", "home_zone_target_mean", "cancels_in_60d"),
                columns.subList(columns.size() - 3, columns.size()));
        assertEquals(43, columns.size(), "the demo's 36, less 4 encoded, plus their 10 and the split column");
        assertEquals(columns, scoring.columns());
    }

    @Test
    void everyRowHasExactlyOnePlanColumnSet() {
        for (Map<String, String> row : training.rows()) {
            assertEquals(1, PLANS.stream().mapToInt(p -> Integer.parseInt(row.get(p))).sum(), row.toString());
        }
    }

    @Test
    void splitAndTrainingCutoffsFollowTheRecipe() throws Exception {
        for (Map<String, String> row : training.rows()) {
            LocalDate cutoff = LocalDate.parse(row.get("cutoff"));
            String expected = !cutoff.isAfter(LocalDate.parse("2025-04-30")) ? "train"
                    : cutoff.isBefore(LocalDate.parse("2025-06-30")) ? ""
                    : !cutoff.isAfter(LocalDate.parse("2025-07-31")) ? "validation"
                    : cutoff.isBefore(LocalDate.parse("2025-09-30")) || cutoff.isAfter(LocalDate.parse("2025-10-31"))
                    ? "" : "test";
            assertEquals(expected, row.get("split"), row.get("cutoff"));
        }
        String fitted = Files.readString(folder.resolve("train/fitted.json"));
        assertTrue(fitted.contains("\"training_cutoffs\": [\"2024-06-30\", \"2024-07-31\", \"2024-08-31\", "
                + "\"2024-09-30\", \"2024-10-31\", \"2024-11-30\", \"2024-12-31\", \"2025-01-31\", \"2025-02-28\", "
                + "\"2025-03-31\", \"2025-04-30\"]"), fitted);
    }

    @Test
    void theTargetMeanIsEmptyOnlyBeforeAnyTrainingLabelIsKnown() {
        // 60-day labels of 2024-06-30 end 2024-08-29: known from the 2024-08-31 rows on.
        for (Map<String, String> row : training.rows()) {
            boolean early = row.get("cutoff").equals("2024-06-30") || row.get("cutoff").equals("2024-07-31");
            assertEquals(early, row.get("home_zone_target_mean").isEmpty(), row.get("cutoff"));
        }
    }

    @Test
    void scoringAMonthAgainWithTheFittedFileGivesTheSameRows() {
        List<Map<String, String>> last = training.rows().stream().filter(r -> r.get("cutoff").equals("2025-12-31"))
                .toList();
        assertTrue(last.size() > 1000, "rows at 2025-12-31: " + last.size());
        assertEquals(last, scoring.rows());
    }

    @Test
    void theDictionaryDescribesEveryColumnInOrder() throws Exception {
        List<CSVRecord> entries = new ArrayList<>();
        try (Reader in = Files.newBufferedReader(folder.resolve("train/dictionary.csv"));
             CSVParser csv = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get().parse(in)) {
            csv.forEach(entries::add);
        }
        assertEquals(training.columns(), entries.stream().map(e -> e.get("column")).toList());
        CSVRecord commuter = entries.get(training.columns().indexOf("plan_commuter"));
        assertTrue(commuter.get("meaning").startsWith("1 when plan is 'commuter', else 0: one-hot level 2 of 4, held by "),
                commuter.get("meaning"));
        assertEquals("plans.plan", commuter.get("sources"));
        assertEquals("split", entries.get(2).get("role"));
        CSVRecord target = entries.get(training.columns().indexOf("home_zone_target_mean"));
        assertTrue(target.get("meaning").contains("(Cestnik 1990)"), target.get("meaning"));
        assertTrue(target.get("defined_at").startsWith("recipes/member-churn-encoded.yaml:"), target.get("defined_at"));
    }
}
