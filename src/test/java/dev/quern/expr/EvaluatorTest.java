package dev.quern.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.QuernException;
import dev.quern.schema.ValueType;
import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

class EvaluatorTest {

    private static final Scope SCOPE = Scope.builder()
            .column("a", ValueType.BOOLEAN, "a")
            .column("b", ValueType.BOOLEAN, "b")
            .column("n", ValueType.INTEGER, "n")
            .column("x", ValueType.DECIMAL, "x")
            .column("s", ValueType.TEXT, "s")
            .column("t", ValueType.TIMESTAMP, "t")
            .column("d", ValueType.DATE, "d")
            .cutoff(ValueType.DATE, "cutoff")
            .build();

    private static CheckedExpression checked(String text) {
        Diagnostics out = new Diagnostics();
        return Expressions.compile(text, Position.NONE, SCOPE, Expect.VALUE, out)
                .orElseThrow(() -> new AssertionError(out.all()));
    }

    private static Object eval(String text, Object... keysAndValues) {
        Map<String, Object> row = new HashMap<>();
        for (String name : new String[] {"a", "b", "n", "x", "s", "t", "d", "cutoff"}) {
            row.put(name, null);
        }
        for (int i = 0; i < keysAndValues.length; i += 2) {
            row.put((String) keysAndValues[i], keysAndValues[i + 1]);
        }
        return Evaluator.evaluate(checked(text), row);
    }

