package dev.quern.recipe;

import dev.quern.Position;
import java.time.LocalDate;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Which cutoffs are for training, validation and testing: each part takes the cutoffs from {@code from}
 * to {@code to} (both included; an open end reaches the first or last cutoff).
 */
public record SplitSpec(List<Part> parts, Position position) {

    /** One part of the split. */
    public record Part(Name name, Optional<LocalDate> from, Optional<LocalDate> to, Position position) {
        public Part {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(to, "to");
            Objects.requireNonNull(position, "position");
        }

        public boolean holds(LocalDate cutoff) {
            return from.map(f -> !cutoff.isBefore(f)).orElse(true) && to.map(t -> !cutoff.isAfter(t)).orElse(true);
        }
    }

    public SplitSpec {
        parts = List.copyOf(parts);
        Objects.requireNonNull(position, "position");
    }
}
