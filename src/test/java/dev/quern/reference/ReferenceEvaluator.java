package dev.quern.reference;

import dev.quern.recipe.CutoffSpec;
import dev.quern.recipe.EntitySpec;
import dev.quern.recipe.FeatureSpec;
import dev.quern.recipe.Hop;
import dev.quern.recipe.LabelSpec;
import dev.quern.recipe.Link;
import dev.quern.recipe.MeasureKind;
import dev.quern.recipe.MeasureSpec;
import dev.quern.recipe.Name;
import dev.quern.recipe.PathSpec;
import dev.quern.expr.CheckedExpression;
import dev.quern.expr.Expect;
import dev.quern.recipe.Link;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.RuleSpec;
import dev.quern.recipe.Span;
import dev.quern.recipe.TableSpec;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.ResultSetMetaData;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeSet;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;

/**
 * A second implementation of the matrix, written from the recipe semantics alone and independently of the
 * SQL path: it reads every table it needs with a plain {@code SELECT *} into Java objects and recomputes every
 * row and column in plain Java. Only the parsed recipe model is shared with the main code; the plan, sql, run
 * and schema stages, {@code Span.before/after} and {@code CutoffSpec.dates()} of a schedule are not used.
 *
 * <p>Time boundaries, with cutoff date D and N = D + 1 day (the start of the next day), and day(t) the date
 * in the first ten characters of an ISO time text:
 * <ul>
 *   <li>cohort: day(since) &lt;= D, and no row of an {@code until} table with day(time) &lt;= D;</li>
 *   <li>window w: N - w &lt;= day(time) &lt;= D, calendar arithmetic applied to N, not to D;</li>
 *   <li>label: N + gap &lt;= day(time) &lt; N + gap + horizon, empty when that end is after the day after the
 *       latest time in any event table of the recipe.</li>
 * </ul>
 *
 * <p>Values come out as {@code Long} (integers), {@code Double} (floating values), {@code String} (text and
 * ISO dates) or null (empty).
 */
final class ReferenceEvaluator {

    /** The recomputed matrix: column names, and rows of values in column order. */
    record Result(List<String> columns, List<List<Object>> rows) {
        Result {
            columns = List.copyOf(columns);
            rows = List.copyOf(rows);
        }
    }

    /** One source table as read: column names in catalogue order and rows of column name to value. */
    private record Table(String name, List<String> columns, List<Map<String, Object>> rows) {
        boolean has(String column) {
            return columns.contains(column);
        }
    }

    /**
     * One row of a path: the day of its first table's time, and the values of the columns a block reads, each
     * from the hop that provides it (null when that hop is unmatched).
     */
    private record PathRow(LocalDate day, long epochDay, Object[] values, Map<String, Object> scope) {
        PathRow(LocalDate day, Object[] values, Map<String, Object> scope) {
            this(day, day.toEpochDay(), values, scope);
        }

        /** The row as a filter sees it at a cutoff: every path column by table.column, and the cutoff. */
        Map<String, Object> at(LocalDate cutoff) {
            Map<String, Object> m = new HashMap<>(scope);
            m.put("cutoff", cutoff);
            return m;
        }
    }

    /** One cohort row: the entity's row and the cutoff. */
    private record CohortRow(Map<String, Object> entity, Object key, LocalDate cutoff) {
    }

    private final Recipe recipe;
    private final Map<String, Table> tables = new HashMap<>();

    private ReferenceEvaluator(Recipe recipe) {
        this.recipe = recipe;
    }

    /** Recomputes the whole matrix of {@code recipe} over the SQLite database in {@code sqlite}. */
    static Result evaluate(Recipe recipe, Path sqlite) {
        ReferenceEvaluator evaluator = new ReferenceEvaluator(recipe);
        evaluator.readTables(sqlite);
        evaluator.applyRules();
        return evaluator.compute();
    }

    // ---------------------------------------------------------------- reading

