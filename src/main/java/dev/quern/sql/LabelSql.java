package dev.quern.sql;

import dev.quern.plan.Boundary;
import dev.quern.plan.Hop;
import dev.quern.plan.LabelPlan;
import java.util.ArrayList;
import java.util.List;
import org.jooq.CommonTableExpression;
import org.jooq.Field;
import org.jooq.SelectField;
import org.jooq.Table;
import org.jooq.impl.DSL;

/**
 * The label as one grouped scan of the horizon after each cutoff. The final value is empty where the
 * horizon is not wholly observed: {@value #COMPLETE} is decided per cutoff in Java from the source's
 * last data day and carried by the cutoffs table.
 */
final class LabelSql {

    static final String NAME = "label_rows";
    static final String COMPLETE = "label_complete";
    private static final String ROWS = "n";
    private static final String TOTAL = "total";

    private final LabelPlan label;
    private final EngineSql engine;
    private final SourceTables sources;
    private final dev.quern.expr.ExprRenderer renderer;

    LabelSql(LabelPlan label, EngineSql engine, SourceTables sources, dev.quern.expr.ExprRenderer renderer) {
        this.label = label;
        this.engine = engine;
        this.sources = sources;
        this.renderer = renderer;
    }

    CommonTableExpression<?> cte() {
        var path = label.path();
        Field<Object> time = Names.field(path.time().column());
        List<SelectField<?>> select = new ArrayList<>();
        select.add(Names.field(Names.COHORT, Names.KEY).as(Names.KEY));
        select.add(Names.field(Names.COHORT, Names.CUTOFF).as(Names.CUTOFF));
        select.add(DSL.count().as(ROWS));
        label.input().ifPresent(c -> select.add(DSL.sum(Names.field(c).coerce(java.math.BigDecimal.class)).as(TOTAL)));
        Table<?> from = Names.table(Names.COHORT).join(sources.table(path.table(), path.alias()))
                .on(Names.field(path.entityLink()).eq(Names.field(Names.COHORT, Names.KEY))
                        .and(time.ge(boundary(label.start())))
                        .and(time.lt(boundary(label.end()))));
        for (Hop hop : path.hops()) {
            from = from.leftJoin(sources.table(hop.table(), hop.alias()))
                    .on(Names.field(hop.alias(), hop.key()).eq(Names.field(hop.link())));
        }
        org.jooq.Condition kept = label.filter()
                .map(f -> renderer.condition(f, Handles.columns(Names.field(Names.COHORT, Names.CUTOFF))))
                .orElse(DSL.noCondition());
        return DSL.name(NAME).as(DSL.select(select).from(from).where(kept)
                .groupBy(Names.field(Names.COHORT, Names.KEY), Names.field(Names.COHORT, Names.CUTOFF)));
    }

    /** The label column of the final select. */
    Field<Object> value() {
        Field<Object> rows = DSL.coalesce(Names.field(NAME, ROWS), DSL.inline(0));
        Field<Object> observed = switch (label.kind()) {
            case EXISTS -> DSL.when(rows.gt(DSL.inline(0)), DSL.inline(1)).otherwise(DSL.inline(0)).coerce(Object.class);
            case COUNT -> rows;
            case SUM -> DSL.coalesce(Names.field(NAME, TOTAL), DSL.inline(0));
        };
        return DSL.when(Names.field(Names.COHORT, COMPLETE).eq(DSL.inline(1)), observed).coerce(Object.class);
    }

    private Field<Object> boundary(Boundary b) {
        return engine.boundaryFor(Names.field(Names.COHORT, b.column()), label.path().time().storage());
    }
}
