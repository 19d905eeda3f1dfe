package dev.quern.report;

import dev.quern.audit.AuditReport;
import dev.quern.audit.CheckResult;
import dev.quern.audit.Finding;
import dev.quern.audit.Severity;
import dev.quern.plan.LabelPlan;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.plan.Role;
import dev.quern.recipe.LabelSpec;
import dev.quern.run.ColumnStats;
import dev.quern.run.RuleOutcome;
import dev.quern.run.RunResult;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;

/**
 * report.html: one self-contained page about a build, for people to look at and to print. It holds the
 * recipe summary, the data dictionary as a table a search box filters, a chart of every feature and the
 * label (inline SVG), the label balance per cutoff, point-in-time notes, the leakage audit's verdict and
 * the data rules' outcomes, and the drift against an earlier build when one is given. Nothing is fetched:
 * no scripts, styles or fonts from elsewhere.
 *
 * <p>The page is the same byte for byte when the same recipe is built on the same source, except for one
 * line: the build time, in the element with id {@value #BUILT_AT_ID}, on a line of its own.
 */
public final class HtmlReport {

    /** The id of the one element that differs between rebuilds: the build time. */
    public static final String BUILT_AT_ID = "built-at";

    /** What the build checked: the leakage audit of the matrix, and the recipe's data rules measured on the source. */
    public record Checks(AuditReport audit, List<RuleOutcome> rules) {
        public Checks {
            Objects.requireNonNull(audit, "audit");
            rules = List.copyOf(rules);
        }
    }

    /** Facts about the build that the plan and run do not hold. */
    public record Facts(String recipeFile, String recipeSha256, String toolVersion, String sourceDisplay,
                        Instant builtAt) {
        public Facts {
            Objects.requireNonNull(recipeFile, "recipeFile");
            Objects.requireNonNull(recipeSha256, "recipeSha256");
            Objects.requireNonNull(toolVersion, "toolVersion");
            Objects.requireNonNull(sourceDisplay, "sourceDisplay");
            Objects.requireNonNull(builtAt, "builtAt");
        }
    }

    private final Plan plan;
    private final RunResult run;
    private final Lineage lineage;
    private final Facts facts;
    private final Checks checks;
    private final Optional<Comparison> drift;
    private final Thresholds limits;
    private final StringBuilder out = new StringBuilder();

    private HtmlReport(Plan plan, RunResult run, Lineage lineage, Facts facts, Checks checks,
                       Optional<Comparison> drift, Thresholds limits) {
        this.plan = plan;
        this.run = run;
        this.lineage = lineage;
        this.facts = facts;
        this.checks = checks;
        this.drift = drift;
        this.limits = limits;
    }

    /** The page; {@code drift} is the comparison with an earlier build, if one was asked for. */
    public static String render(Plan plan, RunResult run, Lineage lineage, Facts facts, Checks checks,
                                Optional<Comparison> drift, Thresholds limits) {
        return new HtmlReport(plan, run, lineage, facts, checks, drift, limits).page();
    }

    private String page() {
        String name = esc(plan.recipeName());
        out.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(name).append(": modelling table report</title>\n")
                .append("<style>\n").append(STYLE).append("</style>\n</head>\n<body>\n");
        out.append("<header>\n<h1>").append(name).append("</h1>\n<p class=\"lead\">One row per ")
                .append(esc(plan.cohort().table())).append(" row and cutoff date: ").append(count(run.rows()))
                .append(" rows, ").append(plan.columns().size()).append(" columns, ").append(plan.cutoffs().size())
                .append(plan.cutoffs().size() == 1 ? " cutoff" : " cutoffs").append(".</p>\n");
        out.append("<nav><a href=\"#summary\">Summary</a> <a href=\"#dictionary-section\">Dictionary</a> ")
                .append("<a href=\"#distributions\">Distributions</a>");
        if (plan.label().isPresent()) {
            out.append(" <a href=\"#label-balance\">Label balance</a>");
        }
        out.append(" <a href=\"#point-in-time\">Point in time</a> <a href=\"#audit\">Leakage audit</a>")
                .append(" <a href=\"#rules\">Data rules</a>");
        if (drift.isPresent()) {
            out.append(" <a href=\"#drift\">Drift</a>");
        }
        out.append("</nav>\n</header>\n<main>\n");
        summary();
        dictionary();
        distributions();
        plan.label().ifPresent(this::labelBalance);
        pointInTime();
        audit();
        rules();
        drift.ifPresent(this::drift);
        out.append("</main>\n<footer>\n<p>Written by Quern ").append(esc(facts.toolVersion()))
                .append(". Every chart is drawn from the values written to matrix.csv.</p>\n");
        // The only line that differs between two builds of the same recipe on the same source.
        out.append("<p>Built <time id=\"").append(BUILT_AT_ID).append("\" datetime=\"")
                .append(facts.builtAt()).append("\">").append(facts.builtAt()).append("</time>.</p>\n");
        out.append("</footer>\n<script>\n").append(SCRIPT).append("</script>\n</body>\n</html>\n");
        return out.toString();
    }

