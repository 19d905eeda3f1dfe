package dev.quern.audit;

import dev.quern.QuernException;
import dev.quern.plan.Aggregate;
import dev.quern.plan.Block;
import dev.quern.plan.Cohort;
import dev.quern.plan.ColumnRef;
import dev.quern.plan.EventPath;
import dev.quern.plan.Hop;
import dev.quern.plan.Lookup;
import dev.quern.plan.LookupColumn;
import dev.quern.plan.Plan;
import dev.quern.plan.TimeRef;
import dev.quern.recipe.FilledAt;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.Span;
import dev.quern.recipe.TableSpec;
import dev.quern.schema.SourceSchema;
import dev.quern.schema.TimeStorage;
import java.sql.Connection;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import org.jooq.Condition;
import org.jooq.DSLContext;
import org.jooq.Field;
import org.jooq.Record;
import org.jooq.Row;
import org.jooq.SelectField;
import org.jooq.SortField;
import org.jooq.Table;
import org.jooq.exception.DataAccessException;
import org.jooq.impl.DSL;

/**
 * Counts, with queries of the audit's own, the source rows that fed each (entity, cutoff) row and were dated,
 * updated or filled in after the cutoff.
 *
 * <p>Each feed is one way values reach the matrix: a block's scan of its path, a lookup's row, or the entity
 * row itself. Its rows are found the way the plan defines them, restated here from the plan and
 * {@link Boundaries}: the cohort (the entity table at every cutoff, from its {@code since} date on, until its
 * first exit row), joined to the feed's table by the entity link within the feed's longest window (a block),
 * the row in force (a history lookup) or the latest row (an event lookup). One query per feed counts, with a
 * flag per question, how many of those rows have a date after their cutoff: the date of the row's time
 * ({@code time-order}), of its update time ({@code late-update}, and the evidence of {@code current-state}),
 * or of the time a value read from it was filled in ({@code filled-later}). When flags are set, a second query
 * fetches the first few example rows.
 *
 * <p>The restatement must follow the plan: when blocks, lookups or the cohort carry filters ({@code where}),
 * they belong in these queries too, or the audit would count rows the matrix never read.
 */
final class SourceRows {

    /** What a flag asks of a fed row. */
    enum Question {
        /** The row's own time, or its validity start, is after the cutoff. */
        DATED_AFTER,
        /** The row's update time is after the cutoff. */
        UPDATED_AFTER,
        /** A value read from the row was filled in after the cutoff, or at a time the source does not say. */
        FILLED_AFTER
    }

    /**
     * One question about the rows of one table of a feed.
     *
     * @param table the source table asked about
     * @param column the time column compared with the cutoff; for {@code FILLED_AFTER}, the column filled in
     * @param at for {@code FILLED_AFTER}, the column that says when it was filled in
     * @param outputs the output columns whose values these rows feed
     */
    record Flag(Question question, String table, String column, Optional<String> at, List<String> outputs,
                Condition when, Field<Object> shown, String shownName) {
        Flag {
            Objects.requireNonNull(question, "question");
            Objects.requireNonNull(table, "table");
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(at, "at");
            outputs = List.copyOf(outputs);
            Objects.requireNonNull(when, "when");
            Objects.requireNonNull(shown, "shown");
            Objects.requireNonNull(shownName, "shownName");
        }
    }

    /** The answer to one flag: how many fed rows it holds for, out of how many, with examples. */
    record Counted(Flag flag, String feed, long fed, long rows, List<String> examples) {
        Counted {
            Objects.requireNonNull(flag, "flag");
            Objects.requireNonNull(feed, "feed");
            examples = List.copyOf(examples);
        }
    }

    private static final String CUTOFFS = "audit_cutoffs";
    private static final String CUTOFF = "cutoff";
    private static final String VISIBLE_UNTIL = "visible_until";
    private static final String ROWS = "audit_rows";
    private static final String ENTITY = "audit_entity";
    private static final String AT_CUTOFF = "audit_cutoff";
    private static final String ROW_KEY = "audit_row";
    private static final String RANK = "audit_rank";
    private static final String FIRST_EXIT = "first_exit";
    static final int EXAMPLES = 3;

    private final Recipe recipe;
    private final Plan plan;
    private final SourceSchema schema;
    private final Boundaries boundaries;
    private final AuditSql engine;
    private final List<Span> windows = new ArrayList<>();

