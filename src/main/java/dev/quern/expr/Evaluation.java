package dev.quern.expr;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.time.LocalDateTime;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Locale;
import java.util.function.Function;

/**
 * One walk over a checked tree for one row, following SQL's rules: null in, null out, except for
 * {@code is null}, coalesce, nullif's second argument, and the three-valued {@code and}/{@code or}
 * ({@code null and false} is false, {@code null or true} is true).
 */
final class Evaluation {

    private final Function<Binding, ?> row;

    Evaluation(Function<Binding, ?> row) {
        this.row = row;
    }

    Object eval(Typed node) {
        if (node instanceof Typed.Constant c) {
            return c.value();
        }
        if (node instanceof Typed.Column c) {
            return Values.read(c.binding(), c.type(), row.apply(c.binding()));
        }
        if (node instanceof Typed.Negate n) {
            Object v = eval(n.operand());
            if (v == null) {
                return null;
            }
            return n.type() == ExprType.INTEGER ? (Object) Math.negateExact((Long) v) : (Object) (-asDouble(v));
        }
        if (node instanceof Typed.Arithmetic a) {
            return arithmetic(a);
        }
        if (node instanceof Typed.Comparison c) {
            return compare(c.operator(), eval(c.left()), eval(c.right()));
        }
        if (node instanceof Typed.Logical l) {
            Boolean left = (Boolean) eval(l.left());
            Boolean right = (Boolean) eval(l.right());
            return l.operator() == Operator.AND ? and(left, right) : or(left, right);
        }
        if (node instanceof Typed.Not n) {
            return not((Boolean) eval(n.operand()));
        }
        if (node instanceof Typed.IsNull i) {
            return (eval(i.value()) == null) != i.negated();
        }
        if (node instanceof Typed.Between b) {
            Object value = eval(b.value());
            Boolean inside = and(compare(Operator.GE, value, eval(b.low())), compare(Operator.LE, value, eval(b.high())));
            return b.negated() ? not(inside) : inside;
        }
        if (node instanceof Typed.In in) {
            Boolean found = in(eval(in.value()), in.items());
            return in.negated() ? not(found) : found;
        }
        if (node instanceof Typed.Call c) {
            return Values.as(c.type(), call(c));
        }
        throw new IllegalStateException("unknown node " + node);
    }

    private Object arithmetic(Typed.Arithmetic a) {
        Object left = eval(a.left());
        Object right = eval(a.right());
        if (left == null || right == null) {
            return null;
        }
        switch (a.operator()) {
            case DIVIDE -> {
                double divisor = asDouble(right);
                return divisor == 0 ? null : asDouble(left) / divisor;
            }
            case MODULO -> {
                long divisor = (Long) right;
                // Java's % truncates toward zero, keeping the dividend's sign, as every engine's does.
                return divisor == 0 ? null : (Long) left % divisor;
            }
            default -> {
                if (a.type() == ExprType.INTEGER) {
                    long x = (Long) left;
                    long y = (Long) right;
                    return switch (a.operator()) {
                        case PLUS -> Math.addExact(x, y);
                        case MINUS -> Math.subtractExact(x, y);
                        default -> Math.multiplyExact(x, y);
                    };
                }
                double x = asDouble(left);
                double y = asDouble(right);
                return switch (a.operator()) {
                    case PLUS -> x + y;
                    case MINUS -> x - y;
                    default -> x * y;
                };
            }
        }
    }

    private Boolean in(Object value, List<Typed> items) {
        if (value == null) {
            return null;
        }
        boolean sawNull = false;
        for (Typed item : items) {
            Object candidate = eval(item);
            if (candidate == null) {
                sawNull = true;
            } else if (Values.compare(value, candidate) == 0) {
                return true;
            }
        }
        return sawNull ? null : Boolean.FALSE;
    }

    private Object call(Typed.Call c) {
        List<Typed> args = c.arguments();
        switch (c.function()) {
            case COALESCE -> {
                for (Typed arg : args) {
                    Object v = eval(arg);
                    if (v != null) {
                        return v;
                    }
                }
                return null;
            }
            case NULLIF -> {
                Object a = eval(args.get(0));
                Object b = eval(args.get(1));
                return a != null && b != null && Values.compare(a, b) == 0 ? null : a;
            }
            default -> {
                // Every other function is null when any argument is.
            }
        }
        List<Object> values = args.stream().map(this::eval).toList();
        if (values.contains(null)) {
            return null;
        }
        Object x = values.get(0);
        return switch (c.function()) {
            case ABS -> x instanceof Long l ? (Object) Math.absExact(l) : (Object) Math.abs(asDouble(x));
            case ROUND -> round(x, values.size() == 2 ? (int) (long) (Long) values.get(1) : 0);
            case LN -> asDouble(x) > 0 ? Math.log(asDouble(x)) : null;
            case LOG10 -> asDouble(x) > 0 ? Math.log10(asDouble(x)) : null;
            case SQRT -> asDouble(x) >= 0 ? Math.sqrt(asDouble(x)) : null;
            case EXP -> asDouble(x) < Rendering.EXP_LIMIT ? Math.exp(asDouble(x)) : null;
            case LEAST -> values.stream().reduce((a, b) -> Values.compare(b, a) < 0 ? b : a).orElseThrow();
            case GREATEST -> values.stream().reduce((a, b) -> Values.compare(b, a) > 0 ? b : a).orElseThrow();
            case LOWER -> ((String) x).toLowerCase(Locale.ROOT);
            case UPPER -> ((String) x).toUpperCase(Locale.ROOT);
            case LENGTH -> (long) ((String) x).codePointCount(0, ((String) x).length());
            case YEAR -> (long) Values.dateOf(x).getYear();
            case MONTH -> (long) Values.dateOf(x).getMonthValue();
            case DAY_OF_WEEK -> (long) Values.dateOf(x).getDayOfWeek().getValue();
            case HOUR -> (long) ((LocalDateTime) x).getHour();
            case DAYS_BETWEEN -> ChronoUnit.DAYS.between(Values.dateOf(x), Values.dateOf(values.get(1)));
            case COALESCE, NULLIF -> throw new IllegalStateException("handled above");
        };
    }

    /** Half away from zero, on the exact value of the double, as SQLite's round() does. */
    private static double round(Object x, int digits) {
        double d = asDouble(x);
        if (!Double.isFinite(d)) {
            return d;
        }
        return new BigDecimal(d).setScale(digits, RoundingMode.HALF_UP).doubleValue();
    }

    private static Boolean compare(Operator operator, Object left, Object right) {
        if (left == null || right == null) {
            return null;
        }
        return operator.holds(Values.compare(left, right));
    }

    static Boolean and(Boolean a, Boolean b) {
        if (Boolean.FALSE.equals(a) || Boolean.FALSE.equals(b)) {
            return false;
        }
        return a == null || b == null ? null : Boolean.TRUE;
    }

    static Boolean or(Boolean a, Boolean b) {
        if (Boolean.TRUE.equals(a) || Boolean.TRUE.equals(b)) {
            return true;
        }
        return a == null || b == null ? null : Boolean.FALSE;
    }

    static Boolean not(Boolean a) {
        return a == null ? null : !a;
    }

    private static double asDouble(Object number) {
        return ((Number) number).doubleValue();
    }
}