    private void summary() {
        out.append("<section id=\"summary\">\n<h2>Summary</h2>\n<dl class=\"facts\">\n");
        fact("Recipe", "<code>" + esc(facts.recipeFile()) + "</code>");
        fact("Recipe SHA-256", "<code class=\"hash\">" + esc(facts.recipeSha256()) + "</code>");
        fact("Source", "<code>" + esc(facts.sourceDisplay()) + "</code> (" + esc(plan.engine().label()) + ")");
        StringBuilder entity = new StringBuilder("<code>" + esc(plan.cohort().table()) + "</code> by <code>"
                + esc(plan.cohort().key().column()) + "</code>");
        plan.cohort().since().ifPresent(s -> entity.append(", from <code>").append(esc(s.column().qualified()))
                .append("</code>"));
        plan.cohort().exits().forEach(e -> entity.append(", until a row in <code>").append(esc(e.table()))
                .append("</code>"));
        fact("Entity", entity.toString());
        List<LocalDate> cutoffs = plan.cutoffs();
        fact("Cutoffs", cutoffs.isEmpty() ? "none" : cutoffs.size() + ", from " + cutoffs.get(0) + " to "
                + cutoffs.get(cutoffs.size() - 1) + " (each the end of that day)");
        fact("Features", Integer.toString(plan.features().size()));
        plan.label().ifPresent(l -> fact("Label", "<code>" + esc(l.column()) + "</code>: "
                + esc(plan.columns().stream().filter(c -> c.role() == Role.LABEL).findFirst()
                        .map(OutputColumn::meaning).orElse(""))));
        plan.timeZone().ifPresent(z -> fact("Time zone", esc(z.toString())));
        fact("Rows", count(run.rows()));
        out.append("</dl>\n</section>\n");
    }

    /** The audit's verdict, each check's result and evidence, and every finding with its fix. */
    private void audit() {
        AuditReport audit = checks.audit();
        out.append("<section id=\"audit\">\n<h2>Leakage audit</h2>\n<p><strong class=\"")
                .append(audit.blocked() ? "warn" : "ok").append("\">").append(audit.blocked() ? "Blocked" : "Passed")
                .append("</strong>: ").append(esc(audit.counts()))
                .append(". <code>audit.md</code> holds the evidence in full.</p>\n")
                .append("<div class=\"wide\"><table id=\"audit-table\">\n<thead><tr><th>check</th><th>result</th>")
                .append("<th>evidence</th></tr></thead>\n<tbody>\n");
        for (CheckResult c : audit.checks()) {
            boolean open = audit.findings(c.check()).stream().anyMatch(HtmlReport::warns);
            out.append("<tr><td><code>").append(esc(c.check().id())).append("</code><div class=\"where\">")
                    .append(esc(c.check().title())).append("</div></td><td").append(open ? " class=\"warn\"" : "")
                    .append(">").append(esc(audit.result(c.check()))).append("</td><td>").append(esc(c.evidence()))
                    .append("</td></tr>\n");
        }
        out.append("</tbody>\n</table></div>\n");
        if (!audit.findings().isEmpty()) {
            out.append("<ul>\n");
            for (Finding f : audit.findings()) {
                out.append("<li").append(warns(f) ? " class=\"warn\"" : "")
                        .append("><code>").append(esc(f.check().id())).append("</code> (")
                        .append(esc(f.severity().label())).append(f.isOpen() ? "" : ", acknowledged").append(")");
                if (!f.columns().isEmpty()) {
                    out.append(" on ").append(esc(String.join(", ", f.columns())));
                }
                out.append(": ").append(esc(f.summary()));
                f.acknowledged().ifPresentOrElse(
                        a -> out.append(" Acknowledged: ").append(esc(a.reason())),
                        () -> out.append(" Fix: ").append(esc(f.fix())));
                out.append("</li>\n");
            }
            out.append("</ul>\n");
        }
        out.append("</section>\n");
    }

