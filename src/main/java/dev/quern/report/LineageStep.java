package dev.quern.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * One step on the way from source rows to an output column. A column's lineage is a list of steps read
 * left to right: the table whose rows are read, the joins along links, the time rule that picks rows (a
 * window, an as-of rule, a label horizon), then what is made of them (a measure, a value). Filters, rules
 * and encodings become further step types when they exist; a reader that meets a step type it does not
 * know can still print {@link #text()} and follow {@link #uses()}.
 */
public sealed interface LineageStep {

    /** The step's type in JSON: {@code table}, {@code join}, {@code window}, ... */
    String kind();

    /** The step in a few words, as the compact one-line lineage writes it. */
    String text();

    /** The step's own fields for JSON, after {@code "step": kind()}. */
    Map<String, Object> fields();

    /** The source columns this step reads, and what for. */
    List<Use> uses();

    /** A sentence that explains the step beyond {@link #text()}, for the terminal; often empty. */
    default String note() {
        return "";
    }

    /** A source column ({@code table.column}) read by a step, and what for. */
    record Use(String column, How how) {
        public Use {
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(how, "how");
        }

        public String table() {
            return column.substring(0, column.indexOf('.'));
        }
    }

    /** What a step reads a source column for. */
    enum How {
        /** Its values become (or are aggregated into) the output. */
        VALUE("value"),
        /** It places rows in time: a window, an as-of rule, a horizon. */
        TIME("time"),
        /** It joins one table to another (a link column or the key it points at). */
        JOIN("join"),
        /** It identifies the row: the entity key. */
        KEY("key"),
        /** It decides which rows count: a filter or a rule. */
        CONDITION("condition");

        private final String label;

        How(String label) {
            this.label = label;
        }

        public String label() {
            return label;
        }
    }

    /** The rows of a source table. */
    record Table(String table) implements LineageStep {
        public Table {
            Objects.requireNonNull(table, "table");
        }

        @Override
        public String kind() {
            return "table";
        }

        @Override
        public String text() {
            return table;
        }

        @Override
        public Map<String, Object> fields() {
            return map("table", table);
        }

        @Override
        public List<Use> uses() {
            return List.of();
        }
    }

    /**
     * A join along a link: {@code from} ({@code table.column}) holds the key {@code to} of another table.
     * {@code toEntity} is true for the join that ties rows to the entity a matrix row describes.
     */
    record Join(String from, String to, boolean toEntity) implements LineageStep {
        public Join {
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(to, "to");
        }

        @Override
        public String kind() {
            return "join";
        }

        @Override
        public String text() {
            return "join " + from + " = " + to;
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = map("from", from);
            m.put("to", to);
            m.put("purpose", toEntity ? "entity" : "link");
            return m;
        }

        @Override
        public List<Use> uses() {
            return List.of(new Use(from, How.JOIN), new Use(to, How.JOIN));
        }

        @Override
        public String note() {
            return toEntity ? "ties each row to the entity" : "follows the link";
        }
    }

    /** Rows whose {@code time} falls in a window that ends with the cutoff day. */
    record Window(String span, String time, String rule) implements LineageStep {
        public Window {
            Objects.requireNonNull(span, "span");
            Objects.requireNonNull(time, "time");
            Objects.requireNonNull(rule, "rule");
        }

        @Override
        public String kind() {
            return "window";
        }

        @Override
        public String text() {
            return "window " + span + " on " + time;
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = map("span", span);
            m.put("time", time);
            m.put("rule", rule);
            return m;
        }

        @Override
        public List<Use> uses() {
            return List.of(new Use(time, How.TIME));
        }

        @Override
        public String note() {
            return rule;
        }
    }

    /**
     * One row per entity as of the cutoff: {@code rule} is {@code in_force} (a history table's validity
     * columns), {@code latest} (the last event at or before the cutoff) or {@code current} (a table without
     * time: the value as the source holds it now, which may have been written after the cutoff).
     */
    record AsOf(String rule, List<String> times, String description) implements LineageStep {
        public AsOf {
            Objects.requireNonNull(rule, "rule");
            times = List.copyOf(times);
            Objects.requireNonNull(description, "description");
        }

        /** True when nothing ties the value to the cutoff. */
        public boolean current() {
            return rule.equals("current");
        }

        @Override
        public String kind() {
            return "as_of";
        }

        @Override
        public String text() {
            return switch (rule) {
                case "in_force" -> "in force at cutoff by " + String.join("/", times);
                case "latest" -> "latest at cutoff by " + String.join("/", times);
                default -> "current value (no history)";
            };
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = map("rule", rule);
            m.put("time", times);
            m.put("rule_text", description);
            return m;
        }

        @Override
        public List<Use> uses() {
            return times.stream().map(t -> new Use(t, How.TIME)).toList();
        }

        @Override
        public String note() {
            return description;
        }
    }

    /** Rows in the label horizon {@code (cutoff + gap, cutoff + gap + span]} by {@code time}. */
    record Horizon(String span, String gap, String time) implements LineageStep {
        public Horizon {
            Objects.requireNonNull(span, "span");
            Objects.requireNonNull(gap, "gap");
            Objects.requireNonNull(time, "time");
        }

        @Override
        public String kind() {
            return "horizon";
        }

        @Override
        public String text() {
            return "horizon " + span + " after cutoff" + (gap.startsWith("0") ? "" : " + " + gap) + " on " + time;
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = map("span", span);
            m.put("gap", gap);
            m.put("time", time);
            return m;
        }

        @Override
        public List<Use> uses() {
            return List.of(new Use(time, How.TIME));
        }
    }

    /** A condition on the rows read: a recipe filter (written as the recipe has it). */
    record Filter(String condition, List<String> columns) implements LineageStep {
        public Filter {
            Objects.requireNonNull(condition, "condition");
            columns = List.copyOf(columns);
        }

        @Override
        public String kind() {
            return "filter";
        }

        @Override
        public String text() {
            return "where " + condition;
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = map("condition", condition);
            m.put("columns", columns);
            return m;
        }

        @Override
        public List<Use> uses() {
            return columns.stream().map(c -> new Use(c, How.CONDITION)).toList();
        }
    }

    /** An aggregate over the rows: {@code measure} by its recipe spelling, of {@code input} if it reads one. */
    record Measure(String measure, Optional<String> input) implements LineageStep {
        public Measure {
            Objects.requireNonNull(measure, "measure");
            Objects.requireNonNull(input, "input");
        }

        @Override
        public String kind() {
            return "measure";
        }

        @Override
        public String text() {
            return measure + input.map(i -> "(" + i + ")").orElse("");
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = map("measure", measure);
            input.ifPresent(i -> m.put("input", i));
            return m;
        }

        @Override
        public List<Use> uses() {
            return input.map(i -> List.of(new Use(i, How.VALUE))).orElse(List.of());
        }
    }

    /** One source column's value taken as it is (a lookup, the entity key, a source the plan names). */
    record Value(String column, How how) implements LineageStep {
        public Value {
            Objects.requireNonNull(column, "column");
            Objects.requireNonNull(how, "how");
        }

        @Override
        public String kind() {
            return how == How.KEY ? "key" : "value";
        }

        @Override
        public String text() {
            return (how == How.KEY ? "key " : "value ") + column;
        }

        @Override
        public Map<String, Object> fields() {
            return map("column", column);
        }

        @Override
        public List<Use> uses() {
            return List.of(new Use(column, how));
        }
    }

    /**
     * Which entities are rows at a cutoff: {@code since} (a time column of the entity table, if any) on or
     * before the cutoff day, and no row in any {@code until} table's time column by its end.
     */
    record Eligibility(java.util.Optional<String> since, List<String> until) implements LineageStep {
        public Eligibility {
            Objects.requireNonNull(since, "since");
            until = List.copyOf(until);
        }

        @Override
        public String kind() {
            return "cohort";
        }

        @Override
        public String text() {
            List<String> parts = new ArrayList<>();
            since.ifPresent(s -> parts.add("since " + s));
            until.forEach(u -> parts.add("until " + u));
            return parts.isEmpty() ? "every entity" : "eligible " + String.join(", ", parts);
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("since", since.orElse(null));
            m.put("until", until);
            return m;
        }

        @Override
        public List<Use> uses() {
            List<Use> out = new ArrayList<>();
            since.ifPresent(s -> out.add(new Use(s, How.TIME)));
            until.forEach(u -> out.add(new Use(u, How.TIME)));
            return out;
        }
    }

    /** The cutoff dates themselves: not read from any table. */
    record Cutoffs(String first, String last, int count) implements LineageStep {
        public Cutoffs {
            Objects.requireNonNull(first, "first");
            Objects.requireNonNull(last, "last");
        }

        @Override
        public String kind() {
            return "cutoffs";
        }

        @Override
        public String text() {
            return count == 0 ? "cutoffs (none)" : "cutoffs " + first + ".." + last + " (" + count + ")";
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = map("first", first);
            m.put("last", last);
            m.put("count", count);
            return m;
        }

        @Override
        public List<Use> uses() {
            return List.of();
        }
    }

    /**
     * A step the plan describes only by the source columns it reads: for columns made in ways lineage does
     * not trace step by step yet (derived expressions, say). {@code what} says what the plan calls it.
     */
    record Reads(String what, List<String> columns) implements LineageStep {
        public Reads {
            Objects.requireNonNull(what, "what");
            columns = List.copyOf(columns);
        }

        @Override
        public String kind() {
            return "reads";
        }

        @Override
        public String text() {
            return what + (columns.isEmpty() ? "" : " of " + String.join(", ", columns));
        }

        @Override
        public Map<String, Object> fields() {
            Map<String, Object> m = map("what", what);
            m.put("columns", columns);
            return m;
        }

        @Override
        public List<Use> uses() {
            List<Use> out = new ArrayList<>();
            columns.stream().filter(c -> c.contains(".")).forEach(c -> out.add(new Use(c, How.VALUE)));
            return out;
        }
    }

    private static Map<String, Object> map(String key, Object value) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put(key, value);
        return m;
    }
}
