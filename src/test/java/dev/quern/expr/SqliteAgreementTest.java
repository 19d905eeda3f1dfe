package dev.quern.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.fail;

import dev.quern.Diagnostics;
import dev.quern.Position;
import dev.quern.schema.Engine;
import dev.quern.schema.ValueType;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jooq.Field;
import org.jooq.Record;
import org.jooq.impl.DSL;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Random well-typed expressions give the same values through SQL on SQLite as through the in-memory
 * {@link Evaluator}, row by row, including nulls: whole numbers exactly, doubles to 1e-9 relative, booleans
 * as SQLite's 1 and 0. Conditions must also keep the same rows in a where clause. Seeds are fixed, so a
 * failure prints an expression and a row that reproduce it.
 */
class SqliteAgreementTest {

    private static final int ROWS = 60;
    private static final int EXPRESSIONS_PER_SEED = 100;
    private static final double RELATIVE = 1e-9;
    private static final List<String> COLUMNS = List.of("i1", "i2", "d1", "d2", "b1", "b2");

    private static final Scope SCOPE = Scope.builder()
            .column("g", "i1", ValueType.INTEGER, "i1")
            .column("g", "i2", ValueType.INTEGER, "i2")
            .column("g", "d1", ValueType.DECIMAL, "d1")
            .column("g", "d2", ValueType.DECIMAL, "d2")
            .column("g", "b1", ValueType.BOOLEAN, "b1")
            .column("g", "b2", ValueType.BOOLEAN, "b2")
            .build();

    private static Field<?> column(Binding binding) {
        return DSL.field(DSL.name("g", binding.name()));
    }

    @ParameterizedTest
    @ValueSource(longs = {20250131L, 7L, 42L, 1789L})
    void sqlAndEvaluatorAgree(long seed) {
        List<List<Object>> rows = ExpressionGenerator.rows(seed, ROWS);
        ExpressionGenerator generator = new ExpressionGenerator(seed);
        List<String> mismatches = new ArrayList<>();
        int checkedValues = 0;
        try (InMemorySqlite db = InMemorySqlite.open()) {
            db.execute("create table g (id integer primary key, i1 integer, i2 integer, d1 real, d2 real,"
                    + " b1 integer, b2 integer)");
            db.insert("g", rows);
            for (int i = 0; i < EXPRESSIONS_PER_SEED; i++) {
                boolean condition = i % 2 == 0;
                String text = condition ? generator.condition() : generator.number().text();
                CheckedExpression checked = compile(text, condition ? Expect.CONDITION : Expect.VALUE);
                checkedValues += compareValues(db, checked, rows, mismatches);
                if (condition) {
                    compareFilter(db, checked, rows, mismatches);
                }
            }
        }
        if (!mismatches.isEmpty()) {
            fail(mismatches.size() + " mismatches with seed " + seed + ", the first:\n"
                    + String.join("\n", mismatches.subList(0, Math.min(10, mismatches.size()))));
        }
        assertEquals(EXPRESSIONS_PER_SEED * ROWS, checkedValues);
    }

    private static CheckedExpression compile(String text, Expect expect) {
        Diagnostics out = new Diagnostics();
        return Expressions.compile(text, Position.NONE, SCOPE, expect, out)
                .orElseThrow(() -> new AssertionError("the generator wrote an ill-typed expression: " + out.all()));
    }

    private static int compareValues(InMemorySqlite db, CheckedExpression checked, List<List<Object>> rows,
                                     List<String> mismatches) {
        Field<Object> value = ExprRenderer.forEngine(Engine.SQLITE).field(checked, SqliteAgreementTest::column);
        List<?> fromSql = db.sql().select(value).from(DSL.table(DSL.name("g")))
                .orderBy(DSL.field(DSL.name("g", "id"))).fetch().getValues(0);
        for (int r = 0; r < rows.size(); r++) {
            Object expected = Evaluator.evaluate(checked, row(rows.get(r)));
            if (!same(expected, fromSql.get(r))) {
                mismatches.add(checked.text() + "\n  row " + row(rows.get(r)) + ": evaluator " + expected
                        + ", SQLite " + fromSql.get(r));
            }
        }
        return rows.size();
    }

    private static void compareFilter(InMemorySqlite db, CheckedExpression checked, List<List<Object>> rows,
                                      List<String> mismatches) {
        var where = ExprRenderer.forEngine(Engine.SQLITE).condition(checked, SqliteAgreementTest::column);
        List<Integer> kept = db.sql().select(DSL.field(DSL.name("g", "id"), Integer.class))
                .from(DSL.table(DSL.name("g"))).where(where).orderBy(DSL.field(DSL.name("g", "id")))
                .fetch().getValues(0, Integer.class);
        List<Integer> expected = rows.stream().filter(row -> Evaluator.keeps(checked, row(row)))
                .map(row -> (Integer) row.get(0)).toList();
        if (!expected.equals(kept)) {
            mismatches.add(checked.text() + "\n  where keeps " + kept + ", evaluator " + expected);
        }
    }

    private static Map<String, Object> row(List<Object> values) {
        Map<String, Object> row = new LinkedHashMap<>();
        for (int c = 0; c < COLUMNS.size(); c++) {
            row.put("g." + COLUMNS.get(c), values.get(c + 1));
        }
        return row;
    }

    private static boolean same(Object expected, Object actual) {
        if (expected == null || actual == null) {
            return expected == actual;
        }
        if (expected instanceof Boolean b) {
            return actual instanceof Number n && n.longValue() == (b ? 1 : 0) && n.doubleValue() == n.longValue();
        }
        if (expected instanceof Long l) {
            // SQLite returns a whole number as an integer whenever the language says it is one.
            return (actual instanceof Integer || actual instanceof Long) && ((Number) actual).longValue() == l;
        }
        double e = (Double) expected;
        double a = ((Number) actual).doubleValue();
        return e == a || Math.abs(e - a) <= RELATIVE * Math.max(Math.abs(e), Math.abs(a));
    }
}
