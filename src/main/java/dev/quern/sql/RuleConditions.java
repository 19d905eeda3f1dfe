package dev.quern.sql;

import dev.quern.expr.ExprRenderer;
import dev.quern.plan.RulePlan;
import org.jooq.Condition;
import org.jooq.Field;
import org.jooq.impl.DSL;

/**
 * The condition a row of a rule's table meets when it passes the rule, written over the table's own name.
 * A check passes only where its condition is true: a row where it cannot be decided (a null) fails, as in
 * a where clause, so a ride with no duration is not taken for a plausible one.
 */
final class RuleConditions {

    private final ExprRenderer renderer;

    RuleConditions(ExprRenderer renderer) {
        this.renderer = renderer;
    }

    Condition passes(RulePlan rule) {
        if (rule instanceof RulePlan.Check check) {
            return renderer.condition(check.condition(), Handles.columns(null));
        }
        if (rule instanceof RulePlan.Orphans orphans) {
            Condition all = DSL.noCondition();
            for (RulePlan.LinkTarget link : orphans.links()) {
                Field<Object> value = Names.field(link.link());
                all = all.and(value.isNull().orExists(DSL.selectOne().from(Names.table(link.table(), "target"))
                        .where(Names.field("target", link.key()).eq(value))));
            }
            return all;
        }
        RulePlan.Unique unique = (RulePlan.Unique) rule;
        throw new IllegalStateException("a unique rule stops the build, it filters nothing: " + unique.describe());
    }
}
