package dev.quern.reference;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.expr.CheckedExpression;
import dev.quern.expr.Evaluator;
import dev.quern.expr.Expect;
import dev.quern.expr.Expressions;
import dev.quern.expr.Scope;
import dev.quern.recipe.Expression;
import dev.quern.schema.ValueType;
import java.util.List;
import java.util.Map;
import java.util.regex.Pattern;

/**
 * The reference evaluator's expressions: checked against a scope typed from the values it was read with
 * (not from Quern's schema stage), and evaluated in memory by the expression language's own evaluator,
 * never through SQL.
 */
final class ReferenceExpressions {

    private static final Pattern DATE = Pattern.compile("\\d{4}-\\d{2}-\\d{2}");
    private static final Pattern TIMESTAMP = Pattern.compile("\\d{4}-\\d{2}-\\d{2}[ T].*");

    private ReferenceExpressions() {
    }

    /** A column of a table as an expression sees it: {@code qualifier.name}, typed by its values. */
    record Column(String qualifier, String name, List<Object> values) {
    }

    static CheckedExpression check(Expression text, List<Column> columns, List<Column> bare, boolean cutoff,
                                   Expect expect) {
        Scope.Builder scope = Scope.builder();
        if (cutoff) {
            scope.cutoff(ValueType.DATE, "cutoff");
        }
        for (Column c : columns) {
            scope.column(c.qualifier(), c.name(), typeOf(c.values()), c.qualifier() + "." + c.name());
        }
        for (Column c : bare) {
            scope.column(c.name(), typeOf(c.values()), c.name());
        }
        Diagnostics problems = new Diagnostics();
        CheckedExpression checked = Expressions.compile(text.text(), text.start(), scope.build(), expect, problems)
                .orElse(null);
        problems.throwIfAny(Failure.RECIPE);
        return checked;
    }

    static boolean keeps(CheckedExpression condition, Map<String, ?> row) {
        return Evaluator.keeps(condition, row);
    }

    static Object value(CheckedExpression expression, Map<String, ?> row) {
        return Evaluator.evaluate(expression, row);
    }

    /** The type the values show: whole numbers, decimals, ISO dates or times, or text. */
    static ValueType typeOf(List<Object> values) {
        boolean any = false;
        boolean whole = true;
        boolean number = true;
        boolean date = true;
        boolean time = true;
        for (Object v : values) {
            if (v == null) {
                continue;
            }
            any = true;
            whole &= v instanceof Long;
            number &= v instanceof Number;
            String s = v.toString();
            date &= v instanceof String && DATE.matcher(s).matches();
            time &= v instanceof String && (DATE.matcher(s).matches() || TIMESTAMP.matcher(s).matches());
        }
        if (!any) {
            return ValueType.TEXT;
        }
        if (whole) {
            return ValueType.INTEGER;
        }
        if (number) {
            return ValueType.DECIMAL;
        }
        return date ? ValueType.DATE : time ? ValueType.TIMESTAMP : ValueType.TEXT;
    }
}
