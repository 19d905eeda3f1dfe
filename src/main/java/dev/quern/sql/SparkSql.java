package dev.quern.sql;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
import org.jooq.Field;
import org.jooq.SortField;
import org.jooq.impl.DSL;

/** Spark SQL, rendered through jOOQ's DuckDB dialect (see {@link Engine#SPARK}). */
final class SparkSql extends EngineSql {

    @Override
    Engine engine() {
        return Engine.SPARK;
    }

    /**
     * Spark subtracts two dates into an INTERVAL DAY, not an integer (measured on Spark 4.0);
     * {@code datediff(end, start)} gives the whole days as an integer.
     */
    @Override
    Field<Object> daysFrom(Field<Object> time, TimeStorage storage, Field<Object> cutoff) {
        return DSL.field("datediff({0}, {1})", Object.class, cutoff, dayOf(time, storage));
    }

    /**
     * Spark already sorts NULL last in descending order; said explicitly so that the lookup does not hang on
     * a default that a configuration could change.
     */
    @Override
    SortField<Object> newestFirst(Field<Object> field) {
        return field.desc().nullsLast();
    }

    /**
     * stddev_samp is Spark's CentralMomentAgg: running mean and second central moment per partition, merged
     * with the pairwise update of Chan, Golub and LeVeque, which survives badly conditioned data.
     */
    @Override
    boolean hasStableStddev() {
        return true;
    }
}
