package dev.quern.plan;

import dev.quern.expr.CheckedExpression;
import java.util.Objects;

/** A column computed from other output columns of its row; bindings' handles are output column names. */
public record DerivedColumn(String column, CheckedExpression expression) {
    public DerivedColumn {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(expression, "expression");
    }
}
