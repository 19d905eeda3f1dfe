package dev.quern.report;

import dev.quern.run.RuleOutcome;
import dev.quern.schema.SourceSchema;
import dev.quern.schema.TimeColumnFacts;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * rules.md: what the recipe's data-quality rules found (rows checked, failing, what was done, examples),
 * and the rows no window can see because their time is empty.
 */
public final class RulesReport {

    private RulesReport() {
    }

    /** {@code eventTimes}: the {@code table.column} names read as event times (empty validity ends mean "still"). */
    public static String markdown(String recipe, List<RuleOutcome> outcomes, SourceSchema schema,
                                  java.util.Set<String> eventTimes, Map<String, Long> late,
                                  java.util.Optional<java.time.LocalDate> lateFrom) {
        StringBuilder md = new StringBuilder("# Data-quality rules: ").append(recipe).append("\n\n");
        if (outcomes.isEmpty()) {
            md.append("The recipe declares no rules.\n");
        } else {
            md.append("| table | rule | rows checked | rows failing | action | examples |\n");
            md.append("| --- | --- | --- | --- | --- | --- |\n");
            for (RuleOutcome o : outcomes) {
                md.append("| ").append(o.rule().table()).append(" | ").append(cell(o.rule().describe()))
                        .append(" | ").append(o.checked()).append(" | ").append(o.failed()).append(" | ")
                        .append(o.action()).append(" | ").append(cell(String.join(", ", o.examples())))
                        .append(" |\n");
            }
            md.append('\n').append(HOW_RULES_APPLY).append('\n');
        }
        List<String> emptyTimes = new ArrayList<>();
        for (TimeColumnFacts f : schema.times().values()) {
            if (f.nulls() > 0 && eventTimes.contains(f.table() + "." + f.column())) {
                emptyTimes.add("- " + f.table() + "." + f.column() + ": " + f.nulls() + " of " + f.rows()
                        + " rows have no value");
            }
        }
        if (!emptyTimes.isEmpty()) {
            md.append("\n## Empty times\n\nRows whose time is empty fall in no window and no horizon.\n\n");
            emptyTimes.forEach(l -> md.append(l).append('\n'));
        }
        if (lateFrom.isPresent() && late.values().stream().anyMatch(n -> n > 0)) {
            md.append("\n## Rows after the last horizon\n\nRows dated on or after ").append(lateFrom.get())
                    .append(", where no cutoff's window or label horizon reaches, are read by no row.\n\n");
            late.forEach((column, n) -> md.append("- ").append(column).append(": ").append(n).append(" rows\n"));
        }
        return md.toString();
    }

    /** How a rule's rows are counted and what excluding them means: under the table in rules.md and report.html. */
    static final String HOW_RULES_APPLY = "A check passes only where its condition is true: a row where it cannot be"
            + " decided fails. Excluded rows are left out of every feature, lookup, label and the cohort.";

    /** The outcomes as provenance.json holds them. */
    public static List<Object> json(List<RuleOutcome> outcomes) {
        List<Object> out = new ArrayList<>();
        for (RuleOutcome o : outcomes) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("table", o.rule().table());
            m.put("rule", o.rule().describe());
            m.put("recipe_line", o.rule().position().toString());
            m.put("rows_checked", o.checked());
            m.put("rows_failing", o.failed());
            m.put("action", o.action());
            m.put("examples", o.examples());
            out.add(m);
        }
        return out;
    }

    private static String cell(String text) {
        return text.replace("|", "\\|").replace("\n", " ");
    }
}