    SourceRows(Recipe recipe, Plan plan, SourceSchema schema, Boundaries boundaries) {
        this.recipe = recipe;
        this.plan = plan;
        this.schema = schema;
        this.boundaries = boundaries;
        this.engine = new AuditSql(plan.engine());
        Map<String, Span> byLabel = new LinkedHashMap<>();
        plan.blocks().forEach(b -> b.windows().forEach(w -> byLabel.putIfAbsent(w.label(), w)));
        windows.addAll(byLabel.values());
    }

    /** Every flag of every feed, counted; flags of feeds that ask nothing are left out. */
    List<Counted> count(Connection connection) {
        DSLContext sql = plan.engine().sql(connection);
        List<Counted> out = new ArrayList<>();
        try {
            for (Feed feed : feeds()) {
                if (!feed.flags.isEmpty()) {
                    out.addAll(feed.count(sql));
                }
            }
        } catch (DataAccessException e) {
            throw QuernException.data("the leakage audit could not query the source: " + e.getMessage(), e);
        }
        return out;
    }

    /** The feeds of the plan: one per block, one per lookup. */
    List<Feed> feeds() {
        List<Feed> feeds = new ArrayList<>();
        for (Block block : plan.blocks()) {
            feeds.add(block(block));
        }
        for (Lookup lookup : plan.lookups()) {
            feeds.add(lookup(lookup));
        }
        return feeds;
    }

    private Feed block(Block block) {
        EventPath path = block.path();
        List<String> all = block.aggregates().stream().map(Aggregate::column).toList();
        Field<Object> time = field(path.time().column());
        TimeStorage storage = path.time().storage();
        Cohort cohort = plan.cohort();
        // Each of the path's rows with its entity row, then with the few cutoffs whose window holds it. The
        // cutoffs are joined last and outer, which every engine keeps in that order: DuckDB otherwise pairs
        // the entity table with the cutoffs first and probes that with every row (a quarter more processor
        // time at 4M rides), and SQLite reads the path's rows once either way. A row in no window keeps one
        // line without a cutoff, which neither the count nor the flags take.
        Table<?> from = DSL.table(DSL.name(path.table())).as(DSL.name(path.alias()))
                .join(DSL.table(DSL.name(cohort.table())).as(DSL.name(cohort.alias())))
                .on(field(cohort.key()).eq(field(path.entityLink())));
        List<Cohort.Exit> exits = cohort.exits();
        for (int i = 0; i < exits.size(); i++) {
            Cohort.Exit exit = exits.get(i);
            from = from.leftJoin(firstExit(exit, i)).on(DSL.field(DSL.name(exitName(i), ENTITY)).eq(field(cohort.key())));
        }
        Condition inWindow = time.ge(boundaryColumn(windowColumn(block.longestWindow()), storage))
                .and(time.lt(boundaryColumn(VISIBLE_UNTIL, storage)));
        from = from.leftJoin(cutoffs()).on(inWindow.and(eligibleByFirstExit()));
        for (Hop hop : path.hops()) {
            from = from.leftJoin(DSL.table(DSL.name(hop.table())).as(DSL.name(hop.alias())))
                    .on(DSL.field(DSL.name(hop.alias(), hop.key())).eq(field(hop.link())));
        }
        List<Flag> flags = new ArrayList<>();
        flags.add(dated(path.table(), path.time(), all));
        updated(path.table(), path.alias(), all).ifPresent(flags::add);
        for (Hop hop : path.hops()) {
            List<String> reading = block.aggregates().stream()
                    .filter(a -> a.input().map(c -> c.alias().equals(hop.alias())).orElse(false))
                    .map(Aggregate::column).toList();
            if (reading.isEmpty()) {
                continue;
            }
            hopTime(hop).ifPresent(t -> flags.add(dated(hop.table(), t, reading)));
            updated(hop.table(), hop.alias(), reading).ifPresent(flags::add);
        }
        Map<String, List<String>> byInput = new LinkedHashMap<>();
        Map<String, ColumnRef> inputs = new LinkedHashMap<>();
        for (Aggregate a : block.aggregates()) {
            a.input().ifPresent(c -> {
                String k = c.alias() + "." + c.column();
                inputs.putIfAbsent(k, c);
                byInput.computeIfAbsent(k, x -> new ArrayList<>()).add(a.column());
            });
        }
        inputs.forEach((k, c) -> filled(c, byInput.get(k)).ifPresent(flags::add));
        String name = "block " + path.text() + " (" + all.get(0) + (all.size() > 1 ? ", ..." : "") + ")";
        return new Feed(name, from, DSL.noCondition(), List.of(), path.key(), flags);
    }