    /** An open finding that blocks or warns: marked on the page. */
    private static boolean warns(Finding f) {
        return f.isOpen() && f.severity() != Severity.NOTE;
    }

    /** Each data rule of the recipe: the rows it checked, the rows that failed it and what became of them. */
    private void rules() {
        out.append("<section id=\"rules\">\n<h2>Data rules</h2>\n");
        if (checks.rules().isEmpty()) {
            out.append("<p>The recipe declares no rules.</p>\n</section>\n");
            return;
        }
        out.append("<div class=\"wide\"><table id=\"rules-table\">\n<thead><tr><th>table</th><th>rule</th>")
                .append("<th class=\"num\">rows checked</th><th class=\"num\">rows failing</th><th>action</th>")
                .append("<th>examples</th></tr></thead>\n<tbody>\n");
        for (RuleOutcome o : checks.rules()) {
            out.append("<tr><td><code>").append(esc(o.rule().table())).append("</code></td><td>")
                    .append(esc(o.rule().describe())).append("</td><td class=\"num\">").append(count(o.checked()))
                    .append("</td><td class=\"num\">").append(count(o.failed())).append("</td><td")
                    .append(o.failed() > 0 ? " class=\"warn\"" : "").append(">").append(esc(o.action()))
                    .append("</td><td>").append(esc(String.join(", ", o.examples()))).append("</td></tr>\n");
        }
        out.append("</tbody>\n</table></div>\n<p class=\"note\">").append(esc(RulesReport.HOW_RULES_APPLY))
                .append(" <code>rules.md</code> has the same table.</p>\n</section>\n");
    }

    private void fact(String term, String html) {
        out.append("<dt>").append(esc(term)).append("</dt><dd>").append(html).append("</dd>\n");
    }

    private void dictionary() {
        out.append("<section id=\"dictionary-section\">\n<h2>Data dictionary</h2>\n")
                .append("<p class=\"search\"><label for=\"search\">Search the columns</label> ")
                .append("<input id=\"search\" type=\"search\" autocomplete=\"off\" ")
                .append("placeholder=\"name, source, window, words of the meaning\"> ")
                .append("<span id=\"shown\">").append(plan.columns().size()).append(" of ")
                .append(plan.columns().size()).append(" columns</span></p>\n")
                .append("<div class=\"wide\"><table id=\"dictionary\">\n<thead><tr><th>column</th><th>role</th>")
                .append("<th>type</th><th>meaning</th><th>lineage</th><th>window</th><th>when empty</th>")
                .append("<th class=\"num\">empty</th><th class=\"num\">min</th><th class=\"num\">mean</th>")
                .append("<th class=\"num\">max</th></tr></thead>\n<tbody>\n");
        for (OutputColumn c : plan.columns()) {
            ColumnStats s = run.column(c.name());
            boolean statistics = c.role() == Role.FEATURE || c.role() == Role.LABEL;
            ColumnLineage l = lineage.column(c.name());
            out.append("<tr data-column=\"").append(esc(c.name())).append("\"><td><code>").append(esc(c.name()))
                    .append("</code><div class=\"where\">").append(esc(l.recipeLine())).append("</div></td><td>")
                    .append(esc(c.role().label())).append("</td><td>")
                    .append(esc(c.type().label())).append("</td><td>").append(esc(c.meaning()))
                    .append("</td><td class=\"lineage\">").append(esc(l.oneLine())).append("</td><td>")
                    .append(esc(c.window().orElse(""))).append("</td><td>").append(esc(c.whenEmpty()))
                    .append("</td><td class=\"num\">").append(Charts.percent(s.emptyShare()))
                    .append("</td><td class=\"num\">").append(statistics ? stat(s.min()) : "")
                    .append("</td><td class=\"num\">").append(statistics ? stat(s.mean()) : "")
                    .append("</td><td class=\"num\">").append(statistics ? stat(s.max()) : "")
                    .append("</td></tr>\n");
        }
        out.append("</tbody>\n</table></div>\n</section>\n");
    }

