package dev.quern.plan;

import dev.quern.Position;
import dev.quern.expr.Binding;
import dev.quern.expr.CheckedExpression;
import dev.quern.recipe.FeatureSpec;
import dev.quern.recipe.MeasureKind;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.TableSpec;
import dev.quern.schema.ColumnInfo;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** Writes each output column's data dictionary entry from what defined it. */
final class Describe {

    private Describe() {
    }

    static OutputColumn aggregate(Aggregate a, EventPath path, Optional<String> filter, Position at) {
        String rows = Words.path(path) + " rows";
        String what = switch (a.kind()) {
            case COUNT -> "Number of " + rows;
            case DAYS_SINCE_FIRST -> "Whole days from the date of the first of the " + rows + " to the cutoff date,";
            case DAYS_SINCE_LAST -> "Whole days from the date of the last of the " + rows + " to the cutoff date,";
            case DISTINCT -> "Number of distinct non-empty values of " + a.input().orElseThrow().qualified()
                    + " over " + rows;
            default -> capitalised(a.kind().phrase()) + " " + a.input().orElseThrow().qualified() + " over " + rows;
        };
        String meaning = what + " " + Words.window(a.window()) + ".";
        List<String> sources = new ArrayList<>();
        sources.add(path.time().column().qualified());
        a.input().ifPresent(c -> sources.add(c.qualified()));
        return new OutputColumn(a.column(), Role.FEATURE, a.type(), meaning, sources,
                Optional.of(a.window().label()), filter, whenEmpty(a.kind()), at);
    }

    static OutputColumn lookup(String column, Recipe recipe, FeatureSpec.Lookup spec, ColumnInfo source) {
        String table = spec.table().text();
        Optional<TableSpec> t = recipe.table(table);
        String meaning;
        String whenEmpty;
        if (table.equals(recipe.entity().table().text())) {
            meaning = "The entity's " + source.name() + " as the source holds it now (" + table
                    + " keeps no history of it).";
            whenEmpty = "empty when the source has no value";
        } else if (t.isPresent() && t.get().history().isPresent()) {
            meaning = source.name() + " of the " + table + " row in force at the end of the cutoff day.";
            whenEmpty = "empty when no row is in force";
        } else {
            meaning = source.name() + " of the latest " + table + " row at or before the end of the cutoff day.";
            whenEmpty = "empty when there is no such row";
        }
        return new OutputColumn(column, Role.FEATURE, source.type(), capitalised(meaning),
                List.of(table + "." + source.name()),
                Optional.empty(), Optional.empty(), whenEmpty, spec.position());
    }

    static OutputColumn derived(String column, CheckedExpression expression, Position at) {
        List<String> uses = expression.columns().stream().map(Binding::name).distinct().toList();
        return new OutputColumn(column, Role.FEATURE, expression.type(), "Computed from other columns of the row as "
                + expression.text() + ".", uses, Optional.empty(), Optional.empty(),
                "empty when an input is empty or the formula is undefined (such as a division by zero)", at);
    }

    static OutputColumn label(LabelPlan label, Optional<String> filter, Position at) {
        String rows = Words.path(label.path()) + " rows";
        String horizon = "in the " + Words.span(label.horizon()) + " after the end of the cutoff day"
                + (label.gap().amount() == 0 ? "" : " plus a gap of " + Words.span(label.gap()));
        String what = switch (label.kind()) {
            case EXISTS -> "1 when there is at least one of the " + rows + " " + horizon + ", else 0.";
            case COUNT -> "Number of " + rows + " " + horizon + ".";
            case SUM -> "Sum of " + label.input().orElseThrow().qualified() + " over " + rows + " " + horizon + ".";
        };
        List<String> sources = new ArrayList<>();
        sources.add(label.path().time().column().qualified());
        label.input().ifPresent(c -> sources.add(c.qualified()));
        String whenEmpty = "empty when the horizon is not yet wholly observed (ends after "
                + label.observedThrough().map(Object::toString).orElse("the data") + ")";
        return new OutputColumn(label.column(), Role.LABEL, label.type(), what, sources,
                Optional.of(label.horizon().label()), filter, whenEmpty, at);
    }

    private static String whenEmpty(MeasureKind kind) {
        return switch (kind) {
            case COUNT, SUM, DISTINCT -> "0 when the window has no rows";
            case STDDEV -> "empty when the window has fewer than two values";
            default -> "empty when the window has no rows";
        };
    }

    private static String capitalised(String s) {
        return Character.toUpperCase(s.charAt(0)) + s.substring(1);
    }
}
