package dev.quern.plan;

import dev.quern.Diagnostics;
import dev.quern.recipe.FeatureSpec;
import dev.quern.recipe.Name;
import dev.quern.recipe.PathSpec;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.TableSpec;
import dev.quern.schema.SourceSchema;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/** Groups lookups by table, so that each table is read once however many of its columns are taken. */
final class LookupPlanner {

    private final Recipe recipe;
    private final SourceSchema schema;
    private final PathResolver paths;
    private final Diagnostics problems;
    private final Protected protectedColumns;

    LookupPlanner(Recipe recipe, SourceSchema schema, PathResolver paths, Diagnostics problems,
                  Protected protectedColumns) {
        this.recipe = recipe;
        this.schema = schema;
        this.paths = paths;
        this.problems = problems;
        this.protectedColumns = protectedColumns;
    }

    List<Lookup> plan(List<FeatureSpec.Lookup> specs) {
        Map<String, List<FeatureSpec.Lookup>> byTable = new LinkedHashMap<>();
        for (FeatureSpec.Lookup spec : specs) {
            boolean usable = schema.table(spec.table().text()).column(spec.column().text()).isPresent()
                    && protectedColumns.why(spec.table().text(), spec.column().text()).isEmpty();
            if (usable) {
                byTable.computeIfAbsent(spec.table().text(), t -> new ArrayList<>()).add(spec);
            }
        }
        List<Lookup> out = new ArrayList<>();
        for (Map.Entry<String, List<FeatureSpec.Lookup>> e : byTable.entrySet()) {
            lookup(e.getKey(), e.getValue(), "l" + (out.size() + 1)).ifPresent(out::add);
        }
        return out;
    }

    private Optional<Lookup> lookup(String table, List<FeatureSpec.Lookup> specs, String name) {
        String alias = name + "_t";
        if (table.equals(recipe.entity().table().text())) {
            return Optional.of(new Lookup.EntityAttributes(table, lookupColumns(specs, "m")));
        }
        TableSpec spec = recipe.table(table).orElseThrow();
        Name usedAt = specs.get(0).table();
        if (spec.history().isPresent()) {
            Optional<ColumnRef> link = paths.entityLink(spec, usedAt, alias);
            if (link.isEmpty()) {
                return Optional.empty();
            }
            var h = spec.history().get();
            TimeRef from = new TimeRef(paths.column(alias, table, h.from().text()),
                    schema.time(table, h.from().text()).storage());
            TimeRef to = new TimeRef(paths.column(alias, table, h.to().text()),
                    schema.time(table, h.to().text()).storage());
            Optional<ColumnRef> key = spec.key().map(k -> paths.column(alias, table, k.text()));
            return Optional.of(new Lookup.InForce(name, table, alias, link.get(), from, to, key,
                    lookupColumns(specs, alias)));
        }
        Optional<EventPath> path = paths.resolve(new PathSpec(List.of(new dev.quern.recipe.Hop(usedAt,
                Optional.empty())), usedAt.position()), name + "_t");
        return path.map(p -> new Lookup.Latest(name, p, lookupColumns(specs, p.alias())));
    }

    private List<LookupColumn> lookupColumns(List<FeatureSpec.Lookup> specs, String alias) {
        List<LookupColumn> out = new ArrayList<>();
        for (FeatureSpec.Lookup spec : specs) {
            String output = outputName(spec);
            out.add(new LookupColumn(output, paths.column(alias, spec.table().text(), spec.column().text())));
        }
        return out;
    }

    static String outputName(FeatureSpec.Lookup spec) {
        return spec.name().map(Name::text).orElse(spec.table().text() + "_" + spec.column().text());
    }
}
