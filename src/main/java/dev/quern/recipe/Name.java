package dev.quern.recipe;

import dev.quern.Position;
import java.util.Objects;

/** An identifier written in the recipe (a table, a column, an output name) and where it was written. */
public record Name(String text, Position position) {

    public Name {
        Objects.requireNonNull(text, "text");
        Objects.requireNonNull(position, "position");
    }

    @Override
    public String toString() {
        return text;
    }
}
