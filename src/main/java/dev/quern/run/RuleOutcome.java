package dev.quern.run;

import dev.quern.plan.RulePlan;
import java.util.List;
import java.util.Objects;

/** What measuring one rule found: rows checked, rows failing, and a few examples of failing rows. */
public record RuleOutcome(RulePlan rule, long checked, long failed, List<String> examples) {
    public RuleOutcome {
        Objects.requireNonNull(rule, "rule");
        examples = List.copyOf(examples);
    }

    /** What happened to the failing rows, in a word for reports. */
    public String action() {
        if (failed == 0) {
            return "passed";
        }
        return switch (rule.failing()) {
            case EXCLUDE -> "excluded";
            case WARN -> "warned";
            case STOP -> "stopped the build";
        };
    }
}
