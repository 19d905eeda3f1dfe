package dev.quern.plan;

import dev.quern.Position;
import dev.quern.expr.CheckedExpression;
import dev.quern.recipe.RuleSpec;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/** A data-quality rule resolved against the schema, ready to be counted and, where it says so, enforced. */
public sealed interface RulePlan {

    String table();

    RuleSpec.Failing failing();

    Position position();

    /** A sentence for rules.md and the dictionary. */
    String describe();

    /** Rows must meet {@code condition}; a row where it is false or unknown fails. */
    record Check(String table, Optional<ColumnRef> key, CheckedExpression condition, Optional<String> reason,
                 RuleSpec.Failing failing, Position position) implements RulePlan {
        public Check {
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(key, "key");
            Objects.requireNonNull(condition, "condition");
            Objects.requireNonNull(reason, "reason");
            Objects.requireNonNull(failing, "failing");
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String describe() {
            return table + " rows must meet " + condition.text() + reason.map(r -> " (" + r + ")").orElse("");
        }
    }

    /** {@code column} must identify one row of the table. */
    record Unique(String table, ColumnRef column, Position position) implements RulePlan {
        public Unique {
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(position, "position");
        }

        @Override
        public RuleSpec.Failing failing() {
            return RuleSpec.Failing.STOP;
        }

        @Override
        public String describe() {
            return column.qualified() + " must identify one row";
        }
    }

    /** Every filled link of the table must find its row; {@code links} are its link columns with targets. */
    record Orphans(String table, Optional<ColumnRef> key, List<LinkTarget> links, RuleSpec.Failing failing,
                   Position position) implements RulePlan {
        public Orphans {
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(key, "key");
            links = List.copyOf(links);
            Objects.requireNonNull(failing, "failing");
            Objects.requireNonNull(position, "position");
        }

        @Override
        public String describe() {
            return "every link of " + table + " must find its row ("
                    + String.join(", ", links.stream().map(l -> l.link().column() + " -> " + l.table()).toList())
                    + ")";
        }
    }

    /** A link column and the table and key it points at. */
    record LinkTarget(ColumnRef link, String table, String key) {
        public LinkTarget {
            Objects.requireNonNull(link, "link");
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(key, "key");
        }
    }
}
