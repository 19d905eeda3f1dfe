package dev.quern.sql;

import dev.quern.plan.Boundary;
import dev.quern.plan.Cohort;
import dev.quern.plan.Lookup;
import dev.quern.plan.LookupColumn;
import java.util.ArrayList;
import java.util.List;
import org.jooq.CommonTableExpression;
import org.jooq.Condition;
import org.jooq.Field;
import org.jooq.SelectField;
import org.jooq.impl.DSL;

/**
 * The cohort: each entity paired with each cutoff at which it is eligible, carrying the cutoff's
 * boundaries so that every later scan compares with columns, not with per-cutoff literals.
 */
final class CohortSql {

    private final Cohort cohort;
    private final List<Lookup> lookups;
    private final List<String> cutoffColumns;
    private final EngineSql engine;
    private final SourceTables sources;
    private final dev.quern.expr.ExprRenderer renderer;

    CohortSql(Cohort cohort, List<String> cutoffColumns, List<Lookup> lookups, EngineSql engine, SourceTables sources,
              dev.quern.expr.ExprRenderer renderer) {
        this.sources = sources;
        this.renderer = renderer;
        this.cohort = cohort;
        this.cutoffColumns = List.copyOf(cutoffColumns);
        this.lookups = lookups;
        this.engine = engine;
    }

    CommonTableExpression<?> cte() {
        List<SelectField<?>> select = new ArrayList<>();
        select.add(Names.field(cohort.key()).as(Names.KEY));
        cutoffColumns.forEach(c -> select.add(Names.field(Names.CUTOFFS, c)));
        for (Lookup lookup : lookups) {
            if (lookup instanceof Lookup.EntityAttributes attributes) {
                for (LookupColumn c : attributes.columns()) {
                    select.add(Names.field(c.source()).as(DSL.name(c.column())));
                }
            }
        }
        Field<Object> visibleUntil = Names.field(Names.CUTOFFS, new Boundary.CutoffEnd().column());
        Condition eligible = DSL.noCondition();
        if (cohort.since().isPresent()) {
            var since = cohort.since().get();
            eligible = eligible.and(Names.field(since.column())
                    .lt(engine.boundaryFor(visibleUntil, since.storage())));
        }
        for (Cohort.Exit exit : cohort.exits()) {
            Field<Object> exitTime = Names.field(exit.time().column());
            eligible = eligible.andNotExists(DSL.selectOne()
                    .from(sources.table(exit.table(), exit.alias()))
                    .where(Names.field(exit.entityLink()).eq(Names.field(cohort.key()))
                            .and(exitTime.lt(engine.boundaryFor(visibleUntil, exit.time().storage())))));
        }
        if (cohort.filter().isPresent()) {
            eligible = eligible.and(renderer.condition(cohort.filter().get(),
                    Handles.columns(Names.field(Names.CUTOFFS, Names.CUTOFF))));
        }
        return DSL.name(Names.COHORT).as(DSL.select(select)
                .from(sources.table(cohort.table(), cohort.alias()))
                .crossJoin(Names.table(Names.CUTOFFS))
                .where(eligible));
    }
}
