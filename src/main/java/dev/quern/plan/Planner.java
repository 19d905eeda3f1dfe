package dev.quern.plan;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.Suggestions;
import dev.quern.expr.CheckedExpression;
import dev.quern.expr.Expect;
import dev.quern.expr.Expressions;
import dev.quern.recipe.FeatureSpec;
import dev.quern.recipe.LabelSpec;
import dev.quern.recipe.MeasureKind;
import dev.quern.recipe.MeasureSpec;
import dev.quern.recipe.Name;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.Span;
import dev.quern.recipe.TableSpec;
import dev.quern.schema.SourceSchema;
import dev.quern.schema.TableInfo;
import dev.quern.schema.ValueType;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The plan stage: resolves the recipe's paths, measures, lookups and label against the checked schema
 * into a {@link Plan}. Every mistake of the stage is reported together, each at its recipe position.
 */
public final class Planner {

    private final Recipe recipe;
    private final SourceSchema schema;
    private final Diagnostics problems = new Diagnostics();
    private final PathResolver paths;
    private final Protected protectedColumns;
    private final Map<String, Position> names = new LinkedHashMap<>();
    private final Scopes scopes;
    private List<RulePlan> rules = List.of();

    private Planner(Recipe recipe, SourceSchema schema) {
        this.recipe = recipe;
        this.schema = schema;
        this.paths = new PathResolver(recipe, schema, problems);
        this.protectedColumns = Protected.of(recipe);
        this.scopes = new Scopes(schema);
    }

    public static Plan plan(Recipe recipe, SourceSchema schema) {
        return new Planner(recipe, schema).plan();
    }

    private Plan plan() {
        rules = new RulePlanner(recipe, schema, problems).plan();
        Cohort cohort = cohort();
        List<OutputColumn> columns = new ArrayList<>();
        columns.add(keyColumn(cohort));
        columns.add(cutoffColumn());
        List<Block> blocks = new ArrayList<>();
        List<Lookup> lookups = new ArrayList<>();
        List<FeatureSpec.Lookup> lookupSpecs = new ArrayList<>();
        List<DerivedColumn> derived = new ArrayList<>();
        for (FeatureSpec feature : recipe.features()) {
            if (feature instanceof FeatureSpec.Aggregates a) {
                block(a, blocks.size() + 1, columns).ifPresent(blocks::add);
            } else if (feature instanceof FeatureSpec.Lookup l) {
                lookupSpecs.add(l);
                lookupColumn(l, columns);
            } else if (feature instanceof FeatureSpec.Derived d) {
                derived(d, columns).ifPresent(derived::add);
            }
        }
        lookups.addAll(new LookupPlanner(recipe, schema, paths, problems, protectedColumns).plan(lookupSpecs));
        Optional<LabelPlan> label = recipe.label().flatMap(l -> label(l, columns));
        problems.throwIfAny(Failure.RECIPE);
        return new Plan(recipe.name().text(), schema.engine(), recipe.timeZone(), recipe.cutoffs().dates(), cohort,
                blocks, lookups, derived, label, rules, columns);
    }

    private Cohort cohort() {
        String table = recipe.entity().table().text();
        ColumnRef key = paths.column("m", table, recipe.entity().key().text());
        Optional<TimeRef> since = recipe.entity().since().map(s -> new TimeRef(paths.column("m", table, s.text()),
                schema.time(table, s.text()).storage()));
        List<Cohort.Exit> exits = new ArrayList<>();
        for (Name exit : recipe.entity().until()) {
            TableSpec spec = recipe.table(exit.text()).orElseThrow();
            String alias = "x" + (exits.size() + 1);
            Optional<ColumnRef> link = paths.entityLink(spec, exit, alias);
            if (link.isEmpty() || spec.time().isEmpty()) {
                if (spec.time().isEmpty()) {
                    problems.error(exit.position(), exit.text() + " needs a 'time' to end an entity's eligibility");
                }
                continue;
            }
            String time = spec.time().get().text();
            exits.add(new Cohort.Exit(exit.text(), alias, link.get(),
                    new TimeRef(paths.column(alias, exit.text(), time), schema.time(exit.text(), time).storage())));
        }
        Optional<CheckedExpression> filter = recipe.entity().where().flatMap(w -> Expressions.compile(w.text(),
                w.start(), scopes.table(table, "m", true), Expect.CONDITION, problems));
        return new Cohort(table, "m", key, since, exits, filter);
    }

