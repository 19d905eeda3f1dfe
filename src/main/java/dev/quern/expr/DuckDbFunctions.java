package dev.quern.expr;

import java.math.BigDecimal;
import java.util.OptionalLong;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** DuckDB follows PostgreSQL's date arithmetic and extract(), but not its rounding. */
final class DuckDbFunctions extends PostgresFunctions {

    /**
     * round(double, integer) exists and rounds half away from zero; a cast to numeric would mean
     * DECIMAL(18,3) in DuckDB and drop digits.
     */
    @Override
    Field<Object> round(Field<BigDecimal> value, OptionalLong digits) {
        return digits.isPresent()
                ? template("round({0}, {1})", value, DSL.inline(digits.getAsLong()))
                : template("round({0})", value);
    }
}
