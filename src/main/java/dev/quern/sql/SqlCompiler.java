package dev.quern.sql;

import dev.quern.plan.Block;
import dev.quern.plan.Boundary;
import dev.quern.expr.ExprRenderer;
import dev.quern.plan.Cohort;
import dev.quern.plan.DerivedColumn;
import dev.quern.plan.LabelPlan;
import dev.quern.plan.Lookup;
import dev.quern.plan.LookupColumn;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.jooq.CommonTableExpression;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.Row;
import org.jooq.SelectField;
import org.jooq.SelectJoinStep;
import org.jooq.Table;
import org.jooq.impl.DSL;

/**
 * The sql stage: renders a plan as one query for its engine. The cutoffs are a table of literal rows
 * with every boundary computed in Java (so calendar arithmetic is the same on every engine); the cohort
 * joins them to the entity table; each block, lookup and the label is one grouped scan; a final select
 * joins them all to the cohort in the output column order.
 */
public final class SqlCompiler {

    private final Plan plan;
    private final EngineSql engine;
    private final DSLContext sql;
    private final ExprRenderer renderer;
    private final SourceTables sources;
    private final Map<String, Field<Object>> outputs = new LinkedHashMap<>();
    private final List<CommonTableExpression<?>> ctes = new ArrayList<>();
    private final List<Joined> joins = new ArrayList<>();

    private record Joined(String cte) {
    }

    private final List<ShapeChoice> choices;
    private final List<BlockScan> scans = new ArrayList<>();

    private SqlCompiler(Plan plan, Optional<BlockShape> asked) {
        this.plan = plan;
        this.choices = ShapeChooser.choose(plan, asked);
        this.engine = EngineSql.of(plan.engine());
        this.sql = engine.context();
        this.renderer = ExprRenderer.forEngine(plan.engine());
        this.sources = new SourceTables(plan, renderer);
    }

    /** The plan with each block in the shape its engine runs best. */
    public static CompiledQuery compile(Plan plan) {
        return compile(plan, Optional.empty());
    }

    /** The plan with every block in the shape {@code asked} where that shape can compute it. */
    public static CompiledQuery compile(Plan plan, Optional<BlockShape> asked) {
        return new SqlCompiler(plan, asked).compile();
    }

    private CompiledQuery compile() {
        List<String> cutoffColumns = cutoffColumns();
        ctes.add(cutoffs(cutoffColumns));
        ctes.add(new CohortSql(plan.cohort(), cutoffColumns, plan.lookups(), engine, sources, renderer).cte());
        cohortOutputs(plan.cohort());
        ScanSql scanSql = new ScanSql(plan, engine, sources, renderer);
        for (ShapeChoice choice : choices) {
            Block block = choice.block();
            if (choice.shape() == BlockShape.ORDERED_SCAN) {
                scans.add(scanSql.scan(block));
                continue;
            }
            BlockSql blockSql = new BlockSql(block, engine, sources, renderer);
            ctes.add(blockSql.cte());
            joins.add(new Joined(block.name()));
            for (var a : block.aggregates()) {
                Field<Object> f = Names.field(block.name(), a.column());
                outputs.put(a.column(), a.kind().zeroWhenEmpty() ? DSL.coalesce(f, DSL.inline(0)) : f);
            }
        }
        for (Lookup lookup : plan.lookups()) {
            lookup(lookup);
        }
        // Derived columns read block columns; when a block is scanned, the run stage computes them per row.
        boolean scanned = !scans.isEmpty();
        if (!scanned) {
            plan.derived().forEach(this::derived);
        }
        plan.label().ifPresent(this::label);
        List<SelectField<?>> select = new ArrayList<>();
        List<String> names = new ArrayList<>();
        for (OutputColumn c : plan.columns()) {
            Field<Object> f = outputs.get(c.name());
            if (f == null && scanned) {
                continue;
            }
            if (f == null) {
                throw new IllegalStateException("no expression for output column " + c.name());
            }
            select.add(engine.output(f, c.type()).as(DSL.name(c.name())));
            names.add(c.name());
        }
        SelectJoinStep<?> query = sql.with(ctes).select(select).from(Names.table(Names.COHORT));
        for (Joined j : joins) {
            query = query.leftJoin(Names.table(j.cte())).on(sameRow(j.cte()));
        }
        Field<Object> key = Names.field(Names.COHORT, Names.KEY);
        Field<Object> cutoff = Names.field(Names.COHORT, Names.CUTOFF);
        // Scanned blocks arrive in key order, so the rest of the row must too; the run stage restores cutoff order.
        var ordered = scanned ? query.orderBy(key, cutoff) : query.orderBy(cutoff, key);
        String flat = sql.renderInlined(ordered);
        String formatted = DSL.using(sql.dialect(),
                org.jooq.conf.SettingsTools.clone(sql.settings()).withRenderFormatted(true)).renderInlined(ordered);
        return new CompiledQuery(plan, flat, formatted, names, scans, choices);
    }

