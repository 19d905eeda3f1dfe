package dev.quern.spark;

import dev.quern.QuernException;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Role;
import dev.quern.schema.Engine;
import dev.quern.sql.CompiledQuery;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.util.List;
import java.util.UUID;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SaveMode;
import org.apache.spark.sql.classic.SparkSession;
import org.jooq.impl.DSL;

/**
 * The matrix written by Spark itself: the compiled query runs once on the cluster and its rows go straight
 * to Parquet part files, one folder per cutoff ({@code cutoff=2025-01-31/}), without passing through the
 * driver. Quern's own stages (statistics, the leakage audit, encodings, the CSV matrix) then read those
 * files back, in the compiled query's order, which is far cheaper than running the query again.
 */
public final class SparkMatrix {

    private SparkMatrix() {
    }

    /**
     * Runs {@code query} on the connection's session into {@code folder} (which must not exist yet), and
     * returns the query that reads the written matrix back in the same columns and order.
     */
    public static CompiledQuery write(CompiledQuery query, Connection connection, Path folder) {
        SparkSession session = SparkConnection.session(connection);
        String cutoff = column(query, Role.CUTOFF);
        String location = folder.toAbsolutePath().toUri().toString();
        String view = "quern_matrix_" + UUID.randomUUID().toString().replace("-", "");
        try {
            ReadOnlyGuard.check(session, query.sql());
            Dataset<Row> matrix = session.sql(query.sql());
            matrix.write().mode(SaveMode.ErrorIfExists).partitionBy(cutoff).parquet(location);
            // Read back with the query's own schema: the cutoff keeps its type rather than one inferred from
            // folder names, and a matrix without rows (no part files at all) reads as empty, not as an error.
            session.read().schema(matrix.schema()).parquet(location).createOrReplaceTempView(view);
        } catch (SQLException | RuntimeException e) {
            throw QuernException.data("Spark could not run the compiled query: " + e.getMessage()
                    + " (see it with 'quern sql --engine spark')", e);
        }
        var sql = Engine.SPARK.sql();
        String readBack = sql.select(query.columns().stream().map(c -> DSL.field(DSL.name(c))).toList())
                .from(DSL.table(DSL.name(view)))
                .orderBy(DSL.field(DSL.name(cutoff)), DSL.field(DSL.name(column(query, Role.KEY))))
                .getSQL();
        return new CompiledQuery(query.plan(), readBack, readBack, query.columns(), query.scans(), query.choices());
    }

    private static String column(CompiledQuery query, Role role) {
        List<OutputColumn> columns = query.plan().columns();
        return columns.stream().filter(c -> c.role() == role).map(OutputColumn::name).findFirst()
                .orElseThrow(() -> new IllegalStateException("the matrix has no " + role + " column"));
    }
}
