package dev.quern.plan;

import java.util.Objects;

/**
 * One further table on a path: {@code alias}'s key equals the link column of the table before it.
 * Joined so that a row of the table before is kept when its link is empty or dangling.
 */
public record Hop(String table, String alias, String key, ColumnRef link) {
    public Hop {
        Objects.requireNonNull(table, "table");
        Objects.requireNonNull(alias, "alias");
        Objects.requireNonNull(key, "key");
        Objects.requireNonNull(link, "link");
    }
}
