package dev.quern.sql;

import dev.quern.plan.Block;
import dev.quern.plan.Boundary;
import dev.quern.plan.Cohort;
import dev.quern.plan.Lookup;
import dev.quern.plan.Plan;
import dev.quern.plan.TimeRef;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.jooq.impl.DSL;

/**
 * Rows dated on or after the day the last cutoff's window or label horizon ends: no row of the matrix can
 * see them, by construction. They are counted so that a report can say how much data a build left unread.
 */
public final class LateRows {

    /** One event time column, the first day no cutoff reaches, and the query that counts rows from then. */
    public record Query(String column, LocalDate from, String sql) {
        public Query {
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(sql, "sql");
        }
    }

    private LateRows() {
    }

    public static List<Query> of(Plan plan) {
        if (plan.cutoffs().isEmpty()) {
            return List.of();
        }
        LocalDate from = null;
        for (LocalDate cutoff : plan.cutoffs()) {
            LocalDate end = new Boundary.CutoffEnd().at(cutoff);
            if (plan.label().isPresent()) {
                LocalDate labelEnd = plan.label().get().end().at(cutoff);
                end = labelEnd.isAfter(end) ? labelEnd : end;
            }
            from = from == null || end.isAfter(from) ? end : from;
        }
        Map<String, TimeRef> times = new LinkedHashMap<>();
        for (Block b : plan.blocks()) {
            add(times, b.path().time());
        }
        plan.label().ifPresent(l -> add(times, l.path().time()));
        for (Lookup l : plan.lookups()) {
            if (l instanceof Lookup.Latest latest) {
                add(times, latest.path().time());
            }
        }
        for (Cohort.Exit exit : plan.cohort().exits()) {
            add(times, exit.time());
        }
        EngineSql engine = EngineSql.of(plan.engine());
        List<Query> out = new ArrayList<>();
        for (TimeRef t : times.values()) {
            String sql = engine.context().renderInlined(DSL.selectCount().from(Names.table(t.column().table()))
                    .where(Names.field(t.column().column()).ge(engine.boundaryFor(DSL.inline(from).coerce(Object.class),
                            t.storage()))));
            out.add(new Query(t.column().qualified(), from, sql));
        }
        return out;
    }

    private static void add(Map<String, TimeRef> times, TimeRef time) {
        times.putIfAbsent(time.column().qualified(), time);
    }
}
