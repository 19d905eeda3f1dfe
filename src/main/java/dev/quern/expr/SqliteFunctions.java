package dev.quern.expr;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.util.OptionalLong;
import org.jooq.Field;
import org.jooq.impl.DSL;

/**
 * SQLite keeps dates and timestamps as ISO text ({@code 2025-03-31}, {@code 2025-03-31 12:00:00}), and
 * ISO text of one form compares as text in time order. Its date functions read that text.
 */
final class SqliteFunctions extends EngineFunctions {

    /**
     * jOOQ writes a decimal text literal as {@code cast(60.0 as decimal)} here, and the NUMERIC affinity
     * of that cast turns 60.0 into the integer 60; a double literal ({@code 6E1}) stays a REAL.
     */
    @Override
    Field<Object> decimal(double value) {
        return DSL.inline(value).coerce(Object.class);
    }

    /** Dates are text in SQLite: the literal is the ISO text itself. */
    @Override
    Field<Object> date(LocalDate value) {
        return DSL.inline(value.toString()).coerce(Object.class);
    }

    /** With a space, as SQLite's own datetime() writes it, so that it compares with stored text of that form. */
    @Override
    Field<Object> timestamp(LocalDateTime value) {
        return DSL.inline(isoText(value)).coerce(Object.class);
    }

    /** SQLite values carry their own type: a null needs no cast. */
    @Override
    Field<Object> nullOf(ExprType type) {
        return DSL.inline((Object) null);
    }

    /** The first ten characters of ISO text are the date. */
    @Override
    Field<Object> dateOf(Field<Object> timestamp) {
        return template("substr({0}, 1, 10)", timestamp);
    }

    /**
     * ISO text orders as text only when every value writes the same separator: '2025-03-31T08:00' sorts
     * after '2025-03-31 12:00' because 'T' comes after ' '. Both forms are ISO 8601 and both occur, so
     * a stored timestamp is compared with the separator made a space, as the language's literals write it.
     */
    @Override
    Field<Object> orderableTimestamp(Field<Object> timestamp) {
        return template("replace({0}, 'T', ' ')", timestamp);
    }

    /** SQLite's sqrt() returns null for a negative number already: no guard, the argument written once. */
    @Override
    Field<Object> sqrt(Field<BigDecimal> x) {
        return DSL.sqrt(x).coerce(Object.class);
    }

    /** round() works on the double's exact value, half away from zero, and always returns a REAL. */
    @Override
    Field<Object> round(Field<BigDecimal> value, OptionalLong digits) {
        return digits.isPresent()
                ? template("round({0}, {1})", value, DSL.inline(digits.getAsLong()))
                : template("round({0})", value);
    }

    @Override
    Field<Object> year(Field<Object> time) {
        return template("cast(strftime('%Y', {0}) as integer)", time);
    }

    @Override
    Field<Object> month(Field<Object> time) {
        return template("cast(strftime('%m', {0}) as integer)", time);
    }

    /** strftime('%w') counts from Sunday = 0; shifting by six days modulo seven makes Monday 1 and Sunday 7. */
    @Override
    Field<Object> dayOfWeek(Field<Object> time) {
        return template("(((cast(strftime('%w', {0}) as integer) + 6) % 7) + 1)", time);
    }

    @Override
    Field<Object> hour(Field<Object> time) {
        return template("cast(strftime('%H', {0}) as integer)", time);
    }

    /** julianday() of two 'YYYY-MM-DD' texts (both midnight) differs by whole days exactly. */
    @Override
    Field<Object> daysBetween(Field<Object> from, ExprType fromType, Field<Object> to, ExprType toType) {
        return template("cast(julianday(substr({0}, 1, 10)) - julianday(substr({1}, 1, 10)) as integer)", to, from);
    }
}