    private static String stat(Optional<String> value) {
        return esc(value.map(DataDictionary::rounded).orElse(""));
    }

    private void distributions() {
        out.append("<section id=\"distributions\">\n<h2>Distributions</h2>\n<p>One chart per feature and for the ")
                .append("label: a histogram for numbers (one bar per value when there are few), the most frequent ")
                .append("levels for text and dates. Hover over a bar for its rows.</p>\n<div class=\"charts\">\n");
        for (OutputColumn c : plan.columns()) {
            if (c.role() != Role.FEATURE && c.role() != Role.LABEL) {
                continue;
            }
            ColumnStats s = run.column(c.name());
            boolean numeric = c.type().isNumber();
            Charts.Shape shape = numeric ? Charts.numeric(s) : Charts.text(s);
            out.append("<figure class=\"chart\" data-column=\"").append(esc(c.name())).append("\" data-kind=\"")
                    .append(numeric ? "numeric" : "levels").append("\">\n<figcaption><code>").append(esc(c.name()))
                    .append("</code> <span class=\"note\">").append(esc(c.type().label())).append(", ")
                    .append(Charts.percent(s.emptyShare())).append(" empty; ").append(esc(shape.note()))
                    .append("</span></figcaption>\n");
            String title = "Distribution of " + c.name();
            out.append(numeric ? Charts.columns("chart numeric", title, shape.bars(), "count")
                    : Charts.rows("chart levels", title, shape.bars())).append("\n</figure>\n");
        }
        out.append("</div>\n</section>\n");
    }

    private void labelBalance(LabelPlan label) {
        boolean exists = label.kind() == LabelSpec.Kind.EXISTS;
        String measure = exists ? "share with label 1" : "mean label";
        out.append("<section id=\"label-balance\">\n<h2>Label balance per cutoff</h2>\n<p><code>")
                .append(esc(label.column())).append("</code>: ").append(esc(measure))
                .append(" at each cutoff. Cutoffs whose horizon runs past the data (observed through ")
                .append(esc(label.observedThrough().map(Object::toString).orElse("unknown")))
                .append(") have no label yet.</p>\n");
        List<Charts.Bar> bars = new ArrayList<>();
        StringBuilder table = new StringBuilder();
        table.append("<div class=\"wide\"><table id=\"label-table\">\n<thead><tr><th>cutoff</th><th class=\"num\">")
                .append("rows</th><th class=\"num\">with a label</th><th class=\"num\">").append(esc(measure))
                .append("</th><th>note</th></tr></thead>\n<tbody>\n");
        for (LocalDate cutoff : plan.cutoffs()) {
            String key = cutoff.toString();
            long rows = run.rowsPerCutoff().getOrDefault(key, 0L);
            ColumnStats s = run.labelPerCutoff().get(key);
            long labelled = s == null ? 0 : s.values();
            Optional<String> mean = s == null ? Optional.empty() : s.mean();
            double value = mean.map(Double::parseDouble).orElse(0.0);
            String shown = mean.map(m -> exists ? Charts.percent(Double.parseDouble(m))
                    : DataDictionary.rounded(m)).orElse("");
            boolean complete = label.complete(cutoff);
            bars.add(new Charts.Bar(key, mean.isPresent() ? value : 0, key + ": " + (mean.isPresent()
                    ? measure + " " + shown + " of " + Charts.count(labelled) + " rows" : "no label yet")));
            table.append("<tr><td>").append(key).append("</td><td class=\"num\">").append(Charts.count(rows))
                    .append("</td><td class=\"num\">").append(Charts.count(labelled)).append("</td><td class=\"num\">")
                    .append(esc(shown)).append("</td><td>").append(complete ? "" : "horizon not yet observed")
                    .append("</td></tr>\n");
        }
        table.append("</tbody>\n</table></div>\n");
        out.append("<figure class=\"balance\">")
                .append(Charts.columns("balance-chart", measure + " per cutoff", bars, exists ? "share" : "count"))
                .append("</figure>\n").append(table).append("</section>\n");
    }

