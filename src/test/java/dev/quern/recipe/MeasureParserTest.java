package dev.quern.recipe;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Diagnostic;
import dev.quern.Diagnostics;
import dev.quern.Position;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class MeasureParserTest {

    private static final Position START = new Position("m.yaml", 2, 5);

    private static Position col(int column) {
        return new Position("m.yaml", 2, column);
    }

    private static MeasureSpec ok(String text) {
        Diagnostics d = new Diagnostics();
        Optional<MeasureSpec> measure = MeasureParser.parse(text, Locator.from(START), Optional.empty(), d);
        assertTrue(d.isEmpty(), () -> d.all().toString());
        return measure.orElseThrow();
    }

    private static List<String> errors(String text) {
        Diagnostics d = new Diagnostics();
        assertEquals(Optional.empty(), MeasureParser.parse(text, Locator.from(START), Optional.empty(), d));
        return d.all().stream().map(Diagnostic::render).toList();
    }

    private static final String KNOWN =
            "measures are count, sum, mean, min, max, stddev, distinct, days_since_first, days_since_last";

    @Test
    void everyMeasureIsReadWithOrWithoutItsColumn() {
        assertEquals(new MeasureSpec(MeasureKind.COUNT, Optional.empty(), Optional.empty(), START), ok("count"));
        assertEquals(new MeasureSpec(MeasureKind.SUM, Optional.of(new Name("distance_km", col(9))), Optional.empty(),
                START), ok("sum(distance_km)"));
        for (MeasureKind kind : MeasureKind.values()) {
            String text = kind.takesColumn() ? kind.spelling() + "(c)" : kind.spelling();
            MeasureSpec measure = ok(text);
            assertEquals(kind, measure.kind());
            assertEquals(text, measure.text());
        }
    }

    @Test
    void spacesAroundTheColumnAreAllowedAndTheColumnIsFoundInside() {
        MeasureSpec measure = ok("mean ( duration_min )");
        assertEquals(new Name("duration_min", col(12)), measure.column().orElseThrow());
        assertEquals("mean(duration_min)", measure.text());
    }

    @Test
    void aGivenNameIsKept() {
        Diagnostics d = new Diagnostics();
        Name name = new Name("visits_{window}", col(30));
        MeasureSpec measure = MeasureParser.parse("count", Locator.from(START), Optional.of(name), d).orElseThrow();
        assertEquals(Optional.of(name), measure.name());
    }

    @Test
    void unknownMeasuresListTheKnownOnesAndHintTheNearest() {
        assertEquals(List.of("m.yaml:2:5: unknown measure 'avg' (did you mean mean?); " + KNOWN), errors("avg(x)"));
        assertEquals(List.of("m.yaml:2:5: unknown measure 'nunique' (did you mean distinct?); " + KNOWN),
                errors("nunique(x)"));
        assertEquals(List.of("m.yaml:2:5: unknown measure 'maxx' (did you mean max?); " + KNOWN), errors("maxx(x)"));
        assertEquals(List.of("m.yaml:2:5: unknown measure 'percentile'; " + KNOWN), errors("percentile(x)"));
        assertEquals(List.of("m.yaml:2:5: unknown measure 'Count' (did you mean count?); " + KNOWN), errors("Count"));
    }

    @Test
    void columnsWhereTheyBelongAndNowhereElse() {
        assertEquals(List.of("m.yaml:2:5: measure 'sum' needs a column: write sum(column)"), errors("sum"));
        assertEquals(List.of("m.yaml:2:5: measure 'distinct' needs a column: write distinct(column)"),
                errors("distinct( )"));
        assertEquals(List.of("m.yaml:2:11: measure 'count' takes no column: write count"), errors("count(ride_id)"));
        assertEquals(List.of("m.yaml:2:11: measure 'count' takes no column: write count"), errors("count()"));
        assertEquals(List.of("m.yaml:2:22: measure 'days_since_first' takes no column: write days_since_first"),
                errors("days_since_first(started_at)"));
    }

    @Test
    void textThatIsNoMeasureAtAll() {
        String how = ": write a measure such as count, or a measure and a column such as sum(distance_km)";
        assertEquals(List.of("m.yaml:2:5: 'sum(amount' is not a measure" + how), errors("sum(amount"));
        assertEquals(List.of("m.yaml:2:5: 'sum amount' is not a measure" + how), errors("sum amount"));
        assertEquals(List.of("m.yaml:2:5: '' is not a measure" + how), errors(""));
        assertEquals(List.of("m.yaml:2:5: 'sum(a) + 1' is not a measure" + how), errors("sum(a) + 1"));
    }

    @Test
    void columnsMustBePlainNames() {
        assertEquals(List.of("m.yaml:2:9: 'a, b' is not a plain column name: use letters, digits and _, not"
                + " starting with a digit"), errors("sum(a, b)"));
        assertEquals(List.of("m.yaml:2:9: 'amount) or (1=1' is not a plain column name: use letters, digits and _,"
                + " not starting with a digit"), errors("sum(amount) or (1=1)"));
        assertEquals(List.of("m.yaml:2:9: '\"amount\"' is not a plain column name: use letters, digits and _, not"
                + " starting with a digit"), errors("sum(\"amount\")"));
    }

    @Test
    void labelValues() {
        Diagnostics d = new Diagnostics();
        assertEquals(new MeasureParser.LabelValue(LabelSpec.Kind.EXISTS, Optional.empty()),
                MeasureParser.label("exists", Locator.from(START), d).orElseThrow());
        assertEquals(new MeasureParser.LabelValue(LabelSpec.Kind.COUNT, Optional.empty()),
                MeasureParser.label("count", Locator.from(START), d).orElseThrow());
        assertEquals(new MeasureParser.LabelValue(LabelSpec.Kind.SUM, Optional.of(new Name("amount", col(9)))),
                MeasureParser.label("sum(amount)", Locator.from(START), d).orElseThrow());
        assertTrue(d.isEmpty());

        MeasureParser.label("exist", Locator.from(START), d);
        MeasureParser.label("exists(x)", Locator.from(START), d);
        MeasureParser.label("mean(x)", Locator.from(START), d);
        assertEquals(List.of(
                "m.yaml:2:5: unknown label value 'exist' (did you mean exists?): write exists, count or sum(column)",
                "m.yaml:2:12: label value 'exists' takes no column: write exists",
                "m.yaml:2:5: unknown label value 'mean': write exists, count or sum(column)"),
                d.all().stream().map(Diagnostic::render).toList());
    }
}
