package dev.quern.expr;

import dev.quern.schema.ValueType;
import java.util.Objects;

/**
 * A name an expression may use, as the caller declared it in a {@link Scope}: its type, and a handle the
 * caller gets back when rendering ({@link ExprRenderer}) to produce the jOOQ field, so that the caller alone
 * decides how a name becomes SQL. The qualifier is empty for a name used without one (a feature column, the
 * cutoff).
 */
public record Binding(String qualifier, String name, ValueType type, Object handle) {

    public Binding {
        Objects.requireNonNull(qualifier, "qualifier");
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(handle, "handle");
    }

    /** {@code rides.distance_km}, or {@code spend_30d} without a qualifier: the key of an evaluator's row. */
    public String key() {
        return qualifier.isEmpty() ? name : qualifier + "." + name;
    }
}
