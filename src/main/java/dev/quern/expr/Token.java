package dev.quern.expr;

/** One token: its kind and where it lies in the expression's text ({@code end} exclusive). */
record Token(TokenKind kind, String text, int start, int end) {

    /** How a message names this token: {@code 'and'}, {@code 'it''s'}, or the end of the expression. */
    String describe() {
        return switch (kind) {
            case END -> "the end of the expression";
            case TEXT -> text;
            default -> "'" + text + "'";
        };
    }
}
