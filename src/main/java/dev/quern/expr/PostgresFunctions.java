package dev.quern.expr;

import java.math.BigDecimal;
import java.util.List;
import java.util.OptionalLong;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** PostgreSQL, with native DATE and TIMESTAMP types. */
class PostgresFunctions extends EngineFunctions {

    /**
     * round(double precision) rounds half to even, and there is no round(double precision, integer);
     * numeric rounds half away from zero and takes digits.
     */
    @Override
    Field<Object> round(Field<BigDecimal> value, OptionalLong digits) {
        return digits.isPresent()
                ? template("round(cast({0} as numeric), {1})", value, DSL.inline(digits.getAsLong()))
                : template("round(cast({0} as numeric))", value);
    }

    /** extract() returns numeric since PostgreSQL 14: cast, so that a year is a whole number. */
    @Override
    Field<Object> year(Field<Object> time) {
        return template("cast(extract(year from {0}) as integer)", time);
    }

    @Override
    Field<Object> month(Field<Object> time) {
        return template("cast(extract(month from {0}) as integer)", time);
    }

    /** isodow: Monday 1 to Sunday 7 (dow would count Sunday as 0). */
    @Override
    Field<Object> dayOfWeek(Field<Object> time) {
        return template("cast(extract(isodow from {0}) as integer)", time);
    }

    @Override
    Field<Object> hour(Field<Object> time) {
        return template("cast(extract(hour from {0}) as integer)", time);
    }

    /** Subtracting two DATE values gives an integer number of days. */
    @Override
    Field<Object> daysBetween(Field<Object> from, ExprType fromType, Field<Object> to, ExprType toType) {
        return template("({0} - {1})", asDate(to, toType), asDate(from, fromType));
    }

    /** greatest() and least() skip nulls here (and in DuckDB). */
    @Override
    Field<Object> extreme(boolean greatest, List<Field<Object>> arguments) {
        return extremeOfAll(greatest, arguments);
    }
}
