package dev.quern;

import java.util.Objects;

/** One thing wrong with the user's input, with where it is and what to do about it. */
public record Diagnostic(Position position, String message) {

    public Diagnostic {
        Objects.requireNonNull(position, "position");
        Objects.requireNonNull(message, "message");
    }

    public static Diagnostic at(Position position, String message) {
        return new Diagnostic(position, message);
    }

    /** {@code recipes/churn.yaml:12:5: unknown column ...}, or just the message when there is no place. */
    public String render() {
        String where = position.toString();
        return where.isEmpty() ? message : where + ": " + message;
    }
}
