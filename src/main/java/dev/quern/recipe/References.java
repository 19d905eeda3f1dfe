package dev.quern.recipe;

import dev.quern.Diagnostics;
import dev.quern.Suggestions;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;

/**
 * The recipe's references to its own tables, checked once the whole file is read and without a database:
 * every table named is declared, paths follow declared links, event tables have a time. The pieces are
 * handed over as they are read; pieces that failed to read are not handed over, and a table whose
 * description had an error is not inspected further, so one mistake is reported once.
 */
final class References {

    private final Diagnostics diagnostics;
    private Name entityTable;
    private Optional<Name> entityKey = Optional.empty();
    private boolean tablesRead;
    private final Map<String, TableSpec> tables = new LinkedHashMap<>();
    private final Set<String> incomplete = new HashSet<>();
    private final Set<String> broken = new HashSet<>();
    private final List<Name> until = new ArrayList<>();
    private final List<PathSpec> paths = new ArrayList<>();
    private final List<FeatureSpec.Lookup> lookups = new ArrayList<>();
    private final List<FeatureSpec.Aggregates> blocks = new ArrayList<>();
    private final List<RuleSpec> rules = new ArrayList<>();

    References(Diagnostics diagnostics) {
        this.diagnostics = diagnostics;
    }

    void entity(Name table, Optional<Name> key) {
        this.entityTable = table;
        this.entityKey = key;
    }

    void until(Name table) {
        until.add(table);
    }

    /** The {@code tables} section could be read as a mapping: its names are the declared tables. */
    void tablesRead() {
        tablesRead = true;
    }

    /** A declared table; {@code complete} is false when part of its description had an error. */
    void table(TableSpec spec, boolean complete) {
        tables.put(spec.name().text(), spec);
        if (!complete) {
            incomplete.add(spec.name().text());
        }
    }

    /** A declared table whose description could not be read at all. */
    void brokenTable(Name name) {
        broken.add(name.text());
    }

    void path(PathSpec path) {
        paths.add(path);
    }

    void lookup(FeatureSpec.Lookup lookup) {
        lookups.add(lookup);
    }

    void block(FeatureSpec.Aggregates block) {
        blocks.add(block);
    }

    void rule(RuleSpec rule) {
        rules.add(rule);
    }

    /**
     * Reports every broken reference. Without the entity table or the tables section nothing can be told
     * apart from a typo, so then there is nothing to check (their own errors are already reported).
     */
    void check() {
        if (entityTable == null || !tablesRead) {
            return;
        }
        for (TableSpec table : tables.values()) {
            for (Link link : table.links()) {
                declared(link.target());
            }
        }
        for (Name table : until) {
            checkUntil(table);
        }
        for (PathSpec path : paths) {
            checkPath(path);
        }
        for (FeatureSpec.Lookup lookup : lookups) {
            checkLookup(lookup);
        }
        for (FeatureSpec.Aggregates block : blocks) {
            checkIdentifiers(block);
        }
        for (RuleSpec rule : rules) {
            checkRule(rule);
        }
    }

    private void checkRule(RuleSpec rule) {
        if (!declared(rule.table()) || !(rule instanceof RuleSpec.Orphans)) {
            return;
        }
        details(rule.table().text()).filter(spec -> spec.links().isEmpty()).ifPresent(spec ->
                diagnostics.error(rule.position(), "table " + rule.table().text() + " declares no links, so it"
                        + " can have no orphans: declare its links or drop the rule"));
    }

    private String entity() {
        return entityTable.text();
    }

    private boolean known(String table) {
        return tables.containsKey(table) || broken.contains(table) || table.equals(entity());
    }

    private boolean declared(Name table) {
        if (known(table.text())) {
            return true;
        }
        Set<String> names = new TreeSet<>(tables.keySet());
        names.addAll(broken);
        names.add(entity());
        diagnostics.error(table.position(), "unknown table " + Names.quote(table.text())
                + ": declare it under tables" + Suggestions.hint(table.text(), names));
        return false;
    }

    /**
     * What the recipe says about a declared table, when it said it without error; the entity table need
     * not be declared and then has no links of its own.
     */
    private Optional<TableSpec> details(String table) {
        if (incomplete.contains(table) || broken.contains(table)) {
            return Optional.empty();
        }
        TableSpec spec = tables.get(table);
        if (spec == null && table.equals(entity())) {
            return Optional.of(new TableSpec(entityTable, entityKey, Optional.empty(), Optional.empty(), List.of(),
                    List.of(), entityTable.position()));
        }
        return Optional.ofNullable(spec);
    }

    private void checkUntil(Name table) {
        if (!declared(table)) {
            return;
        }
        if (table.text().equals(entity())) {
            diagnostics.error(table.position(), "'until' names the entity table " + entity()
                    + ": name a table whose rows end eligibility, e.g. cancellations");
            return;
        }
        details(table.text()).ifPresent(spec -> {
            if (spec.time().isEmpty()) {
                diagnostics.error(table.position(), "table " + table.text() + " needs a 'time' to end eligibility"
                        + " with 'until': add one under tables." + table.text());
            }
            linksToEntity(table, spec);
        });
    }

