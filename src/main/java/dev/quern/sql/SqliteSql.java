package dev.quern.sql;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** SQLite: dates are text, and there is no standard deviation aggregate at all. */
final class SqliteSql extends EngineSql {

    @Override
    Engine engine() {
        return Engine.SQLITE;
    }

    /** SQLite keeps dates as text already, and jOOQ renders a date literal as text: compare as they are. */
    @Override
    Field<Object> boundaryFor(Field<Object> boundary, TimeStorage storage) {
        return boundary;
    }

    /** julianday() of two 'YYYY-MM-DD' texts differs by whole days exactly. */
    @Override
    Field<Object> daysFrom(Field<Object> time, TimeStorage storage, Field<Object> cutoff) {
        return DSL.field("cast(julianday({0}) - julianday(substr({1}, 1, 10)) as integer)", Object.class,
                cutoff, time);
    }

    /** SQLite has no stddev aggregate. */
    @Override
    boolean hasStableStddev() {
        return false;
    }

    /** SQLite's avg() always returns a REAL, summed with compensation (since 3.43). */
    @Override
    Field<Object> mean(Field<Object> value) {
        return DSL.avg(value.coerce(java.math.BigDecimal.class)).coerce(Object.class);
    }

    @Override
    Field<Object> dayOf(Field<Object> time, TimeStorage storage) {
        return DSL.substring(time.coerce(String.class), 1, 10).coerce(Object.class);
    }
}
