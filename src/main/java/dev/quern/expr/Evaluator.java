package dev.quern.expr;

import dev.quern.QuernException;
import java.util.Map;
import java.util.Objects;
import java.util.function.Function;

/**
 * Evaluates a checked expression in memory for one row, by the same rules as the SQL the
 * {@link ExprRenderer} writes: three-valued logic, null for division by zero and for logarithms and roots
 * outside their domain. Results are Long (whole numbers), Double (decimal numbers), String, Boolean,
 * LocalDate, LocalDateTime, or null.
 */
public final class Evaluator {

    private Evaluator() {
    }

    /**
     * The value for a row given as a map from {@link Binding#key()} (and {@value Scope#CUTOFF} for the
     * cutoff) to values in the evaluator's or JDBC's forms (ISO text for SQLite dates, 0/1 for booleans).
     */
    public static Object evaluate(CheckedExpression expression, Map<String, ?> row) {
        Objects.requireNonNull(row, "row");
        return evaluate(expression, binding -> {
            if (!row.containsKey(binding.key())) {
                throw new IllegalArgumentException("the row has no value for " + binding.key());
            }
            return row.get(binding.key());
        });
    }

    /** The value for a row whose values the caller looks up per binding. */
    public static Object evaluate(CheckedExpression expression, Function<Binding, ?> row) {
        Objects.requireNonNull(row, "row");
        try {
            return new Evaluation(row).eval(expression.root());
        } catch (ArithmeticException e) {
            throw QuernException.data("'" + expression.text() + "' goes beyond the range of whole numbers on this row", e);
        }
    }

    /** Whether a where clause with this condition keeps the row: only when it is true, not false or null. */
    public static boolean keeps(CheckedExpression expression, Map<String, ?> row) {
        if (expression.root().type() != ExprType.BOOLEAN) {
            throw new IllegalArgumentException("'" + expression.text() + "' is not a condition");
        }
        return Boolean.TRUE.equals(evaluate(expression, row));
    }
}