    private OutputColumn keyColumn(Cohort cohort) {
        name(cohort.key().column(), recipe.entity().key().position());
        return new OutputColumn(cohort.key().column(), Role.KEY, cohort.keyType(),
                "Key of the " + cohort.table() + " row this row describes; an identifier, never a feature.",
                List.of(cohort.key().qualified()), Optional.empty(), Optional.empty(), "never empty",
                recipe.entity().key().position());
    }

    private OutputColumn cutoffColumn() {
        name("cutoff", recipe.cutoffs().position());
        return new OutputColumn("cutoff", Role.CUTOFF, ValueType.DATE,
                "The cutoff date: every feature describes the entity as of the end of this day.", List.of(),
                Optional.empty(), Optional.empty(), "never empty", recipe.cutoffs().position());
    }

    private Optional<Block> block(FeatureSpec.Aggregates spec, int number, List<OutputColumn> columns) {
        String name = "b" + number;
        Optional<EventPath> path = paths.resolve(spec.from(), name + "_t");
        if (path.isEmpty()) {
            return Optional.empty();
        }
        String prefix = spec.prefix().map(Name::text).orElse(spec.from().defaultPrefix());
        Optional<CheckedExpression> filter = spec.where().flatMap(w -> Expressions.compile(w.text(), w.start(),
                scopes.path(path.get()), Expect.CONDITION, problems));
        Optional<String> filterNote = filterNote(path.get(), filter);
        List<Aggregate> aggregates = new ArrayList<>();
        for (MeasureSpec measure : spec.measures()) {
            Optional<ColumnRef> input = measure.column().flatMap(c -> measureInput(path.get(), measure, c));
            if (measure.column().isPresent() && input.isEmpty()) {
                continue;
            }
            for (Span window : spec.windows()) {
                String column = measure.name().map(n -> n.text().replace("{window}", window.label()))
                        .orElseGet(() -> generatedName(prefix, measure, window));
                Position at = measure.name().map(Name::position).orElse(measure.position());
                name(column, at);
                Aggregate aggregate = new Aggregate(column, measure.kind(), input, window,
                        resultType(measure.kind(), input));
                aggregates.add(aggregate);
                columns.add(Describe.aggregate(aggregate, path.get(), filterNote, at));
            }
        }
        return aggregates.isEmpty() ? Optional.empty()
                : Optional.of(new Block(name, path.get(), filter, aggregates));
    }

    private Optional<ColumnRef> measureInput(EventPath path, MeasureSpec measure, Name column) {
        Optional<ColumnRef> ref = paths.pathColumn(path, column);
        if (ref.isEmpty()) {
            return ref;
        }
        ColumnRef c = ref.get();
        Optional<String> why = protectedColumns.why(c.table(), c.column());
        if (why.isPresent() && measure.kind() != MeasureKind.DISTINCT) {
            problems.error(column.position(), c.qualified() + " is " + why.get()
                    + ": keys and identifiers never become features; distinct(" + c.column()
                    + ") counts them instead");
            return Optional.empty();
        }
        boolean fits = switch (measure.kind().input()) {
            case NUMBER -> c.type().isNumber();
            case ORDERED -> c.type().isNumber() || c.type().isTemporal() || c.type() == ValueType.TEXT;
            default -> true;
        };
        if (!fits) {
            problems.error(column.position(), measure.kind().spelling() + " needs a number column, but "
                    + c.qualified() + " holds " + c.type().label() + " ("
                    + schema.column(c.table(), c.column()).declaredType() + ")");
            return Optional.empty();
        }
        return ref;
    }

    private static String generatedName(String prefix, MeasureSpec measure, Span window) {
        String column = measure.column().map(c -> "_" + c.text()).orElse("");
        return prefix + "_" + measure.kind().spelling() + column + "_" + window.label();
    }

    private static ValueType resultType(MeasureKind kind, Optional<ColumnRef> input) {
        return switch (kind) {
            case COUNT, DISTINCT, DAYS_SINCE_FIRST, DAYS_SINCE_LAST -> ValueType.INTEGER;
            case MEAN, STDDEV -> ValueType.DECIMAL;
            case SUM -> input.orElseThrow().type() == ValueType.INTEGER ? ValueType.INTEGER : ValueType.DECIMAL;
            case MIN, MAX -> input.orElseThrow().type();
        };
    }

