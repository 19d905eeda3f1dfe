package dev.quern.sql;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
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

    /** stddev_samp accumulates with Welford's method in both. */
    @Override
    boolean hasStableStddev() {
        return true;
    }
}
