package dev.quern.recipe;

import dev.quern.Position;
import java.util.List;
import java.util.Objects;
import java.util.stream.Collectors;

/**
 * A path from an event table along links: {@code rides} or {@code rides -> stations}. The first table is
 * the one whose time column decides the window; it links to the entity. Columns are read from the last.
 */
public record PathSpec(List<Hop> hops, Position position) {
    public PathSpec {
        hops = List.copyOf(hops);
        if (hops.isEmpty()) {
            throw new IllegalArgumentException("a path needs at least one table");
        }
        Objects.requireNonNull(position, "position");
    }

    public Hop first() {
        return hops.get(0);
    }

    public Hop last() {
        return hops.get(hops.size() - 1);
    }

    /** The path as written, normalised: {@code rides.start_station_id -> stations}. */
    public String text() {
        StringBuilder out = new StringBuilder(hops.get(0).table().text());
        for (int i = 1; i < hops.size(); i++) {
            Hop hop = hops.get(i);
            hop.via().ifPresent(v -> out.append('.').append(v.text()));
            out.append(" -> ").append(hop.table().text());
        }
        return out.toString();
    }

    /** The tables joined with underscores, the default prefix of generated column names. */
    public String defaultPrefix() {
        return hops.stream().map(h -> h.table().text()).collect(Collectors.joining("_"));
    }
}
