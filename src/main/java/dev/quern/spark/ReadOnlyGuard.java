package dev.quern.spark;

import java.sql.SQLException;
import java.util.ArrayDeque;
import java.util.Deque;
import org.apache.spark.sql.catalyst.plans.logical.Command;
import org.apache.spark.sql.catalyst.plans.logical.LogicalPlan;
import org.apache.spark.sql.classic.SparkSession;
import scala.jdk.javaapi.CollectionConverters;

/**
 * Refuses every statement that is not a plain query, before Spark sees it: {@code SparkSession.sql} runs
 * commands (CREATE, INSERT, DROP, SET, CACHE ...) at once, so the check is on the parsed plan. Spark's
 * commands are nodes of its {@code Command} trait; INSERT and a few other writes are parsed as
 * "...Statement" nodes first, and EXECUTE IMMEDIATE carries a statement in a string.
 */
final class ReadOnlyGuard {

    private ReadOnlyGuard() {
    }

    static void check(SparkSession session, String sql) throws SQLException {
        LogicalPlan plan;
        // The parser reads its settings (double-quoted identifiers) from the thread's active session.
        SparkSession.setActiveSession(session);
        try {
            plan = session.sessionState().sqlParser().parsePlan(sql);
        } catch (org.apache.spark.sql.catalyst.parser.ParseException | RuntimeException e) {
            throw new SQLException(e.getMessage(), e);
        }
        Deque<LogicalPlan> open = new ArrayDeque<>();
        open.push(plan);
        while (!open.isEmpty()) {
            LogicalPlan node = open.pop();
            String kind = node.getClass().getSimpleName();
            if (node instanceof Command || kind.endsWith("Statement") || kind.contains("ExecuteImmediate")) {
                throw new SQLException("Quern's Spark connection is read-only: it runs queries only, and refused a "
                        + kind + " (the source's data is never written)");
            }
            CollectionConverters.asJava(node.children()).forEach(open::push);
        }
    }
}