    private void pointInTime() {
        out.append("<section id=\"point-in-time\">\n<h2>Point in time</h2>\n<ul>\n")
                .append("<li>Every window ends at the end of its cutoff day: a row dated the day after is never ")
                .append("counted.</li>\n");
        plan.label().ifPresent(l -> out.append("<li>The label horizon starts the day after the cutoff")
                .append(l.gap().amount() == 0 ? "" : " plus a gap of " + esc(l.gap().label()))
                .append(", so no feature window reaches into it.</li>\n"));
        List<String> current = new ArrayList<>();
        for (ColumnLineage c : lineage.columns()) {
            boolean now = c.steps().stream().anyMatch(s -> s instanceof LineageStep.AsOf a && a.current());
            if (now) {
                current.add("<code>" + esc(c.column()) + "</code> (" + esc(String.join(", ", c.sources())) + ")");
            }
        }
        if (current.isEmpty()) {
            out.append("<li>No feature reads a table without history.</li>\n");
        } else {
            out.append("<li class=\"warn\">Read as the source holds them now, from tables that keep no history: ")
                    .append(String.join(", ", current)).append(". Their values may have been written after the ")
                    .append("cutoff.</li>\n");
        }
        out.append("</ul>\n</section>\n");
    }

    private void drift(Comparison c) {
        List<String> findings = c.findings(limits);
        out.append("<section id=\"drift\">\n<h2>Drift against an earlier build</h2>\n<p>Earlier build: <code>")
                .append(esc(c.oldName())).append("</code>. PSI over bins of the earlier build (deciles for numbers, ")
                .append("frequent levels for text, and empty values as a bin of their own); below 0.10 stable, ")
                .append("0.10 to 0.25 a moderate shift, above 0.25 a large shift. A bin without rows in one build ")
                .append("counts as a share of ").append(Bins.number(Psi.EMPTY_BIN_SHARE)).append(".</p>\n");
        if (findings.isEmpty()) {
            out.append("<p class=\"ok\">Nothing goes beyond the thresholds.</p>\n");
        } else {
            out.append("<p class=\"warn\">").append(findings.size())
                    .append(findings.size() == 1 ? " finding goes" : " findings go")
                    .append(" beyond the thresholds:</p>\n<ul class=\"findings\">\n");
            findings.forEach(f -> out.append("<li>").append(esc(f)).append("</li>\n"));
            out.append("</ul>\n");
        }
        if (!c.provenance().isEmpty()) {
            out.append("<h3>Recipe and source</h3>\n<div class=\"wide\"><table>\n<thead><tr><th>fact</th>")
                    .append("<th>earlier</th><th>this build</th></tr></thead>\n<tbody>\n");
            for (Comparison.ProvenanceChange p : c.provenance()) {
                out.append("<tr><td><code>").append(esc(p.what())).append("</code></td><td class=\"hash\">")
                        .append(esc(p.oldValue())).append("</td><td class=\"hash\">").append(esc(p.newValue()))
                        .append("</td></tr>\n");
            }
            out.append("</tbody>\n</table></div>\n");
        }
        if (!c.columnChanges().isEmpty()) {
            out.append("<h3>Columns</h3>\n<ul>\n");
            for (Comparison.ColumnChange ch : c.columnChanges()) {
                out.append("<li><code>").append(esc(ch.column())).append("</code> ").append(ch.change().label())
                        .append(" (").append(esc(ch.change() == Comparison.Change.RETYPED
                                ? ch.oldType() + " to " + ch.newType()
                                : ch.change() == Comparison.Change.ADDED ? ch.newType() : ch.oldType()))
                        .append(")</li>\n");
            }
            out.append("</ul>\n");
        }
        List<Comparison.CutoffRows> changed = c.rows().stream()
                .filter(r -> !r.inBoth() || r.oldRows().getAsLong() != r.newRows().getAsLong()).toList();
        out.append("<h3>Rows per cutoff</h3>\n<p>").append(c.rows().size() - changed.size())
                .append(" cutoffs have the same rows in both builds.</p>\n");
        if (!changed.isEmpty()) {
            out.append("<table>\n<thead><tr><th>cutoff</th><th class=\"num\">earlier</th><th class=\"num\">")
                    .append("this build</th><th class=\"num\">change</th></tr></thead>\n<tbody>\n");
            for (Comparison.CutoffRows r : changed) {
                out.append("<tr><td>").append(esc(r.cutoff())).append("</td><td class=\"num\">")
                        .append(r.oldRows().isPresent() ? Charts.count(r.oldRows().getAsLong()) : "")
                        .append("</td><td class=\"num\">")
                        .append(r.newRows().isPresent() ? Charts.count(r.newRows().getAsLong()) : "")
                        .append("</td><td class=\"num\">").append(r.inBoth() ? esc(Comparison.percent(r.change()))
                                : r.oldRows().isPresent() ? "only earlier" : "only now").append("</td></tr>\n");
            }
            out.append("</tbody>\n</table>\n");
        }
        out.append("<h3>Columns, by PSI</h3>\n<div class=\"wide\"><table id=\"drift-table\">\n<thead><tr>")
                .append("<th>column</th><th class=\"num\">PSI</th><th>reading</th><th class=\"num\">empty before</th>")
                .append("<th class=\"num\">empty now</th></tr></thead>\n<tbody>\n");
        List<Comparison.ColumnDrift> sorted = new ArrayList<>(c.drift());
        sorted.sort(java.util.Comparator.comparingDouble((Comparison.ColumnDrift d) -> d.hasPsi() ? -d.psi() : 1)
                .thenComparing(Comparison.ColumnDrift::column));
        for (Comparison.ColumnDrift d : sorted) {
            String reading = d.hasPsi() ? d.reading().name().toLowerCase(Locale.ROOT) : "none";
            out.append("<tr><td><code>").append(esc(d.column())).append("</code></td><td class=\"num\">")
                    .append(d.hasPsi() ? Comparison.fixed(d.psi()) : "").append("</td><td><span class=\"badge ")
                    .append(reading).append("\">").append(d.hasPsi() ? esc(d.reading().label()) : "no rows")
                    .append("</span></td><td class=\"num\">").append(Charts.percent(d.oldEmptyShare()))
                    .append("</td><td class=\"num\">").append(Charts.percent(d.newEmptyShare())).append("</td></tr>\n");
        }
        out.append("</tbody>\n</table></div>\n");
        List<Comparison.ColumnDrift> shifted = sorted.stream()
                .filter(d -> d.hasPsi() && d.reading() != Psi.Reading.STABLE).toList();
        if (!shifted.isEmpty()) {
            out.append("<p>Bin shares of the columns that moved (grey earlier, blue now):</p>\n")
                    .append("<div class=\"charts\">\n");
            for (Comparison.ColumnDrift d : shifted) {
                out.append("<figure class=\"drift\" data-column=\"").append(esc(d.column()))
                        .append("\"><figcaption><code>")
                        .append(esc(d.column())).append("</code> <span class=\"note\">PSI ")
                        .append(Comparison.fixed(d.psi())).append("</span></figcaption>")
                        .append(Charts.paired("Bin shares of " + d.column() + ", earlier and now", d.bins()))
                        .append("</figure>\n");
            }
            out.append("</div>\n");
        }
        out.append("</section>\n");
    }

