package dev.quern.expr;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalLong;
import java.util.function.Function;
import org.jooq.Condition;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** One walk over a checked tree, producing jOOQ fields and conditions. */
final class Rendering {

    /** exp() of this or more is null: just below ln(Double.MAX_VALUE) = 709.7827..., where a double overflows. */
    static final double EXP_LIMIT = 709.78;

    private final EngineFunctions engine;
    private final Function<Binding, ? extends Field<?>> columns;

    Rendering(EngineFunctions engine, Function<Binding, ? extends Field<?>> columns) {
        this.engine = engine;
        this.columns = columns;
    }

    Field<Object> value(Typed node) {
        if (node instanceof Typed.Constant c) {
            return constant(c);
        }
        if (node instanceof Typed.Column c) {
            Field<?> field = columns.apply(c.binding());
            if (field == null) {
                throw new IllegalStateException("no field given for " + c.binding().key());
            }
            return field.coerce(Object.class);
        }
        if (node instanceof Typed.Negate n) {
            return number(n.operand()).neg().coerce(Object.class);
        }
        if (node instanceof Typed.Arithmetic a) {
            return arithmetic(a);
        }
        if (node instanceof Typed.Call c) {
            return call(c);
        }
        return DSL.field(condition(node)).coerce(Object.class);
    }

    Condition condition(Typed node) {
        if (node instanceof Typed.Comparison c) {
            return compare(c.operator(), c.left(), c.right());
        }
        if (node instanceof Typed.Logical l) {
            return l.operator() == Operator.AND
                    ? condition(l.left()).and(condition(l.right()))
                    : condition(l.left()).or(condition(l.right()));
        }
        if (node instanceof Typed.Not n) {
            return DSL.not(condition(n.operand()));
        }
        if (node instanceof Typed.IsNull i) {
            return i.negated() ? value(i.value()).isNotNull() : value(i.value()).isNull();
        }
        if (node instanceof Typed.Between b) {
            return between(b);
        }
        if (node instanceof Typed.In in) {
            return in(in);
        }
        return DSL.condition(value(node).coerce(Boolean.class));
    }

    private Field<Object> constant(Typed.Constant c) {
        Object v = c.value();
        if (v == null) {
            return engine.nullOf(c.type());
        }
        if (v instanceof Long l) {
            return DSL.inline(l).coerce(Object.class);
        }
        if (v instanceof Double d) {
            return engine.decimal(d);
        }
        if (v instanceof String s) {
            return DSL.inline(s).coerce(Object.class);
        }
        if (v instanceof Boolean b) {
            return DSL.inline(b).coerce(Object.class);
        }
        if (v instanceof LocalDate d) {
            return engine.date(d);
        }
        if (v instanceof LocalDateTime t) {
            return engine.timestamp(t);
        }
        throw new IllegalStateException("unexpected constant " + v.getClass());
    }

    private Field<Object> arithmetic(Typed.Arithmetic a) {
        Field<BigDecimal> left = number(a.left());
        Field<BigDecimal> right = number(a.right());
        Field<BigDecimal> result = switch (a.operator()) {
            case PLUS -> left.plus(right);
            case MINUS -> left.minus(right);
            case TIMES -> left.times(right);
            case DIVIDE -> engine.realDividend(left).div(DSL.nullif(right, DSL.inline(0).coerce(BigDecimal.class)));
            case MODULO -> left.mod(DSL.nullif(right, DSL.inline(0).coerce(BigDecimal.class)));
            default -> throw new IllegalStateException("not arithmetic: " + a.operator());
        };
        return result.coerce(Object.class);
    }

    private Field<Object> call(Typed.Call c) {
        List<Typed> args = c.arguments();
        return switch (c.function()) {
            case ABS -> DSL.abs(number(args.get(0))).coerce(Object.class);
            case ROUND -> engine.round(number(args.get(0)), args.size() == 2
                    ? OptionalLong.of((Long) ((Typed.Constant) args.get(1)).value()) : OptionalLong.empty());
            case LN -> DSL.ln(positiveOrNull(number(args.get(0)))).coerce(Object.class);
            case LOG10 -> DSL.log10(positiveOrNull(number(args.get(0)))).coerce(Object.class);
            case SQRT -> engine.sqrt(number(args.get(0)));
            case EXP -> DSL.exp(belowExpLimitOrNull(number(args.get(0)))).coerce(Object.class);
            // Seen as text fields only to pick jOOQ's overload; coerce() renders nothing.
            case COALESCE -> DSL.coalesce(text(args.get(0)),
                    args.subList(1, args.size()).stream().map(this::value).toArray(Field<?>[]::new)).coerce(Object.class);
            case NULLIF -> DSL.nullif(text(args.get(0)), text(args.get(1))).coerce(Object.class);
            case LEAST -> engine.extreme(false, args.stream().map(this::value).toList());
            case GREATEST -> engine.extreme(true, args.stream().map(this::value).toList());
            case LOWER -> DSL.lower(text(args.get(0))).coerce(Object.class);
            case UPPER -> DSL.upper(text(args.get(0))).coerce(Object.class);
            case LENGTH -> DSL.charLength(text(args.get(0))).coerce(Object.class);
            case YEAR -> engine.year(value(args.get(0)));
            case MONTH -> engine.month(value(args.get(0)));
            case DAY_OF_WEEK -> engine.dayOfWeek(value(args.get(0)));
            case HOUR -> engine.hour(value(args.get(0)));
            case DAYS_BETWEEN -> engine.daysBetween(value(args.get(0)), args.get(0).type(),
                    value(args.get(1)), args.get(1).type());
        };
    }

