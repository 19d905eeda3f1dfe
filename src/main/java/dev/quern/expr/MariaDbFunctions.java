package dev.quern.expr;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.util.OptionalLong;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** MariaDB and MySQL. */
final class MariaDbFunctions extends EngineFunctions {

    /** jOOQ writes a JDBC escape ({d '...'}) here; the standard literal works in both engines' own clients too. */
    @Override
    Field<Object> date(LocalDate value) {
        return template("date {0}", DSL.inline(value.toString()));
    }

    @Override
    Field<Object> timestamp(LocalDateTime value) {
        return template("timestamp {0}", DSL.inline(isoText(value)));
    }

    /** CAST has no BOOLEAN target here, and an untyped null is accepted by every function. */
    @Override
    Field<Object> nullOf(ExprType type) {
        return DSL.inline((Object) null);
    }

    /**
     * Dividing integers gives a DECIMAL with only div_precision_increment (4) more digits (1 / 3 = 0.3333);
     * a double dividend divides in full. jOOQ renders a cast to DOUBLE as DECIMAL for these dialects, so the
     * cast is written out (CAST AS DOUBLE exists since MySQL 8.0.17 and MariaDB 10.4).
     */
    @Override
    Field<BigDecimal> realDividend(Field<BigDecimal> dividend) {
        return template("cast({0} as double)", dividend).coerce(BigDecimal.class);
    }

    /**
     * round() of a double uses the C library's rint (half to even); of an exact DECIMAL, half away from
     * zero. DECIMAL(65, 30) holds magnitudes below 10^35.
     */
    @Override
    Field<Object> round(Field<BigDecimal> value, OptionalLong digits) {
        return template("round(cast({0} as decimal(65, 30)), {1})", value, DSL.inline(digits.orElse(0)));
    }

    @Override
    Field<Object> year(Field<Object> time) {
        return template("year({0})", time);
    }

    @Override
    Field<Object> month(Field<Object> time) {
        return template("month({0})", time);
    }

    /** weekday() counts from Monday = 0 (dayofweek() would start at Sunday = 1). */
    @Override
    Field<Object> dayOfWeek(Field<Object> time) {
        return template("(weekday({0}) + 1)", time);
    }

    @Override
    Field<Object> hour(Field<Object> time) {
        return template("hour({0})", time);
    }

    /** datediff() ignores the time of day: whole days between the two dates. */
    @Override
    Field<Object> daysBetween(Field<Object> from, ExprType fromType, Field<Object> to, ExprType toType) {
        return template("datediff({0}, {1})", to, from);
    }
}
