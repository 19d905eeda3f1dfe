package dev.quern.plan;

import dev.quern.Diagnostics;
import dev.quern.Suggestions;
import dev.quern.expr.Expect;
import dev.quern.expr.Expressions;
import dev.quern.recipe.Link;
import dev.quern.recipe.Name;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.RuleSpec;
import dev.quern.recipe.TableSpec;
import dev.quern.schema.SchemaReader;
import dev.quern.schema.SourceSchema;
import dev.quern.schema.TableInfo;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Resolves the recipe's rules. A rule's names are the columns of its own table, qualified by the table's
 * name, which is also the alias its rows are read under when a rule filters them.
 */
final class RulePlanner {

    private final Recipe recipe;
    private final SourceSchema schema;
    private final Scopes scopes;
    private final Diagnostics problems;

    RulePlanner(Recipe recipe, SourceSchema schema, Diagnostics problems) {
        this.recipe = recipe;
        this.schema = schema;
        this.scopes = new Scopes(schema);
        this.problems = problems;
    }

    List<RulePlan> plan() {
        List<RulePlan> out = new ArrayList<>();
        for (RuleSpec rule : recipe.rules()) {
            rule(rule).ifPresent(out::add);
        }
        return out;
    }

    private Optional<RulePlan> rule(RuleSpec rule) {
        String table = rule.table().text();
        TableInfo info = schema.table(table);
        Optional<ColumnRef> key = SchemaReader.keyOf(recipe, table).map(k -> ref(table, k.text()));
        if (rule instanceof RuleSpec.Check check) {
            return Expressions.compile(check.condition().text(), check.condition().start(),
                            scopes.table(table, table, false), Expect.CONDITION, problems)
                    .map(c -> new RulePlan.Check(table, key, c, check.reason(), check.failing(), check.position()));
        }
        if (rule instanceof RuleSpec.Unique unique) {
            Name column = unique.column();
            if (info.column(column.text()).isEmpty()) {
                problems.error(column.position(), "table " + table + " has no column '" + column.text() + "'"
                        + Suggestions.hint(column.text(), info.columns().keySet()));
                return Optional.empty();
            }
            return Optional.of(new RulePlan.Unique(table, ref(table, column.text()), unique.position()));
        }
        RuleSpec.Orphans orphans = (RuleSpec.Orphans) rule;
        List<RulePlan.LinkTarget> links = new ArrayList<>();
        TableSpec spec = recipe.table(table).orElseThrow();
        for (Link link : spec.links()) {
            String target = link.target().text();
            SchemaReader.keyOf(recipe, target).ifPresent(k -> links.add(
                    new RulePlan.LinkTarget(ref(table, link.column().text()), target, k.text())));
        }
        return Optional.of(new RulePlan.Orphans(table, key, links, orphans.failing(), orphans.position()));
    }

    private ColumnRef ref(String table, String column) {
        return new ColumnRef(table, table, column, schema.column(table, column).type());
    }
}
