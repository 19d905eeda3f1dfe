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
import java.time.LocalDate;
import java.util.ArrayList;
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
        List<Connection> extra = new ArrayList<>();
        List<Statement> statements = new ArrayList<>();
        List<BlockScanner> scanners = new ArrayList<>();
        List<int[]> offsets = new ArrayList<>();
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
                scanners.add(new BlockScanner(scan, rs, ValueFormat.readTypes(rs.getMetaData(), plan.engine())));
                offsets.add(scan.aggregates().stream().mapToInt(a -> position.get(a.column())).toArray());
            }
            try (ResultSet rs = main.executeQuery(query.sql())) {
                int[] types = ValueFormat.readTypes(rs.getMetaData(), plan.engine());
                long rows = 0;
                Object previous = null;
                while (rs.next()) {
                    Object[] row = new Object[columns.size()];
                    for (int i = 0; i < fromQuery.length; i++) {
                        row[fromQuery[i]] = ValueFormat.read(rs, i + 1, types[i]);
                    }
                    if (previous != null && KeyOrder.INSTANCE.compare(previous, row[keyAt]) > 0) {
                        throw BlockScanner.outOfOrder("the main query", previous, row[keyAt]);
                    }
                    previous = row[keyAt];
                    String cutoffText = ValueFormat.format(row[cutoffAt], ValueType.DATE);
                    Integer c = cutoffIndex.get(cutoffText);
                    if (c == null) {
                        throw new IllegalStateException("the query returned cutoff " + cutoffText + ", not in the plan");
                    }
                    LocalDate cutoff = plan.cutoffs().get(c);
                    for (int b = 0; b < scanners.size(); b++) {
                        scanners.get(b).measure(row[keyAt], cutoff, row, offsets.get(b));
                    }
                    derive(row, position, cutoffAt);
                    spill.add(c, row);
                    if (++rows % MatrixWriter.FETCH_SIZE == 0) {
                        progress.rows(rows);
                    }
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

    private int indexOf(Role role) {
        for (int i = 0; i < columns.size(); i++) {
            if (columns.get(i).role() == role) {
                return i;
            }
        }
        throw new IllegalStateException("no " + role + " column");
    }
}
