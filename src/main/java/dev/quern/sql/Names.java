package dev.quern.sql;

import dev.quern.plan.ColumnRef;
import org.jooq.Field;
import org.jooq.Table;
import org.jooq.impl.DSL;

/** Quoted references: every identifier goes through jOOQ's name quoting, never into SQL as text. */
final class Names {

    static final String COHORT = "cohort";
    static final String CUTOFFS = "cutoffs";
    static final String KEY = "entity_key";
    static final String CUTOFF = "cutoff";

    private Names() {
    }

    static Field<Object> field(String qualifier, String column) {
        return DSL.field(DSL.name(qualifier, column));
    }

    static Field<Object> field(String column) {
        return DSL.field(DSL.name(column));
    }

    static Field<Object> field(ColumnRef ref) {
        return field(ref.alias(), ref.column());
    }

    static Table<?> table(String table, String alias) {
        return DSL.table(DSL.name(table)).as(DSL.name(alias));
    }

    static Table<?> table(String table) {
        return DSL.table(DSL.name(table));
    }
}