    private void checkPath(PathSpec path) {
        boolean allDeclared = true;
        for (Hop hop : path.hops()) {
            allDeclared &= declared(hop.table());
        }
        Name first = path.first().table();
        if (known(first.text())) {
            if (first.text().equals(entity())) {
                diagnostics.error(first.position(), "a path cannot start at the entity table " + entity()
                        + ": start at a table with a 'time' that links to it; use lookup for its own columns");
            } else {
                details(first.text()).ifPresent(spec -> {
                    if (spec.time().isEmpty()) {
                        diagnostics.error(first.position(), "table " + first.text() + " needs a 'time' to start a"
                                + " path, so that its rows fall in windows: add one under tables." + first.text());
                    }
                    linksToEntity(first, spec);
                });
            }
        }
        if (!allDeclared) {
            return;
        }
        for (int i = 1; i < path.hops().size(); i++) {
            Name from = path.hops().get(i - 1).table();
            Hop hop = path.hops().get(i);
            details(from.text()).ifPresent(spec -> checkHop(spec, hop));
        }
    }

    private void checkHop(TableSpec from, Hop hop) {
        String table = from.name().text();
        String target = hop.table().text();
        if (hop.via().isPresent()) {
            Name via = hop.via().get();
            Optional<Link> link = from.linkThrough(via.text());
            if (link.isEmpty()) {
                List<String> columns = from.links().stream().map(l -> l.column().text()).toList();
                diagnostics.error(via.position(), "table " + table + " has no link " + Names.quote(via.text())
                        + ": declare it under tables." + table + ".links" + Suggestions.hint(via.text(), columns));
            } else if (!link.get().target().text().equals(target)) {
                diagnostics.error(via.position(), table + "." + via.text() + " links to "
                        + link.get().target().text() + ", not " + target);
            }
            return;
        }
        List<Link> links = from.linksTo(target);
        if (links.isEmpty()) {
            diagnostics.error(hop.table().position(), table + " has no link to " + target + ": add one under tables."
                    + table + ".links");
        } else if (links.size() > 1) {
            diagnostics.error(hop.table().position(), table + " has " + links.size() + " links to " + target + " ("
                    + columns(links) + "): name one, e.g. " + table + "." + links.get(0).column().text() + " -> "
                    + target);
        }
    }

    /** A table read for each entity must say which of its columns holds the entity's key: exactly one link. */
    private void linksToEntity(Name table, TableSpec spec) {
        List<Link> links = spec.linksTo(entity());
        if (links.isEmpty()) {
            diagnostics.error(table.position(), table.text() + " has no link to " + entity()
                    + ", the entity: add one under tables." + table.text() + ".links");
        } else if (links.size() > 1) {
            diagnostics.error(table.position(), table.text() + " has " + links.size() + " links to " + entity()
                    + ", the entity (" + columns(links) + "): keep the one that says whose row it is");
        }
    }

    private void checkLookup(FeatureSpec.Lookup lookup) {
        Name table = lookup.table();
        if (!declared(table)) {
            return;
        }
        boolean ofEntity = table.text().equals(entity());
        details(table.text()).ifPresent(spec -> {
            if (!ofEntity) {
                if (spec.time().isEmpty() && spec.history().isEmpty()) {
                    diagnostics.error(table.position(), "cannot look up from " + table.text()
                            + ": it has neither 'time' nor 'history'; look up from the entity table, a table with"
                            + " 'history' or a table with 'time'");
                    return;
                }
                linksToEntity(table, spec);
            }
            String column = lookup.column().text();
            String where = table.text() + "." + column;
            Optional<Name> key = ofEntity ? entityKey : spec.key();
            if (key.isPresent() && key.get().text().equals(column)) {
                diagnostics.error(lookup.column().position(), where + " is the key of " + table.text()
                        + " and cannot be looked up");
            } else if (spec.linkThrough(column).isPresent()) {
                diagnostics.error(lookup.column().position(), where + " is a link column and cannot be looked up");
            } else if (isIdentifier(spec, column)) {
                diagnostics.error(lookup.column().position(), where + " is a direct identifier and cannot be a"
                        + " feature");
            }
        });
    }

    /** Measure columns of the last table of a block's path that the recipe marks as direct identifiers. */
    private void checkIdentifiers(FeatureSpec.Aggregates block) {
        String last = block.from().last().table().text();
        if (!known(last)) {
            return;
        }
        details(last).ifPresent(spec -> {
            for (MeasureSpec measure : block.measures()) {
                measure.column().filter(c -> isIdentifier(spec, c.text())).ifPresent(c -> diagnostics.error(
                        c.position(), last + "." + c.text() + " is a direct identifier and cannot be a feature"));
            }
        });
    }

    private static boolean isIdentifier(TableSpec spec, String column) {
        return spec.identifiers().stream().anyMatch(i -> i.text().equals(column));
    }

    private static String columns(List<Link> links) {
        return links.stream().map(l -> l.column().text()).collect(Collectors.joining(", "));
    }
}