    /** SQL's three-valued truth tables (ISO/IEC 9075-2, 6.39 "boolean value expression"). */
    @Test
    void andOrNotFollowThreeValuedLogic() {
        Boolean[] values = {Boolean.TRUE, Boolean.FALSE, null};
        // Rows: a = true, false, null; columns: b = true, false, null.
        Boolean[][] and = {{true, false, null}, {false, false, false}, {null, false, null}};
        Boolean[][] or = {{true, true, true}, {true, false, null}, {true, null, null}};
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                String where = "a=" + values[i] + ", b=" + values[j];
                assertEquals(and[i][j], eval("a and b", "a", values[i], "b", values[j]), where);
                assertEquals(or[i][j], eval("a or b", "a", values[i], "b", values[j]), where);
            }
        }
        assertEquals(false, eval("not a", "a", true));
        assertEquals(true, eval("not a", "a", false));
        assertNull(eval("not a", "a", null));
    }

    @Test
    void comparisonsWithNullAreNull() {
        assertNull(eval("n = 1"));
        assertNull(eval("null = null"));
        assertEquals(true, eval("n is null"));
        assertEquals(false, eval("n is not null"));
        assertEquals(true, eval("n = 1.0", "n", 1L));
        assertEquals(true, eval("-0.0 = 0"));
    }

    @Test
    void inFollowsThreeValuedLogic() {
        assertEquals(true, eval("1 in (1, null)"));
        assertNull(eval("3 in (1, null)"));
        assertEquals(false, eval("3 in (1, 2)"));
        assertNull(eval("3 not in (1, null)"));
        assertEquals(true, eval("3 not in (1, 2)"));
        assertNull(eval("n in (1, 2)"));
    }

    @Test
    void betweenIsTwoComparisons() {
        assertEquals(true, eval("2 between 1 and 3"));
        assertEquals(false, eval("1 between null and 0"));
        assertNull(eval("1 between null and 2"));
        assertEquals(true, eval("1 not between null and 0"));
        assertEquals(true, eval("1.5 between 1 and 2"));
    }

    @Test
    void divisionByZeroIsNull() {
        assertNull(eval("1 / 0"));
        assertNull(eval("1 / 0.0"));
        assertNull(eval("n % 0", "n", 5L));
        assertEquals(3.5, eval("7 / 2"));
        assertEquals(-1L, eval("-7 % 3"));
        assertEquals(1L, eval("7 % -3"));
    }

    @Test
    void logarithmsAndRootsOutsideTheirDomainAreNull() {
        assertNull(eval("ln(0)"));
        assertNull(eval("ln(-1)"));
        assertNull(eval("log10(0)"));
        assertNull(eval("sqrt(-0.5)"));
        assertEquals(0.0, eval("sqrt(0)"));
        assertEquals(2.0, eval("log10(100)"));
        assertNull(eval("exp(710)"));
        assertTrue(Double.isFinite((Double) eval("exp(709)")));
    }

    @Test
    void wholeNumbersStayWholeAndDecimalsAreDoubles() {
        assertEquals(7L, eval("n * 2 + 1", "n", 3));
        assertEquals(7.0, eval("x * 2 + 1", "x", new BigDecimal("3")));
        assertEquals(3L, eval("abs(n)", "n", -3L));
        assertEquals(2.0, eval("coalesce(n, x)", "n", 2L, "x", 1.5));
        assertEquals(1.5, eval("least(n, x)", "n", 2L, "x", 1.5));
        assertEquals(2.0, eval("greatest(n, x)", "n", 2L, "x", 1.5));
        assertNull(eval("greatest(n, x)", "n", 2L));
        assertNull(eval("nullif(n, 2.0)", "n", 2L));
        assertEquals(2L, eval("nullif(n, null)", "n", 2L));
    }

    /** Half away from zero, on the double's exact value: 2.675 is 2.67499999... as a double. */
    @Test
    void roundingIsHalfAwayFromZeroOnTheExactValue() {
        assertEquals(3.0, eval("round(2.5)"));
        assertEquals(-3.0, eval("round(-2.5)"));
        assertEquals(0.13, eval("round(0.125, 2)"));
        assertEquals(2.67, eval("round(2.675, 2)"));
        assertEquals(3.0, eval("round(n)", "n", 3L));
    }

    @Test
    void textFunctionsCountCharactersNotUnits() {
        assertEquals(1L, eval("length(s)", "s", "😀"));
        assertEquals("ab", eval("lower(s)", "s", "AB"));
        assertEquals(true, eval("s < '😀'", "s", "ｓ"));
    }

    /** 2025-03-30 was a Sunday and 2025-03-31 a Monday; 2024 was a leap year. */
    @Test
    void datePartsAndDayCounts() {
        assertEquals(7L, eval("day_of_week(date '2025-03-30')"));
        assertEquals(1L, eval("day_of_week(d)", "d", "2025-03-31"));
        assertEquals(2025L, eval("year(t)", "t", "2025-03-31T23:59:59"));
        assertEquals(3L, eval("month(t)", "t", LocalDateTime.of(2025, 3, 31, 23, 59)));
        assertEquals(23L, eval("hour(t)", "t", "2025-03-31 23:59:59.5"));
        assertEquals(2L, eval("days_between(date '2024-02-28', date '2024-03-01')"));
        assertEquals(1L, eval("days_between(timestamp '2025-03-31 23:59', timestamp '2025-04-01 00:01')"));
        assertEquals(-30L, eval("days_between(cutoff, d)", "cutoff", LocalDate.of(2025, 3, 31), "d", "2025-03-01"));
    }

    /** A date stands for its whole day: a timestamp on that day is neither before nor after it. */
    @Test
    void aTimestampMeetsADateByItsDay() {
        assertEquals(true, eval("t <= cutoff", "t", "2025-03-31 23:59:59", "cutoff", "2025-03-31"));
        assertEquals(true, eval("t = cutoff", "t", "2025-03-31 12:00:00", "cutoff", "2025-03-31"));
        assertEquals(false, eval("t <= cutoff", "t", "2025-04-01 00:00:00", "cutoff", "2025-03-31"));
        assertEquals(true, eval("t in (date '2025-03-31')", "t", "2025-03-31T08:00"));
        assertEquals(true, eval("t > timestamp '2025-03-31 12:00'", "t", "2025-03-31 12:00:01"));
    }

    @Test
    void rowValuesInJdbcFormsAreAccepted() {
        assertEquals(true, eval("a and b", "a", 1, "b", 1L));
        assertEquals(4L, eval("n + 1", "n", new BigDecimal("3")));
        assertEquals(true, eval("d = date '2025-03-31'", "d", java.sql.Date.valueOf("2025-03-31")));
        assertEquals(true, eval("t = timestamp '2025-03-31 12:00'", "t", java.sql.Timestamp.valueOf("2025-03-31 12:00:00")));
    }

    @Test
    void aValueThatIsNotOfTheColumnsTypeStopsTheRun() {
        QuernException e = assertThrows(QuernException.class, () -> eval("n + 1", "n", 2.5));
        assertEquals(Failure.DATA, e.failure());
        assertEquals("column n holds 2.5, which is not a whole number", e.getMessage());
        assertEquals("column d holds '31/03/2025', which is not a date",
                assertThrows(QuernException.class, () -> eval("year(d)", "d", "31/03/2025")).getMessage());
        assertEquals("column a holds 2, which is not a boolean",
                assertThrows(QuernException.class, () -> eval("not a", "a", 2)).getMessage());
    }

    @Test
    void wholeNumberOverflowIsReportedNotWrapped() {
        QuernException e = assertThrows(QuernException.class, () -> eval("n * 2", "n", Long.MAX_VALUE));
        assertEquals("'n * 2' goes beyond the range of whole numbers on this row", e.getMessage());
    }

    @Test
    void aMissingRowValueIsTheCallersMistake() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Evaluator.evaluate(checked("n + 1"), Map.of("x", 1)));
        assertEquals("the row has no value for n", e.getMessage());
    }

    @Test
    void aWhereClauseKeepsOnlyTrueRows() {
        Diagnostics out = new Diagnostics();
        CheckedExpression positive = Expressions.compile("n > 0", Position.NONE, SCOPE, Expect.CONDITION, out).orElseThrow();
        Map<String, Object> row = new HashMap<>();
        row.put("n", 1L);
        assertTrue(Evaluator.keeps(positive, row));
        row.put("n", -1L);
        assertFalse(Evaluator.keeps(positive, row));
        row.put("n", null);
        assertFalse(Evaluator.keeps(positive, row));
        assertEquals(Arrays.asList(true, null), Arrays.asList(eval("1 < 2"), eval("n < 2")));
    }
}
