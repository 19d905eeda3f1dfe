package dev.quern.sql;

import dev.quern.expr.Binding;
import dev.quern.plan.ColumnRef;
import dev.quern.plan.Cutoff;
import java.util.function.Function;
import org.jooq.Field;

/** How the names of a checked expression become fields of the query it is placed in. */
final class Handles {

    private Handles() {
    }

    /** Source columns by their alias on the path; the cutoff as {@code cutoff} of the given query part. */
    static Function<Binding, Field<?>> columns(Field<Object> cutoff) {
        return binding -> {
            Object handle = binding.handle();
            if (handle instanceof ColumnRef ref) {
                return Names.field(ref);
            }
            if (handle == Cutoff.ROW) {
                return cutoff;
            }
            throw new IllegalStateException("no field for the name " + binding.key());
        };
    }
}
