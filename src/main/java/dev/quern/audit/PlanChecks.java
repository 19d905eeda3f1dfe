package dev.quern.audit;

import static dev.quern.audit.Results.columns;
import static dev.quern.audit.Results.count;
import static dev.quern.audit.Results.list;

import dev.quern.Position;
import dev.quern.plan.Aggregate;
import dev.quern.plan.Block;
import dev.quern.plan.LabelPlan;
import dev.quern.plan.Lookup;
import dev.quern.plan.LookupColumn;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.recipe.Link;
import dev.quern.recipe.MeasureKind;
import dev.quern.recipe.Name;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.SplitSpec;
import dev.quern.recipe.Span;
import dev.quern.recipe.TableSpec;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

/** The checks decided from the plan and the recipe alone: the label horizon, the time split and sensitive columns. */
final class PlanChecks {

    /** The caution the sensitive check gives, with the columns it is about. */
    static final String CAUTION = "Decisions about people made with models are regulated in many places (credit,"
            + " insurance, employment): follow local law and the organisation's review before using these columns,"
            + " and columns derived from them, in a model.";

    private final Recipe recipe;
    private final Plan plan;
    private final Boundaries boundaries;
    private final Results results;

    PlanChecks(Recipe recipe, Plan plan, Boundaries boundaries, Results results) {
        this.recipe = recipe;
        this.plan = plan;
        this.boundaries = boundaries;
        this.results = results;
    }

    /**
     * Windows end with the cutoff day: a block reads rows before {@code visibleUntil}, a lookup the row in
     * force, or the latest one, before it. The horizon starts at {@code visibleUntil} moved on by the gap. So
     * they cannot overlap in a plan; this check shows it for every cutoff, with the boundaries the audit uses.
     */
    void horizon() {
        if (plan.label().isEmpty()) {
            results.notApplicable(Check.HORIZON, "The recipe has no label.");
            return;
        }
        LabelPlan label = plan.label().get();
        List<String> overlaps = new ArrayList<>();
        long closest = Long.MAX_VALUE;
        for (LocalDate cutoff : plan.cutoffs()) {
            LocalDate seenUntil = boundaries.visibleUntil(cutoff);
            for (Block b : plan.blocks()) {
                for (Span w : b.windows()) {
                    if (boundaries.windowStart(w, cutoff).isAfter(seenUntil)) {
                        overlaps.add("cutoff " + cutoff + ": window " + w.label() + " starts after it ends");
                    }
                }
            }
            LocalDate starts = label.start().at(cutoff);
            closest = Math.min(closest, ChronoUnit.DAYS.between(seenUntil, starts));
            if (seenUntil.isAfter(starts)) {
                overlaps.add("cutoff " + cutoff + ": windows and lookups read rows before " + seenUntil
                        + ", the horizon of " + label.column() + " starts " + starts);
            }
        }
        List<String> features = plan.features().stream().map(OutputColumn::name).toList();
        if (!overlaps.isEmpty()) {
            results.find(Finding.of(Check.HORIZON, Severity.BLOCKING, features,
                    "At " + count(overlaps.size()) + " of " + count(plan.cutoffs().size()) + " cutoffs the features"
                            + " read rows from the label's horizon.",
                    Map.of("cutoffs", (long) overlaps.size()), overlaps.subList(0, Math.min(3, overlaps.size())),
                    "Windows end with the cutoff day and the horizon starts after it, so a compiled plan cannot"
                            + " overlap: report this as a bug in Quern.",
                    Position.NONE));
        }
        String gap = label.gap().amount() == 0 ? "no gap" : "a gap of " + label.gap().label();
        results.pass(Check.HORIZON, "Every window and lookup reads rows before the day after the cutoff; the horizon"
                + " of " + label.column() + " (" + label.horizon().label() + ", " + gap + ") starts "
                + (closest == 0 ? "on that day" : closest + " day(s) later at the least") + ", at each of the "
                + count(plan.cutoffs().size()) + " cutoffs. Windows only reach back from the cutoff and spans are"
                + " never negative, so a recipe cannot make them overlap.");
    }

