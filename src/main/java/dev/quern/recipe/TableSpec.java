package dev.quern.recipe;

import dev.quern.Position;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * How the recipe describes one source table: its key, the column that says when each row happened (for
 * event tables) or its validity columns (for history tables), its links to other tables, the columns
 * that directly identify a person and must never become features, and what the leakage audit needs to
 * know: the column that records when a row was last changed ({@code updated}), columns about people that
 * call for care ({@code sensitive}), and columns filled in after their row's time ({@code filled}).
 */
public record TableSpec(
        Name name,
        Optional<Name> key,
        Optional<Name> time,
        Optional<History> history,
        List<Link> links,
        List<Name> identifiers,
        Optional<Name> updated,
        List<Name> sensitive,
        List<FilledAt> filled,
        Position position) {

    public TableSpec {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(key, "key");
        Objects.requireNonNull(time, "time");
        Objects.requireNonNull(history, "history");
        links = List.copyOf(links);
        identifiers = List.copyOf(identifiers);
        Objects.requireNonNull(updated, "updated");
        sensitive = List.copyOf(sensitive);
        filled = List.copyOf(filled);
        Objects.requireNonNull(position, "position");
    }

    /** A table described by its keys, times and links only. */
    public TableSpec(Name name, Optional<Name> key, Optional<Name> time, Optional<History> history, List<Link> links,
                     List<Name> identifiers, Position position) {
        this(name, key, time, history, links, identifiers, Optional.empty(), List.of(), List.of(), position);
    }

    /** The links from this table to {@code target}. */
    public List<Link> linksTo(String target) {
        return links.stream().filter(l -> l.target().text().equals(target)).toList();
    }

    public Optional<Link> linkThrough(String column) {
        return links.stream().filter(l -> l.column().text().equals(column)).findFirst();
    }
}
