package dev.quern.recipe;

import java.util.Objects;

/** A column of one table that holds the key of another table. */
public record Link(Name column, Name target) {
    public Link {
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(target, "target");
    }
}