    /**
     * Rows of a part used for fitting (train, then validation) whose label horizon ends after the first
     * cutoff of a later part: their labels were observed during the later part's period.
     */
    void timeSplit(Map<String, Long> labelledPerCutoff) {
        if (recipe.split().isEmpty()) {
            results.notApplicable(Check.TIME_SPLIT, "The recipe has no split.");
            return;
        }
        if (plan.label().isEmpty()) {
            results.notApplicable(Check.TIME_SPLIT, "The recipe has no label, so no horizon can reach across parts.");
            return;
        }
        LabelPlan label = plan.label().get();
        List<SplitSpec.Part> parts = new ArrayList<>();
        for (String name : List.of("train", "validation", "test")) {
            recipe.split().get().parts().stream().filter(p -> p.name().text().equals(name)).findFirst()
                    .ifPresent(parts::add);
        }
        List<String> evidence = new ArrayList<>();
        for (SplitSpec.Part p : parts) {
            List<LocalDate> in = cutoffsOf(p);
            evidence.add(p.name().text() + " " + (in.isEmpty() ? "no cutoffs"
                    : count(in.size()) + " cutoff(s) " + in.get(0) + " to " + in.get(in.size() - 1)));
        }
        for (int i = 0; i < parts.size(); i++) {
            for (int j = i + 1; j < parts.size(); j++) {
                compare(parts.get(i), parts.get(j), label, labelledPerCutoff);
            }
        }
        results.pass(Check.TIME_SPLIT, "Parts: " + list(evidence) + "; the horizon of " + label.column() + " is "
                + label.horizon().label() + (label.gap().amount() == 0 ? "" : " after a gap of " + label.gap().label())
                + ".");
    }

    private void compare(SplitSpec.Part earlier, SplitSpec.Part later, LabelPlan label, Map<String, Long> labelled) {
        List<LocalDate> fitted = cutoffsOf(earlier);
        List<LocalDate> judged = cutoffsOf(later);
        if (fitted.isEmpty() || judged.isEmpty()) {
            return;
        }
        LocalDate first = judged.get(0);
        List<String> examples = new ArrayList<>();
        List<LocalDate> reaching = new ArrayList<>();
        long rows = 0;
        for (LocalDate c : fitted) {
            LocalDate lastDay = label.end().at(c).minusDays(1);
            boolean shared = judged.contains(c);
            if (shared || lastDay.isAfter(first)) {
                long n = labelled.getOrDefault(c.toString(), 0L);
                if (n == 0) {
                    continue;
                }
                reaching.add(c);
                rows += n;
                if (examples.size() < SourceRows.EXAMPLES) {
                    examples.add(shared ? "cutoff " + c + " is in both " + earlier.name().text() + " and "
                            + later.name().text()
                            : "cutoff " + c + ": " + count(n) + " labelled rows observed through " + lastDay + ", after "
                            + later.name().text() + " starts at " + first);
                }
            }
        }
        if (reaching.isEmpty()) {
            return;
        }
        LocalDate safe = null;
        for (LocalDate c : plan.cutoffs()) {
            if (!label.end().at(c).minusDays(1).isAfter(first) && !judged.contains(c)) {
                safe = c;
            }
        }
        String fix = safe == null
                ? "Start " + later.name().text() + " later, so that every " + earlier.name().text() + " label horizon"
                + " ends by its first cutoff."
                : "End " + earlier.name().text() + " at " + safe + " (the last cutoff whose horizon ends by " + first
                + ") or start " + later.name().text() + " later: leave at least the label horizon between the parts.";
        Map<String, Object> counts = new LinkedHashMap<>();
        counts.put("rows", rows);
        counts.put("cutoffs", (long) reaching.size());
        results.find(Finding.of(Check.TIME_SPLIT, Severity.BLOCKING, List.of(label.column()),
                count(rows) + " " + earlier.name().text() + " rows at " + count(reaching.size()) + " cutoff(s) ("
                        + list(reaching.stream().map(LocalDate::toString).toList()) + ") have labels observed after "
                        + later.name().text() + " starts at " + first + ": a model fitted on them knows outcomes of the "
                        + later.name().text() + " period.",
                counts, examples, fix, recipe.split().get().position()));
    }

