package dev.quern.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.quern.Diagnostics;
import dev.quern.Position;
import dev.quern.schema.Engine;
import dev.quern.schema.ValueType;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jooq.Field;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Dates and timestamps kept as ISO text, as SQLite keeps them: SQLite's strftime() and julianday() agree
 * with java.time in the evaluator, two independent calendars, across leap days, year ends, both ends of the
 * week, both ISO separators and nulls.
 */
class DateFunctionsOnSqliteTest {

    private static final List<String> DATES = Arrays.asList("2024-02-28", "2024-02-29", "2024-03-01", "2024-12-31",
            "2025-01-01", "2025-03-30", "2025-03-31", "2023-01-01", null);
    private static final List<String> TIMES = Arrays.asList("2025-03-31 23:59:59", "2025-03-31T00:00:00",
            "2024-02-29 12:30:00", "2025-01-01 00:00:00.5", "2025-03-30T07:15:00", "2025-03-31 12:00:00", null);
    private static final String CUTOFF = "2025-03-31";

    private static final Scope SCOPE = Scope.builder()
            .column("e", "d", ValueType.DATE, "d")
            .column("e", "t", ValueType.TIMESTAMP, "t")
            .cutoff(ValueType.DATE, "cutoff")
            .build();

    private static List<List<Object>> rows() {
        List<List<Object>> rows = new ArrayList<>();
        int id = 1;
        for (String d : DATES) {
            for (String t : TIMES) {
                rows.add(Arrays.asList(id++, d, t, CUTOFF));
            }
        }
        return rows;
    }

    private static Field<?> column(Binding binding) {
        return DSL.field(DSL.name("e", (String) binding.handle()));
    }

    private static CheckedExpression compile(String text) {
        Diagnostics out = new Diagnostics();
        return Expressions.compile(text, Position.NONE, SCOPE, Expect.VALUE, out)
                .orElseThrow(() -> new AssertionError(out.all()));
    }

    @ParameterizedTest
    @ValueSource(strings = {
        "year(d)", "month(d)", "day_of_week(d)", "year(t)", "month(t)", "day_of_week(t)", "hour(t)",
        "days_between(d, t)", "days_between(t, d)", "days_between(d, cutoff)", "days_between(t, cutoff)",
        "t <= cutoff", "t < cutoff", "t = d", "t > d", "d >= cutoff", "t between d and cutoff",
        "t not between d and cutoff", "t in (d, cutoff)", "t < timestamp '2025-03-31 12:00'",
        "t = timestamp '2025-03-31 00:00'", "t between timestamp '2025-01-01 00:00' and timestamp '2025-03-31 08:00'",
        "t in (timestamp '2025-03-30 07:15')", "d = date '2024-02-29'", "day_of_week(d) in (6, 7)"})
    void sqliteAndTheEvaluatorAgree(String text) {
        CheckedExpression checked = compile(text);
        List<List<Object>> rows = rows();
        try (InMemorySqlite db = InMemorySqlite.open()) {
            db.execute("create table e (id integer primary key, d text, t text, cutoff text)");
            db.insert("e", rows);
            Field<Object> value = ExprRenderer.forEngine(Engine.SQLITE).field(checked, DateFunctionsOnSqliteTest::column);
            List<?> fromSql = db.sql().select(value).from(DSL.table(DSL.name("e")))
                    .orderBy(DSL.field(DSL.name("e", "id"))).fetch().getValues(0);
            List<Object> expected = new ArrayList<>();
            List<Object> actual = new ArrayList<>();
            for (int r = 0; r < rows.size(); r++) {
                Map<String, Object> row = new LinkedHashMap<>();
                row.put("e.d", rows.get(r).get(1));
                row.put("e.t", rows.get(r).get(2));
                row.put(Scope.CUTOFF, rows.get(r).get(3));
                Object v = Evaluator.evaluate(checked, row);
                expected.add(rows.get(r).get(1) + " " + rows.get(r).get(2) + " -> "
                        + (v instanceof Boolean b ? (b ? 1 : 0) : v));
                Object s = fromSql.get(r);
                actual.add(rows.get(r).get(1) + " " + rows.get(r).get(2) + " -> "
                        + (s instanceof Number n ? String.valueOf(n.longValue()) : s));
            }
            assertEquals(expected, actual, text);
        }
    }

    /** Calendar facts: 2025-03-30 was a Sunday, 2025-03-31 a Monday, and 2024 had a 29 February. */
    @Test
    void knownDaysComeOutRight() {
        try (InMemorySqlite db = InMemorySqlite.open()) {
            Object[] answers = db.sql().select(
                    render("day_of_week(date '2025-03-30')"), render("day_of_week(date '2025-03-31')"),
                    render("days_between(date '2024-02-28', date '2024-03-01')"),
                    render("days_between(timestamp '2025-03-31 23:59', timestamp '2025-04-01 00:01')"))
                    .fetchOne().intoArray();
            assertEquals(List.of(7, 1, 2, 1), Arrays.stream(answers).map(a -> ((Number) a).intValue()).toList());
        }
    }

    private static Field<Object> render(String text) {
        return ExprRenderer.forEngine(Engine.SQLITE).field(compile(text), DateFunctionsOnSqliteTest::column);
    }
}