    private static String esc(String text) {
        return Html.escape(text);
    }

    private static String count(long n) {
        return Charts.count(n);
    }

    private static final String STYLE = """
            :root { --ink: #1d2433; --muted: #5b6475; --line: #d9dee7; --bar: #3b6ea5; --old: #a3abb8;
              --warn: #9a3412; --ok: #166534; --paper: #ffffff; --band: #f5f7fa; }
            * { box-sizing: border-box; }
            body { margin: 0; color: var(--ink); background: var(--paper);
              font: 15px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif; }
            header, main, footer { max-width: 1280px; margin: 0 auto; padding: 0 20px; }
            header { padding-top: 16px; border-bottom: 1px solid var(--line); }
            h1 { margin: 0 0 4px; font-size: 24px; }
            h2 { margin: 28px 0 8px; font-size: 19px; border-bottom: 1px solid var(--line); padding-bottom: 4px; }
            h3 { margin: 18px 0 6px; font-size: 16px; }
            .lead { margin: 0 0 8px; color: var(--muted); }
            nav { margin: 0 0 10px; }
            nav a { margin-right: 14px; color: var(--bar); text-decoration: none; }
            code { font: 13px ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; }
            .hash { word-break: break-all; }
            dl.facts { display: grid; grid-template-columns: max-content 1fr; gap: 4px 16px; margin: 0; }
            dl.facts dt { color: var(--muted); }
            dl.facts dd { margin: 0; }
            .wide { overflow-x: auto; }
            table { border-collapse: collapse; width: 100%; font-size: 13px; }
            th, td { text-align: left; vertical-align: top; padding: 4px 6px; border-bottom: 1px solid var(--line); }
            thead th { position: sticky; top: 0; background: var(--band); }
            td.num, th.num { text-align: right; white-space: nowrap; font-variant-numeric: tabular-nums; }
            td.lineage { font: 11.5px ui-monospace, SFMono-Regular, Menlo, Consolas, monospace; color: var(--muted);
              min-width: 210px; word-break: break-word; }
            #dictionary { font-size: 12.5px; }
            #dictionary td:nth-child(4) { min-width: 190px; }
            #dictionary td:nth-child(7) { min-width: 110px; }
            .where { font-size: 11px; color: var(--muted); }
            p.search { display: flex; gap: 10px; align-items: center; flex-wrap: wrap; }
            #search { flex: 0 1 420px; font: inherit; padding: 5px 8px; border: 1px solid var(--line);
              border-radius: 4px; }
            #shown { color: var(--muted); }
            .charts { display: grid; grid-template-columns: repeat(auto-fill, minmax(340px, 1fr)); gap: 14px; }
            figure { margin: 0; padding: 8px; border: 1px solid var(--line); border-radius: 6px; break-inside: avoid; }
            figcaption { font-size: 13px; margin-bottom: 4px; }
            .note { color: var(--muted); }
            svg { display: block; max-width: 100%; height: auto; }
            svg rect { fill: var(--bar); }
            svg rect.old { fill: var(--old); }
            svg .tick { font-size: 10px; fill: var(--muted); }
            svg .axis { stroke: var(--line); }
            figure.balance { max-width: 680px; }
            .warn { color: var(--warn); }
            .ok { color: var(--ok); }
            .badge { padding: 1px 6px; border-radius: 8px; font-size: 12px; background: var(--band); }
            .badge.moderate { background: #fef3c7; }
            .badge.large { background: #fee2e2; color: var(--warn); }
            footer { margin-top: 32px; padding-bottom: 24px; color: var(--muted); font-size: 13px;
              border-top: 1px solid var(--line); }
            @media print {
              body { font-size: 11px; }
              header, main, footer { max-width: none; padding: 0; }
              nav, p.search { display: none; }
              tr[hidden] { display: table-row; }
              figure[hidden] { display: block; }
              thead th { position: static; }
              .wide { overflow: visible; }
              h2 { break-after: avoid; }
              tr, figure { break-inside: avoid; }
              .charts { grid-template-columns: repeat(2, 1fr); }
              a { color: inherit; text-decoration: none; }
            }
            """;