    private static Condition sameRow(String cte) {
        return Names.field(cte, Names.KEY).eq(Names.field(Names.COHORT, Names.KEY))
                .and(Names.field(cte, Names.CUTOFF).eq(Names.field(Names.COHORT, Names.CUTOFF)));
    }

    /** One literal row per cutoff, with every boundary the plan compares with. */
    private List<String> cutoffColumns() {
        List<String> columns = new ArrayList<>();
        columns.add(Names.CUTOFF);
        plan.boundaries().forEach(b -> columns.add(b.column()));
        plan.label().ifPresent(l -> columns.add(LabelSql.COMPLETE));
        return columns;
    }

    private CommonTableExpression<?> cutoffs(List<String> columns) {
        List<Boundary> boundaries = plan.boundaries();
        List<Row> rows = new ArrayList<>();
        for (var cutoff : plan.cutoffs()) {
            List<Field<?>> values = new ArrayList<>();
            values.add(DSL.inline(cutoff));
            boundaries.forEach(b -> values.add(DSL.inline(b.at(cutoff))));
            plan.label().ifPresent(l -> values.add(DSL.inline(l.complete(cutoff) ? 1 : 0)));
            rows.add(DSL.row(values));
        }
        Table<?> table = DSL.values(rows.toArray(org.jooq.RowN[]::new)).as(DSL.name("v"),
                columns.stream().map(DSL::name).toArray(org.jooq.Name[]::new));
        List<Field<?>> fields = columns.stream().<Field<?>>map(c -> Names.field("v", c)).toList();
        return DSL.name(Names.CUTOFFS).as(DSL.select(fields).from(table));
    }

    private void cohortOutputs(Cohort cohort) {
        outputs.put(cohort.key().column(), Names.field(Names.COHORT, Names.KEY));
        outputs.put(Names.CUTOFF, Names.field(Names.COHORT, Names.CUTOFF));
    }

    private void lookup(Lookup lookup) {
        if (lookup instanceof Lookup.EntityAttributes attributes) {
            for (LookupColumn c : attributes.columns()) {
                outputs.put(c.column(), Names.field(Names.COHORT, c.column()));
            }
            return;
        }
        LookupSql lookupSql = new LookupSql(lookup, engine, sources);
        ctes.add(lookupSql.cte());
        String name = lookupSql.name();
        joins.add(new Joined(name));
        for (LookupColumn c : lookup.columns()) {
            outputs.put(c.column(), Names.field(name, c.column()));
        }
    }

    /** A derived column is its formula over the final select's expressions of the columns it names. */
    private void derived(DerivedColumn derived) {
        Field<Object> cutoff = Names.field(Names.COHORT, Names.CUTOFF);
        outputs.put(derived.column(), renderer.field(derived.expression(), binding ->
                binding.handle() == dev.quern.plan.Cutoff.ROW ? cutoff : outputs.get((String) binding.handle())));
    }

    private void label(LabelPlan label) {
        LabelSql labelSql = new LabelSql(label, engine, sources, renderer);
        ctes.add(labelSql.cte());
        joins.add(new Joined(LabelSql.NAME));
        outputs.put(label.column(), labelSql.value());
    }
}
