package dev.quern.expr;

import java.math.BigDecimal;
import java.util.List;
import java.util.OptionalLong;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** Spark SQL (measured on Spark 4.0 in local mode). */
final class SparkFunctions extends EngineFunctions {

    /** round(double, digits) rounds half away from zero (HALF_UP on the decimal value) in Spark. */
    @Override
    Field<Object> round(Field<BigDecimal> value, OptionalLong digits) {
        return digits.isPresent()
                ? template("round({0}, {1})", value, DSL.inline(digits.getAsLong()))
                : template("round({0})", value);
    }

    @Override
    Field<Object> year(Field<Object> time) {
        return template("year({0})", time);
    }

    @Override
    Field<Object> month(Field<Object> time) {
        return template("month({0})", time);
    }

    /** dayofweek_iso counts Monday 1 to Sunday 7; Spark's dayofweek() counts from Sunday. */
    @Override
    Field<Object> dayOfWeek(Field<Object> time) {
        return template("extract(dayofweek_iso from {0})", time);
    }

    @Override
    Field<Object> hour(Field<Object> time) {
        return template("hour({0})", time);
    }

    /** date - date is an INTERVAL DAY in Spark; datediff(end, start) is the integer day count. */
    @Override
    Field<Object> daysBetween(Field<Object> from, ExprType fromType, Field<Object> to, ExprType toType) {
        return template("datediff({0}, {1})", asDate(to, toType), asDate(from, fromType));
    }

    /** A typed null: Spark refuses {@code varchar} without a length; {@code string} is its text type. */
    @Override
    Field<Object> nullOf(ExprType type) {
        if (type == ExprType.TEXT) {
            return DSL.field("cast(null as string)", Object.class);
        }
        return super.nullOf(type);
    }

    /** greatest() and least() skip nulls in Spark. */
    @Override
    Field<Object> extreme(boolean greatest, List<Field<Object>> arguments) {
        return extremeOfAll(greatest, arguments);
    }
}
