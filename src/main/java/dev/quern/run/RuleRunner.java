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

    /**
     * Stops the build when a number column a range join measures holds text (SQLite only; see
     * {@link dev.quern.sql.TextInNumbers}), naming each such column with the first value found.
     */
    public static void requireNumbers(List<dev.quern.sql.TextInNumbers.Query> queries, Connection connection) {
        List<Diagnostic> found = new ArrayList<>();
        for (dev.quern.sql.TextInNumbers.Query q : queries) {
            try (Statement s = connection.createStatement(); ResultSet rs = s.executeQuery(q.sql())) {
                if (!rs.next()) {
                    continue;
                }
                for (int i = 0; i < q.columns().size(); i++) {
                    Object value = rs.getObject(i + 1);
                    if (value != null && !(value instanceof Number)) {
                        found.add(Diagnostic.at(dev.quern.Position.NONE, q.table() + "." + q.columns().get(i)
                                + " holds " + ValueFormat.quoted(value) + " in some rows, where a number belongs"
                                + " (SQLite keeps whatever is put in a column, and would count it as 0): "
                                + ValueFormat.TEXT_IN_NUMBERS_CURE));
                    }
                }
            } catch (SQLException e) {
                throw QuernException.data("looking for text in the number columns of " + q.table() + " failed: "
                        + e.getMessage(), e);
            }
        }
        if (!found.isEmpty()) {
            throw new QuernException(Failure.DATA, found);
        }
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
