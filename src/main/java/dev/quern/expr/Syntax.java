package dev.quern.expr;

import java.time.LocalDate;
import java.time.LocalDateTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The tree the parser builds, before any name is resolved or type checked. Every node knows the stretch
 * of the expression's text it was read from ({@code start} inclusive, {@code end} exclusive), so that a
 * later message can quote it and point at it.
 */
sealed interface Syntax {

    int start();

    int end();

    /** The nodes directly below this one, left to right. */
    default List<Syntax> children() {
        if (this instanceof Negate n) {
            return List.of(n.operand());
        }
        if (this instanceof Not n) {
            return List.of(n.operand());
        }
        if (this instanceof Group g) {
            return List.of(g.inner());
        }
        if (this instanceof Binary b) {
            return List.of(b.left(), b.right());
        }
        if (this instanceof Between b) {
            return List.of(b.value(), b.low(), b.high());
        }
        if (this instanceof In in) {
            List<Syntax> all = new ArrayList<>();
            all.add(in.value());
            all.addAll(in.items());
            return all;
        }
        if (this instanceof IsNull i) {
            return List.of(i.value());
        }
        if (this instanceof Call c) {
            return c.arguments();
        }
        return List.of();
    }

    /** {@code value} is a Long for a whole number and a Double for a decimal one. */
    record NumberLiteral(Number value, int start, int end) implements Syntax {
        public NumberLiteral {
            Objects.requireNonNull(value, "value");
        }
    }

    record TextLiteral(String value, int start, int end) implements Syntax {
        public TextLiteral {
            Objects.requireNonNull(value, "value");
        }
    }

    record BooleanLiteral(boolean value, int start, int end) implements Syntax {
    }

    record NullLiteral(int start, int end) implements Syntax {
    }

    record DateLiteral(LocalDate value, int start, int end) implements Syntax {
        public DateLiteral {
            Objects.requireNonNull(value, "value");
        }
    }

    record TimestampLiteral(LocalDateTime value, int start, int end) implements Syntax {
        public TimestampLiteral {
            Objects.requireNonNull(value, "value");
        }
    }

    /** {@code distance_km}, {@code rides.distance_km} or the special name {@code cutoff}. */
    record Name(Optional<String> qualifier, String name, int start, int end) implements Syntax {
        public Name {
            Objects.requireNonNull(qualifier, "qualifier");
            Objects.requireNonNull(name, "name");
        }

        String written() {
            return qualifier.map(q -> q + "." + name).orElse(name);
        }
    }

    /** {@code -x}: a minus directly before a number literal is folded into the literal instead. */
    record Negate(Syntax operand, int start, int end) implements Syntax {
        public Negate {
            Objects.requireNonNull(operand, "operand");
        }
    }

    record Not(Syntax operand, int start, int end) implements Syntax {
        public Not {
            Objects.requireNonNull(operand, "operand");
        }
    }

    /** {@code symbol} is the operator as written ({@code <>}, {@code AND}), {@code at} where it is. */
    record Binary(Operator operator, String symbol, int at, Syntax left, Syntax right) implements Syntax {
        public Binary {
            Objects.requireNonNull(operator, "operator");
            Objects.requireNonNull(symbol, "symbol");
            Objects.requireNonNull(left, "left");
            Objects.requireNonNull(right, "right");
        }

        @Override
        public int start() {
            return left.start();
        }

        @Override
        public int end() {
            return right.end();
        }
    }

    record Between(Syntax value, Syntax low, Syntax high, boolean negated, int at) implements Syntax {
        public Between {
            Objects.requireNonNull(value, "value");
            Objects.requireNonNull(low, "low");
            Objects.requireNonNull(high, "high");
        }

        @Override
        public int start() {
            return value.start();
        }

        @Override
        public int end() {
            return high.end();
        }
    }

    record In(Syntax value, List<Syntax> items, boolean negated, int at, int end) implements Syntax {
        public In {
            Objects.requireNonNull(value, "value");
            items = List.copyOf(items);
        }

        @Override
        public int start() {
            return value.start();
        }
    }

    record IsNull(Syntax value, boolean negated, int at, int end) implements Syntax {
        public IsNull {
            Objects.requireNonNull(value, "value");
        }

        @Override
        public int start() {
            return value.start();
        }
    }

    /** {@code (inner)}: kept so that quoting a node includes its parentheses. */
    record Group(Syntax inner, int start, int end) implements Syntax {
        public Group {
            Objects.requireNonNull(inner, "inner");
        }
    }

    /** A function call; {@code function} is the name as written, {@code start} where it begins. */
    record Call(String function, List<Syntax> arguments, int start, int end) implements Syntax {
        public Call {
            Objects.requireNonNull(function, "function");
            arguments = List.copyOf(arguments);
        }
    }
}
