package dev.quern.sql;

import dev.quern.plan.Aggregate;
import dev.quern.plan.Block;
import dev.quern.plan.Boundary;
import dev.quern.plan.ColumnRef;
import dev.quern.plan.Hop;
import dev.quern.recipe.MeasureKind;
import dev.quern.recipe.Span;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jooq.CommonTableExpression;
import org.jooq.Field;
import org.jooq.SelectField;
import org.jooq.Table;
import org.jooq.TableOnConditionStep;
import org.jooq.impl.DSL;

/**
 * One block as one grouped scan: the path's rows in the longest window are joined to the cohort once,
 * each row is flagged with the windows it falls in, and every measure of every window is a conditional
 * aggregate over those flags.
 */
final class BlockSql {

    private static final String ROWS = "r";
    private static final String TIME = "t";

    private final Block block;
    private final EngineSql engine;
    private final SourceTables sources;
    private final dev.quern.expr.ExprRenderer renderer;
    private final Map<String, String> inputs = new LinkedHashMap<>();

    BlockSql(Block block, EngineSql engine, SourceTables sources, dev.quern.expr.ExprRenderer renderer) {
        this.block = block;
        this.engine = engine;
        this.sources = sources;
        this.renderer = renderer;
        for (Aggregate a : block.aggregates()) {
            a.input().ifPresent(c -> inputs.putIfAbsent(c.alias() + "." + c.column(), "v" + (inputs.size() + 1)));
        }
    }

    CommonTableExpression<?> cte() {
        List<SelectField<?>> select = new ArrayList<>();
        select.add(Names.field(ROWS, Names.KEY));
        select.add(Names.field(ROWS, Names.CUTOFF));
        for (Aggregate a : block.aggregates()) {
            select.add(measure(a).as(DSL.name(a.column())));
        }
        return DSL.name(block.name()).as(DSL.select(select).from(rows().asTable(DSL.name(ROWS)))
                .groupBy(Names.field(ROWS, Names.KEY), Names.field(ROWS, Names.CUTOFF)));
    }

    /** The joined rows: key, cutoff, time, a flag per window and each input value once. */
    private org.jooq.Select<?> rows() {
        var path = block.path();
        Field<Object> time = Names.field(path.time().column());
        List<SelectField<?>> select = new ArrayList<>();
        select.add(Names.field(Names.COHORT, Names.KEY).as(Names.KEY));
        select.add(Names.field(Names.COHORT, Names.CUTOFF).as(Names.CUTOFF));
        select.add(time.as(TIME));
        Span longest = block.longestWindow();
        for (Span w : block.windows()) {
            Field<Object> flag = w.label().equals(longest.label())
                    ? DSL.inline(1).coerce(Object.class)
                    : DSL.when(time.ge(boundary(new Boundary.WindowStart(w))), DSL.inline(1)).coerce(Object.class);
            select.add(flag.as(flag(w)));
        }
        Map<String, ColumnRef> refs = new LinkedHashMap<>();
        block.aggregates().forEach(a -> a.input().ifPresent(c -> refs.putIfAbsent(c.alias() + "." + c.column(), c)));
        refs.forEach((k, c) -> select.add(Names.field(c).as(inputs.get(k))));
        if (!engine.hasStableStddev()) {
            twoPassMeans(select);
        }
        Table<?> from = Names.table(Names.COHORT).join(sources.table(path.table(), path.alias()))
                .on(Names.field(path.entityLink()).eq(Names.field(Names.COHORT, Names.KEY))
                        .and(time.ge(boundary(new Boundary.WindowStart(longest))))
                        .and(time.lt(boundary(new Boundary.CutoffEnd()))));
        for (Hop hop : path.hops()) {
            TableOnConditionStep<?> joined = from.leftJoin(sources.table(hop.table(), hop.alias()))
                    .on(Names.field(hop.alias(), hop.key()).eq(Names.field(hop.link())));
            from = joined;
        }
        org.jooq.Condition kept = block.filter()
                .map(f -> renderer.condition(f, Handles.columns(Names.field(Names.COHORT, Names.CUTOFF))))
                .orElse(DSL.noCondition());
        return DSL.select(select).from(from).where(kept);
    }

