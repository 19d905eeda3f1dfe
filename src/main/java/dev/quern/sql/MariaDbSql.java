package dev.quern.sql;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
import dev.quern.schema.ValueType;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** MariaDB and MySQL. */
final class MariaDbSql extends EngineSql {

    private final Engine engine;

    MariaDbSql(Engine engine) {
        this.engine = engine;
    }

    @Override
    Engine engine() {
        return engine;
    }

    @Override
    Field<Object> daysFrom(Field<Object> time, TimeStorage storage, Field<Object> cutoff) {
        return DSL.field("datediff({0}, {1})", Object.class, cutoff, dayOf(time, storage));
    }

    /**
     * jOOQ renders a cast to DOUBLE as {@code cast(x as decimal)} for MariaDB, which is DECIMAL(10,0) and
     * rounds every value to an integer; and avg of an integer or decimal returns DECIMAL with only four more
     * digits. {@code cast(x as double)} (MariaDB 10.4.5+, MySQL 8.0.17+) averages in double precision.
     */
    @Override
    Field<Object> mean(Field<Object> value) {
        return DSL.avg(DSL.field("cast({0} as double)", java.math.BigDecimal.class, value)).coerce(Object.class);
    }

    /**
     * MariaDB's driver (3.5) decodes a DATETIME through the JVM's time zone, even for getString: a time in a
     * daylight-saving gap there (02:30 on a spring-forward night in Europe/Amsterdam) comes back an hour
     * later. Times leave the server as text, which the driver hands over untouched.
     */
    @Override
    Field<Object> output(Field<Object> value, ValueType type) {
        if (type == ValueType.TIMESTAMP) {
            return DSL.field("date_format({0}, '%Y-%m-%d %H:%i:%s')", Object.class, value);
        }
        return value;
    }

    /** stddev_samp accumulates with Welford's method in both. */
    @Override
    boolean hasStableStddev() {
        return true;
    }
}
