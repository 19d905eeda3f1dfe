package dev.quern.expr;

import java.util.List;
import java.util.Objects;

/**
 * The checked tree: every name resolved to its {@link Binding}, every node with its type. The renderer and
 * the evaluator walk this tree only, so both see exactly what the checker accepted.
 */
sealed interface Typed {

    ExprType type();

    /**
     * A literal. {@code value} is a Long (INTEGER), Double (DECIMAL), String, Boolean, LocalDate,
     * LocalDateTime, or null; a null keeps the type its context gave it, so that engines which need to
     * know the type of a null (PostgreSQL) get a typed one.
     */
    record Constant(Object value, ExprType type) implements Typed {
        public Constant {
            Objects.requireNonNull(type, "type");
        }
    }

    record Column(Binding binding, ExprType type) implements Typed {
        public Column {
            Objects.requireNonNull(binding, "binding");
            Objects.requireNonNull(type, "type");
        }
    }

    record Negate(Typed operand, ExprType type) implements Typed {
        public Negate {
            Objects.requireNonNull(operand, "operand");
            Objects.requireNonNull(type, "type");
        }
    }

    /** + - * / %: the type says whether the arithmetic is on whole numbers or on doubles. */
    record Arithmetic(Operator operator, Typed left, Typed right, ExprType type) implements Typed {
        public Arithmetic {
            Objects.requireNonNull(operator, "operator");
            Objects.requireNonNull(left, "left");
            Objects.requireNonNull(right, "right");
            Objects.requireNonNull(type, "type");
        }
    }

    record Comparison(Operator operator, Typed left, Typed right) implements Typed {
        public Comparison {
            Objects.requireNonNull(operator, "operator");
            Objects.requireNonNull(left, "left");
            Objects.requireNonNull(right, "right");
        }

        @Override
        public ExprType type() {
            return ExprType.BOOLEAN;
        }
    }

    /** and, or. */
    record Logical(Operator operator, Typed left, Typed right) implements Typed {
        public Logical {
            Objects.requireNonNull(operator, "operator");
            Objects.requireNonNull(left, "left");
            Objects.requireNonNull(right, "right");
        }

        @Override
        public ExprType type() {
            return ExprType.BOOLEAN;
        }
    }

    record Not(Typed operand) implements Typed {
        public Not {
            Objects.requireNonNull(operand, "operand");
        }

        @Override
        public ExprType type() {
            return ExprType.BOOLEAN;
        }
    }

    record Between(Typed value, Typed low, Typed high, boolean negated) implements Typed {
        public Between {
            Objects.requireNonNull(value, "value");
            Objects.requireNonNull(low, "low");
            Objects.requireNonNull(high, "high");
        }

        @Override
        public ExprType type() {
            return ExprType.BOOLEAN;
        }
    }

    record In(Typed value, List<Typed> items, boolean negated) implements Typed {
        public In {
            Objects.requireNonNull(value, "value");
            items = List.copyOf(items);
        }

        @Override
        public ExprType type() {
            return ExprType.BOOLEAN;
        }
    }

    record IsNull(Typed value, boolean negated) implements Typed {
        public IsNull {
            Objects.requireNonNull(value, "value");
        }

        @Override
        public ExprType type() {
            return ExprType.BOOLEAN;
        }
    }

    /** A function call; round's digits, when given, are a Constant holding a Long from 0 to 15. */
    record Call(BuiltIn function, List<Typed> arguments, ExprType type) implements Typed {
        public Call {
            Objects.requireNonNull(function, "function");
            arguments = List.copyOf(arguments);
            Objects.requireNonNull(type, "type");
        }
    }
}
