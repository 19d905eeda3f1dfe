package dev.quern.expr;

/** The operators of the language, as the checker, the renderer and the evaluator see them. */
enum Operator {
    PLUS, MINUS, TIMES, DIVIDE, MODULO,
    EQ, NE, LT, LE, GT, GE,
    AND, OR;

    static Operator of(TokenKind kind) {
        return switch (kind) {
            case PLUS -> PLUS;
            case MINUS -> MINUS;
            case STAR -> TIMES;
            case SLASH -> DIVIDE;
            case PERCENT -> MODULO;
            case EQ -> EQ;
            case NE -> NE;
            case LT -> LT;
            case LE -> LE;
            case GT -> GT;
            case GE -> GE;
            case AND -> AND;
            case OR -> OR;
            default -> throw new IllegalArgumentException("not a binary operator: " + kind);
        };
    }

    boolean isArithmetic() {
        return ordinal() <= MODULO.ordinal();
    }

    boolean isComparison() {
        return ordinal() >= EQ.ordinal() && ordinal() <= GE.ordinal();
    }

    boolean isLogical() {
        return this == AND || this == OR;
    }

    /** Whether the comparison holds, given the sign of {@code compare(left, right)}. */
    boolean holds(int sign) {
        return switch (this) {
            case EQ -> sign == 0;
            case NE -> sign != 0;
            case LT -> sign < 0;
            case LE -> sign <= 0;
            case GT -> sign > 0;
            case GE -> sign >= 0;
            default -> throw new IllegalStateException("not a comparison: " + this);
        };
    }
}
