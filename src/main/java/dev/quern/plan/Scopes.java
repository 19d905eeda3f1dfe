package dev.quern.plan;

import dev.quern.expr.Scope;
import dev.quern.schema.ColumnInfo;
import dev.quern.schema.SourceSchema;
import dev.quern.schema.ValueType;
import java.util.List;

/**
 * The names an expression may use where it is written. Columns are written {@code table.column}, or bare
 * where only one table of the place has that column; their handles are {@link ColumnRef}s. {@code cutoff}
 * is the row's cutoff date, where the place has one (handle {@link Cutoff#ROW}).
 */
final class Scopes {

    private final SourceSchema schema;

    Scopes(SourceSchema schema) {
        this.schema = schema;
    }

    /** The columns of every table on a path, with the cutoff: for a block's or a label's filter. */
    Scope path(EventPath path) {
        Scope.Builder scope = Scope.builder().cutoff(ValueType.DATE, Cutoff.ROW);
        addTable(scope, path.table(), path.alias());
        for (Hop hop : path.hops()) {
            if (!hop.table().equals(path.table())) {
                addTable(scope, hop.table(), hop.alias());
            }
        }
        return scope.build();
    }

    /** The columns of one table, optionally with the cutoff: for the cohort filter and for rules. */
    Scope table(String table, String alias, boolean withCutoff) {
        Scope.Builder scope = Scope.builder();
        if (withCutoff) {
            scope.cutoff(ValueType.DATE, Cutoff.ROW);
        }
        addTable(scope, table, alias);
        return scope.build();
    }

    /** Output columns by name: for a derived column's formula. */
    static Scope outputs(List<OutputColumn> columns) {
        Scope.Builder scope = Scope.builder().cutoff(ValueType.DATE, Cutoff.ROW);
        for (OutputColumn c : columns) {
            if (c.role() == Role.FEATURE) {
                scope.column(c.name(), c.type(), c.name());
            }
        }
        return scope.build();
    }

    private void addTable(Scope.Builder scope, String table, String alias) {
        for (ColumnInfo c : schema.table(table).columns().values()) {
            scope.column(table, c.name(), c.type(), new ColumnRef(alias, table, c.name(), c.type()));
        }
    }
}
