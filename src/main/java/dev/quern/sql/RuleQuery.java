package dev.quern.sql;

import dev.quern.plan.RulePlan;
import java.util.Objects;

/**
 * The queries that measure one rule on its table as stored: {@code count} returns the rows checked and the
 * rows that fail; {@code examples} returns a few keys (or values) of failing rows.
 */
public record RuleQuery(RulePlan rule, String count, String examples) {
    public RuleQuery {
        Objects.requireNonNull(rule, "rule");
        Objects.requireNonNull(count, "count");
        Objects.requireNonNull(examples, "examples");
    }
}
