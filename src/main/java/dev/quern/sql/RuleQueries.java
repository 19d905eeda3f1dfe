package dev.quern.sql;

import dev.quern.expr.ExprRenderer;
import dev.quern.plan.Plan;
import dev.quern.plan.RulePlan;
import java.util.ArrayList;
import java.util.List;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.impl.DSL;

/** Renders, for each rule of a plan, the queries that count and show the rows failing it. */
public final class RuleQueries {

    /** How many failing rows a report shows. */
    public static final int EXAMPLES = 5;

    private RuleQueries() {
    }

    public static List<RuleQuery> of(Plan plan) {
        EngineSql engine = EngineSql.of(plan.engine());
        DSLContext sql = engine.context();
        RuleConditions conditions = new RuleConditions(ExprRenderer.forEngine(plan.engine()));
        List<RuleQuery> out = new ArrayList<>();
        for (RulePlan rule : plan.rules()) {
            if (rule instanceof RulePlan.Unique unique) {
                Field<Object> column = Names.field(unique.column());
                out.add(new RuleQuery(rule,
                        sql.renderInlined(DSL.select(DSL.count(column), DSL.count(column).minus(DSL.countDistinct(column)))
                                .from(Names.table(rule.table()))),
                        sql.renderInlined(DSL.select(column).from(Names.table(rule.table())).where(column.isNotNull())
                                .groupBy(column).having(DSL.count().gt(1)).orderBy(column).limit(EXAMPLES))));
                continue;
            }
            Condition passes = conditions.passes(rule);
            Field<Integer> fails = DSL.when(passes, DSL.inline(0)).otherwise(DSL.inline(1));
            Field<?> shown = key(rule);
            out.add(new RuleQuery(rule,
                    sql.renderInlined(DSL.select(DSL.count(), DSL.coalesce(DSL.sum(fails), DSL.inline(java.math.BigDecimal.ZERO)))
                            .from(Names.table(rule.table()))),
                    sql.renderInlined(DSL.select(shown).from(Names.table(rule.table()))
                            .where(fails.eq(DSL.inline(1))).orderBy(shown).limit(EXAMPLES))));
        }
        return out;
    }

    /** The column that names a failing row in a report: the table's key, or its first link. */
    private static Field<?> key(RulePlan rule) {
        if (rule instanceof RulePlan.Check c && c.key().isPresent()) {
            return Names.field(c.key().get());
        }
        if (rule instanceof RulePlan.Orphans o && o.key().isPresent()) {
            return Names.field(o.key().get());
        }
        if (rule instanceof RulePlan.Orphans o && !o.links().isEmpty()) {
            return Names.field(o.links().get(0).link());
        }
        return DSL.inline("(a row without key)");
    }
}