    private Feed lookup(Lookup lookup) {
        List<String> all = lookup.columns().stream().map(LookupColumn::column).toList();
        List<Flag> flags = new ArrayList<>();
        Table<?> from;
        List<SortField<?>> newestFirst = new ArrayList<>();
        Optional<ColumnRef> key;
        String alias;
        if (lookup instanceof Lookup.InForce f) {
            Field<Object> start = field(f.from().column());
            Field<Object> end = field(f.to().column());
            Condition inForce = start.lt(boundaryColumn(VISIBLE_UNTIL, f.from().storage()))
                    .and(end.isNull().or(end.ge(boundaryColumn(VISIBLE_UNTIL, f.to().storage()))));
            from = cohortRows().join(DSL.table(DSL.name(f.table())).as(DSL.name(f.alias())))
                    .on(field(f.entityLink()).eq(field(plan.cohort().key())).and(inForce));
            newestFirst.add(start.desc());
            f.key().ifPresent(k -> newestFirst.add(field(k).desc()));
            flags.add(dated(f.table(), f.from(), all));
            key = f.key();
            alias = f.alias();
        } else if (lookup instanceof Lookup.Latest l) {
            Field<Object> time = field(l.path().time().column());
            from = cohortRows().join(DSL.table(DSL.name(l.path().table())).as(DSL.name(l.path().alias())))
                    .on(field(l.path().entityLink()).eq(field(plan.cohort().key()))
                            .and(time.lt(boundaryColumn(VISIBLE_UNTIL, l.path().time().storage()))));
            newestFirst.add(time.desc());
            l.path().key().ifPresent(k -> newestFirst.add(field(k).desc()));
            flags.add(dated(l.table(), l.path().time(), all));
            key = l.path().key();
            alias = l.path().alias();
        } else {
            from = cohortRows();
            key = Optional.of(plan.cohort().key());
            alias = plan.cohort().alias();
        }
        updated(lookup.table(), alias, all).ifPresent(flags::add);
        for (LookupColumn c : lookup.columns()) {
            filled(c.source(), List.of(c.column())).ifPresent(flags::add);
        }
        String name = (lookup instanceof Lookup.EntityAttributes ? "entity row " : "lookup ") + lookup.table()
                + " (" + String.join(", ", all) + ")";
        return new Feed(name, from, cohortCondition(), newestFirst, key, flags);
    }

    /** The table a hop reaches, when it has a time of its own: its time, or the start of its validity. */
    private Optional<TimeRef> hopTime(Hop hop) {
        Optional<TableSpec> spec = recipe.table(hop.table());
        Optional<String> column = spec.flatMap(TableSpec::time).map(n -> n.text())
                .or(() -> spec.flatMap(TableSpec::history).map(h -> h.from().text()));
        return column.map(c -> new TimeRef(new ColumnRef(hop.alias(), hop.table(), c,
                schema.column(hop.table(), c).type()), schema.time(hop.table(), c).storage()));
    }

    private Flag dated(String table, TimeRef time, List<String> outputs) {
        Field<Object> t = field(time.column());
        return new Flag(Question.DATED_AFTER, table, time.column().column(), Optional.empty(), outputs,
                engine.dateAfter(t, time.storage(), cutoffColumn()), t, time.column().column());
    }

    private Optional<Flag> updated(String table, String alias, List<String> outputs) {
        return recipe.table(table).flatMap(TableSpec::updated).map(u -> {
            Field<Object> t = DSL.field(DSL.name(alias, u.text()));
            TimeStorage storage = schema.time(table, u.text()).storage();
            return new Flag(Question.UPDATED_AFTER, table, u.text(), Optional.empty(), outputs,
                    engine.dateAfter(t, storage, cutoffColumn()), t, u.text());
        });
    }

    /**
     * A value filled in after its row's time: known at the cutoff only when it was filled in by then. A value
     * whose fill time is empty counts as filled in after the cutoff, since nothing shows it was known.
     */
    private Optional<Flag> filled(ColumnRef input, List<String> outputs) {
        Optional<FilledAt> filled = recipe.table(input.table())
                .flatMap(t -> t.filled().stream().filter(f -> f.column().text().equals(input.column())).findFirst());
        return filled.map(f -> {
            String at = f.at().text();
            Field<Object> atField = DSL.field(DSL.name(input.alias(), at));
            TimeStorage storage = schema.time(input.table(), at).storage();
            Condition when = field(input).isNotNull()
                    .and(atField.isNull().or(engine.dateAfter(atField, storage, cutoffColumn())));
            return new Flag(Question.FILLED_AFTER, input.table(), input.column(), Optional.of(at), outputs, when,
                    atField, at);
        });
    }

