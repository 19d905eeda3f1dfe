package dev.quern.plan;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Rows of an event table, tied to the entity by {@code entityLink} and placed in time by {@code time},
 * with the further tables reached along links.
 */
public record EventPath(String table, String alias, ColumnRef entityLink, TimeRef time, Optional<ColumnRef> key,
                        List<Hop> hops) {
    public EventPath {
        Objects.requireNonNull(table, "table");
        Objects.requireNonNull(alias, "alias");
        Objects.requireNonNull(entityLink, "entityLink");
        Objects.requireNonNull(time, "time");
        Objects.requireNonNull(key, "key");
        hops = List.copyOf(hops);
    }

    /** {@code rides -> stations}. */
    public String text() {
        StringBuilder out = new StringBuilder(table);
        hops.forEach(h -> out.append(" -> ").append(h.table()));
        return out.toString();
    }
}
