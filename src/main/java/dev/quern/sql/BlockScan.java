package dev.quern.sql;

import dev.quern.plan.Aggregate;
import dev.quern.plan.Block;
import java.util.List;
import java.util.Objects;

/**
 * A block computed by the ordered scan: the query that reads its rows (columns: the entity link, the
 * row's day as {@code YYYY-MM-DD} text or a date, then each input once), ordered by link and day, and
 * for each aggregate of the block the position of its input among those columns (0 when it reads none).
 */
public record BlockScan(Block block, String sql, String formattedSql, List<Integer> inputColumns) {
    public BlockScan {
        Objects.requireNonNull(block, "block");
        Objects.requireNonNull(sql, "sql");
        Objects.requireNonNull(formattedSql, "formattedSql");
        inputColumns = List.copyOf(inputColumns);
        if (inputColumns.size() != block.aggregates().size()) {
            throw new IllegalArgumentException("one input position per aggregate");
        }
    }

    /** The first input column: 1 is the link, 2 the day. */
    public static final int FIRST_INPUT = 3;

    /** The result column (1-based) of {@code aggregate}'s input, or 0 when it reads none. */
    public int inputColumn(int aggregate) {
        return inputColumns.get(aggregate);
    }

    public List<Aggregate> aggregates() {
        return block.aggregates();
    }
}
