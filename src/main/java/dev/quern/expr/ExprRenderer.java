package dev.quern.expr;

import dev.quern.schema.Engine;
import java.util.Objects;
import java.util.function.Function;
import org.jooq.Condition;
import org.jooq.Field;

/**
 * Turns a checked expression into jOOQ for one engine. Literals become inlined jOOQ values (jOOQ escapes
 * them for the dialect); names become whatever field the caller's {@code columns} function returns for
 * each {@link Binding}, normally {@code DSL.field(DSL.name(alias, column))}. No text of the expression is
 * ever pasted into SQL.
 *
 * <p>Language rules the SQL keeps on every engine: division by zero and modulo by zero give null
 * ({@code a / nullif(b, 0)}), division is never integer division, ln/log10 of a non-positive number,
 * sqrt of a negative one and exp of 709.78 or more give null (the argument is replaced by null first, so
 * that no engine raises an error even for constants), least/greatest are null when any argument is, and a
 * timestamp compared with a date is compared by its date.
 */
public final class ExprRenderer {

    private final EngineFunctions functions;

    private ExprRenderer(EngineFunctions functions) {
        this.functions = functions;
    }

    public static ExprRenderer forEngine(Engine engine) {
        return new ExprRenderer(EngineFunctions.of(Objects.requireNonNull(engine, "engine")));
    }

    /** The expression as a value: for a derived column, or a condition's value (true, false or null). */
    public Field<Object> field(CheckedExpression expression, Function<Binding, ? extends Field<?>> columns) {
        return new Rendering(functions, columns).value(expression.root());
    }

    /** The expression as a condition, for a where clause. */
    public Condition condition(CheckedExpression expression, Function<Binding, ? extends Field<?>> columns) {
        if (expression.root().type() != ExprType.BOOLEAN) {
            throw new IllegalArgumentException("'" + expression.text() + "' is not a condition but "
                    + expression.root().type().noun() + "; check it with Expect.CONDITION");
        }
        return new Rendering(functions, columns).condition(expression.root());
    }
}
