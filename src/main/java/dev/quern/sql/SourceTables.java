package dev.quern.sql;

import dev.quern.expr.ExprRenderer;
import dev.quern.plan.Plan;
import dev.quern.plan.RulePlan;
import java.util.List;
import org.jooq.Condition;
import org.jooq.Table;
import org.jooq.impl.DSL;

/**
 * Every read of a source table goes through here, so that the rows a rule excludes are left out of every
 * feature, lookup, label and the cohort alike: such a table is read as {@code (select * from t where ...)}.
 */
final class SourceTables {

    private final Plan plan;
    private final RuleConditions conditions;

    SourceTables(Plan plan, ExprRenderer renderer) {
        this.plan = plan;
        this.conditions = new RuleConditions(renderer);
    }

    Table<?> table(String table, String alias) {
        List<RulePlan> exclusions = plan.exclusions(table);
        if (exclusions.isEmpty()) {
            return Names.table(table, alias);
        }
        Condition kept = DSL.noCondition();
        for (RulePlan rule : exclusions) {
            kept = kept.and(conditions.passes(rule));
        }
        return DSL.select(DSL.asterisk()).from(Names.table(table)).where(kept).asTable(DSL.name(alias));
    }
}