    /** The cutoffs with the boundaries the audit restates the plan's windows with, one literal row each. */
    private Table<?> cutoffs() {
        List<String> names = new ArrayList<>();
        names.add(CUTOFF);
        names.add(VISIBLE_UNTIL);
        windows.forEach(w -> names.add(windowColumn(w)));
        List<Row> rows = new ArrayList<>();
        for (LocalDate cutoff : plan.cutoffs()) {
            List<Field<?>> values = new ArrayList<>();
            values.add(DSL.inline(cutoff));
            values.add(DSL.inline(boundaries.visibleUntil(cutoff)));
            windows.forEach(w -> values.add(DSL.inline(boundaries.windowStart(w, cutoff))));
            rows.add(DSL.row(values));
        }
        return DSL.values(rows.toArray(org.jooq.RowN[]::new)).as(DSL.name(CUTOFFS),
                names.stream().map(DSL::name).toArray(org.jooq.Name[]::new));
    }

    /** The entity table at every cutoff; {@link #cohortCondition} keeps the eligible pairs. */
    private Table<?> cohortRows() {
        Cohort cohort = plan.cohort();
        return cutoffs().crossJoin(DSL.table(DSL.name(cohort.table())).as(DSL.name(cohort.alias())));
    }

    /** In the cohort: from the entity's since date on, and before its first exit row. */
    private Condition cohortCondition() {
        Cohort cohort = plan.cohort();
        Condition eligible = DSL.noCondition();
        if (cohort.since().isPresent()) {
            TimeRef since = cohort.since().get();
            eligible = eligible.and(field(since.column()).lt(boundaryColumn(VISIBLE_UNTIL, since.storage())));
        }
        for (Cohort.Exit exit : cohort.exits()) {
            eligible = eligible.andNotExists(DSL.selectOne()
                    .from(DSL.table(DSL.name(exit.table())).as(DSL.name(exit.alias())))
                    .where(field(exit.entityLink()).eq(field(cohort.key()))
                            .and(field(exit.time().column()).lt(boundaryColumn(VISIBLE_UNTIL, exit.time().storage())))));
        }
        return eligible;
    }

    /**
     * The same pairs as {@link #cohortCondition}, with each exit table read once: no exit row before the end of
     * the cutoff day is the same as the entity's first exit time (if any) being on or after it.
     */
    private Condition eligibleByFirstExit() {
        Cohort cohort = plan.cohort();
        Condition eligible = DSL.noCondition();
        if (cohort.since().isPresent()) {
            TimeRef since = cohort.since().get();
            eligible = eligible.and(field(since.column()).lt(boundaryColumn(VISIBLE_UNTIL, since.storage())));
        }
        for (int i = 0; i < cohort.exits().size(); i++) {
            Field<Object> first = DSL.field(DSL.name(exitName(i), FIRST_EXIT));
            eligible = eligible.and(first.isNull().or(first.ge(
                    boundaryColumn(VISIBLE_UNTIL, cohort.exits().get(i).time().storage()))));
        }
        return eligible;
    }

    /** Each entity's earliest row of an exit table. */
    private Table<?> firstExit(Cohort.Exit exit, int i) {
        Field<Object> link = field(exit.entityLink());
        return DSL.select(link.as(ENTITY), DSL.min(field(exit.time().column())).as(FIRST_EXIT))
                .from(DSL.table(DSL.name(exit.table())).as(DSL.name(exit.alias())))
                .groupBy(link).asTable(DSL.name(exitName(i)));
    }

    private static String exitName(int i) {
        return "audit_exit_" + i;
    }

    private Field<Object> boundaryColumn(String column, TimeStorage storage) {
        return engine.boundary(DSL.field(DSL.name(CUTOFFS, column)), storage);
    }

    private static Field<Object> cutoffColumn() {
        return DSL.field(DSL.name(CUTOFFS, CUTOFF));
    }

    private static String windowColumn(Span window) {
        return "from_" + window.label();
    }

    private static Field<Object> field(ColumnRef ref) {
        return DSL.field(DSL.name(ref.alias(), ref.column()));
    }

    /**
     * The rows of one feed, each an (entity, cutoff, source row) triple, with one flag per question. A lookup
     * keeps only the row it takes: the first in {@code order} for each entity and cutoff.
     */
    final class Feed {
        private final String name;
        private final Table<?> from;
        private final Condition where;
        private final List<SortField<?>> order;
        private final Optional<ColumnRef> key;
        private final List<Flag> flags;

