package dev.quern.sql;

import dev.quern.plan.Plan;
import java.util.List;
import java.util.Objects;

/** The one query that builds the modelling table, rendered for the plan's engine, and its column names. */
public record CompiledQuery(Plan plan, String sql, String formattedSql, List<String> columns) {
    public CompiledQuery {
        Objects.requireNonNull(plan, "plan");
        Objects.requireNonNull(sql, "sql");
        Objects.requireNonNull(formattedSql, "formattedSql");
        columns = List.copyOf(columns);
    }
}
