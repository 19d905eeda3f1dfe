package dev.quern.expr;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.quern.Diagnostic;
import dev.quern.Diagnostics;
import dev.quern.Position;
import dev.quern.QuernException;
import dev.quern.Failure;
import dev.quern.schema.ValueType;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class TypeCheckerTest {

    private static final Position AT = new Position("rides.yaml", 14, 8);

    private static final Scope SCOPE = Scope.builder()
            .column("rides", "distance_km", ValueType.DECIMAL, "h1")
            .column("rides", "duration", ValueType.TEXT, "h2")
            .column("rides", "member_id", ValueType.INTEGER, "h3")
            .column("rides", "started_at", ValueType.TIMESTAMP, "h4")
            .column("rides", "electric", ValueType.BOOLEAN, "h5")
            .column("rides", "photo", ValueType.OTHER, "h6")
            .column("members", "member_id", ValueType.INTEGER, "h7")
            .column("members", "joined_on", ValueType.DATE, "h8")
            .cutoff(ValueType.DATE, "cutoff-handle")
            .build();

    private static List<String> errors(String text, Expect expect, Scope scope) {
        Diagnostics out = new Diagnostics();
        Optional<CheckedExpression> checked = Expressions.compile(text, AT, scope, expect, out);
        assertEquals(out.isEmpty(), checked.isPresent(), "a result exactly when there is no error");
        return out.all().stream().map(Diagnostic::render).toList();
    }

    /** The one error of a condition, as the user sees it. */
    private static String error(String text) {
        List<String> all = errors(text, Expect.CONDITION, SCOPE);
        assertEquals(1, all.size(), () -> "errors: " + all);
        return all.get(0);
    }

    /** The first line of the one error: the message with its position. */
    private static String message(String text) {
        return error(text).lines().findFirst().orElseThrow();
    }

    private static CheckedExpression ok(String text, Expect expect) {
        Diagnostics out = new Diagnostics();
        Optional<CheckedExpression> checked = Expressions.compile(text, AT, SCOPE, expect, out);
        assertTrue(out.isEmpty(), () -> "unexpected: " + out.all());
        return checked.orElseThrow();
    }

    @Test
    void arithmeticOnTextPointsAtTheTextOperand() {
        assertEquals("""
                rides.yaml:14:22: '/' needs numbers, but duration is text
                distance_km / duration > 1
                              ^""", error("distance_km / duration > 1"));
    }

    @Test
    void unknownNamesSuggestTheClosestKnownOne() {
        assertEquals("rides.yaml:14:8: unknown column 'distnce_km' (did you mean distance_km?)",
                message("distnce_km > 3"));
        assertEquals("rides.yaml:14:8: unknown table 'ridse' (did you mean rides?)",
                message("ridse.distance_km > 3"));
        assertEquals("rides.yaml:14:8: unknown column 'distnce_km' in rides (did you mean distance_km?)",
                message("rides.distnce_km > 3"));
        assertEquals("rides.yaml:14:8: unknown column 'Distance_km' (did you mean distance_km?)",
                message("Distance_km > 3"));
        assertEquals("rides.yaml:14:8: unknown column 'speed'", message("speed > 3"));
    }

    @Test
    void aBareNameInTwoTablesMustBeQualified() {
        assertEquals("rides.yaml:14:8: 'member_id' is a column of more than one table;"
                + " write rides.member_id or members.member_id", message("member_id = 3"));
    }

    @Test
    void theCutoffIsOnlyThereWhenTheScopeHasOne() {
        Scope noCutoff = Scope.builder().column("rides", "started_at", ValueType.TIMESTAMP, "h").build();
        assertEquals(List.of("""
                rides.yaml:14:22: the cutoff cannot be used here
                started_at <= cutoff
                              ^"""), errors("started_at <= cutoff", Expect.CONDITION, noCutoff));
    }

    @Test
    void columnsOfUnusableTypesAreRefused() {
        assertEquals("rides.yaml:14:8: column rides.photo has a type that expressions cannot use (other)",
                message("photo is null"));
    }

    @Test
    void moduloNeedsWholeNumbers() {
        assertEquals("rides.yaml:14:8: '%' needs whole numbers, but distance_km is a decimal number",
                message("distance_km % 2 = 0"));
    }

    @Test
    void dateArithmeticPointsToDaysBetween() {
        assertEquals("rides.yaml:14:8: '+' needs numbers, but joined_on is a date"
                + " (days_between(a, b) counts the days from a to b)", message("joined_on + 30 > 5"));
    }

    @Test
    void negationNeedsANumber() {
        assertEquals(List.of("rides.yaml:14:9: '-' needs a number, but duration is text\n-duration\n ^"),
                errors("-duration", Expect.VALUE, SCOPE));
    }

    @Test
    void logicNeedsBooleans() {
        assertEquals("rides.yaml:14:21: 'and' needs booleans, but distance_km is a number",
                message("electric AND distance_km"));
        assertEquals("rides.yaml:14:12: 'not' needs a boolean, but duration is text",
                message("not duration"));
    }

    @Test
    void comparisonsNeedComparableTypes() {
        assertEquals("""
                rides.yaml:14:20: '=' cannot compare distance_km (a number) with 'far' (text)
                distance_km = 'far'
                            ^""", error("distance_km = 'far'"));
        assertEquals("rides.yaml:14:18: '>=' cannot compare joined_on (a date) with '2025-01-01' (text)"
                + " (write date 'YYYY-MM-DD' for a date)", message("joined_on >= '2025-01-01'"));
        assertEquals("rides.yaml:14:34: 'between' cannot compare distance_km (a number) with 'x' (text)",
                message("distance_km between 1 and 'x'"));
    }

    @Test
    void everyBadItemOfAnInListIsReported() {
        assertEquals(List.of(
                "rides.yaml:14:31: 'in' cannot compare rides.member_id (a number) with 'two' (text)",
                "rides.yaml:14:38: 'in' cannot compare rides.member_id (a number) with true (a boolean)"),
                errors("rides.member_id in (1, 'two', true)", Expect.CONDITION, SCOPE).stream()
                        .map(e -> e.lines().findFirst().orElseThrow()).toList());
    }

    @Test
    void datesAndTimestampsCompare() {
        CheckedExpression checked = ok("started_at <= cutoff and joined_on < started_at", Expect.CONDITION);
        assertEquals(ValueType.BOOLEAN, checked.type());
    }

    @Test
    void functionsAreLookedUpAndCounted() {
        assertEquals("rides.yaml:14:8: unknown function 'sqr' (did you mean sqrt?)", message("sqr(distance_km) > 1"));
        assertEquals("rides.yaml:14:8: round takes 1 or 2 arguments, but got 3", message("round(distance_km, 1, 2) > 1"));
        assertEquals("rides.yaml:14:8: abs takes 1 argument, but got 0", message("abs() > 1"));
        assertEquals("rides.yaml:14:8: coalesce takes at least 2 arguments, but got 1",
                message("coalesce(distance_km) > 1"));
        assertEquals("rides.yaml:14:8: days_between takes 2 arguments, but got 1",
                message("days_between(joined_on) > 1"));
    }

    @Test
    void functionArgumentsMustFit() {
        assertEquals("rides.yaml:14:11: ln needs a number, but duration is text", message("ln(duration) > 0"));
        assertEquals("rides.yaml:14:14: lower needs text, but distance_km is a number",
                message("lower(distance_km) = 'x'"));
        assertEquals("rides.yaml:14:13: year needs a date or a timestamp, but duration is text",
                message("year(duration) = 2025"));
        assertEquals("rides.yaml:14:13: hour needs a timestamp, but joined_on is a date",
                message("hour(joined_on) = 3"));
        assertEquals("rides.yaml:14:32: days_between needs dates or timestamps, but 5 is a number",
                message("days_between(joined_on, 5) > 3"));
    }

    @Test
    void roundTakesLiteralDigitsFromZeroToFifteen() {
        String expected = "the digits of round must be a whole number from 0 to 15, like round(x, 2)";
        assertEquals("rides.yaml:14:27: " + expected, message("round(distance_km, 1.5) > 1"));
        assertEquals("rides.yaml:14:27: " + expected, message("round(distance_km, -1) > 1"));
        assertEquals("rides.yaml:14:27: " + expected, message("round(distance_km, 16) > 1"));
        assertEquals("rides.yaml:14:27: " + expected, message("round(distance_km, rides.member_id) > 1"));
    }

    @Test
    void coalesceAndItsKinTakeOneType() {
        assertEquals("rides.yaml:14:30: coalesce needs arguments of one type, but distance_km is a number"
                + " and duration is text", message("coalesce(distance_km, duration) > 1"));
        assertEquals("rides.yaml:14:28: greatest needs arguments of one type, but joined_on is a date"
                + " and started_at is a timestamp", message("greatest(joined_on, started_at) > cutoff"));
        assertEquals(ValueType.DECIMAL, ok("coalesce(null, rides.member_id, distance_km)", Expect.VALUE).type());
    }

    @Test
    void aFilterMustBeACondition() {
        assertEquals("""
                rides.yaml:14:8: expected a condition (true or false), but distance_km * 2 is a number
                distance_km * 2
                ^""", error("distance_km * 2"));
    }

    @Test
    void anExpressionThatIsAlwaysNullIsRefused() {
        assertEquals(List.of("rides.yaml:14:8: the expression is always null\nnull\n^"),
                errors("null", Expect.VALUE, SCOPE));
        assertEquals("rides.yaml:14:8: the expression is always null", message("coalesce(null, null)"));
    }

    @Test
    void everyTypeErrorIsReportedInOrder() {
        List<String> all = errors("distnce_km > 3 and duration + 1 > 2 and sqr(2) = 1 or 'a' < 1",
                Expect.CONDITION, SCOPE).stream().map(e -> e.lines().findFirst().orElseThrow()).toList();
        assertEquals(List.of(
                "rides.yaml:14:8: unknown column 'distnce_km' (did you mean distance_km?)",
                "rides.yaml:14:27: '+' needs numbers, but duration is text",
                "rides.yaml:14:48: unknown function 'sqr' (did you mean sqrt?)",
                "rides.yaml:14:66: '<' cannot compare 'a' (text) with 1 (a number)"), all);
    }

    @Test
    void aMistakeIsReportedOnceNotAgainByEveryNodeAbove() {
        assertEquals("rides.yaml:14:12: unknown column 'speed'", message("abs(speed) > 1"));
        assertEquals("rides.yaml:14:12: unknown column 'speed'", message("not speed"));
        assertEquals("rides.yaml:14:17: unknown column 'speed'", message("coalesce(speed, 'x') = 'x'"));
        assertEquals("rides.yaml:14:8: unknown function 'sqr' (did you mean sqrt?)", message("sqr(2) and true"));
    }

    @Test
    void anExpressionWhoseSqlWouldExplodeIsRefused() {
        String nested = "sqrt(".repeat(14) + "distance_km" + ")".repeat(14) + " > 1";
        assertEquals("rides.yaml:14:8: the expression is too large to write as SQL: sqrt, least and greatest"
                + " repeat their arguments on some engines, so nesting them doubles it at every level", message(nested));
        ok("sqrt(".repeat(12) + "distance_km" + ")".repeat(12) + " > 1", Expect.CONDITION);
        ok("ln(".repeat(90) + "distance_km" + ")".repeat(90) + " > 1", Expect.CONDITION);
        ok("rides.member_id in (" + "1, ".repeat(6000) + "2)", Expect.CONDITION);
    }

    @Test
    void theResultKnowsItsTypeColumnsAndCutoff() {
        CheckedExpression checked = ok("rides.member_id % 2 = 0 and distance_km / 2 > 1 and rides.member_id > 0"
                + " and days_between(joined_on, cutoff) >= 30", Expect.CONDITION);
        assertEquals(List.of("rides.member_id", "rides.distance_km", "members.joined_on"),
                checked.columns().stream().map(Binding::key).toList());
        assertTrue(checked.usesCutoff());
        assertEquals(ValueType.INTEGER, ok("rides.member_id % 2", Expect.VALUE).type());
        assertEquals(ValueType.DECIMAL, ok("rides.member_id / 2", Expect.VALUE).type());
        assertEquals(ValueType.INTEGER, ok("abs(rides.member_id) * 3 - 1", Expect.VALUE).type());
        assertEquals(ValueType.DECIMAL, ok("round(rides.member_id)", Expect.VALUE).type());
        assertEquals(ValueType.TEXT, ok("upper(duration)", Expect.VALUE).type());
        assertFalse(ok("upper(duration)", Expect.VALUE).usesCutoff());
    }

    @Test
    void aNullTakesTheTypeOfItsContext() {
        CheckedExpression checked = ok("abs(null) + 1", Expect.VALUE);
        Typed.Arithmetic plus = (Typed.Arithmetic) checked.root();
        Typed.Call abs = (Typed.Call) plus.left();
        assertEquals(new Typed.Constant(null, ExprType.INTEGER), abs.arguments().get(0));
    }

    @Test
    void checkedDiagnosticsStopTheStageAsARecipeFailure() {
        Diagnostics out = new Diagnostics();
        Expressions.compile("speed > 1", AT, SCOPE, Expect.CONDITION, out);
        QuernException e = org.junit.jupiter.api.Assertions.assertThrows(QuernException.class,
                () -> out.throwIfAny(Failure.RECIPE));
        assertEquals("rides.yaml:14:8: unknown column 'speed'\nspeed > 1\n^", e.getMessage());
    }
}
