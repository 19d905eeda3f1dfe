package dev.quern.plan;

import dev.quern.recipe.Link;
import dev.quern.recipe.Name;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.TableSpec;
import java.util.HashMap;
import java.util.Map;
import java.util.Optional;

/**
 * The columns that must never become feature values: keys, link columns (they hold another row's key)
 * and the direct identifiers the recipe names. Rows about people are identified by them.
 */
final class Protected {

    private final Map<String, String> reasons;

    private Protected(Map<String, String> reasons) {
        this.reasons = reasons;
    }

    static Protected of(Recipe recipe) {
        Map<String, String> reasons = new HashMap<>();
        reasons.put(key(recipe.entity().table().text(), recipe.entity().key().text()), "the entity key");
        for (TableSpec t : recipe.tables().values()) {
            String table = t.name().text();
            t.key().ifPresent(k -> reasons.put(key(table, k.text()), "a key"));
            for (Link l : t.links()) {
                reasons.putIfAbsent(key(table, l.column().text()), "a link to " + l.target().text());
            }
            for (Name id : t.identifiers()) {
                reasons.put(key(table, id.text()), "marked as an identifier");
            }
        }
        return new Protected(Map.copyOf(reasons));
    }

    /** Why the column is protected, or empty when it may be a feature. */
    Optional<String> why(String table, String column) {
        return Optional.ofNullable(reasons.get(key(table, column)));
    }

    private static String key(String table, String column) {
        return table + "." + column;
    }
}
