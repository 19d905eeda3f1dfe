package dev.quern.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Failure;
import dev.quern.Quern;
import dev.quern.QuernException;
import dev.quern.cli.Main;
import dev.quern.plan.Plan;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;

/** Lineage of the demo's columns, forwards and in reverse, as text, JSON and the dictionary's one line. */
class LineageTest {

    private static final java.nio.file.Path DEMO = java.nio.file.Path.of("recipes/member-churn.yaml");

    static Plan plan;
    static Lineage lineage;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    @BeforeAll
    static void compile() {
        plan = Quern.load(DEMO).compile().plan();
        lineage = Lineage.of(plan);
    }

    private int quern(String... args) {
        return Main.run(new PrintWriter(out, true), new PrintWriter(err, true), args);
    }

    @Test
    void everyOutputColumnHasALineageInOutputOrder() {
        assertEquals(plan.columns().stream().map(c -> c.name()).toList(),
                lineage.columns().stream().map(ColumnLineage::column).toList());
    }

    @Test
    void aMeasureGoesFromItsTableThroughItsJoinsAndWindow() {
        assertEquals("""
                start_station_distinct_zone_90d (feature, integer, defined at recipes/member-churn.yaml:67)
                  table    rides
                  join     rides.member_id = members.member_id
                           ties each row to the entity
                  join     rides.start_station_id = stations.station_id
                           follows the link
                  filter   %s
                  window   90d on rides.started_at
                           rows with rides.started_at in [end of cutoff day - 90d, end of cutoff day)
                  measure  distinct(stations.zone)
                """.formatted("where rule: rides rows must meet distance_km / (duration_min / 60.0) <= 45 (faster than any e-bike: the bike was on a train or in a car)"), Lineage.text(List.of(lineage.column("start_station_distinct_zone_90d"))));
    }

    @Test
    void lookupsSayHowTheyAreTiedToTheCutoff() {
        assertEquals("""
                plan (feature, text, defined at recipes/member-churn.yaml:87)
                  table    plans
                  join     plans.member_id = members.member_id
                           ties each row to the entity
                  as_of    in force at cutoff by plans.valid_from/plans.valid_to
                           the row with plans.valid_from before the end of the cutoff day and plans.valid_to \
                empty or not before it; the latest valid_from wins, then the highest key
                  value    plans.plan

                home_zone (feature, text, defined at recipes/member-churn.yaml:91)
                  table    members
                  as_of    current value (no history)
                           the value as the source holds it now: members keeps no history of it, so it may \
                have been written after the cutoff
                  value    members.home_zone
                """, Lineage.text(List.of(lineage.column("plan"), lineage.column("home_zone"))));
    }

    @Test
    void theOneLineFormIsWhatTheDictionaryCarries() {
        assertEquals("rides > join rides.member_id = members.member_id > where rule: rides rows must meet distance_km / (duration_min / 60.0) <= 45 (faster than any e-bike: the bike was on a train or in a car)"
                + " > window 30d on rides.started_at > sum(rides.distance_km)",
                lineage.column("rides_sum_distance_km_30d").oneLine());
        assertEquals("cancellations > join cancellations.member_id = members.member_id"
                + " > horizon 60d after cutoff on cancellations.cancelled_at > exists",
                lineage.column("cancels_in_60d").oneLine());
        assertEquals("members > eligible since members.joined_on, until cancellations.cancelled_at"
                + " > key members.member_id", lineage.column("member_id").oneLine());
        assertEquals("cutoffs 2024-06-30..2025-12-31 (19)", lineage.column("cutoff").oneLine());

        String dictionary = new DataDictionary(plan, emptyRun()).csv();
        assertTrue(dictionary.lines().findFirst().orElseThrow().contains(",defined_at,lineage,empty_share,"),
                dictionary.lines().findFirst().orElseThrow());
        assertTrue(dictionary.contains(",recipes/member-churn.yaml:64,rides > join rides.member_id = "
                + "members.member_id > where rule: rides rows must meet distance_km / (duration_min / 60.0) <= 45 (faster than any e-bike: the bike was on a train or in a car) > window 30d on rides.started_at > count,"), dictionary);
    }

