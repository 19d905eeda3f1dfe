package dev.quern.recipe;

import dev.quern.Position;
import java.util.Objects;
import java.util.Optional;

/** A data-quality rule on one source table: what data the recipe does not trust, and what to do about it. */
public sealed interface RuleSpec {

    Name table();

    Position position();

    /** What happens to rows that fail a rule. */
    enum Failing {
        /** Left out of every feature and label, and counted. */
        EXCLUDE("exclude"),
        /** Counted and reported; the rows stay. */
        WARN("warn"),
        /** The build stops, with examples. */
        STOP("stop");

        private final String spelling;

        Failing(String spelling) {
            this.spelling = spelling;
        }

        public String spelling() {
            return spelling;
        }
    }

    /** Rows must meet a condition; {@code reason} says why the others cannot be trusted. */
    record Check(Name table, Expression condition, Optional<String> reason, Failing failing, Position position)
            implements RuleSpec {
        public Check {
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(condition, "condition");
            Objects.requireNonNull(reason, "reason");
            Objects.requireNonNull(failing, "failing");
            Objects.requireNonNull(position, "position");
        }
    }

    /** A column must identify one row: a repeat stops the build. */
    record Unique(Name table, Name column, Position position) implements RuleSpec {
        public Unique {
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(position, "position");
        }
    }

    /** Every link of the table must find its row in the linked table. */
    record Orphans(Name table, Failing failing, Position position) implements RuleSpec {
        public Orphans {
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(failing, "failing");
            Objects.requireNonNull(position, "position");
        }
    }
}