    private void lookupColumn(FeatureSpec.Lookup spec, List<OutputColumn> columns) {
        String column = LookupPlanner.outputName(spec);
        name(column, spec.name().map(Name::position).orElse(spec.position()));
        TableInfo table = schema.table(spec.table().text());
        if (table.column(spec.column().text()).isEmpty()) {
            problems.error(spec.column().position(), "table " + table.name() + " has no column '"
                    + spec.column().text() + "'" + Suggestions.hint(spec.column().text(), table.columns().keySet()));
            return;
        }
        protectedColumns.why(spec.table().text(), spec.column().text()).ifPresent(why ->
                problems.error(spec.column().position(), spec.table().text() + "." + spec.column().text() + " is "
                        + why + ": keys and identifiers never become features"));
        columns.add(Describe.lookup(column, recipe, spec, schema.column(spec.table().text(), spec.column().text())));
    }

    private Optional<LabelPlan> label(LabelSpec spec, List<OutputColumn> columns) {
        Optional<EventPath> path = paths.resolve(spec.from(), "y");
        if (path.isEmpty()) {
            return Optional.empty();
        }
        Optional<ColumnRef> input = spec.column().flatMap(c -> paths.pathColumn(path.get(), c));
        if (spec.column().isPresent()) {
            if (input.isEmpty()) {
                return Optional.empty();
            }
            if (!input.get().type().isNumber()) {
                problems.error(spec.column().get().position(), "a sum label needs a number column, but "
                        + input.get().qualified() + " holds " + input.get().type().label());
                return Optional.empty();
            }
        }
        ValueType type = spec.kind() == LabelSpec.Kind.SUM ? input.get().type() : ValueType.INTEGER;
        Optional<CheckedExpression> filter = spec.where().flatMap(w -> Expressions.compile(w.text(), w.start(),
                scopes.path(path.get()), Expect.CONDITION, problems));
        LabelPlan label = new LabelPlan(spec.name().text(), path.get(), spec.gap(), spec.horizon(), spec.kind(),
                input, filter, type, schema.latestOf(recipe.eventTimes()));
        name(label.column(), spec.name().position());
        columns.add(Describe.label(label, filterNote(path.get(), filter), spec.position()));
        return Optional.of(label);
    }

    /**
     * A column computed from the output columns defined before it. The label is not among its names: a
     * feature computed from the label would be the label itself.
     */
    private Optional<DerivedColumn> derived(FeatureSpec.Derived spec, List<OutputColumn> columns) {
        name(spec.name().text(), spec.name().position());
        Optional<CheckedExpression> expression = Expressions.compile(spec.expression().text(),
                spec.expression().start(), Scopes.outputs(columns), Expect.VALUE, problems);
        expression.ifPresent(e -> columns.add(Describe.derived(spec.name().text(), e, spec.position())));
        return expression.map(e -> new DerivedColumn(spec.name().text(), e));
    }

    /** What a column's rows were filtered by: the block's own filter and the rules of the path's tables. */
    private Optional<String> filterNote(EventPath path, Optional<CheckedExpression> filter) {
        List<String> notes = new ArrayList<>();
        filter.ifPresent(f -> notes.add(f.text()));
        List<String> tables = new ArrayList<>();
        tables.add(path.table());
        path.hops().forEach(h -> tables.add(h.table()));
        for (String table : tables) {
            for (RulePlan rule : rules) {
                if (rule.table().equals(table) && rule.failing() == dev.quern.recipe.RuleSpec.Failing.EXCLUDE) {
                    notes.add("rule: " + rule.describe());
                }
            }
        }
        return notes.isEmpty() ? Optional.empty() : Optional.of(String.join("; ", notes));
    }

    /** Claims an output name; a second claim is a mistake reported at both places. */
    private void name(String column, Position at) {
        Position earlier = names.putIfAbsent(column, at);
        if (earlier != null) {
            problems.error(at, "the output column '" + column + "' is defined twice (first at " + earlier
                    + "); give one of them a 'name'");
        }
    }
}
