package dev.quern.recipe;

import static dev.quern.recipe.Values.forKey;
import static dev.quern.recipe.Values.in;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;

/**
 * Reads the {@code rules} list. Each rule names its table and one of {@code check} (a condition the rows
 * must meet), {@code unique} (a column that must identify rows) or {@code orphans} (links must resolve).
 * {@code - rides: "condition"} is short for a check that excludes failing rows.
 */
final class RuleReader {

    static final List<String> RULE_KEYS = List.of("table", "check", "reason", "failing", "unique", "orphans");

    private final Values values;
    private final References references;

    RuleReader(Values values, References references) {
        this.values = values;
        this.references = references;
    }

    Optional<List<RuleSpec>> rules(Node node) {
        Optional<List<Node>> items = values.list(node, "a list of rules", forKey("rules"));
        if (items.isEmpty()) {
            return Optional.empty();
        }
        int errors = values.errorCount();
        List<RuleSpec> out = new ArrayList<>();
        for (Node item : items.get()) {
            rule(item).ifPresent(rule -> {
                references.rule(rule);
                out.add(rule);
            });
        }
        return values.errorCount() > errors ? Optional.empty() : Optional.of(out);
    }

    private Optional<RuleSpec> rule(Node item) {
        if (item instanceof MappingNode mapping && isShortForm(mapping)) {
            NodeTuple only = mapping.getValue().get(0);
            Optional<Name> table = values.name(only.getKeyNode(), "table", in("rules"));
            Optional<Expression> check = values.expression(only.getValueNode(), "for the rule on "
                    + table.map(Name::text).orElse("this table"));
            if (table.isEmpty() || check.isEmpty()) {
                return Optional.empty();
            }
            return Optional.of(new RuleSpec.Check(table.get(), check.get(), Optional.empty(),
                    RuleSpec.Failing.EXCLUDE, values.at(item)));
        }
        int errors = values.errorCount();
        Optional<MappingReader> read = values.mapping(item, in("rules"), "rule", RULE_KEYS);
        if (read.isEmpty()) {
            return Optional.empty();
        }
        MappingReader m = read.get();
        Optional<Name> table = m.required("table", "the table the rule is about")
                .flatMap(n -> values.name(n, "table", forKey("table")));
        int kinds = (m.has("check") ? 1 : 0) + (m.has("unique") ? 1 : 0) + (m.has("orphans") ? 1 : 0);
        if (kinds != 1) {
            values.diagnostics().error(m.position(), "a rule takes exactly one of 'check' (a condition rows must"
                    + " meet), 'unique' (a column) or 'orphans' (exclude, warn or stop)");
            return Optional.empty();
        }
        if (m.has("check")) {
            Optional<Expression> check = m.optional("check").flatMap(n -> values.expression(n, forKey("check")));
            Optional<String> reason = m.optional("reason").flatMap(n -> values.text(n, "a sentence", forKey("reason")));
            Optional<RuleSpec.Failing> failing = m.optional("failing")
                    .map(n -> failing(n, List.of(RuleSpec.Failing.EXCLUDE, RuleSpec.Failing.STOP)))
                    .orElse(Optional.of(RuleSpec.Failing.EXCLUDE));
            if (values.errorCount() > errors) {
                return Optional.empty();
            }
            return Optional.of(new RuleSpec.Check(table.get(), check.get(), reason, failing.get(), m.position()));
        }
        if (m.has("reason") || m.has("failing")) {
            values.diagnostics().error(m.position(), "'reason' and 'failing' go with 'check'; 'orphans' says"
                    + " itself what to do, and a repeated 'unique' key always stops the build");
            return Optional.empty();
        }
        if (m.has("unique")) {
            Optional<Name> column = m.optional("unique").flatMap(n -> values.name(n, "column", forKey("unique")));
            if (values.errorCount() > errors) {
                return Optional.empty();
            }
            return Optional.of(new RuleSpec.Unique(table.get(), column.get(), m.position()));
        }
        Optional<RuleSpec.Failing> orphans = m.optional("orphans").flatMap(n -> failing(n,
                Arrays.asList(RuleSpec.Failing.values())));
        if (values.errorCount() > errors) {
            return Optional.empty();
        }
        return Optional.of(new RuleSpec.Orphans(table.get(), orphans.get(), m.position()));
    }

    /** {@code - rides: "..."}: one entry whose key is not a rule key. */
    private static boolean isShortForm(MappingNode mapping) {
        return mapping.getValue().size() == 1
                && mapping.getValue().get(0).getKeyNode() instanceof ScalarNode key
                && !RULE_KEYS.contains(key.getValue());
    }

    private Optional<RuleSpec.Failing> failing(Node node, List<RuleSpec.Failing> allowed) {
        List<String> spellings = allowed.stream().map(RuleSpec.Failing::spelling).toList();
        return values.scalar(node, String.join(" or ", spellings), "here").flatMap(s -> {
            for (RuleSpec.Failing f : allowed) {
                if (f.spelling().equals(s.getValue())) {
                    return Optional.of(f);
                }
            }
            values.error(s, Names.quote(s.getValue()) + " is not one of " + String.join(", ", spellings)
                    + dev.quern.Suggestions.hint(s.getValue(), spellings));
            return Optional.empty();
        });
    }
}
