package dev.quern.recipe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.QuernException;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RecipeReaderTest {

    private static final String FILE = "member-churn.yaml";

    /** The example of docs/recipe.md, copied verbatim. */
    private static String example() throws IOException {
        try (InputStream in = RecipeReaderTest.class.getResourceAsStream("/recipes/member-churn.yaml")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    private static Position at(int line, int column) {
        return new Position(FILE, line, column);
    }

    private static Name name(String text, int line, int column) {
        return new Name(text, at(line, column));
    }

    @Test
    void theDocumentedExampleReadsIntoTheExpectedModel() throws IOException {
        String text = example();
        Recipe recipe = RecipeReader.parse(FILE, text);

        Map<String, TableSpec> tables = new LinkedHashMap<>();
        tables.put("rides", new TableSpec(name("rides", 19, 3), Optional.of(name("ride_id", 20, 10)),
                Optional.of(name("started_at", 21, 11)), Optional.empty(),
                List.of(new Link(name("member_id", 22, 14), name("members", 22, 25)),
                        new Link(name("start_station_id", 22, 34), name("stations", 22, 52)),
                        new Link(name("end_station_id", 22, 62), name("stations", 22, 78))),
                List.of(), at(19, 3)));
        tables.put("stations", new TableSpec(name("stations", 23, 3), Optional.of(name("station_id", 23, 20)),
                Optional.empty(), Optional.empty(), List.of(), List.of(), at(23, 3)));
        tables.put("plans", new TableSpec(name("plans", 24, 3), Optional.of(name("plan_row_id", 25, 10)),
                Optional.empty(), Optional.of(new History(name("valid_from", 26, 22), name("valid_to", 26, 38))),
                List.of(new Link(name("member_id", 27, 14), name("members", 27, 25))), List.of(), at(24, 3)));
        tables.put("cancellations", new TableSpec(name("cancellations", 28, 3),
                Optional.of(name("cancellation_id", 29, 10)), Optional.of(name("cancelled_at", 30, 11)),
                Optional.empty(), List.of(new Link(name("member_id", 31, 14), name("members", 31, 25))), List.of(),
                at(28, 3)));
        tables.put("members", new TableSpec(name("members", 32, 3), Optional.empty(), Optional.empty(),
                Optional.empty(), List.of(), List.of(name("email", 33, 19)), at(32, 3)));

        Recipe expected = new Recipe(FILE, text,
                name("member-churn", 1, 9),
                name("jdbc:sqlite:../sample-db/cycle-club.sqlite", 2, 9),
                Optional.of(ZoneId.of("Europe/Amsterdam")),
                new EntitySpec(name("members", 6, 10), name("member_id", 7, 8),
                        Optional.of(name("joined_on", 8, 10)), List.of(name("cancellations", 9, 10)), at(6, 3)),
                new CutoffSpec.Schedule(Every.MONTH_END, LocalDate.of(2024, 7, 31), LocalDate.of(2025, 12, 31),
                        at(12, 3)),
                tables,
                Optional.of(new LabelSpec(name("cancels_in_60d", 36, 9),
                        new PathSpec(List.of(new Hop(name("cancellations", 37, 9), Optional.empty())), at(37, 9)),
                        new Span(60, WindowUnit.DAY, at(38, 12)), new Span(0, WindowUnit.DAY, at(39, 8)),
                        LabelSpec.Kind.EXISTS, Optional.empty(), at(36, 3))),
                List.of(
                        new FeatureSpec.Aggregates(
                                new PathSpec(List.of(new Hop(name("rides", 43, 11), Optional.empty())), at(43, 11)),
                                List.of(new Span(30, WindowUnit.DAY, at(44, 15)),
                                        new Span(90, WindowUnit.DAY, at(44, 20)),
                                        new Span(365, WindowUnit.DAY, at(44, 25))),
                                List.of(new MeasureSpec(MeasureKind.COUNT, Optional.empty(), Optional.empty(),
                                                at(45, 16)),
                                        new MeasureSpec(MeasureKind.SUM, Optional.of(name("distance_km", 45, 27)),
                                                Optional.empty(), at(45, 23)),
                                        new MeasureSpec(MeasureKind.MEAN, Optional.of(name("duration_min", 45, 46)),
                                                Optional.empty(), at(45, 41)),
                                        new MeasureSpec(MeasureKind.STDDEV, Optional.of(name("duration_min", 45, 68)),
                                                Optional.empty(), at(45, 61)),
                                        new MeasureSpec(MeasureKind.DAYS_SINCE_LAST, Optional.empty(),
                                                Optional.empty(), at(45, 83))),
                                Optional.empty(), at(43, 5)),
                        new FeatureSpec.Aggregates(
                                new PathSpec(List.of(new Hop(name("rides", 46, 11), Optional.empty()),
                                        new Hop(name("stations", 46, 37),
                                                Optional.of(name("start_station_id", 46, 17)))),
                                        at(46, 11)),
                                List.of(new Span(90, WindowUnit.DAY, at(47, 15))),
                                List.of(new MeasureSpec(MeasureKind.DISTINCT, Optional.of(name("zone", 49, 18)),
                                                Optional.empty(), at(49, 9)),
                                        new MeasureSpec(MeasureKind.COUNT, Optional.empty(),
                                                Optional.of(name("station_visits_{window}", 50, 34)), at(50, 9))),
                                Optional.of(name("start", 51, 13)), at(46, 5)),
                        new FeatureSpec.Lookup(name("plans", 52, 13), name("plan", 52, 19),
                                Optional.of(name("plan", 53, 11)), at(52, 5))));

        assertEquals(expected.entity(), recipe.entity());
        assertEquals(expected.cutoffs(), recipe.cutoffs());
        assertEquals(expected.tables(), recipe.tables());
        assertEquals(expected.label(), recipe.label());
        assertEquals(expected.features(), recipe.features());
        assertEquals(expected, recipe);
    }

    @Test
    void documentedExampleHasEighteenMonthEnds() throws IOException {
        List<LocalDate> dates = RecipeReader.parse(FILE, example()).cutoffs().dates();
        assertEquals(18, dates.size());
        assertEquals(LocalDate.of(2024, 7, 31), dates.get(0));
        assertEquals(LocalDate.of(2024, 11, 30), dates.get(4));
        assertEquals(LocalDate.of(2025, 2, 28), dates.get(7));
        assertEquals(LocalDate.of(2025, 12, 31), dates.get(17));
    }

    @Test
    void positionsPointAtTheValueAndInsideStrings() throws IOException {
        Recipe recipe = RecipeReader.parse(FILE, example());
        FeatureSpec.Aggregates twoHops = (FeatureSpec.Aggregates) recipe.features().get(1);
        assertEquals("member-churn.yaml:46:37", twoHops.from().last().table().position().toString());
        assertEquals("member-churn.yaml:46:17", twoHops.from().last().via().orElseThrow().position().toString());
        assertEquals("rides.start_station_id -> stations", twoHops.from().text());
        assertEquals("member-churn.yaml:44:25",
                ((FeatureSpec.Aggregates) recipe.features().get(0)).windows().get(2).position().toString());
        assertEquals("member-churn.yaml:7:8", recipe.entity().key().position().toString());
    }

    /** A small valid recipe; {@code %s} takes extra top-level text or replaces a section. */
    private static final String SMALL = """
            recipe: small
            source: jdbc:sqlite:${DATA_DIR}/shop.sqlite
            entity: { table: customers, key: customer_id }
            %s
            tables:
              orders: { key: order_id, time: ordered_at, links: { customer_id: customers } }
            features:
              - from: orders
                windows: [4w]
                measures: [count]
            %s
            """;

    private static Recipe small(String cutoffs, String rest) {
        return RecipeReader.parse("small.yaml", SMALL.formatted(cutoffs, rest));
    }

    @Test
    void weekEndSchedulesGiveSundays() {
        Recipe recipe = small("cutoffs: { every: week-end, from: 2025-01-01, to: 2025-01-31 }", "");
        assertEquals(List.of(LocalDate.of(2025, 1, 5), LocalDate.of(2025, 1, 12), LocalDate.of(2025, 1, 19),
                LocalDate.of(2025, 1, 26)), recipe.cutoffs().dates());
        assertTrue(recipe.cutoffs().dates().stream().allMatch(d -> d.getDayOfWeek() == java.time.DayOfWeek.SUNDAY));
    }

    @Test
    void explicitDatesAreSortedWithoutRepeats() {
        Recipe recipe = small("cutoffs: { dates: [2025-06-30, 2025-03-31, 2025-06-30] }", "");
        assertEquals(List.of(LocalDate.of(2025, 3, 31), LocalDate.of(2025, 6, 30)), recipe.cutoffs().dates());
        assertTrue(recipe.cutoffs() instanceof CutoffSpec.Dates);
    }

    @Test
    void sourceIsKeptAsWrittenAndTheWholeTextIsKept() {
        String text = SMALL.formatted("cutoffs: { dates: [2025-03-31] }", "");
        Recipe recipe = RecipeReader.parse("small.yaml", text);
        assertEquals("jdbc:sqlite:${DATA_DIR}/shop.sqlite", recipe.source().text());
        assertEquals(text, recipe.text());
        assertEquals("small.yaml", recipe.file());
        assertEquals(Optional.empty(), recipe.timeZone());
        assertEquals(Optional.empty(), recipe.label());
    }

    @Test
    void missingGapIsZeroDaysWrittenNowhere() {
        Recipe recipe = small("cutoffs: { dates: [2025-03-31] }", """
                label: { name: spend_60d, from: orders, horizon: 60d, value: sum(amount) }
                """);
        LabelSpec label = recipe.label().orElseThrow();
        assertEquals(new Span(0, WindowUnit.DAY, Position.NONE), label.gap());
        assertEquals(LabelSpec.Kind.SUM, label.kind());
        assertEquals(new Name("amount", new Position("small.yaml", 11, 66)), label.column().orElseThrow());
    }

    @Test
    void untilTakesAListOfTables() {
        String text = """
                recipe: small
                source: jdbc:sqlite:shop.sqlite
                entity:
                  table: customers
                  key: customer_id
                  until: [closures, bans]
                cutoffs: { dates: [2025-03-31] }
                tables:
                  closures: { time: closed_at, links: { customer_id: customers } }
                  bans: { time: banned_at, links: { customer_id: customers } }
                features:
                  - lookup: bans.reason
                """;
        EntitySpec entity = RecipeReader.parse("u.yaml", text).entity();
        assertEquals(List.of(new Name("closures", new Position("u.yaml", 6, 11)),
                new Name("bans", new Position("u.yaml", 6, 21))), entity.until());
        assertEquals(Optional.empty(), entity.since());
    }

    @Test
    void anEmptyTableDescriptionDeclaresTheTable() {
        Recipe recipe = RecipeReader.parse("e.yaml", SMALL.formatted("cutoffs: { dates: [2025-03-31] }", "")
                .replace("tables:\n", "tables:\n  regions:\n"));
        TableSpec regions = recipe.tables().get("regions");
        assertEquals(Optional.empty(), regions.key());
        assertEquals(List.of(), regions.links());
        assertEquals(new Position("e.yaml", 6, 3), regions.position());
    }

    @Test
    void quotedValuesWithoutEscapesKeepInnerPositions() {
        String text = SMALL.formatted("cutoffs: { dates: [2025-03-31] }", "")
                .replace("- from: orders", "- from: \"orders\"")
                .replace("measures: [count]", "measures: ['sum( amount )', \"mean(\\u0061mount)\"]");
        FeatureSpec.Aggregates block = (FeatureSpec.Aggregates) RecipeReader.parse("q.yaml", text).features().get(0);
        assertEquals(new Position("q.yaml", 8, 12), block.from().first().table().position());
        // single-quoted, written as read: the column is found inside the quotes
        assertEquals(new Position("q.yaml", 10, 22), block.measures().get(0).column().orElseThrow().position());
        // an escape makes the written text longer than the value: the value's own position is used
        assertEquals(new Position("q.yaml", 10, 33), block.measures().get(1).column().orElseThrow().position());
        assertEquals("amount", block.measures().get(1).column().orElseThrow().text());
    }

    @Test
    void readNamesPositionsAfterTheGivenPath(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("shop.yaml");
        Files.writeString(file, SMALL.formatted("cutoffs: { dates: [2025-03-31] }", ""));
        Recipe recipe = RecipeReader.read(file);
        assertEquals(file.toString(), recipe.file());
        assertEquals(new Position(file.toString(), 1, 9), recipe.name().position());
    }

    @Test
    void aMissingFileIsAUsageError(@TempDir Path dir) {
        Path file = dir.resolve("nowhere.yaml");
        QuernException e = assertThrows(QuernException.class, () -> RecipeReader.read(file));
        assertEquals(Failure.USAGE, e.failure());
        assertEquals("no recipe file " + file + ": check the path", e.getMessage());
    }

    @Test
    void aFolderIsAUsageError(@TempDir Path dir) {
        QuernException e = assertThrows(QuernException.class, () -> RecipeReader.read(dir));
        assertEquals(Failure.USAGE, e.failure());
        assertTrue(e.getMessage().contains(dir.toString()), e.getMessage());
    }

    @Test
    void aFileThatIsNotUtf8IsARecipeError(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("latin1.yaml");
        Files.write(file, "recipe: caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1));
        QuernException e = assertThrows(QuernException.class, () -> RecipeReader.read(file));
        assertEquals(Failure.RECIPE, e.failure());
        assertEquals(file + ": the file is not UTF-8 text: save it as UTF-8", e.getMessage());
    }

    @Test
    void errorsAreReportedInFileOrderWithTheRecipeExitCode() {
        QuernException e = assertThrows(QuernException.class, () -> small("cutoffs: { dates: [2025-13-01] }",
                "label: { name: x, from: orders, horizon: 0d, value: exists }"));
        assertEquals(Failure.RECIPE, e.failure());
        assertEquals(65, e.failure().exitCode());
        assertEquals(List.of(
                "small.yaml:4:20: '2025-13-01' is not a date: write YYYY-MM-DD",
                "small.yaml:11:42: horizon 0d is empty: a label horizon must be longer than zero, e.g. 60d"),
                e.diagnostics().stream().map(dev.quern.Diagnostic::render).toList());
    }
}
