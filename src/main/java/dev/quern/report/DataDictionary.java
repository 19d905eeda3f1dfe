package dev.quern.report;

import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.plan.Role;
import dev.quern.run.ColumnStats;
import dev.quern.run.MatrixWriter;
import dev.quern.run.RunResult;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVPrinter;

/**
 * The data dictionary: one entry per output column with its meaning, sources, window, what an empty
 * window gives, the recipe line that defined it, its lineage in one line (see {@link Lineage}), and
 * statistics of the values written.
 */
public final class DataDictionary {

    static final List<String> HEADER = List.of("column", "role", "type", "meaning", "sources", "window", "filter",
            "when_empty", "defined_at", "lineage", "empty_share", "min", "mean", "max");

    private final Plan plan;
    private final RunResult run;
    private final Lineage lineage;

    public DataDictionary(Plan plan, RunResult run) {
        this(plan, run, Lineage.of(plan));
    }

    public DataDictionary(Plan plan, RunResult run, Lineage lineage) {
        this.plan = plan;
        this.run = run;
        this.lineage = lineage;
    }

    public String csv() {
        StringWriter out = new StringWriter();
        try (CSVPrinter csv = new CSVPrinter(out, MatrixWriter.FORMAT)) {
            csv.printRecord(HEADER);
            for (OutputColumn c : plan.columns()) {
                csv.printRecord(entry(c));
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out.toString();
    }

    public String markdown() {
        StringBuilder md = new StringBuilder();
        md.append("# Data dictionary: ").append(plan.recipeName()).append("\n\n");
        OutputColumn key = plan.columns().get(0);
        md.append("One row per ").append(plan.cohort().table()).append(" row and cutoff date: ")
                .append(run.rows()).append(" rows, ").append(plan.columns().size()).append(" columns, ")
                .append(plan.cutoffs().size()).append(" cutoffs. Rows are ordered by cutoff, then ")
                .append(key.name()).append(".\n\n");
        md.append("`").append(key.name()).append("` identifies the row and `cutoff` dates it; neither is a")
                .append(" feature. Keys, link columns and identifiers named in the recipe never become feature")
                .append(" columns.\n");
        plan.timeZone().ifPresent(z -> md.append("\nTimes are read as stored, in the time zone ").append(z)
                .append(".\n"));
        md.append('\n');
        md.append("| ").append(String.join(" | ", HEADER)).append(" |\n");
        md.append("|").append(" --- |".repeat(HEADER.size())).append('\n');
        for (OutputColumn c : plan.columns()) {
            md.append("| ");
            md.append(String.join(" | ", entry(c).stream().map(DataDictionary::cell).toList()));
            md.append(" |\n");
        }
        return md.toString();
    }

    private List<String> entry(OutputColumn c) {
        ColumnStats s = run.column(c.name());
        List<String> out = new ArrayList<>();
        out.add(c.name());
        out.add(c.role().label());
        out.add(c.type().label());
        out.add(c.meaning());
        out.add(String.join(" ", c.sources()));
        out.add(c.window().orElse(""));
        out.add(c.filter().orElse(""));
        out.add(c.whenEmpty());
        out.add(c.definedAt().isKnown() ? c.definedAt().file() + ":" + c.definedAt().line() : "");
        out.add(lineage.column(c.name()).oneLine());
        out.add(String.format(Locale.ROOT, "%.4f", s.emptyShare()));
        boolean statistics = c.role() == Role.FEATURE || c.role() == Role.LABEL;
        out.add(statistics ? s.min().map(DataDictionary::rounded).orElse("") : "");
        out.add(statistics ? s.mean().map(DataDictionary::rounded).orElse("") : "");
        out.add(statistics ? s.max().map(DataDictionary::rounded).orElse("") : "");
        return out;
    }

    /** Six significant digits: enough to read, and stable across engines that sum in another order. */
    static String rounded(String value) {
        try {
            return new BigDecimal(value).round(new MathContext(6)).stripTrailingZeros().toPlainString();
        } catch (NumberFormatException e) {
            return value;
        }
    }

    private static String cell(String text) {
        return text.replace("|", "\\|").replace("\n", " ");
    }
}