    /**
     * {@code nullif(greatest(x, 0), 0)}: x when it is positive, else null, so that ln and log10 never see a
     * value they would reject (PostgreSQL raises an error, even for a constant it folds while planning).
     * It names x once: a {@code case when x > 0 then x end} would write x twice, and nested calls would
     * then double the SQL at every level. greatest() skipping a null on some engines changes nothing here.
     */
    private static Field<BigDecimal> positiveOrNull(Field<BigDecimal> x) {
        return DSL.nullif(DSL.greatest(x, zero()), zero());
    }

    /** {@code nullif(least(x, 709.78), 709.78)}: x below the limit, else null; x named once, as above. */
    private Field<BigDecimal> belowExpLimitOrNull(Field<BigDecimal> x) {
        Field<BigDecimal> limit = engine.decimal(EXP_LIMIT).coerce(BigDecimal.class);
        return DSL.nullif(DSL.least(x, limit), limit);
    }

    private Condition compare(Operator operator, Typed leftNode, Typed rightNode) {
        List<Typed> pair = List.of(leftNode, rightNode);
        Field<Object> left = comparable(leftNode, pair);
        Field<Object> right = comparable(rightNode, pair);
        return switch (operator) {
            case EQ -> left.eq(right);
            case NE -> left.ne(right);
            case LT -> left.lt(right);
            case LE -> left.le(right);
            case GT -> left.gt(right);
            case GE -> left.ge(right);
            default -> throw new IllegalStateException("not a comparison: " + operator);
        };
    }

    /**
     * An operand of a comparison among {@code peers}. A date stands for its whole day, so a timestamp
     * compared with a date is compared by its date: on that day it is neither before nor after it.
     */
    private Field<Object> comparable(Typed node, List<Typed> peers) {
        Field<Object> field = value(node);
        if (node.type() != ExprType.TIMESTAMP) {
            return field;
        }
        if (peers.stream().anyMatch(p -> p.type() == ExprType.DATE)) {
            return engine.dateOf(field);
        }
        // Literals are already written in the engine's orderable form.
        return node instanceof Typed.Constant ? field : engine.orderableTimestamp(field);
    }

    private Condition between(Typed.Between b) {
        List<Typed> all = List.of(b.value(), b.low(), b.high());
        if (mixesDayAndTime(all)) {
            // Spelled out, so that each pair follows the date-against-timestamp rule on its own.
            Condition inside = compare(Operator.GE, b.value(), b.low()).and(compare(Operator.LE, b.value(), b.high()));
            return b.negated() ? DSL.not(inside) : inside;
        }
        Field<Object> value = comparable(b.value(), all);
        Field<Object> low = comparable(b.low(), all);
        Field<Object> high = comparable(b.high(), all);
        return b.negated() ? value.notBetween(low, high) : value.between(low, high);
    }

    private Condition in(Typed.In in) {
        List<Typed> all = new ArrayList<>(in.items());
        all.add(in.value());
        if (mixesDayAndTime(all)) {
            // 'x in (a, b)' is 'x = a or x = b' under three-valued logic too; spelled out for the date rule.
            Condition any = DSL.or(in.items().stream().map(item -> compare(Operator.EQ, in.value(), item)).toList());
            return in.negated() ? DSL.not(any) : any;
        }
        Field<Object> value = comparable(in.value(), all);
        List<Field<Object>> items = in.items().stream().map(item -> comparable(item, all)).toList();
        return in.negated() ? value.notIn(items) : value.in(items);
    }

    static boolean mixesDayAndTime(List<Typed> nodes) {
        return nodes.stream().anyMatch(n -> n.type() == ExprType.DATE)
                && nodes.stream().anyMatch(n -> n.type() == ExprType.TIMESTAMP);
    }

    private Field<BigDecimal> number(Typed node) {
        return value(node).coerce(BigDecimal.class);
    }

    private Field<String> text(Typed node) {
        return value(node).coerce(String.class);
    }

    private static Field<BigDecimal> zero() {
        return DSL.inline(0).coerce(BigDecimal.class);
    }
}
