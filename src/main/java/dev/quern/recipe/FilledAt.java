package dev.quern.recipe;

import java.util.Objects;

/**
 * A column whose value is written later than its row's own time: a ticket's {@code satisfaction} is
 * filled in when the ticket is closed, at {@code at}. A value is known at a cutoff only when {@code at} is.
 */
public record FilledAt(Name column, Name at) {
    public FilledAt {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(at, "at");
    }
}