    private void readTables(Path sqlite) {
        Set<String> needed = new TreeSet<>(recipe.tables().keySet());
        needed.add(recipe.entity().table().text());
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + sqlite.toAbsolutePath())) {
            for (String name : needed) {
                tables.put(name, read(c, name));
            }
        } catch (SQLException e) {
            throw new IllegalStateException("reading " + sqlite + " failed: " + e.getMessage(), e);
        }
    }

    /**
     * Rules that exclude rows take them out of their table before anything reads it: a check keeps the rows
     * where its condition is true; an orphans rule keeps the rows whose filled links all find their row.
     */
    private void applyRules() {
        Map<String, Table> kept = new HashMap<>();
        for (RuleSpec rule : recipe.rules()) {
            if (!(rule instanceof RuleSpec.Check || rule instanceof RuleSpec.Orphans)
                    || rule instanceof RuleSpec.Check c && c.failing() != RuleSpec.Failing.EXCLUDE
                    || rule instanceof RuleSpec.Orphans o && o.failing() != RuleSpec.Failing.EXCLUDE) {
                continue;
            }
            String name = rule.table().text();
            Table original = tables.get(name);
            Table current = kept.getOrDefault(name, original);
            List<Map<String, Object>> rows = new ArrayList<>();
            if (rule instanceof RuleSpec.Check check) {
                CheckedExpression condition = ReferenceExpressions.check(check.condition(), columnsOf(original),
                        List.of(), false, Expect.CONDITION);
                for (Map<String, Object> row : current.rows()) {
                    if (ReferenceExpressions.keeps(condition, qualified(name, row))) {
                        rows.add(row);
                    }
                }
            } else {
                for (Map<String, Object> row : current.rows()) {
                    boolean linked = true;
                    for (Link link : spec(name).links()) {
                        Object value = row.get(link.column().text());
                        String target = link.target().text();
                        String key = target.equals(recipe.entity().table().text()) ? recipe.entity().key().text()
                                : spec(target).key().orElseThrow().text();
                        linked &= value == null || tables.get(target).rows().stream()
                                .anyMatch(t -> keyOf(value).equals(keyOf(t.get(key))));
                    }
                    if (linked) {
                        rows.add(row);
                    }
                }
            }
            kept.put(name, new Table(name, current.columns(), rows));
        }
        tables.putAll(kept);
    }

    private List<ReferenceExpressions.Column> columnsOf(Table table) {
        List<ReferenceExpressions.Column> out = new ArrayList<>();
        for (String c : table.columns()) {
            List<Object> values = new ArrayList<>();
            table.rows().forEach(r -> values.add(r.get(c)));
            out.add(new ReferenceExpressions.Column(table.name(), c, values));
        }
        return out;
    }

    private static Map<String, Object> qualified(String table, Map<String, Object> row) {
        Map<String, Object> out = new HashMap<>();
        row.forEach((k, v) -> out.put(table + "." + k, v));
        return out;
    }

    private static Table read(Connection c, String name) throws SQLException {
        try (Statement s = c.createStatement();
             ResultSet rs = s.executeQuery("SELECT * FROM \"" + name.replace("\"", "\"\"") + "\"")) {
            ResultSetMetaData meta = rs.getMetaData();
            List<String> columns = new ArrayList<>();
            for (int i = 1; i <= meta.getColumnCount(); i++) {
                columns.add(meta.getColumnName(i));
            }
            List<Map<String, Object>> rows = new ArrayList<>();
            while (rs.next()) {
                Map<String, Object> row = new HashMap<>();
                for (int i = 1; i <= columns.size(); i++) {
                    row.put(columns.get(i - 1), normalise(rs.getObject(i)));
                }
                rows.add(row);
            }
            return new Table(name, List.copyOf(columns), rows);
        }
    }

    /** Integers of any width as Long, floating values as Double, text as String. */
    private static Object normalise(Object v) {
        if (v instanceof Integer || v instanceof Short || v instanceof Byte) {
            return ((Number) v).longValue();
        }
        if (v instanceof Float f) {
            return f.doubleValue();
        }
        return v;
    }

    private Table table(String name) {
        Table t = tables.get(name);
        if (t == null) {
            throw new IllegalStateException("table " + name + " was not read");
        }
        return t;
    }

    private TableSpec spec(String table) {
        TableSpec spec = recipe.tables().get(table);
        if (spec == null) {
            throw new IllegalStateException("the recipe does not describe table " + table);
        }
        return spec;
    }

    // ---------------------------------------------------------------- the matrix

    private Result compute() {
        EntitySpec entity = recipe.entity();
        String entityKey = entity.key().text();
        List<CohortRow> cohort = cohort();

        List<String> columns = new ArrayList<>(List.of(entityKey, "cutoff"));
        List<List<Object>> rows = new ArrayList<>();
        for (CohortRow r : cohort) {
            List<Object> row = new ArrayList<>();
            row.add(r.key());
            row.add(r.cutoff().toString());
            rows.add(row);
        }
        for (FeatureSpec feature : recipe.features()) {
            if (feature instanceof FeatureSpec.Aggregates block) {
                aggregates(block, cohort, columns, rows);
            } else if (feature instanceof FeatureSpec.Lookup lookup) {
                lookup(lookup, cohort, columns, rows);
            } else if (feature instanceof FeatureSpec.Derived derived) {
                derived(derived, cohort, columns, rows);
            }
        }
        recipe.label().ifPresent(label -> label(label, cohort, columns, rows));
        return new Result(columns, rows);
    }

    /** A formula over the feature columns before it (the row's values as written), and the cutoff. */
    private void derived(FeatureSpec.Derived derived, List<CohortRow> cohort, List<String> columns,
                         List<List<Object>> rows) {
        List<ReferenceExpressions.Column> features = new ArrayList<>();
        for (int c = 2; c < columns.size(); c++) {
            List<Object> values = new ArrayList<>();
            for (List<Object> row : rows) {
                values.add(row.get(c));
            }
            features.add(new ReferenceExpressions.Column("", columns.get(c), values));
        }
        CheckedExpression formula = ReferenceExpressions.check(derived.expression(), List.of(), features, true,
                Expect.VALUE);
        for (int r = 0; r < rows.size(); r++) {
            Map<String, Object> values = new HashMap<>();
            for (int c = 2; c < columns.size(); c++) {
                values.put(columns.get(c), rows.get(r).get(c));
            }
            values.put("cutoff", cohort.get(r).cutoff());
            rows.get(r).add(ReferenceExpressions.value(formula, values));
        }
        columns.add(derived.name().text());
    }

    /** The cutoff dates: own expansion of a schedule; an explicit list sorted without repeats. */
    List<LocalDate> cutoffs() {
        CutoffSpec spec = recipe.cutoffs();
        TreeSet<LocalDate> out = new TreeSet<>();
        if (spec instanceof CutoffSpec.Schedule s) {
            for (LocalDate d = s.from(); !d.isAfter(s.to()); d = d.plusDays(1)) {
                boolean take = switch (s.every()) {
                    case MONTH_END -> d.plusDays(1).getDayOfMonth() == 1;
                    case WEEK_END -> d.getDayOfWeek() == DayOfWeek.SUNDAY;
                };
                if (take) {
                    out.add(d);
                }
            }
        } else if (spec instanceof CutoffSpec.Dates d) {
            out.addAll(d.dates()); // the dates as parsed (the record's own list): nothing to expand
        }
        return List.copyOf(out);
    }

    private List<CohortRow> cohort() {
        EntitySpec entity = recipe.entity();
        String entityTable = entity.table().text();
        String key = entity.key().text();
        List<Map<String, Object>> entities = new ArrayList<>(table(entityTable).rows());
        entities.sort(Comparator.comparing(r -> r.get(key), ReferenceEvaluator::compareValues));

        // The first exit day of each entity over all until tables.
        Map<Object, LocalDate> exit = new HashMap<>();
        for (Name until : entity.until()) {
            TableSpec spec = spec(until.text());
            String link = entityLink(spec);
            String time = spec.time().orElseThrow(() -> new IllegalStateException(until.text() + " has no time"))
                    .text();
            for (Map<String, Object> row : table(until.text()).rows()) {
                Object owner = row.get(link);
                LocalDate day = day(row.get(time));
                if (owner != null && day != null) {
                    exit.merge(owner, day, (a, b) -> a.isBefore(b) ? a : b);
                }
            }
        }

        CheckedExpression cohortFilter = entity.where().map(w -> ReferenceExpressions.check(w,
                columnsOf(table(entityTable)), List.of(), true, Expect.CONDITION)).orElse(null);
        List<CohortRow> out = new ArrayList<>();
        for (LocalDate d : cutoffs()) {
            for (Map<String, Object> e : entities) {
                if (entity.since().isPresent()) {
                    LocalDate since = day(e.get(entity.since().get().text()));
                    if (since == null || since.isAfter(d)) {
                        continue;
                    }
                }
                LocalDate gone = exit.get(e.get(key));
                if (gone != null && !gone.isAfter(d)) {
                    continue;
                }
                if (cohortFilter != null) {
                    Map<String, Object> scope = qualified(entityTable, e);
                    scope.put("cutoff", d);
                    if (!ReferenceExpressions.keeps(cohortFilter, scope)) {
                        continue;
                    }
                }
                out.add(new CohortRow(e, e.get(key), d));
            }
        }
        return out;
    }

    // ---------------------------------------------------------------- aggregate blocks

    private void aggregates(FeatureSpec.Aggregates block, List<CohortRow> cohort, List<String> columns,
                            List<List<Object>> rows) {
        PathSpec path = block.from();
        List<MeasureSpec> measures = block.measures();
        List<String> read = new ArrayList<>();
        int[] source = new int[measures.size()];
        for (int i = 0; i < measures.size(); i++) {
            source[i] = measures.get(i).column().map(c -> {
                read.add(c.text());
                return read.size() - 1;
            }).orElse(-1);
        }
        Map<Object, List<PathRow>> byEntity = pathRows(path, read);
        CheckedExpression filter = block.where().map(w -> ReferenceExpressions.check(w, pathColumns(path), List.of(),
                true, Expect.CONDITION)).orElse(null);
        String prefix = block.prefix().map(Name::text).orElseGet(() -> joinedTables(path));
        List<Span> windows = block.windows();

        for (MeasureSpec m : measures) {
            for (Span w : windows) {
                String label = spanLabel(w);
                columns.add(m.name().map(n -> n.text().replace("{window}", label)).orElseGet(() ->
                        prefix + "_" + m.kind().spelling() + m.column().map(c -> "_" + c.text()).orElse("")
                                + "_" + label));
            }
        }
        for (int r = 0; r < cohort.size(); r++) {
            CohortRow row = cohort.get(r);
            LocalDate d = row.cutoff();
            LocalDate next = d.plusDays(1);
            List<PathRow> all = kept(byEntity.getOrDefault(row.key(), List.of()), filter, d);
            List<List<PathRow>> inWindow = new ArrayList<>();
            for (Span w : windows) {
                // all is sorted by day: the window start <= day <= d is one run of it
                LocalDate start = minus(next, w);
                inWindow.add(all.subList(firstOnOrAfter(all, start), firstOnOrAfter(all, next)));
            }
            List<Object> out = rows.get(r);
            for (int i = 0; i < measures.size(); i++) {
                MeasureSpec m = measures.get(i);
                for (List<PathRow> in : inWindow) {
                    out.add(measure(m, source[i], in, d));
                }
            }
        }
    }

    /** The rows a filter keeps at a cutoff; all of them when there is no filter. */
    private static List<PathRow> kept(List<PathRow> rows, CheckedExpression filter, LocalDate cutoff) {
        if (filter == null) {
            return rows;
        }
        List<PathRow> out = new ArrayList<>();
        for (PathRow r : rows) {
            if (ReferenceExpressions.keeps(filter, r.at(cutoff))) {
                out.add(r);
            }
        }
        return out;
    }

    /** Every column of every table of a path, as a filter names them. */
    private List<ReferenceExpressions.Column> pathColumns(PathSpec path) {
        List<ReferenceExpressions.Column> out = new ArrayList<>();
        Set<String> seen = new java.util.HashSet<>();
        for (Hop h : path.hops()) {
            if (seen.add(h.table().text())) {
                out.addAll(columnsOf(table(h.table().text())));
            }
        }
        return out;
    }

    /** The index of the first row of {@code rows} (sorted by day) whose day is on or after {@code day}. */
    private static int firstOnOrAfter(List<PathRow> rows, LocalDate day) {
        long target = day.toEpochDay();
        int lo = 0;
        int hi = rows.size();
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (rows.get(mid).epochDay() < target) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    private static String joinedTables(PathSpec path) {
        List<String> names = new ArrayList<>();
        for (Hop h : path.hops()) {
            names.add(h.table().text());
        }
        return String.join("_", names);
    }

    /** The index of the last hop, searching back from the end, whose table has {@code column}. */
    private int columnHop(PathSpec path, String column) {
        for (int i = path.hops().size() - 1; i >= 0; i--) {
            if (table(path.hops().get(i).table().text()).has(column)) {
                return i;
            }
        }
        throw new IllegalStateException("no table of " + path.text() + " has column " + column);
    }

    /**
     * Every row of the path's first table, grouped by the entity it links to and sorted by day, each joined
     * left along the path's links (an empty or dangling link leaves the later hops null), with the values of
     * {@code columns} each read from the last hop that has it.
     */
    private Map<Object, List<PathRow>> pathRows(PathSpec path, List<String> columns) {
        List<Hop> hops = path.hops();
        String first = hops.get(0).table().text();
        TableSpec firstSpec = spec(first);
        String link = entityLink(firstSpec);
        String time = firstSpec.time().orElseThrow(() -> new IllegalStateException(first + " has no time")).text();

        // Per later hop: the column of the previous table it is reached through, and its rows by key.
        List<String> via = new ArrayList<>();
        List<Map<Object, Map<String, Object>>> byKey = new ArrayList<>();
        for (int i = 1; i < hops.size(); i++) {
            String previous = hops.get(i - 1).table().text();
            String target = hops.get(i).table().text();
            String column = hops.get(i).via().map(Name::text).orElseGet(() -> onlyLink(spec(previous), target));
            via.add(column);
            String key = spec(target).key().orElseThrow(() -> new IllegalStateException(target + " has no key"))
                    .text();
            Map<Object, Map<String, Object>> index = new HashMap<>();
            for (Map<String, Object> row : table(target).rows()) {
                index.put(keyOf(row.get(key)), row);
            }
            byKey.add(index);
        }

        int[] hopOf = new int[columns.size()];
        for (int i = 0; i < hopOf.length; i++) {
            hopOf[i] = columnHop(path, columns.get(i));
        }
        Map<Object, List<PathRow>> out = new HashMap<>();
        for (Map<String, Object> row : table(first).rows()) {
            LocalDate day = day(row.get(time));
            Object owner = row.get(link);
            if (day == null || owner == null) {
                continue; // no time: in no window; no owner: no entity's row
            }
            List<Map<String, Object>> joined = new ArrayList<>();
            joined.add(row);
            Map<String, Object> current = row;
            for (int i = 0; i < via.size(); i++) {
                Object ref = current == null ? null : current.get(via.get(i));
                current = ref == null ? null : byKey.get(i).get(keyOf(ref));
                joined.add(current);
            }
            Object[] values = new Object[columns.size()];
            for (int i = 0; i < values.length; i++) {
                Map<String, Object> source = joined.get(hopOf[i]);
                values[i] = source == null ? null : source.get(columns.get(i));
            }
            Map<String, Object> scope = new HashMap<>();
            for (int h = joined.size() - 1; h >= 0; h--) {
                String hopTable = hops.get(h).table().text();
                Map<String, Object> hopRow = joined.get(h);
                for (String c : table(hopTable).columns()) {
                    scope.putIfAbsent(hopTable + "." + c, hopRow == null ? null : hopRow.get(c));
                }
            }
            out.computeIfAbsent(owner, k -> new ArrayList<>()).add(new PathRow(day, values, scope));
        }
        out.values().forEach(rows -> rows.sort(Comparator.comparing(PathRow::day)));
        return out;
    }

    /** Keys compared as values: an integral Double equals the Long of the same value. */
    private static Object keyOf(Object v) {
        if (v instanceof Double x && x == Math.rint(x) && Math.abs(x) < 9.0e15) {
            return (long) x.doubleValue();
        }
        return v;
    }

    private static Object measure(MeasureSpec m, int source, List<PathRow> in, LocalDate d) {
        MeasureKind kind = m.kind();
        if (kind == MeasureKind.COUNT) {
            return (long) in.size();
        }
        if (kind == MeasureKind.DAYS_SINCE_FIRST || kind == MeasureKind.DAYS_SINCE_LAST) {
            if (in.isEmpty()) {
                return null;
            }
            LocalDate pick = null;
            for (PathRow p : in) {
                if (pick == null || (kind == MeasureKind.DAYS_SINCE_FIRST ? p.day().isBefore(pick)
                        : p.day().isAfter(pick))) {
                    pick = p.day();
                }
            }
            return ChronoUnit.DAYS.between(pick, d);
        }
        List<Object> values = new ArrayList<>();
        for (PathRow p : in) {
            Object v = p.values()[source];
            if (v != null) {
                values.add(v);
            }
        }
        return switch (kind) {
            case SUM -> sum(values);
            case MEAN -> values.isEmpty() ? null : accurateSum(values) / values.size();
            case MIN -> values.stream().min(ReferenceEvaluator::compareValues).orElse(null);
            case MAX -> values.stream().max(ReferenceEvaluator::compareValues).orElse(null);
            case STDDEV -> stddev(values);
            case DISTINCT -> {
                Set<Object> seen = new HashSet<>();
                values.forEach(v -> seen.add(keyOf(v)));
                yield (long) seen.size();
            }
            default -> throw new IllegalStateException("measure " + kind + " not covered");
        };
    }

    /** The sum of non-empty values: exact for integers (as Long), else a compensated double sum. */
    private static Object sum(List<Object> values) {
        if (values.stream().allMatch(v -> v instanceof Long)) {
            long s = 0;
            for (Object v : values) {
                s = Math.addExact(s, (Long) v);
            }
            return s;
        }
        return accurateSum(values);
    }

    /**
     * Neumaier's compensated summation: the rounding error of each addition is collected and added back at
     * the end, so the result is within a few units in the last place of the exact sum, whatever the order.
     */
    private static double accurateSum(List<Object> values) {
        double sum = 0;
        double lost = 0;
        for (Object v : values) {
            double x = ((Number) v).doubleValue();
            double t = sum + x;
            lost += Math.abs(sum) >= Math.abs(x) ? (sum - t) + x : (x - t) + sum;
            sum = t;
        }
        return sum + lost;
    }

    private static BigDecimal decimal(Object v) {
        if (v instanceof Long l) {
            return BigDecimal.valueOf(l);
        }
        if (v instanceof Double x) {
            return new BigDecimal(x); // the double's exact value
        }
        if (v instanceof Number n) {
            return new BigDecimal(n.toString());
        }
        throw new IllegalStateException("not a number: " + v);
    }

    /**
     * Sample standard deviation (n - 1) by the corrected two-pass method: the mean first (compensated sum),
     * then the sum of squared deviations less the square of the summed deviations over n, which takes out the
     * rounding error of the mean. Null for fewer than two values.
     */
    static Double stddev(List<Object> values) {
        int n = values.size();
        if (n < 2) {
            return null;
        }
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = ((Number) values.get(i)).doubleValue();
        }
        double mean = accurateSum(values) / n;
        double squares = 0;
        double deviations = 0;
        for (double v : x) {
            double dev = v - mean;
            squares += dev * dev;
            deviations += dev;
        }
        double variance = (squares - deviations * deviations / n) / (n - 1);
        double sd = Math.sqrt(Math.max(variance, 0));

        // Second, independent reference: Apache Commons Math DescriptiveStatistics (bias-corrected sample
        // standard deviation).
        double commons = new DescriptiveStatistics(x).getStandardDeviation();
        double scale = 0;
        for (double v : x) {
            scale = Math.max(scale, Math.abs(v));
        }
        if (Math.abs(sd - commons) > Math.max(1e-9 * Math.abs(commons), 1e-12 * Math.max(1, scale))) {
            throw new AssertionError("two-pass stddev " + sd + " disagrees with Apache Commons Math "
                    + "DescriptiveStatistics " + commons + " on " + values);
        }
        return sd;
    }

    // ---------------------------------------------------------------- lookups

    private void lookup(FeatureSpec.Lookup lookup, List<CohortRow> cohort, List<String> columns,
                        List<List<Object>> rows) {
        String tableName = lookup.table().text();
        String column = lookup.column().text();
        columns.add(lookup.name().map(Name::text).orElse(tableName + "_" + column));
        TableSpec spec = recipe.tables().get(tableName);
        boolean isEntity = tableName.equals(recipe.entity().table().text());

        if (spec != null && spec.history().isPresent()) {
            String from = spec.history().get().from().text();
            String to = spec.history().get().to().text();
            String key = spec.key().orElseThrow().text();
            Map<Object, List<Map<String, Object>>> byEntity = groupByEntity(spec);
            // Greatest from (string order), then greatest key.
            Comparator<Map<String, Object>> latest = Comparator
                    .comparing((Map<String, Object> r) -> (String) r.get(from))
                    .thenComparing(r -> r.get(key), ReferenceEvaluator::compareValues);
            for (int i = 0; i < cohort.size(); i++) {
                LocalDate d = cohort.get(i).cutoff();
                Map<String, Object> pick = null;
                for (Map<String, Object> r : byEntity.getOrDefault(cohort.get(i).key(), List.of())) {
                    LocalDate f = day(r.get(from));
                    LocalDate t = day(r.get(to));
                    if (f != null && !f.isAfter(d) && (t == null || t.isAfter(d))
                            && (pick == null || latest.compare(r, pick) > 0)) {
                        pick = r;
                    }
                }
                rows.get(i).add(pick == null ? null : pick.get(column));
            }
        } else if (spec != null && spec.time().isPresent()) {
            String time = spec.time().get().text();
            String key = spec.key().orElseThrow().text();
            Map<Object, List<Map<String, Object>>> byEntity = groupByEntity(spec);
            // Greatest time text, then greatest key.
            Comparator<Map<String, Object>> latest = Comparator
                    .comparing((Map<String, Object> r) -> (String) r.get(time))
                    .thenComparing(r -> r.get(key), ReferenceEvaluator::compareValues);
            for (int i = 0; i < cohort.size(); i++) {
                LocalDate d = cohort.get(i).cutoff();
                Map<String, Object> pick = null;
                for (Map<String, Object> r : byEntity.getOrDefault(cohort.get(i).key(), List.of())) {
                    LocalDate day = day(r.get(time));
                    if (day != null && !day.isAfter(d) && (pick == null || latest.compare(r, pick) > 0)) {
                        pick = r;
                    }
                }
                rows.get(i).add(pick == null ? null : pick.get(column));
            }
        } else if (isEntity) {
            for (int i = 0; i < cohort.size(); i++) {
                rows.get(i).add(cohort.get(i).entity().get(column));
            }
        } else {
            throw new IllegalStateException("lookup from " + tableName + ": neither history, time nor the entity");
        }
    }

    private Map<Object, List<Map<String, Object>>> groupByEntity(TableSpec spec) {
        String link = entityLink(spec);
        Map<Object, List<Map<String, Object>>> out = new HashMap<>();
        for (Map<String, Object> r : table(spec.name().text()).rows()) {
            Object owner = r.get(link);
            if (owner != null) {
                out.computeIfAbsent(owner, k -> new ArrayList<>()).add(r);
            }
        }
        return out;
    }

    /** The one link column of {@code spec} whose target is the entity table. */
    private String entityLink(TableSpec spec) {
        return onlyLink(spec, recipe.entity().table().text());
    }

    /** The one link column of {@code spec} whose target is {@code target}. */
    private static String onlyLink(TableSpec spec, String target) {
        List<String> links = new ArrayList<>();
        for (Link l : spec.links()) {
            if (l.target().text().equals(target)) {
                links.add(l.column().text());
            }
        }
        if (links.size() != 1) {
            throw new IllegalStateException(spec.name().text() + " has " + links.size() + " links to " + target);
        }
        return links.get(0);
    }

    // ---------------------------------------------------------------- label

    private void label(LabelSpec label, List<CohortRow> cohort, List<String> columns, List<List<Object>> rows) {
        columns.add(label.name().text());
        LocalDate observed = latestObservedDay();
        Map<Object, List<PathRow>> byEntity = pathRows(label.from(),
                label.column().map(c -> List.of(c.text())).orElse(List.of()));
        CheckedExpression filter = label.where().map(w -> ReferenceExpressions.check(w, pathColumns(label.from()),
                List.of(), true, Expect.CONDITION)).orElse(null);
        for (int i = 0; i < cohort.size(); i++) {
            CohortRow row = cohort.get(i);
            LocalDate start = plus(row.cutoff().plusDays(1), label.gap());
            LocalDate end = plus(start, label.horizon());
            if (observed == null || end.isAfter(observed.plusDays(1))) {
                rows.get(i).add(null); // the horizon is not wholly observed
                continue;
            }
            List<PathRow> all = kept(byEntity.getOrDefault(row.key(), List.of()), filter, row.cutoff());
            List<PathRow> in = all.subList(firstOnOrAfter(all, start), firstOnOrAfter(all, end)); // start <= day < end
            rows.get(i).add(switch (label.kind()) {
                case EXISTS -> in.isEmpty() ? 0L : 1L;
                case COUNT -> (long) in.size();
                case SUM -> {
                    List<Object> values = new ArrayList<>();
                    for (PathRow p : in) {
                        Object v = p.values()[0];
                        if (v != null) {
                            values.add(v);
                        }
                    }
                    yield sum(values);
                }
            });
        }
    }

    /** The latest day of any row of any table the recipe gives a time. */
    private LocalDate latestObservedDay() {
        LocalDate latest = null;
        for (TableSpec spec : recipe.tables().values()) {
            if (spec.time().isEmpty()) {
                continue;
            }
            String time = spec.time().get().text();
            for (Map<String, Object> r : table(spec.name().text()).rows()) {
                LocalDate day = day(r.get(time));
                if (day != null && (latest == null || day.isAfter(latest))) {
                    latest = day;
                }
            }
        }
        return latest;
    }

    // ---------------------------------------------------------------- calendar and values

    /** The date in the first ten characters of an ISO time text; null for an empty value. */
    static LocalDate day(Object time) {
        if (time == null) {
            return null;
        }
        if (!(time instanceof String s) || s.length() < 10) {
            throw new IllegalStateException("the reference evaluator reads times as ISO text, not " + time);
        }
        if (s.charAt(4) != '-' || s.charAt(7) != '-') {
            throw new IllegalStateException("not an ISO date or time: " + s);
        }
        return LocalDate.of(digits(s, 0, 4), digits(s, 5, 7), digits(s, 8, 10));
    }

    private static int digits(String s, int from, int to) {
        int n = 0;
        for (int i = from; i < to; i++) {
            char c = s.charAt(i);
            if (c < '0' || c > '9') {
                throw new IllegalStateException("not an ISO date or time: " + s);
            }
            n = n * 10 + (c - '0');
        }
        return n;
    }

    static LocalDate minus(LocalDate boundary, Span span) {
        return step(boundary, span, -1);
    }

    static LocalDate plus(LocalDate boundary, Span span) {
        return step(boundary, span, 1);
    }

    private static LocalDate step(LocalDate boundary, Span span, int sign) {
        long n = (long) sign * span.amount();
        return switch (span.unit()) {
            case DAY -> boundary.plusDays(n);
            case WEEK -> boundary.plusDays(7 * n);
            case MONTH -> boundary.plusMonths(n);
            case YEAR -> boundary.plusYears(n);
        };
    }

    static String spanLabel(Span span) {
        return span.amount() + String.valueOf(span.unit().suffix());
    }

    /** Numbers numerically, text by string order, numbers before text (as SQLite orders them). */
    static int compareValues(Object a, Object b) {
        Objects.requireNonNull(a, "a");
        Objects.requireNonNull(b, "b");
        boolean na = a instanceof Number;
        boolean nb = b instanceof Number;
        if (na && nb) {
            if (a instanceof Long x && b instanceof Long y) {
                return Long.compare(x, y);
            }
            if (a instanceof Double x && b instanceof Double y) {
                return Double.compare(x, y);
            }
            return decimal(a).compareTo(decimal(b)); // a Long against a Double: exactly
        }
        if (na != nb) {
            return na ? -1 : 1;
        }
        return a.toString().compareTo(b.toString());
    }
}
