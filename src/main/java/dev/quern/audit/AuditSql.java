package dev.quern.audit;

import dev.quern.schema.Engine;
import dev.quern.schema.TimeStorage;
import org.jooq.Condition;
import org.jooq.Field;
import org.jooq.impl.DSL;
import org.jooq.impl.SQLDataType;

/**
 * The few comparisons the audit's own queries make, per engine and time storage. They are written here and
 * not borrowed from the sql stage, so that the audit does not share a mistake with the query it checks: the
 * compiled query compares a stored time with the start of the next day; the audit takes the time's date
 * and compares it with the cutoff date.
 */
final class AuditSql {

    private final Engine engine;

    AuditSql(Engine engine) {
        this.engine = engine;
    }

    /**
     * A boundary date in the form a time column of this storage compares with. ISO text compares as text with
     * {@code 'YYYY-MM-DD'}; SQLite already holds the boundary as such text, other engines cast it.
     */
    Field<Object> boundary(Field<Object> date, TimeStorage storage) {
        if (storage == TimeStorage.ISO_TEXT && engine != Engine.SQLITE) {
            return date.cast(SQLDataType.VARCHAR(10)).coerce(Object.class);
        }
        return date;
    }

    /**
     * The time's date is after the cutoff date. ISO text: its first ten characters, compared as text with the
     * cutoff's {@code YYYY-MM-DD} (on SQLite {@code substr(t, 1, 10)}); native dates and timestamps: cast to a
     * date and compared as dates.
     */
    Condition dateAfter(Field<Object> time, TimeStorage storage, Field<Object> cutoff) {
        if (storage == TimeStorage.ISO_TEXT) {
            Field<Object> day = DSL.substring(time.cast(SQLDataType.VARCHAR(64)), 1, 10).coerce(Object.class);
            return day.gt(boundary(cutoff, storage));
        }
        return time.cast(SQLDataType.DATE).coerce(Object.class).gt(cutoff.cast(SQLDataType.DATE).coerce(Object.class));
    }
}
