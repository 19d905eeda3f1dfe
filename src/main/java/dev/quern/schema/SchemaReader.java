package dev.quern.schema;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.QuernException;
import dev.quern.Suggestions;
import dev.quern.recipe.History;
import dev.quern.recipe.Link;
import dev.quern.recipe.Name;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.TableSpec;
import java.sql.Connection;
import java.sql.SQLException;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;

/**
 * The schema stage: checks every table and column the recipe declares against the source's catalogue,
 * samples how each time column stores its values, and checks that the keys rows are joined on are unique.
 * It reads no feature data; it stops with all mistakes found together.
 */
public final class SchemaReader {

    private final Connection connection;
    private final Engine engine;
    private final CatalogueReader catalogue;

    public SchemaReader(Connection connection, Engine engine) {
        this.connection = connection;
        this.engine = engine;
        this.catalogue = new CatalogueReader(connection, engine);
    }

    public SourceSchema read(Recipe recipe) {
        try {
            Map<String, TableInfo> tables = checkDeclarations(recipe);
            if (engine == Engine.SQLITE) {
                TextTimeDetector detector = new TextTimeDetector(engine.sql(connection));
                tables.replaceAll((name, table) -> detector.retype(table));
            }
            Map<String, TimeColumnFacts> times = new TimeSampler(connection, engine).sample(timeColumns(recipe), tables);
            new KeyChecker(connection, engine).checkUnique(joinKeys(recipe));
            return new SourceSchema(engine, tables, times);
        } catch (SQLException e) {
            throw QuernException.data("reading the source's catalogue failed: " + e.getMessage(), e);
        }
    }

    private Map<String, TableInfo> checkDeclarations(Recipe recipe) throws SQLException {
        Diagnostics problems = new Diagnostics();
        TreeSet<String> known = catalogue.tableNames();
        Map<String, TableInfo> found = new LinkedHashMap<>();
        Name entityTable = recipe.entity().table();
        Optional<TableInfo> entity = lookUp(entityTable, known, problems, found);
        entity.ifPresent(t -> {
            requireColumn(t, recipe.entity().key(), "the entity key", problems);
            recipe.entity().since().ifPresent(s -> requireColumn(t, s, "the entity's since date", problems));
        });
        for (TableSpec spec : recipe.tables().values()) {
            Optional<TableInfo> table = spec.name().text().equals(entityTable.text())
                    ? entity : lookUp(spec.name(), known, problems, found);
            table.ifPresent(t -> checkTableSpec(recipe, spec, t, problems));
        }
        problems.throwIfAny(Failure.RECIPE);
        return found;
    }

    private Optional<TableInfo> lookUp(Name name, Set<String> known, Diagnostics problems,
                                       Map<String, TableInfo> found) throws SQLException {
        Optional<TableInfo> table = catalogue.table(name.text());
        if (table.isEmpty()) {
            problems.error(name.position(), "the source has no table '" + name.text() + "'"
                    + Suggestions.hint(name.text(), known));
        } else {
            found.put(name.text(), table.get());
        }
        return table;
    }

    private void checkTableSpec(Recipe recipe, TableSpec spec, TableInfo table, Diagnostics problems) {
        spec.key().ifPresent(k -> requireColumn(table, k, "the key", problems));
        spec.time().ifPresent(t -> requireColumn(table, t, "the time", problems));
        spec.history().ifPresent(h -> {
            requireColumn(table, h.from(), "the validity start", problems);
            requireColumn(table, h.to(), "the validity end", problems);
        });
        for (Link link : spec.links()) {
            requireColumn(table, link.column(), "a link", problems);
            if (keyOf(recipe, link.target().text()).isEmpty()) {
                problems.error(link.target().position(), "'" + link.target().text()
                        + "' is linked to but declares no key: add 'key:' under tables." + link.target().text());
            }
        }
        for (Name identifier : spec.identifiers()) {
            requireColumn(table, identifier, "an identifier", problems);
        }
        spec.updated().ifPresent(u -> requireColumn(table, u, "the update time", problems));
        for (Name sensitive : spec.sensitive()) {
            requireColumn(table, sensitive, "a sensitive column", problems);
        }
        for (var filled : spec.filled()) {
            requireColumn(table, filled.column(), "a column filled in later", problems);
            requireColumn(table, filled.at(), "the time it is filled at", problems);
        }
    }

    private static void requireColumn(TableInfo table, Name column, String role, Diagnostics problems) {
        if (table.column(column.text()).isEmpty()) {
            problems.error(column.position(), "table " + table.name() + " has no column '" + column.text()
                    + "' to serve as " + role + Suggestions.hint(column.text(), table.columns().keySet()));
        }
    }

    /** The key column of a table, as the recipe declares it; the entity's key for the entity table. */
    public static Optional<Name> keyOf(Recipe recipe, String table) {
        if (table.equals(recipe.entity().table().text())) {
            return Optional.of(recipe.entity().key());
        }
        return recipe.table(table).flatMap(TableSpec::key);
    }

    /** Every column the recipe reads as a time, table by table. */
    private static Map<String, Set<String>> timeColumns(Recipe recipe) {
        Map<String, Set<String>> columns = new LinkedHashMap<>();
        recipe.entity().since().ifPresent(s -> add(columns, recipe.entity().table().text(), s.text()));
        for (TableSpec spec : recipe.tables().values()) {
            spec.time().ifPresent(t -> add(columns, spec.name().text(), t.text()));
            spec.history().map(History::from).ifPresent(f -> add(columns, spec.name().text(), f.text()));
            spec.history().map(History::to).ifPresent(t -> add(columns, spec.name().text(), t.text()));
            spec.updated().ifPresent(u -> add(columns, spec.name().text(), u.text()));
            spec.filled().forEach(f -> add(columns, spec.name().text(), f.at().text()));
        }
        return columns;
    }

    /** The tables whose key other rows are joined on, with that key: they must be unique. */
    private static Map<String, String> joinKeys(Recipe recipe) {
        Map<String, String> keys = new LinkedHashMap<>();
        keys.put(recipe.entity().table().text(), recipe.entity().key().text());
        Set<String> targets = new LinkedHashSet<>();
        recipe.tables().values().forEach(t -> t.links().forEach(l -> targets.add(l.target().text())));
        for (String target : targets) {
            keyOf(recipe, target).ifPresent(k -> keys.put(target, k.text()));
        }
        return keys;
    }

    private static void add(Map<String, Set<String>> columns, String table, String column) {
        columns.computeIfAbsent(table, t -> new LinkedHashSet<>()).add(column);
    }
}
