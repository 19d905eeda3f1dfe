package dev.quern.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.quern.Diagnostics;
import dev.quern.Position;
import dev.quern.schema.Engine;
import dev.quern.schema.ValueType;
import org.jooq.Field;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;

/** Whole SQL text for SQLite and PostgreSQL: every difference between the two is an engine fact. */
class ExprRendererTest {

    /** The caller's side of rendering: each binding's handle is the alias it is read under. */
    private static final Scope SCOPE = Scope.builder()
            .column("r", "distance_km", ValueType.DECIMAL, "r")
            .column("r", "duration_min", ValueType.DECIMAL, "r")
            .column("r", "n", ValueType.INTEGER, "r")
            .column("r", "started_at", ValueType.TIMESTAMP, "r")
            .column("r", "name", ValueType.TEXT, "r")
            .column("m", "joined_on", ValueType.DATE, "m")
            .column("t", "closed_at", ValueType.TIMESTAMP, "t")
            .cutoff(ValueType.DATE, "cohort")
            .build();

    private static Field<?> column(Binding binding) {
        return DSL.field(DSL.name((String) binding.handle(), binding.name()));
    }

    private static CheckedExpression checked(String text, Expect expect) {
        Diagnostics out = new Diagnostics();
        return Expressions.compile(text, Position.NONE, SCOPE, expect, out)
                .orElseThrow(() -> new AssertionError(out.all()));
    }

    private static String condition(Engine engine, String text) {
        return engine.sql().render(ExprRenderer.forEngine(engine).condition(checked(text, Expect.CONDITION),
                ExprRendererTest::column));
    }

    private static String value(Engine engine, String text) {
        return engine.sql().render(ExprRenderer.forEngine(engine).field(checked(text, Expect.VALUE),
                ExprRendererTest::column));
    }

    @Test
    void divisionIsRealAndNullByZero() {
        String rule = "distance_km / (duration_min / 60.0) <= 45";
        assertEquals("(cast(r.distance_km as double) / nullif((cast(r.duration_min as double) / nullif(6E1, 0)), 0))"
                + " <= 45", condition(Engine.SQLITE, rule));
        assertEquals("(cast(\"r\".\"distance_km\" as double precision) / nullif((cast(\"r\".\"duration_min\" as double"
                + " precision) / nullif(60.0, 0)), 0)) <= 45", condition(Engine.POSTGRES, rule));
    }

    @Test
    void aTimestampMeetsADateByItsDay() {
        assertEquals("substr(t.closed_at, 1, 10) <= cohort.cutoff", condition(Engine.SQLITE, "closed_at <= cutoff"));
        assertEquals("cast(\"t\".\"closed_at\" as date) <= \"cohort\".\"cutoff\"",
                condition(Engine.POSTGRES, "closed_at <= cutoff"));
    }

    @Test
    void datePartsAndDayCountsFollowTheEngine() {
        String text = "day_of_week(started_at) in (6, 7) and days_between(joined_on, cutoff) >= 30";
        assertEquals("((((cast(strftime('%w', r.started_at) as integer) + 6) % 7) + 1) in (6, 7)"
                + " and cast(julianday(substr(cohort.cutoff, 1, 10)) - julianday(substr(m.joined_on, 1, 10)) as integer)"
                + " >= 30)", condition(Engine.SQLITE, text));
        assertEquals("(cast(extract(isodow from \"r\".\"started_at\") as integer) in (6, 7)"
                + " and (\"cohort\".\"cutoff\" - \"m\".\"joined_on\") >= 30)", condition(Engine.POSTGRES, text));
        assertEquals("((cast(strftime('%Y', r.started_at) as integer) * 100) + cast(strftime('%m', r.started_at) as integer))",
                value(Engine.SQLITE, "year(started_at) * 100 + month(started_at)"));
        assertEquals("((cast(extract(year from \"r\".\"started_at\") as integer) * 100)"
                        + " + cast(extract(month from \"r\".\"started_at\") as integer))",
                value(Engine.POSTGRES, "year(started_at) * 100 + month(started_at)"));
    }

    @Test
    void logarithmsAndRootsSeeNullOutsideTheirDomain() {
        String text = "ln(distance_km) > 1 or sqrt(n) is null or exp(n) > 1";
        assertEquals("(ln(nullif(max(r.distance_km, 0), 0)) > 1 or sqrt(r.n) is null"
                + " or exp(nullif(min(r.n, 7.0978E2), 7.0978E2)) > 1)", condition(Engine.SQLITE, text));
        assertEquals("(ln(nullif(greatest(\"r\".\"distance_km\", 0), 0)) > 1"
                + " or sqrt(case when \"r\".\"n\" >= 0 then \"r\".\"n\" end) is null"
                + " or exp(nullif(least(\"r\".\"n\", 709.78), 709.78)) > 1)", condition(Engine.POSTGRES, text));
    }

    @Test
    void greatestIsNullWhenAnyArgumentIs() {
        String text = "coalesce(n, 0) + greatest(distance_km, 2.5)";
        assertEquals("(coalesce(r.n, 0) + max(r.distance_km, 2.5E0))", value(Engine.SQLITE, text));
        assertEquals("(coalesce(\"r\".\"n\", 0) + case when (\"r\".\"distance_km\" is not null and 2.5 is not null)"
                + " then greatest(\"r\".\"distance_km\", 2.5) end)", value(Engine.POSTGRES, text));
    }

    @Test
    void roundingIsHalfAwayFromZeroOnBoth() {
        assertEquals("round(r.distance_km, 1)", value(Engine.SQLITE, "round(distance_km, 1)"));
        assertEquals("round(cast(\"r\".\"distance_km\" as numeric), 1)", value(Engine.POSTGRES, "round(distance_km, 1)"));
    }

    @Test
    void literalsAreInlinedAndEscaped() {
        String text = "joined_on = date '2025-03-31' or started_at < timestamp '2025-03-31 12:00' or name = 'it''s'";
        assertEquals("(m.joined_on = '2025-03-31' or replace(r.started_at, 'T', ' ') < '2025-03-31 12:00:00'"
                + " or r.name = 'it''s')",
                condition(Engine.SQLITE, text));
        assertEquals("(\"m\".\"joined_on\" = date '2025-03-31' or \"r\".\"started_at\" < timestamp '2025-03-31 12:00:00.0'"
                + " or \"r\".\"name\" = 'it''s')", condition(Engine.POSTGRES, text));
    }

    @Test
    void nullsAreTypedWhereTheEngineNeedsIt() {
        String text = "not (n not between 1 and 3) and name not in ('a', null) and abs(null) is null";
        assertEquals("(not (r.n not between 1 and 3) and r.name not in ('a', null) and abs(null) is null)",
                condition(Engine.SQLITE, text));
        assertEquals("(not (\"r\".\"n\" not between 1 and 3) and \"r\".\"name\" not in ('a', cast(null as varchar))"
                + " and abs(cast(null as bigint)) is null)", condition(Engine.POSTGRES, text));
    }

    @Test
    void aConditionIsAlsoAValue() {
        assertEquals("(r.n > 2)", value(Engine.SQLITE, "n > 2"));
    }

    @Test
    void onlyABooleanRendersAsACondition() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> ExprRenderer.forEngine(Engine.SQLITE)
                .condition(checked("n + 1", Expect.VALUE), ExprRendererTest::column));
        assertEquals("'n + 1' is not a condition but a number; check it with Expect.CONDITION", e.getMessage());
    }
}