    /**
     * For engines without a stable standard deviation: each window's mean of each input, over the same
     * rows, so that the outer query sums squared deviations from it (the two-pass formula).
     */
    private void twoPassMeans(List<SelectField<?>> select) {
        for (Aggregate a : block.aggregates()) {
            if (a.kind() == MeasureKind.STDDEV) {
                Field<Object> source = Names.field(a.input().orElseThrow());
                Field<Object> inWindow = DSL.when(flagged(a.window()), source).coerce(Object.class);
                select.add(DSL.avg(inWindow.coerce(java.math.BigDecimal.class))
                        .over(DSL.partitionBy(Names.field(Names.COHORT, Names.KEY),
                                Names.field(Names.COHORT, Names.CUTOFF)))
                        .as(meanName(a)));
            }
        }
    }

    private Field<Object> measure(Aggregate a) {
        Field<Object> flag = Names.field(ROWS, flag(a.window()));
        Field<Object> value = a.input().map(c -> Names.field(ROWS, inputs.get(key(c))))
                .map(v -> DSL.when(flag.eq(DSL.inline(1)), v).coerce(Object.class))
                .orElse(null);
        Field<Object> cutoff = Names.field(ROWS, Names.CUTOFF);
        Field<Object> timeInWindow = DSL.when(flag.eq(DSL.inline(1)), Names.field(ROWS, TIME)).coerce(Object.class);
        return switch (a.kind()) {
            case COUNT -> DSL.count(flag).coerce(Object.class);
            case SUM -> DSL.sum(value.coerce(java.math.BigDecimal.class)).coerce(Object.class);
            case MEAN -> engine.mean(value);
            case MIN -> DSL.min(value);
            case MAX -> DSL.max(value);
            case DISTINCT -> DSL.countDistinct(value).coerce(Object.class);
            case STDDEV -> engine.hasStableStddev()
                    ? DSL.stddevSamp(value.coerce(java.math.BigDecimal.class)).coerce(Object.class)
                    : twoPassStddev(a, flag, value);
            case DAYS_SINCE_FIRST -> engine.daysFrom(DSL.min(timeInWindow), block.path().time().storage(), cutoff);
            case DAYS_SINCE_LAST -> engine.daysFrom(DSL.max(timeInWindow), block.path().time().storage(), cutoff);
        };
    }

    /** sqrt(sum((x - mean)^2) / (n - 1)): empty for fewer than two values. */
    private Field<Object> twoPassStddev(Aggregate a, Field<Object> flag, Field<Object> value) {
        Field<java.math.BigDecimal> deviation = Names.field(ROWS, inputs.get(key(a.input().orElseThrow())))
                .coerce(java.math.BigDecimal.class)
                .minus(Names.field(ROWS, meanName(a)).coerce(java.math.BigDecimal.class));
        Field<java.math.BigDecimal> squares = DSL.sum(DSL.when(flag.eq(DSL.inline(1)), deviation.times(deviation)));
        Field<Integer> n = DSL.count(value);
        return DSL.sqrt(squares.div(DSL.nullif(n.minus(DSL.inline(1)), DSL.inline(0)))).coerce(Object.class);
    }

    private org.jooq.Condition flagged(Span window) {
        if (window.label().equals(block.longestWindow().label())) {
            return DSL.trueCondition();
        }
        return Names.field(block.path().time().column()).ge(boundary(new Boundary.WindowStart(window)));
    }

    private Field<Object> boundary(Boundary b) {
        return engine.boundaryFor(Names.field(Names.COHORT, b.column()), block.path().time().storage());
    }

    private static String flag(Span window) {
        return "in_" + window.label();
    }

    private static String meanName(Aggregate a) {
        return "mean_" + a.column();
    }

    private static String key(ColumnRef c) {
        return c.alias() + "." + c.column();
    }
}
