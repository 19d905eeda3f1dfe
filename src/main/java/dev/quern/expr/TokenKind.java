package dev.quern.expr;

/** The kinds of token the lexer produces. Words such as {@code date} or {@code cutoff} are names: their meaning depends on what follows. */
enum TokenKind {
    NUMBER, TEXT, NAME,
    AND, OR, NOT, IN, IS, NULL, TRUE, FALSE, BETWEEN,
    PLUS, MINUS, STAR, SLASH, PERCENT,
    EQ, NE, LT, LE, GT, GE,
    LPAREN, RPAREN, COMMA, DOT,
    END;

    boolean isComparison() {
        return this == EQ || this == NE || this == LT || this == LE || this == GT || this == GE;
    }

    /** Reserved words: written in any case, never names unless qualified ({@code t.in}). */
    boolean isKeyword() {
        return ordinal() >= AND.ordinal() && ordinal() <= BETWEEN.ordinal();
    }
}