    @Test
    void theReverseListsEveryColumnASourceColumnFeedsAndHow() {
        List<Lineage.Fed> fed = lineage.fedBy("rides.distance_km");

        assertEquals(List.of("rides_sum_distance_km_30d", "rides_sum_distance_km_90d", "rides_sum_distance_km_365d",
                "rides_max_distance_km_30d", "rides_max_distance_km_90d", "rides_max_distance_km_365d"),
                fed.stream().map(f -> f.column().column()).toList());
        assertEquals("""
                stations.zone feeds 1 column:
                  start_station_distinct_zone_90d  value       recipes/member-churn.yaml:67
                """, Lineage.text("stations.zone", lineage.fedBy("stations.zone")));
        assertEquals(List.of(LineageStep.How.TIME), lineage.fedBy("plans.valid_to").get(0).uses());
        assertEquals(19, lineage.fedBy("rides").size(), "a table feeds every column that reads any of it");
        assertEquals(plan.columns().size() - 3, lineage.fedBy("members.member_id").size(),
                "the entity key joins or is every column but the cutoff, home_zone (the entity's own row) and"
                        + " spend_trend (computed from other columns)");
    }

    @Test
    void unknownNamesAreUsageMistakesWithAHint() {
        QuernException column = assertThrows(QuernException.class, () -> lineage.column("rides_count_03d"));
        assertEquals(Failure.USAGE, column.failure());
        assertEquals("no output column 'rides_count_03d' (did you mean rides_count_30d?)", column.getMessage());

        QuernException source = assertThrows(QuernException.class, () -> lineage.fedBy("rides.distanse_km"));
        assertEquals("no output column reads 'rides.distanse_km' (did you mean rides.distance_km?); name a source"
                + " column as table.column, or a table", source.getMessage());
    }

    @Test
    @SuppressWarnings("unchecked")
    void theCommandWritesJsonWithTypedSteps() {
        assertEquals(0, quern("lineage", DEMO.toString(), "rides_mean_duration_min_90d", "--json"),
                err.toString());

        List<Map<String, Object>> columns = (List<Map<String, Object>>) new Yaml(
                new SafeConstructor(new LoaderOptions())).load(out.toString());
        assertEquals(1, columns.size());
        Map<String, Object> c = columns.get(0);
        assertEquals("rides_mean_duration_min_90d", c.get("column"));
        assertEquals("recipes/member-churn.yaml:64", c.get("defined_at"));
        assertEquals(List.of("rides.member_id", "members.member_id", "rides.started_at", "rides.duration_min"),
                c.get("sources"));
        List<Map<String, Object>> steps = (List<Map<String, Object>>) c.get("steps");
        assertEquals(List.of("table", "join", "filter", "window", "measure"),
                steps.stream().map(s -> s.get("step")).toList());
        assertEquals(Map.of("step", "join", "from", "rides.member_id", "to", "members.member_id", "purpose", "entity"),
                steps.get(1));
        assertEquals(Map.of("step", "measure", "measure", "mean", "input", "rides.duration_min"), steps.get(4));
    }

    @Test
    @SuppressWarnings("unchecked")
    void theCommandFollowsASourceForwardsWithFrom() {
        assertEquals(0, quern("lineage", DEMO.toString(), "--from", "payments.amount", "--json"),
                err.toString());

        Map<String, Object> root = (Map<String, Object>) new Yaml(new SafeConstructor(new LoaderOptions()))
                .load(out.toString());
        assertEquals("payments.amount", root.get("from"));
        assertEquals(List.of("payments_sum_amount_30d", "payments_sum_amount_365d"),
                ((List<Map<String, Object>>) root.get("columns")).stream().map(m -> m.get("column")).toList());
    }

    @Test
    void theCommandRejectsMistakesWithExitTwo() {
        assertEquals(2, quern("lineage", DEMO.toString(), "rides_count_30d", "--from", "rides"));
        assertTrue(err.toString().contains("name output columns or --from a source, not both"), err.toString());
        assertEquals(2, quern("lineage", DEMO.toString(), "--from", "ridez"));
        assertTrue(err.toString().contains("(did you mean rides?)"), err.toString());
        assertEquals("", out.toString());
    }

    private static dev.quern.run.RunResult emptyRun() {
        return new dev.quern.run.RunResult(0, Map.of(), plan.columns().stream()
                .map(c -> new dev.quern.run.ColumnStats(c.name(), c.type())).toList(), java.time.Duration.ZERO,
                java.time.Duration.ZERO);
    }
}
