package dev.quern.recipe;

import java.util.Objects;

/**
 * The validity columns of a table that keeps history: a row is in force from {@code from} (included) until
 * {@code to} (excluded); an empty {@code to} means still in force.
 */
public record History(Name from, Name to) {
    public History {
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(to, "to");
    }
}
