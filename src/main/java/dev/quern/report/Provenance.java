package dev.quern.report;

import dev.quern.plan.LabelPlan;
import dev.quern.plan.Plan;
import dev.quern.run.RuleOutcome;
import dev.quern.run.RunResult;
import dev.quern.schema.SourceSchema;
import dev.quern.schema.TimeColumnFacts;
import java.time.Duration;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * provenance.json: enough to tell later whether a rerun saw the same recipe and the same data — the
 * recipe's hash, the tool version, the source's fingerprint, the cutoffs, row and column counts and
 * timings. The source appears only in its printable form, never with a secret.
 */
public final class Provenance {

    private Provenance() {
    }

    /** Facts about the build that the stages do not hold themselves. */
    public record Facts(String recipeFile, String recipeSha256, String toolVersion, String sourceDisplay,
                        Optional<String> sourceFileSha256, Instant builtAt, Map<String, Duration> timings) {
    }

    public static String render(Plan plan, SourceSchema schema, RunResult run, List<RuleOutcome> rules,
                                Facts facts) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("quern_version", facts.toolVersion());
        root.put("built_at", facts.builtAt().toString());
        root.put("recipe", Map.of("name", plan.recipeName(), "file", facts.recipeFile(), "sha256",
                facts.recipeSha256()));
        Map<String, Object> source = new LinkedHashMap<>();
        source.put("url", facts.sourceDisplay());
        source.put("engine", plan.engine().label());
        facts.sourceFileSha256().ifPresent(h -> source.put("file_sha256", h));
        source.put("time_columns", timeColumns(schema));
        root.put("source", source);
        root.put("time_zone", plan.timeZone().map(Object::toString).orElse(null));
        root.put("cutoffs", plan.cutoffs().stream().map(Object::toString).toList());
        root.put("rows", run.rows());
        root.put("columns", plan.columns().size());
        root.put("features", plan.features().size());
        root.put("rows_per_cutoff", run.rowsPerCutoff());
        plan.label().ifPresent(l -> root.put("label", label(l, plan, run)));
        root.put("rules", RulesReport.json(rules));
        Map<String, Object> timings = new LinkedHashMap<>();
        facts.timings().forEach((k, v) -> timings.put(k + "_ms", v.toMillis()));
        root.put("timings", timings);
        return Json.write(root);
    }

    private static List<Object> timeColumns(SourceSchema schema) {
        return schema.times().values().stream().<Object>map(Provenance::timeColumn).toList();
    }

    private static Map<String, Object> timeColumn(TimeColumnFacts f) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("column", f.table() + "." + f.column());
        m.put("storage", f.storage().name().toLowerCase(java.util.Locale.ROOT));
        m.put("rows", f.rows());
        m.put("empty", f.nulls());
        m.put("earliest", f.earliest().map(Object::toString).orElse(null));
        m.put("latest", f.latest().map(Object::toString).orElse(null));
        return m;
    }

    private static Map<String, Object> label(LabelPlan label, Plan plan, RunResult run) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("column", label.column());
        m.put("observed_through", label.observedThrough().map(Object::toString).orElse(null));
        long incomplete = 0;
        List<String> incompleteCutoffs = new java.util.ArrayList<>();
        for (var cutoff : plan.cutoffs()) {
            if (!label.complete(cutoff)) {
                incompleteCutoffs.add(cutoff.toString());
                incomplete += run.rowsPerCutoff().getOrDefault(cutoff.toString(), 0L);
            }
        }
        m.put("rows_with_label", run.rows() - incomplete);
        m.put("rows_without_label", incomplete);
        m.put("cutoffs_without_label", incompleteCutoffs);
        return m;
    }
}
