package dev.quern.plan;

import dev.quern.Diagnostics;
import dev.quern.Suggestions;
import dev.quern.recipe.Link;
import dev.quern.recipe.Name;
import dev.quern.recipe.PathSpec;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.TableSpec;
import dev.quern.schema.SchemaReader;
import dev.quern.schema.SourceSchema;
import dev.quern.schema.TableInfo;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** Turns a recipe path into the tables and joins a query walks, and finds the columns it reads. */
final class PathResolver {

    private final Recipe recipe;
    private final SourceSchema schema;
    private final Diagnostics problems;

    PathResolver(Recipe recipe, SourceSchema schema, Diagnostics problems) {
        this.recipe = recipe;
        this.schema = schema;
        this.problems = problems;
    }

    /** The event path, or empty after reporting why it cannot be walked. */
    Optional<EventPath> resolve(PathSpec spec, String aliasPrefix) {
        Name first = spec.first().table();
        Optional<TableSpec> table = recipe.table(first.text());
        if (table.isEmpty() || table.get().time().isEmpty()) {
            problems.error(first.position(), "'" + first.text() + "' needs a 'time' column under tables."
                    + first.text() + " to be read over windows");
            return Optional.empty();
        }
        Optional<ColumnRef> entityLink = entityLink(table.get(), first, aliasPrefix + "0");
        if (entityLink.isEmpty()) {
            return Optional.empty();
        }
        String alias = aliasPrefix + "0";
        ColumnRef time = column(alias, first.text(), table.get().time().get().text());
        Optional<ColumnRef> key = table.get().key().map(k -> column(alias, first.text(), k.text()));
        List<Hop> hops = new ArrayList<>();
        TableSpec previous = table.get();
        String previousAlias = alias;
        for (int i = 1; i < spec.hops().size(); i++) {
            var hop = spec.hops().get(i);
            String target = hop.table().text();
            TableSpec from = previous;
            List<Link> candidates = hop.via()
                    .map(v -> from.linkThrough(v.text()).stream().toList())
                    .orElseGet(() -> from.linksTo(target));
            if (candidates.size() != 1 || !candidates.get(0).target().text().equals(target)) {
                problems.error(hop.table().position(), previous.name().text() + " has no single link to " + target
                        + ": declare one under tables." + previous.name().text() + ".links, or name it as "
                        + previous.name().text() + ".<column> -> " + target);
                return Optional.empty();
            }
            String hopAlias = aliasPrefix + i;
            String targetKey = SchemaReader.keyOf(recipe, target).map(Name::text).orElseThrow();
            hops.add(new Hop(target, hopAlias, targetKey,
                    column(previousAlias, previous.name().text(), candidates.get(0).column().text())));
            previous = recipe.table(target).orElseGet(() -> entityAsTable(target));
            previousAlias = hopAlias;
        }
        return Optional.of(new EventPath(first.text(), alias, entityLink.get(),
                new TimeRef(time, schema.time(first.text(), time.column()).storage()), key, hops));
    }

    /** The column that ties a table's rows to the entity: its one link to the entity table. */
    Optional<ColumnRef> entityLink(TableSpec table, Name usedAt, String alias) {
        String entity = recipe.entity().table().text();
        List<Link> links = table.linksTo(entity);
        if (links.size() != 1) {
            problems.error(usedAt.position(), table.name().text() + (links.isEmpty() ? " has no link to " + entity
                    + ": add one under tables." + table.name().text() + ".links, e.g. { "
                    + recipe.entity().key().text() + ": " + entity + " }"
                    : " has several links to " + entity + "; Quern needs exactly one to tie its rows to the entity"));
            return Optional.empty();
        }
        return Optional.of(column(alias, table.name().text(), links.get(0).column().text()));
    }

    /**
     * The column {@code name} read on a path: from the last table that has it, searching from the end of
     * the path back to its start.
     */
    Optional<ColumnRef> pathColumn(EventPath path, Name name) {
        List<String[]> tables = new ArrayList<>();
        tables.add(new String[] {path.table(), path.alias()});
        path.hops().forEach(h -> tables.add(new String[] {h.table(), h.alias()}));
        for (int i = tables.size() - 1; i >= 0; i--) {
            TableInfo info = schema.table(tables.get(i)[0]);
            if (info.column(name.text()).isPresent()) {
                return Optional.of(column(tables.get(i)[1], tables.get(i)[0], name.text()));
            }
        }
        TableInfo last = schema.table(tables.get(tables.size() - 1)[0]);
        problems.error(name.position(), "no table on the path " + path.text() + " has a column '" + name.text()
                + "'" + Suggestions.hint(name.text(), last.columns().keySet()));
        return Optional.empty();
    }

    ColumnRef column(String alias, String table, String column) {
        return new ColumnRef(alias, table, column, schema.column(table, column).type());
    }

    private TableSpec entityAsTable(String name) {
        return new TableSpec(recipe.entity().table(), Optional.of(recipe.entity().key()), Optional.empty(),
                Optional.empty(), List.of(), List.of(), recipe.entity().position());
    }
}