    private List<LocalDate> cutoffsOf(SplitSpec.Part part) {
        return plan.cutoffs().stream().filter(part::holds).toList();
    }

    /**
     * Columns marked sensitive, and the columns read from them, get a note with the caution. Keys, link columns
     * and identifiers never give a feature its value: the planner refuses them; the audit shows it for the
     * plan at hand (a distinct count of keys counts them, it does not show them).
     */
    void sensitive() {
        Set<String> marked = new LinkedHashSet<>();
        for (TableSpec t : recipe.tables().values()) {
            t.sensitive().forEach(s -> marked.add(t.name().text() + "." + s.text()));
        }
        Set<String> keys = protectedColumns();
        List<String> reading = new ArrayList<>();
        Set<String> read = new LinkedHashSet<>();
        for (OutputColumn c : plan.features()) {
            List<String> hits = c.sources().stream().filter(marked::contains).toList();
            if (!hits.isEmpty()) {
                reading.add(c.name());
                read.addAll(hits);
            }
        }
        List<String> keyValues = new ArrayList<>();
        List<String> keyCounts = new ArrayList<>();
        for (Block b : plan.blocks()) {
            for (Aggregate a : b.aggregates()) {
                a.input().filter(in -> keys.contains(in.qualified())).ifPresent(in ->
                        (a.kind() == MeasureKind.DISTINCT ? keyCounts : keyValues).add(a.column()));
            }
        }
        for (Lookup l : plan.lookups()) {
            for (LookupColumn c : l.columns()) {
                if (keys.contains(c.source().qualified())) {
                    keyValues.add(c.column());
                }
            }
        }
        if (!reading.isEmpty()) {
            results.find(Finding.of(Check.SENSITIVE, Severity.NOTE, reading,
                    columns(reading) + " " + (reading.size() == 1 ? "reads" : "read") + " "
                            + list(new ArrayList<>(read)) + ", marked sensitive. " + CAUTION,
                    Map.of("columns", (long) reading.size()), List.of(), CAUTION, position(reading.get(0))));
        }
        if (!keyValues.isEmpty()) {
            results.find(Finding.of(Check.SENSITIVE, Severity.BLOCKING, keyValues, columns(keyValues)
                            + " take the value of a key, link or identifier column: rows about people are identified"
                            + " by them.", Map.of("columns", (long) keyValues.size()), List.of(),
                    "Leave keys and identifiers out of the features; report this as a bug in Quern, whose planner"
                            + " should have refused them.", position(keyValues.get(0))));
        }
        String sensitive = marked.isEmpty() ? "No column is marked sensitive."
                : "Marked sensitive: " + list(new ArrayList<>(marked)) + (reading.isEmpty() ? ", read by no feature."
                : ", read by " + columns(reading) + ".");
        results.pass(Check.SENSITIVE, sensitive + " Keys, link columns and identifiers (" + count(keys.size())
                + ") give no feature its value" + (keyCounts.isEmpty() ? "" : "; " + columns(keyCounts)
                + " count distinct values of one") + ": the planner refuses them, and the audit found "
                + (keyValues.isEmpty() ? "none" : count(keyValues.size())) + " in this plan.");
    }

    private Set<String> protectedColumns() {
        Set<String> keys = new LinkedHashSet<>();
        keys.add(recipe.entity().table().text() + "." + recipe.entity().key().text());
        for (TableSpec t : recipe.tables().values()) {
            String table = t.name().text();
            t.key().ifPresent(k -> keys.add(table + "." + k.text()));
            for (Link l : t.links()) {
                keys.add(table + "." + l.column().text());
            }
            for (Name id : t.identifiers()) {
                keys.add(table + "." + id.text());
            }
        }
        return keys;
    }

    private Position position(String column) {
        return plan.columns().stream().filter(c -> c.name().equals(column)).map(OutputColumn::definedAt)
                .findFirst().orElse(Position.NONE);
    }
}
