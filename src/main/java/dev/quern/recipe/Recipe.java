package dev.quern.recipe;

import dev.quern.Position;
import java.time.ZoneId;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * A parsed recipe: what the user wrote, with every value's position, and nothing checked against the
 * source yet. {@code text} is the file as read, for the recipe hash in provenance.
 */
public record Recipe(
        String file,
        String text,
        Name name,
        Name source,
        Optional<ZoneId> timeZone,
        EntitySpec entity,
        CutoffSpec cutoffs,
        Map<String, TableSpec> tables,
        List<RuleSpec> rules,
        Optional<LabelSpec> label,
        List<FeatureSpec> features,
        List<EncodingSpec> encodings,
        Optional<SplitSpec> split,
        AuditSpec audit) {

    public Recipe {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(text, "text");
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(timeZone, "timeZone");
        Objects.requireNonNull(entity, "entity");
        Objects.requireNonNull(cutoffs, "cutoffs");
        tables = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(tables));
        rules = List.copyOf(rules);
        Objects.requireNonNull(label, "label");
        features = List.copyOf(features);
        encodings = List.copyOf(encodings);
        Objects.requireNonNull(split, "split");
        Objects.requireNonNull(audit, "audit");
    }

    /** A recipe without rules. */
    public Recipe(String file, String text, Name name, Name source, Optional<ZoneId> timeZone, EntitySpec entity,
                  CutoffSpec cutoffs, Map<String, TableSpec> tables, Optional<LabelSpec> label,
                  List<FeatureSpec> features) {
        this(file, text, name, source, timeZone, entity, cutoffs, tables, List.of(), label, features, List.of(),
                Optional.empty(), AuditSpec.DEFAULT);
    }

    /** Every event time the recipe declares, as {@code table.column}, in declaration order. */
    public java.util.Set<String> eventTimes() {
        java.util.Set<String> out = new java.util.LinkedHashSet<>();
        tables.values().forEach(t -> t.time().ifPresent(c -> out.add(t.name().text() + "." + c.text())));
        return out;
    }

    public Optional<TableSpec> table(String name) {
        return Optional.ofNullable(tables.get(name));
    }

    /** The same recipe reading another source: the command line's {@code --source}. */
    public Recipe withSource(String url) {
        return new Recipe(file, text, name, new Name(url, Position.NONE), timeZone, entity, cutoffs, tables, rules,
                label, features, encodings, split, audit);
    }
}
