package dev.quern.recipe;

import dev.quern.Position;
import java.util.Objects;

/**
 * The recipe's answer to an audit finding it accepts: which check, which output column, and why the
 * column is safe all the same. The reason is recorded in the dictionary and the audit.
 */
public record Acknowledgement(Name check, Name column, String reason, Position position) {
    public Acknowledgement {
        Objects.requireNonNull(check, "check");
        Objects.requireNonNull(column, "column");
        Objects.requireNonNull(reason, "reason");
        Objects.requireNonNull(position, "position");
    }
}
