package dev.quern.expr;

import dev.quern.Position;
import dev.quern.schema.ValueType;
import java.util.List;
import java.util.Objects;

/**
 * An expression whose names all resolved in a scope and whose types fit: the only form that can be
 * rendered to SQL ({@link ExprRenderer}) or evaluated in memory ({@link Evaluator}). Immutable.
 */
public final class CheckedExpression {

    private final ParsedExpression parsed;
    private final Typed root;
    private final List<Binding> columns;
    private final boolean usesCutoff;

    CheckedExpression(ParsedExpression parsed, Typed root, List<Binding> columns, boolean usesCutoff) {
        this.parsed = Objects.requireNonNull(parsed, "parsed");
        this.root = Objects.requireNonNull(root, "root");
        this.columns = List.copyOf(columns);
        this.usesCutoff = usesCutoff;
    }

    public String text() {
        return parsed.text();
    }

    public Position start() {
        return parsed.start();
    }

    /** The type of the result: BOOLEAN for a condition; never OTHER. */
    public ValueType type() {
        return root.type().valueType();
    }

    /** The columns the expression reads, each once, in order of first use; the cutoff is not among them. */
    public List<Binding> columns() {
        return columns;
    }

    /** Whether the expression refers to the row's cutoff. */
    public boolean usesCutoff() {
        return usesCutoff;
    }

    Typed root() {
        return root;
    }

    @Override
    public String toString() {
        return parsed.text();
    }
}
