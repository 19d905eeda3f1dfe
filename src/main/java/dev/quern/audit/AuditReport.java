package dev.quern.audit;

import dev.quern.Diagnostic;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.report.Json;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * What the leakage audit found: each check's result with its evidence, and the findings. It renders
 * {@code audit.json} (for programs; the schema is in docs/audit.md and changes only with {@link #FORMAT})
 * and {@code audit.md} (for people).
 */
public final class AuditReport {

    /** The name and version of audit.json's schema. */
    public static final String FORMAT = "quern-audit/1";

    private final String recipe;
    private final double auc;
    private final double rho;
    private final List<CheckResult> checks;
    private final List<Finding> findings;

    AuditReport(String recipe, double auc, double rho, List<CheckResult> checks, List<Finding> findings) {
        this.recipe = Objects.requireNonNull(recipe, "recipe");
        this.auc = auc;
        this.rho = rho;
        this.checks = List.copyOf(checks);
        this.findings = List.copyOf(findings);
    }

    public List<CheckResult> checks() {
        return checks;
    }

    public List<Finding> findings() {
        return findings;
    }

    public List<Finding> findings(Check check) {
        return findings.stream().filter(f -> f.check() == check).toList();
    }

    /** True when a blocking finding is not acknowledged: the build writes no matrix. */
    public boolean blocked() {
        return findings.stream().anyMatch(Finding::blocks);
    }

    /** How many findings of this severity the recipe does not acknowledge. */
    public long open(Severity severity) {
        return findings.stream().filter(f -> f.isOpen() && f.severity() == severity).count();
    }

    public long acknowledged() {
        return findings.stream().filter(f -> !f.isOpen()).count();
    }

    /**
     * A check's result: {@code pass}, {@code not applicable}, the worst severity among its open findings, or
     * {@code acknowledged} when the recipe acknowledges all of them.
     */
    public String result(Check check) {
        List<Finding> of = findings(check);
        for (Severity s : Severity.values()) {
            if (of.stream().anyMatch(f -> f.isOpen() && f.severity() == s)) {
                return s.label();
            }
        }
        if (!of.isEmpty()) {
            return "acknowledged";
        }
        return checks.stream().filter(c -> c.check() == check).findFirst().map(c -> c.applicable() ? "pass"
                : "not applicable").orElse("not run");
    }

    /** One line: passed or blocked, with the counts. */
    public String summary() {
        return (blocked() ? "blocked: " : "passed: ") + counts();
    }

    /** The open findings by severity, and how many the recipe acknowledges. */
    public String counts() {
        return open(Severity.BLOCKING) + " blocking, " + open(Severity.WARNING) + " warning(s), "
                + open(Severity.NOTE) + " note(s)" + (acknowledged() == 0 ? ""
                : "; " + acknowledged() + " finding(s) acknowledged in the recipe");
    }

    /** The open blocking findings as diagnostics, each at the recipe line of the columns involved. */
    public List<Diagnostic> blocking() {
        List<Diagnostic> out = new ArrayList<>();
        for (Finding f : findings) {
            if (f.blocks()) {
                out.add(Diagnostic.at(f.at(), "leakage audit, " + f.check().id() + ": " + f.summary()));
            }
        }
        return out;
    }

    /**
     * The plan with each acknowledged column's meaning extended by the acknowledgement, so that the data
     * dictionary records why the column was kept.
     */
    public Plan annotate(Plan plan) {
        Map<String, List<String>> notes = new LinkedHashMap<>();
        for (Finding f : findings) {
            f.acknowledged().ifPresent(a -> f.columns().forEach(c -> notes.computeIfAbsent(c, x -> new ArrayList<>())
                    .add("Leakage audit, " + f.check().id() + " acknowledged: " + a.reason())));
        }
        if (notes.isEmpty()) {
            return plan;
        }
        List<OutputColumn> columns = new ArrayList<>();
        for (OutputColumn c : plan.columns()) {
            List<String> n = notes.get(c.name());
            columns.add(n == null ? c : new OutputColumn(c.name(), c.role(), c.type(),
                    c.meaning() + " " + String.join(" ", n.stream().map(AuditReport::sentence).toList()), c.sources(),
                    c.window(), c.filter(), c.whenEmpty(), c.definedAt()));
        }
        return plan.withColumns(columns);
    }

    /** audit.json. */
    public String json() {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("format", FORMAT);
        root.put("recipe", recipe);
        root.put("outcome", blocked() ? "blocked" : "passed");
        Map<String, Object> summary = new LinkedHashMap<>();
        summary.put("blocking", open(Severity.BLOCKING));
        summary.put("warnings", open(Severity.WARNING));
        summary.put("notes", open(Severity.NOTE));
        summary.put("acknowledged", acknowledged());
        root.put("summary", summary);
        Map<String, Object> thresholds = new LinkedHashMap<>();
        thresholds.put("auc", auc);
        thresholds.put("rho", rho);
        root.put("thresholds", thresholds);
        List<Object> checkList = new ArrayList<>();
        for (CheckResult c : checks) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("check", c.check().id());
            m.put("title", c.check().title());
            m.put("result", result(c.check()));
            m.put("evidence", c.evidence());
            checkList.add(m);
        }
        root.put("checks", checkList);
        List<Object> findingList = new ArrayList<>();
        for (Finding f : findings) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("check", f.check().id());
            m.put("severity", f.severity().label());
            m.put("columns", f.columns());
            m.put("summary", f.summary());
            m.put("counts", f.counts());
            m.put("examples", f.examples());
            m.put("fix", f.fix());
            m.put("defined_at", f.at().isKnown() ? f.at().toString() : null);
            m.put("acknowledged", f.acknowledged().map(a -> {
                Map<String, Object> ack = new LinkedHashMap<>();
                ack.put("reason", a.reason());
                ack.put("at", a.at().isKnown() ? a.at().toString() : null);
                return (Object) ack;
            }).orElse(null));
            findingList.add(m);
        }
        root.put("findings", findingList);
        return Json.write(root);
    }

    /** audit.md. */
    public String markdown() {
        StringBuilder md = new StringBuilder();
        md.append("# Leakage audit: ").append(recipe).append("\n\n");
        if (blocked()) {
            md.append("**Blocked.** ").append(plural(open(Severity.BLOCKING), "blocking finding is",
                            "blocking findings are"))
                    .append(" not acknowledged, so a build writes no matrix.csv (nor dictionary or provenance) until")
                    .append(" each is fixed, or acknowledged in the recipe under `audit: { acknowledge: [...] }` with a")
                    .append(" reason. Files of an earlier build in the output folder are left as they were.\n\n");
        } else {
            md.append("**Passed.** No blocking finding is open");
            long warnings = open(Severity.WARNING);
            md.append(warnings == 0 ? ", and no warning" : "; " + plural(warnings, "warning", "warnings")
                    + " to read below");
            md.append(".\n\n");
        }
        md.append("Open: ").append(counts()).append(".\n\n");
        md.append("| check | result | evidence |\n| --- | --- | --- |\n");
        for (CheckResult c : checks) {
            md.append("| ").append(c.check().id()).append(" | ").append(result(c.check())).append(" | ")
                    .append(cell(c.evidence())).append(" |\n");
        }
        md.append("\nEach check in one line:\n\n");
        for (CheckResult c : checks) {
            md.append("- `").append(c.check().id()).append("`: ").append(c.check().title()).append(".\n");
        }
        if (!findings.isEmpty()) {
            md.append("\n## Findings\n");
            for (Finding f : findings) {
                md.append("\n### ").append(f.check().id()).append(": ").append(cell(Results.columns(f.columns())))
                        .append(" (").append(f.severity().label()).append(f.isOpen() ? "" : ", acknowledged")
                        .append(")\n\n");
                md.append(f.summary()).append("\n\n");
                if (f.at().isKnown()) {
                    md.append("- defined at: ").append(f.at()).append('\n');
                }
                if (f.columns().size() > 4) {
                    md.append("- columns: ").append(String.join(", ", f.columns())).append('\n');
                }
                if (!f.counts().isEmpty()) {
                    List<String> counts = new ArrayList<>();
                    f.counts().forEach((k, v) -> counts.add(k + " " + v));
                    md.append("- counts: ").append(String.join(", ", counts)).append('\n');
                }
                if (!f.examples().isEmpty()) {
                    md.append("- examples:\n");
                    f.examples().forEach(e -> md.append("  - ").append(e).append('\n'));
                }
                md.append("- fix: ").append(f.fix()).append('\n');
                f.acknowledged().ifPresent(a -> md.append("- acknowledged")
                        .append(a.at().isKnown() ? " at " + a.at() : "").append(": ").append(a.reason()).append('\n'));
            }
        }
        return md.toString();
    }

    private static String plural(long n, String one, String many) {
        return n + " " + (n == 1 ? one : many);
    }

    private static String cell(String text) {
        return text.replace("|", "\\|").replace("\n", " ");
    }

    private static String sentence(String s) {
        String t = s.strip();
        return t.endsWith(".") ? t : t + ".";
    }
}