    /** Filters the dictionary and the charts by the search box; {@code #search=words} fills it on load. */
    private static final String SCRIPT = """
            (function () {
              'use strict';
              var box = document.getElementById('search');
              var shown = document.getElementById('shown');
              var rows = Array.prototype.slice.call(document.querySelectorAll('#dictionary tbody tr'));
              var charts = Array.prototype.slice.call(document.querySelectorAll('#distributions figure'));
              function apply(query) {
                var q = query.trim().toLowerCase();
                var visible = {};
                var n = 0;
                rows.forEach(function (row) {
                  var hit = q === '' || row.textContent.toLowerCase().indexOf(q) >= 0;
                  row.hidden = !hit;
                  if (hit) { n++; visible[row.getAttribute('data-column')] = true; }
                });
                charts.forEach(function (figure) {
                  figure.hidden = !visible[figure.getAttribute('data-column')];
                });
                shown.textContent = n + ' of ' + rows.length + ' columns';
              }
              function fromAddress() {
                var m = /(?:^#|&)search=([^&]*)/.exec(window.location.hash);
                return m ? decodeURIComponent(m[1].replace(/\\+/g, ' ')) : '';
              }
              box.addEventListener('input', function () {
                apply(box.value);
                try {
                  history.replaceState(null, '', box.value ? '#search=' + encodeURIComponent(box.value) : '#');
                } catch (e) {
                  // Some browsers refuse to change the address of a local file; the filter still works.
                }
              });
              window.addEventListener('hashchange', function () { box.value = fromAddress(); apply(box.value); });
              box.value = fromAddress();
              apply(box.value);
              document.documentElement.setAttribute('data-ready', 'yes');
            })();
            """;
}
