package dev.quern.sql;

import dev.quern.expr.ExprRenderer;
import dev.quern.plan.Aggregate;
import dev.quern.plan.Block;
import dev.quern.plan.Boundary;
import dev.quern.plan.ColumnRef;
import dev.quern.plan.EventPath;
import dev.quern.plan.Hop;
import dev.quern.plan.Plan;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.SelectField;
import org.jooq.Table;
import org.jooq.impl.DSL;

/**
 * The one query of an ordered-scan block: the path's rows that any cutoff's longest window can hold, with
 * the block's filter and the rules' exclusions applied, ordered by entity link and day. Only the day of a
 * row's time is read: every boundary is the start of a day, so a time is in {@code [from, until)} exactly
 * when its day is, on every engine and storage.
 */
final class ScanSql {

    private final Plan plan;
    private final EngineSql engine;
    private final SourceTables sources;
    private final ExprRenderer renderer;

    ScanSql(Plan plan, EngineSql engine, SourceTables sources, ExprRenderer renderer) {
        this.plan = plan;
        this.engine = engine;
        this.sources = sources;
        this.renderer = renderer;
    }

    BlockScan scan(Block block) {
        EventPath path = block.path();
        Field<Object> link = Names.field(path.entityLink());
        Field<Object> time = Names.field(path.time().column());
        List<SelectField<?>> select = new ArrayList<>();
        select.add(link.as("k"));
        select.add(engine.scanDay(time, path.time().storage()).as("d"));
        Map<String, Integer> inputs = new LinkedHashMap<>();
        List<Integer> positions = new ArrayList<>();
        for (Aggregate a : block.aggregates()) {
            if (a.input().isEmpty()) {
                positions.add(0);
                continue;
            }
            ColumnRef c = a.input().get();
            String key = c.alias() + "." + c.column();
            Integer at = inputs.get(key);
            if (at == null) {
                at = BlockScan.FIRST_INPUT + inputs.size();
                inputs.put(key, at);
                select.add(Names.field(c).as("v" + (at - BlockScan.FIRST_INPUT + 1)));
            }
            positions.add(at);
        }
        Table<?> from = sources.table(path.table(), path.alias());
        for (Hop hop : path.hops()) {
            from = from.leftJoin(sources.table(hop.table(), hop.alias()))
                    .on(Names.field(hop.alias(), hop.key()).eq(Names.field(hop.link())));
        }
        Condition kept = link.isNotNull()
                .and(time.ge(boundary(earliest(block), path)))
                .and(time.lt(boundary(latest(), path)));
        if (block.filter().isPresent()) {
            kept = kept.and(renderer.condition(block.filter().get(), Handles.columns(DSL.inline((Object) null))));
        }
        DSLContext sql = engine.context();
        var query = sql.select(select).from(from).where(kept).orderBy(DSL.field(DSL.name("k")), DSL.field(DSL.name("d")));
        String formatted = DSL.using(sql.dialect(),
                org.jooq.conf.SettingsTools.clone(sql.settings()).withRenderFormatted(true)).renderInlined(query);
        return new BlockScan(block, sql.renderInlined(query), formatted, positions);
    }

    /** The first day any cutoff's longest window reaches back to. */
    private LocalDate earliest(Block block) {
        Boundary start = new Boundary.WindowStart(block.longestWindow());
        return plan.cutoffs().stream().map(start::at).min(LocalDate::compareTo).orElseThrow();
    }

    /** The day after the last cutoff: nothing from then on is visible to any row. */
    private LocalDate latest() {
        Boundary end = new Boundary.CutoffEnd();
        return plan.cutoffs().stream().map(end::at).max(LocalDate::compareTo).orElseThrow();
    }

    private Field<Object> boundary(LocalDate day, EventPath path) {
        return engine.boundaryFor(DSL.inline((Object) day), path.time().storage());
    }
}
