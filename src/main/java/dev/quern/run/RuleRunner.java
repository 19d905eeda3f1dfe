package dev.quern.run;

import dev.quern.Diagnostic;
import dev.quern.Failure;
import dev.quern.QuernException;
import dev.quern.recipe.RuleSpec;
import dev.quern.sql.RuleQuery;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;

/**
 * Measures every rule on the source before the matrix is built. Rules that stop the build on failure stop
 * it here, all together, with examples; the others' outcomes go to the reports.
 */
public final class RuleRunner {

    private RuleRunner() {
    }

    public static List<RuleOutcome> run(List<RuleQuery> queries, Connection connection) {
        List<RuleOutcome> outcomes = new ArrayList<>();
        List<Diagnostic> stops = new ArrayList<>();
        for (RuleQuery q : queries) {
            RuleOutcome outcome = measure(q, connection);
            outcomes.add(outcome);
            if (outcome.failed() > 0 && outcome.rule().failing() == RuleSpec.Failing.STOP) {
                stops.add(Diagnostic.at(q.rule().position(), "rule failed on " + outcome.failed() + " of "
                        + outcome.checked() + " rows: " + q.rule().describe() + "; e.g. " + outcome.examples()
                        + ". Fix the data, or let the rule exclude those rows"));
            }
        }
        if (!stops.isEmpty()) {
            throw new QuernException(Failure.DATA, stops);
        }
        return outcomes;
    }

    /** Counts, per event time column, the rows dated where no cutoff reaches: {@code table.column} to count. */
    public static java.util.Map<String, Long> countLate(List<dev.quern.sql.LateRows.Query> queries,
                                                        Connection connection) {
        java.util.Map<String, Long> out = new java.util.LinkedHashMap<>();
        for (dev.quern.sql.LateRows.Query q : queries) {
            try (Statement s = connection.createStatement(); ResultSet rs = s.executeQuery(q.sql())) {
                rs.next();
                out.put(q.column(), rs.getLong(1));
            } catch (SQLException e) {
                throw QuernException.data("counting the rows of " + q.column() + " after the last horizon failed: "
                        + e.getMessage(), e);
            }
        }
        return out;
    }

    private static RuleOutcome measure(RuleQuery q, Connection connection) {
        try (Statement s = connection.createStatement()) {
            long checked;
            long failed;
            try (ResultSet rs = s.executeQuery(q.count())) {
                rs.next();
                checked = rs.getLong(1);
                failed = rs.getLong(2);
            }
            List<String> examples = new ArrayList<>();
            if (failed > 0) {
                try (Statement e = connection.createStatement(); ResultSet rs = e.executeQuery(q.examples())) {
                    while (rs.next()) {
                        examples.add(String.valueOf(rs.getObject(1)));
                    }
                }
            }
            return new RuleOutcome(q.rule(), checked, failed, examples);
        } catch (SQLException e) {
            throw QuernException.data("measuring the rule '" + q.rule().describe() + "' failed: " + e.getMessage(), e);
        }
    }
}