        Feed(String name, Table<?> from, Condition where, List<SortField<?>> order, Optional<ColumnRef> key,
             List<Flag> flags) {
            this.name = name;
            this.from = from;
            this.where = where;
            this.order = List.copyOf(order);
            this.key = key;
            this.flags = List.copyOf(flags);
        }

        String name() {
            return name;
        }

        List<Flag> flags() {
            return flags;
        }

        private Table<?> rows() {
            Field<Object> entityKey = field(plan.cohort().key());
            List<SelectField<?>> select = new ArrayList<>();
            select.add(entityKey.as(ENTITY));
            select.add(cutoffColumn().as(AT_CUTOFF));
            select.add(key.map(SourceRows::field).orElse(DSL.inline((Object) null)).as(ROW_KEY));
            for (int i = 0; i < flags.size(); i++) {
                Flag f = flags.get(i);
                select.add(f.shown().as("audit_shown_" + i));
                select.add(DSL.when(cutoffColumn().isNotNull().and(f.when()), DSL.inline(1)).otherwise(DSL.inline(0))
                        .as("audit_flag_" + i));
            }
            if (!order.isEmpty()) {
                select.add(DSL.rowNumber().over(DSL.partitionBy(entityKey, cutoffColumn()).orderBy(order)).as(RANK));
            }
            return DSL.select(select).from(from).where(where).asTable(DSL.name(ROWS));
        }

        private Condition taken() {
            return order.isEmpty() ? DSL.noCondition() : DSL.field(DSL.name(ROWS, RANK)).eq(DSL.inline(1));
        }

        List<Counted> count(DSLContext sql) {
            Table<?> rows = rows();
            List<SelectField<?>> select = new ArrayList<>();
            // The triples: a block's row in no window has no cutoff (see block).
            select.add(DSL.count(DSL.field(DSL.name(ROWS, AT_CUTOFF))));
            for (int i = 0; i < flags.size(); i++) {
                select.add(DSL.sum(DSL.field(DSL.name(ROWS, "audit_flag_" + i), Integer.class)));
            }
            Record totals = sql.select(select).from(rows).where(taken()).fetchOne();
            long fed = number(totals.get(0));
            List<Counted> out = new ArrayList<>();
            for (int i = 0; i < flags.size(); i++) {
                long count = number(totals.get(i + 1));
                List<String> examples = count == 0 ? List.of() : examples(sql, rows, i);
                out.add(new Counted(flags.get(i), name, fed, count, examples));
            }
            return out;
        }

        private List<String> examples(DSLContext sql, Table<?> rows, int i) {
            Flag f = flags.get(i);
            String entityName = plan.cohort().key().column();
            List<String> out = new ArrayList<>();
            for (Record r : sql.select(DSL.field(DSL.name(ROWS, ENTITY)), DSL.field(DSL.name(ROWS, AT_CUTOFF)),
                            DSL.field(DSL.name(ROWS, ROW_KEY)), DSL.field(DSL.name(ROWS, "audit_shown_" + i)))
                    .from(rows).where(taken().and(DSL.field(DSL.name(ROWS, "audit_flag_" + i)).eq(DSL.inline(1))))
                    .orderBy(DSL.field(DSL.name(ROWS, AT_CUTOFF)), DSL.field(DSL.name(ROWS, ENTITY)),
                            DSL.field(DSL.name(ROWS, ROW_KEY)))
                    .limit(EXAMPLES).fetch()) {
                String source = source(f, r.get(2));
                out.add(entityName + " " + r.get(0) + " at cutoff " + day(r.get(1)) + ": " + source + f.shownName()
                        + " " + (r.get(3) == null ? "empty" : r.get(3)));
            }
            return out;
        }

        /** Which source row an example is about: empty for the entity row itself. */
        private String source(Flag f, Object rowKey) {
            if (key.isEmpty()) {
                return f.table() + " row, ";
            }
            ColumnRef k = key.get();
            if (!f.table().equals(k.table())) {
                return f.table() + " row reached from " + k.table() + " " + k.column() + " " + rowKey + ", ";
            }
            return k.table().equals(plan.cohort().table()) ? "" : k.table() + " " + k.column() + " " + rowKey + ", ";
        }
    }

    private static String day(Object value) {
        String text = String.valueOf(value);
        return text.length() >= 10 ? text.substring(0, 10) : text;
    }

    private static long number(Object value) {
        return value == null ? 0 : ((Number) value).longValue();
    }
}
