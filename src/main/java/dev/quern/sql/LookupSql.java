package dev.quern.sql;

import dev.quern.plan.Boundary;
import dev.quern.plan.Lookup;
import dev.quern.plan.LookupColumn;
import java.util.ArrayList;
import java.util.List;
import org.jooq.CommonTableExpression;
import org.jooq.Condition;
import org.jooq.Field;
import org.jooq.SelectField;
import org.jooq.SortField;
import org.jooq.Table;
import org.jooq.impl.DSL;

/**
 * A lookup as one scan: the candidate rows of each (entity, cutoff) are numbered, newest first with the
 * key breaking ties, and the first is kept, so reruns pick the same row.
 */
final class LookupSql {

    private static final String RANK = "rank_in_cutoff";

    private final Lookup lookup;
    private final EngineSql engine;
    private final SourceTables sources;

    LookupSql(Lookup lookup, EngineSql engine, SourceTables sources) {
        this.lookup = lookup;
        this.engine = engine;
        this.sources = sources;
    }

    String name() {
        if (lookup instanceof Lookup.InForce f) {
            return f.name();
        }
        if (lookup instanceof Lookup.Latest l) {
            return l.name();
        }
        throw new IllegalStateException("entity attributes need no scan of their own");
    }

    CommonTableExpression<?> cte() {
        Field<Object> visibleUntil = Names.field(Names.COHORT, new Boundary.CutoffEnd().column());
        Table<?> from;
        List<SortField<?>> newestFirst = new ArrayList<>();
        if (lookup instanceof Lookup.InForce f) {
            Field<Object> start = Names.field(f.from().column());
            Field<Object> end = Names.field(f.to().column());
            Condition inForce = start.lt(engine.boundaryFor(visibleUntil, f.from().storage()))
                    .and(end.isNull().or(end.ge(engine.boundaryFor(visibleUntil, f.to().storage()))));
            from = Names.table(Names.COHORT).join(sources.table(f.table(), f.alias()))
                    .on(Names.field(f.entityLink()).eq(Names.field(Names.COHORT, Names.KEY)).and(inForce));
            newestFirst.add(engine.newestFirst(start));
            f.key().ifPresent(k -> newestFirst.add(engine.newestFirst(Names.field(k))));
        } else {
            Lookup.Latest l = (Lookup.Latest) lookup;
            Field<Object> time = Names.field(l.path().time().column());
            from = Names.table(Names.COHORT).join(sources.table(l.path().table(), l.path().alias()))
                    .on(Names.field(l.path().entityLink()).eq(Names.field(Names.COHORT, Names.KEY))
                            .and(time.lt(engine.boundaryFor(visibleUntil, l.path().time().storage()))));
            newestFirst.add(engine.newestFirst(time));
            l.path().key().ifPresent(k -> newestFirst.add(engine.newestFirst(Names.field(k))));
        }
        List<SelectField<?>> inner = new ArrayList<>();
        inner.add(Names.field(Names.COHORT, Names.KEY).as(Names.KEY));
        inner.add(Names.field(Names.COHORT, Names.CUTOFF).as(Names.CUTOFF));
        for (LookupColumn c : lookup.columns()) {
            inner.add(Names.field(c.source()).as(DSL.name(c.column())));
        }
        inner.add(DSL.rowNumber().over(DSL.partitionBy(Names.field(Names.COHORT, Names.KEY),
                Names.field(Names.COHORT, Names.CUTOFF)).orderBy(newestFirst)).as(RANK));
        List<SelectField<?>> outer = new ArrayList<>();
        outer.add(Names.field("c", Names.KEY));
        outer.add(Names.field("c", Names.CUTOFF));
        lookup.columns().forEach(c -> outer.add(Names.field("c", c.column())));
        return DSL.name(name()).as(DSL.select(outer).from(DSL.select(inner).from(from).asTable(DSL.name("c")))
                .where(Names.field("c", RANK).eq(DSL.inline(1))));
    }
}
