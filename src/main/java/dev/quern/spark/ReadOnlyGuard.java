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
 * commands are nodes of its {@code Command} trait, but not every write is one: INSERT parses as an
 * {@code InsertIntoStatement} and INSERT OVERWRITE DIRECTORY as a plain {@code InsertIntoDir} node (which
 * overwrote a source file in a test before this guard knew it), and EXECUTE IMMEDIATE carries a statement
 * in a string. So a node is also refused when a word of its class name says it writes or changes something.
 */
final class ReadOnlyGuard {

    private ReadOnlyGuard() {
    }

    private static final java.util.Set<String> WRITING_WORDS = java.util.Set.of("Insert", "Write", "Writing",
            "Command", "Statement", "Create", "Drop", "Alter", "Cache", "Uncache", "Execute", "Merge", "Delete",
            "Update", "Replace", "Overwrite", "Dir", "Directory", "Truncate", "Refresh", "Load", "Call", "Declare",
            "Analyze", "Comment", "Rename", "Repair", "Append", "Save");

    /** Whether a word of a CamelCase class name ({@code InsertIntoDir}: Insert, Into, Dir) is a writing word. */
    static boolean writes(String className) {
        for (String word : className.split("(?<=[a-z0-9])(?=[A-Z])|\\$")) {
            if (WRITING_WORDS.contains(word)) {
                return true;
            }
        }
        return false;
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
            if (node instanceof Command || writes(kind)) {
                throw new SQLException("Quern's Spark connection is read-only: it runs queries only, and refused a "
                        + kind + " (the source's data is never written)");
            }
            CollectionConverters.asJava(node.children()).forEach(open::push);
        }
    }
}
