package dev.quern;

import java.util.List;
import java.util.stream.Collectors;

/**
 * A failure the user can act on: it carries every diagnostic of the stage that found them, so that one
 * run reports all mistakes at once.
 */
public final class QuernException extends RuntimeException {

    private final Failure failure;
    private final List<Diagnostic> diagnostics;

    public QuernException(Failure failure, List<Diagnostic> diagnostics) {
        super(render(diagnostics));
        if (diagnostics.isEmpty()) {
            throw new IllegalArgumentException("a failure needs at least one diagnostic");
        }
        this.failure = failure;
        this.diagnostics = List.copyOf(diagnostics);
    }

    public QuernException(Failure failure, List<Diagnostic> diagnostics, Throwable cause) {
        this(failure, diagnostics);
        initCause(cause);
    }

    public static QuernException recipe(List<Diagnostic> diagnostics) {
        return new QuernException(Failure.RECIPE, diagnostics);
    }

    public static QuernException recipe(Position at, String message) {
        return new QuernException(Failure.RECIPE, List.of(Diagnostic.at(at, message)));
    }

    public static QuernException usage(String message) {
        return new QuernException(Failure.USAGE, List.of(Diagnostic.at(Position.NONE, message)));
    }

    public static QuernException data(String message) {
        return new QuernException(Failure.DATA, List.of(Diagnostic.at(Position.NONE, message)));
    }

    public static QuernException data(String message, Throwable cause) {
        return new QuernException(Failure.DATA, List.of(Diagnostic.at(Position.NONE, message)), cause);
    }

    public static QuernException output(String message, Throwable cause) {
        return new QuernException(Failure.OUTPUT, List.of(Diagnostic.at(Position.NONE, message)), cause);
    }

    public Failure failure() {
        return failure;
    }

    public List<Diagnostic> diagnostics() {
        return diagnostics;
    }

    private static String render(List<Diagnostic> diagnostics) {
        return diagnostics.stream().map(Diagnostic::render).collect(Collectors.joining("\n"));
    }
}
