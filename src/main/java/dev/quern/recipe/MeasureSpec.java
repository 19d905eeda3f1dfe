package dev.quern.recipe;

import dev.quern.Position;
import java.util.Objects;
import java.util.Optional;

/**
 * One measure of a feature block: {@code count}, {@code sum(distance_km)}. {@code name} overrides the
 * generated column name; it may contain {@code {window}}, replaced by the window label.
 */
public record MeasureSpec(MeasureKind kind, Optional<Name> column, Optional<Name> name, Position position) {
    public MeasureSpec {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(position, "position");
    }

    /** As written in a recipe: {@code sum(distance_km)}. */
    public String text() {
        return column.map(c -> kind.spelling() + "(" + c.text() + ")").orElse(kind.spelling());
    }
}
