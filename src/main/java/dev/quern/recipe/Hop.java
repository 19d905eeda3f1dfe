package dev.quern.recipe;

import java.util.Objects;
import java.util.Optional;

/**
 * One table on a path. {@code via} names the link column of the previous table when the recipe chose one
 * ({@code rides.end_station_id -> stations}); empty when the only link serves.
 */
public record Hop(Name table, Optional<Name> via) {
    public Hop {
        Objects.requireNonNull(table, "table");
        Objects.requireNonNull(via, "via");
    }
}
