package dev.quern.sql;

import dev.quern.plan.Block;
import java.util.Objects;

/** The shape chosen for one block, and why: what {@code quern sql --explain} prints. */
public record ShapeChoice(Block block, BlockShape shape, String reason) {
    public ShapeChoice {
        Objects.requireNonNull(block, "block");
        Objects.requireNonNull(shape, "shape");
        Objects.requireNonNull(reason, "reason");
    }
}
