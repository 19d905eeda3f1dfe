package dev.quern.expr;

/**
 * Stops lexing or parsing at the first mistake: after one, the rest of the text is usually reported
 * wrongly, so only the first is worth showing.
 */
final class SyntaxError extends RuntimeException {

    private final int offset;

    SyntaxError(int offset, String message) {
        super(message, null, false, false);
        this.offset = offset;
    }

    int offset() {
        return offset;
    }
}
