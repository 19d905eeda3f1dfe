package dev.quern.recipe;

import dev.quern.Position;
import java.util.Objects;

/**
 * An expression written in the recipe, kept as text: a filter ({@code where}), a rule's check or a derived
 * column. The plan stage parses and type-checks it against the schema; {@code start} is where its first
 * character stands, so errors point inside the text.
 */
public record Expression(String text, Position start) {
    public Expression {
        Objects.requireNonNull(text, "text");
        Objects.requireNonNull(start, "start");
    }

    @Override
    public String toString() {
        return text;
    }
}
