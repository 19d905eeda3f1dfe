package dev.quern.run;

import dev.quern.plan.Cutoff;
import dev.quern.plan.DerivedColumn;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.plan.Role;
import dev.quern.expr.Evaluator;
import dev.quern.sql.BlockScan;
import dev.quern.sql.CompiledQuery;
import dev.quern.schema.ValueType;
import java.io.IOException;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Consumer;

/**
 * The matrix of a plan with scanned blocks: the main query's rows (key, then cutoff order) merged with one
 * {@link BlockScanner} per scanned block, the derived columns evaluated per row, and the rows handed on in
 * the matrix's order (cutoff, then key) through a {@link CutoffSpill}.
 */
final class ScannedRows {

    /** Rows of the main query measured together: enough that the threads meet rarely, few enough to stay flat. */
    private static final int BATCH = 1_000;

    private final CompiledQuery query;
    private final Plan plan;
    private final List<OutputColumn> columns;

    ScannedRows(CompiledQuery query) {
        this.query = query;
        this.plan = query.plan();
        this.columns = plan.columns();
    }

    /**
     * Runs the queries on {@code connection} and hands every matrix row to {@code sink}; {@code merged} is
     * told when the last query row has been read, before the first row goes to the sink. The sink gets one
     * array, refilled for each row, and must not keep it.
     */
    void run(Connection connection, Progress progress, Runnable merged, Consumer<Object[]> sink)
            throws SQLException, IOException {
        Map<String, Integer> position = new HashMap<>();
        for (int i = 0; i < columns.size(); i++) {
            position.put(columns.get(i).name(), i);
        }
        int[] fromQuery = query.columns().stream().mapToInt(position::get).toArray();
        int keyAt = indexOf(Role.KEY);
        int cutoffAt = indexOf(Role.CUTOFF);
        Map<String, Integer> cutoffIndex = new HashMap<>();
        for (int i = 0; i < plan.cutoffs().size(); i++) {
            cutoffIndex.put(plan.cutoffs().get(i).toString(), i);
        }
        Map<Object, Integer> cutoffOf = new HashMap<>();
        List<Connection> extra = new ArrayList<>();
        List<Statement> statements = new ArrayList<>();
        List<BlockScanner> scanners = new ArrayList<>();
        List<ScanWorkers.Block> blocks = new ArrayList<>();
        try (CutoffSpill spill = new CutoffSpill(plan.cutoffs().size(), columns.size())) {
            Statement main = connection.createStatement();
            statements.add(main);
            main.setFetchSize(MatrixWriter.FETCH_SIZE);
            for (BlockScan scan : query.scans()) {
                Connection reader = ConcurrentReads.another(connection, plan.engine());
                if (reader != connection) {
                    extra.add(reader);
                }
                Statement s = reader.createStatement();
                statements.add(s);
                s.setFetchSize(MatrixWriter.FETCH_SIZE);
                ResultSet rs = s.executeQuery(scan.sql());
                BlockScanner scanner = new BlockScanner(scan, rs, ValueFormat.readTypes(rs.getMetaData(), plan.engine()));
                scanners.add(scanner);
                int[] offsets = scan.aggregates().stream().mapToInt(a -> position.get(a.column())).toArray();
                blocks.add((row, cutoff) -> scanner.measure(row[keyAt], plan.cutoffs().get(cutoff), row, offsets));
            }
            try (ResultSet rs = main.executeQuery(query.sql());
                 ScanWorkers workers = new ScanWorkers(blocks, extra.size() == scanners.size())) {
                int[] types = ValueFormat.readTypes(rs.getMetaData(), plan.engine());
                // Two batches take turns: the blocks measure one while the next is read and the last spilled.
                ScanWorkers.Batch reading = new ScanWorkers.Batch(BATCH, columns.size());
                ScanWorkers.Batch measuring = new ScanWorkers.Batch(BATCH, columns.size());
                boolean measuringAny = false;
                long rows = 0;
                Object previous = null;
                while (true) {
                    reading.size = 0;
                    while (!reading.full() && rs.next()) {
                        int n = reading.size++;
                        Object[] row = reading.rows[n];
                        Arrays.fill(row, null);
                        for (int i = 0; i < fromQuery.length; i++) {
                            row[fromQuery[i]] = ValueFormat.read(rs, i + 1, types[i]);
                        }
                        if (previous != null && KeyOrder.INSTANCE.compare(previous, row[keyAt]) > 0) {
                            throw BlockScanner.outOfOrder("the main query", previous, row[keyAt]);
                        }
                        previous = row[keyAt];
                        reading.cutoffIndex[n] = cutoffIndex(row[cutoffAt], cutoffIndex, cutoffOf);
                    }
                    if (reading.size > 0) {
                        workers.start(reading);
                    }
                    if (measuringAny) {
                        workers.await(measuring);
                        for (int i = 0; i < measuring.size; i++) {
                            derive(measuring.rows[i], position, cutoffAt);
                            spill.add(measuring.cutoffIndex[i], measuring.rows[i]);
                        }
                        rows += measuring.size;
                        progress.rows(rows);
                    }
                    if (reading.size == 0) {
                        break;
                    }
                    ScanWorkers.Batch spilled = measuring;
                    measuring = reading;
                    reading = spilled;
                    measuringAny = true;
                }
            }
            merged.run();
            spill.replay(sink);
        } finally {
            for (BlockScanner scanner : scanners) {
                scanner.close();
            }
            for (Statement s : statements) {
                s.close();
            }
            for (Connection c : extra) {
                c.close();
            }
        }
    }

    /** Derived columns, in recipe order, from the row's values as the SQL would have read them. */
    private void derive(Object[] row, Map<String, Integer> position, int cutoffAt) {
        for (DerivedColumn derived : plan.derived()) {
            row[position.get(derived.column())] = Evaluator.evaluate(derived.expression(), binding ->
                    binding.handle() == Cutoff.ROW ? row[cutoffAt] : row[position.get((String) binding.handle())]);
        }
    }

    /**
     * The position of the row's cutoff among the plan's, found by its text once per value the engine returns
     * (the plan's few cutoffs), not once per row.
     */
    private int cutoffIndex(Object cutoff, Map<String, Integer> byText, Map<Object, Integer> byValue) {
        Integer known = byValue.get(cutoff);
        if (known != null) {
            return known;
        }
        String text = ValueFormat.format(cutoff, ValueType.DATE);
        Integer c = byText.get(text);
        if (c == null) {
            throw new IllegalStateException("the query returned cutoff " + text + ", not in the plan");
        }
        byValue.put(cutoff, c);
        return c;
    }

    private int indexOf(Role role) {
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i).role() == role) {
                return i;
            }
        }
        throw new IllegalStateException("no " + role + " column");
    }
}
