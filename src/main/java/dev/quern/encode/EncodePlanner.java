package dev.quern.encode;

import dev.quern.Diagnostics;
import dev.quern.Failure;
import dev.quern.Position;
import dev.quern.Suggestions;
import dev.quern.plan.LabelPlan;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Plan;
import dev.quern.plan.Role;
import dev.quern.recipe.EncodingSpec;
import dev.quern.recipe.Name;
import dev.quern.recipe.Recipe;
import dev.quern.recipe.SplitSpec;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Checks the recipe's {@code encode} and {@code split} against the plan's output columns: known kinds and
 * options, chains that make sense, number steps on number columns, no encoding of keys, cutoff or label,
 * and a split whose training labels end before the test period starts. Every mistake is reported at once.
 */
final class EncodePlanner {

    static final int DEFAULT_TOP = 10;
    static final double DEFAULT_M = 10.0;
    static final int DEFAULT_BINS = 4;

    private final Recipe recipe;
    private final Plan plan;
    private final Diagnostics problems = new Diagnostics();

    EncodePlanner(Recipe recipe, Plan plan) {
        this.recipe = recipe;
        this.plan = plan;
    }

    EncodePlan plan() {
        List<ColumnEncoding> columns = new ArrayList<>();
        Map<String, Position> seen = new HashMap<>();
        for (EncodingSpec spec : recipe.encodings()) {
            Position earlier = seen.putIfAbsent(spec.column().text(), spec.column().position());
            if (earlier != null) {
                problems.error(spec.column().position(), spec.column().text() + " is encoded twice (first at "
                        + earlier + "): write one chain, e.g. [log1p, standardise]");
                continue;
            }
            column(spec).ifPresent(columns::add);
        }
        recipe.split().ifPresent(this::checkSplit);
        problems.throwIfAny(Failure.RECIPE);
        columns.sort(Comparator.comparingInt(ColumnEncoding::index));
        return new EncodePlan(plan, columns, recipe.split(), trainingCutoffs(), trainingRule());
    }

    // ------------------------------------------------------------------------------------------ columns

    private Optional<ColumnEncoding> column(EncodingSpec spec) {
        Name name = spec.column();
        int index = indexOf(name.text());
        if (index < 0) {
            List<String> features = plan.columns().stream().filter(c -> c.role() == Role.FEATURE)
                    .map(OutputColumn::name).toList();
            problems.error(name.position(), "there is no output column '" + name.text() + "' to encode"
                    + Suggestions.hint(name.text(), features));
            return Optional.empty();
        }
        OutputColumn source = plan.columns().get(index);
        switch (source.role()) {
            case KEY -> {
                problems.error(name.position(), name.text() + " is the entity key: keys identify rows and are "
                        + "never encoded");
                return Optional.empty();
            }
            case CUTOFF -> {
                problems.error(name.position(), "the cutoff dates rows and is never encoded");
                return Optional.empty();
            }
            case LABEL -> {
                problems.error(name.position(), name.text() + " is the label: encoding it would hand the model "
                        + "its answer");
                return Optional.empty();
            }
            default -> {
            }
        }
        int errors = problems.all().size();
        List<Step> steps = new ArrayList<>();
        for (EncodingSpec.Step written : spec.steps()) {
            step(written, source).ifPresent(steps::add);
        }
        if (problems.all().size() > errors || steps.isEmpty()) {
            return Optional.empty();
        }
        chain(steps, source);
        return problems.all().size() > errors ? Optional.empty()
                : Optional.of(new ColumnEncoding(source, index, steps, spec.position()));
    }

    private Optional<Step> step(EncodingSpec.Step written, OutputColumn source) {
        Name kindName = written.kind();
        Optional<Kind> kind = Kind.of(kindName.text());
        if (kind.isEmpty()) {
            problems.error(kindName.position(), "unknown encoding '" + kindName.text() + "'"
                    + Suggestions.hint(kindName.text(), Kind.spellings()) + "; the encodings are "
                    + String.join(", ", Kind.spellings()));
            return Optional.empty();
        }
        Kind k = kind.get();
        Map<String, Name> options = new HashMap<>();
        boolean ok = true;
        for (Map.Entry<String, Name> option : written.options().entrySet()) {
            String key = option.getKey().isEmpty() ? k.mainOption() : option.getKey();
            if (key.isEmpty()) {
                problems.error(option.getValue().position(), k.spelling() + " takes no options");
                ok = false;
            } else if (!k.options().contains(key)) {
                problems.error(option.getValue().position(), k.spelling() + " has no option '" + key + "'"
                        + Suggestions.hint(key, k.options()) + "; "
                        + (k.options().isEmpty() ? "it takes none" : "its options: " + String.join(", ", k.options())));
                ok = false;
            } else {
                options.put(key, option.getValue());
            }
        }
        if (!ok) {
            return Optional.empty();
        }
        Position at = kindName.position();
        if (k.numeric() && !source.type().isNumber()) {
            problems.error(at, k.spelling() + " needs a number column, but " + source.name() + " holds "
                    + source.type().label());
            return Optional.empty();
        }
        return switch (k) {
            case ONE_HOT -> whole(options.get("top"), "top", 1, DEFAULT_TOP).map(top -> new Step.OneHot(top, at));
            case FREQUENCY -> Optional.of(new Step.Frequency(at));
            case TARGET_MEAN -> targetMean(options.get("m"), at);
            case BINS -> whole(options.get("count"), "count", 2, DEFAULT_BINS).map(n -> new Step.Bins(n, at));
            case LOG1P -> Optional.of(new Step.Log1p(at));
            case STANDARDISE -> Optional.of(new Step.Standardise(at));
            case MISSING -> Optional.of(new Step.Missing(at));
            case IMPUTE -> impute(options.get("with"), at);
        };
    }

    private Optional<Integer> whole(Name value, String option, int least, int otherwise) {
        if (value == null) {
            return Optional.of(otherwise);
        }
        try {
            int n = Integer.parseInt(value.text());
            if (n >= least) {
                return Optional.of(n);
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        problems.error(value.position(), option + " must be a whole number of at least " + least + ", not '"
                + value.text() + "'");
        return Optional.empty();
    }

    private Optional<Step> targetMean(Name m, Position at) {
        if (plan.label().isEmpty()) {
            problems.error(at, "target-mean needs a label: the recipe has none");
            return Optional.empty();
        }
        if (m == null) {
            return Optional.of(new Step.TargetMean(DEFAULT_M, at));
        }
        Optional<Double> value = number(m.text()).filter(v -> v >= 0.0);
        if (value.isEmpty()) {
            problems.error(m.position(), "m must be a number of at least 0 (the weight of the prior, in rows), not '"
                    + m.text() + "'");
            return Optional.empty();
        }
        return Optional.of(new Step.TargetMean(value.get(), at));
    }

    private Optional<Step> impute(Name with, Position at) {
        if (with == null) {
            problems.error(at, "impute needs a value to fill with: {impute: median}, {impute: mean} or {impute: 0}");
            return Optional.empty();
        }
        switch (with.text()) {
            case "mean" -> {
                return Optional.of(new Step.Impute(Step.Impute.Method.MEAN, Double.NaN, at));
            }
            case "median" -> {
                return Optional.of(new Step.Impute(Step.Impute.Method.MEDIAN, Double.NaN, at));
            }
            default -> {
                Optional<Double> constant = number(with.text());
                if (constant.isPresent()) {
                    return Optional.of(new Step.Impute(Step.Impute.Method.CONSTANT, constant.get(), at));
                }
                problems.error(with.position(), "impute with '" + with.text() + "': write mean, median or a number"
                        + Suggestions.hint(with.text(), List.of("mean", "median")));
                return Optional.empty();
            }
        }
    }

    private static Optional<Double> number(String text) {
        try {
            double v = Double.parseDouble(text);
            return Double.isFinite(v) ? Optional.of(v) : Optional.empty();
        } catch (NumberFormatException e) {
            return Optional.empty();
        }
    }

    /** Rules on the order of steps, each reported at the step that breaks it. */
    private void chain(List<Step> steps, OutputColumn source) {
        Set<Kind> seen = new HashSet<>();
        for (int i = 0; i < steps.size(); i++) {
            Step step = steps.get(i);
            Kind kind = ColumnEncoding.kind(step);
            if (!seen.add(kind)) {
                problems.error(step.position(), kind.spelling() + " appears twice in the encoding of "
                        + source.name());
            }
            if (kind.categorical() && steps.size() > 1) {
                problems.error(step.position(), kind.spelling() + " reads the value as a level and must be the only"
                        + " encoding of " + source.name() + (kind == Kind.ONE_HOT ? " (it has a missing column of its own)"
                        : ""));
            }
            if (kind == Kind.BINS && i < steps.size() - 1) {
                problems.error(step.position(), "bins must be the last step: it turns the value into a bin number");
            }
            if (kind == Kind.MISSING && seen.contains(Kind.IMPUTE)) {
                problems.error(step.position(), "missing after impute would always be 0: put missing before impute");
            }
            if (kind == Kind.LOG1P && seen.contains(Kind.STANDARDISE)) {
                problems.error(step.position(), "log1p after standardise: standardised values are often below -1, "
                        + "where log1p is undefined; put log1p first");
            }
        }
    }

    // --------------------------------------------------------------------------------------------- split

    /** Checks the split on the recipe's own cutoffs: each part holds some, parts are apart, test after train. */
    private void checkSplit(SplitSpec split) {
        List<LocalDate> cutoffs = recipe.cutoffs().dates();
        if (indexOf(EncodePlan.SPLIT_COLUMN) >= 0) {
            problems.error(split.position(), "a split adds a column named '" + EncodePlan.SPLIT_COLUMN
                    + "', but an output column already has that name: rename it");
        }
        Map<String, List<LocalDate>> held = new HashMap<>();
        for (SplitSpec.Part part : split.parts()) {
            List<LocalDate> in = cutoffs.stream().filter(part::holds).toList();
            held.put(part.name().text(), in);
            if (in.isEmpty()) {
                problems.error(part.position(), "no cutoff of the recipe falls in the " + part.name().text()
                        + " part" + range(part));
            }
        }
        boolean overlap = false;
        for (int i = 0; i < split.parts().size(); i++) {
            for (int j = i + 1; j < split.parts().size(); j++) {
                SplitSpec.Part a = split.parts().get(i);
                SplitSpec.Part b = split.parts().get(j);
                Optional<LocalDate> both = held.get(b.name().text()).stream().filter(a::holds).findFirst();
                if (both.isPresent()) {
                    overlap = true;
                    problems.error(b.position(), "cutoff " + both.get() + " falls in both the " + a.name().text()
                            + " and the " + b.name().text() + " part: parts must not overlap");
                }
            }
        }
        List<LocalDate> train = held.getOrDefault("train", List.of());
        List<LocalDate> test = held.getOrDefault("test", List.of());
        Optional<SplitSpec.Part> testPart = split.parts().stream().filter(p -> p.name().text().equals("test"))
                .findFirst();
        if (overlap || train.isEmpty() || test.isEmpty() || testPart.isEmpty()) {
            return;
        }
        LocalDate lastTrain = train.get(train.size() - 1);
        LocalDate firstTest = test.get(0);
        if (!firstTest.isAfter(lastTrain)) {
            problems.error(testPart.get().position(), "the test part starts at cutoff " + firstTest
                    + ", not after the last training cutoff " + lastTrain + ": test cutoffs come after training");
            return;
        }
        plan.label().ifPresent(label -> gap(label, lastTrain, firstTest, cutoffs, testPart.get()));
    }

    /**
     * The labels of the last training cutoff must be wholly observed by the end of the first test cutoff's
     * day: otherwise training labels see events of the test period (Kaufman et al. 2011, leakage).
     */
    private void gap(LabelPlan label, LocalDate lastTrain, LocalDate firstTest, List<LocalDate> cutoffs,
                     SplitSpec.Part testPart) {
        LocalDate labelsEnd = label.end().at(lastTrain);
        if (!labelsEnd.isAfter(firstTest.plusDays(1))) {
            return;
        }
        String length = (label.gap().amount() == 0 ? "" : label.gap().label() + " gap + ")
                + label.horizon().label() + " horizon";
        Optional<LocalDate> latest = cutoffs.stream().filter(c -> c.isBefore(firstTest))
                .filter(c -> !label.end().at(c).isAfter(firstTest.plusDays(1))).reduce((a, b) -> b);
        problems.error(testPart.position(), "the test part starts at cutoff " + firstTest + ", but the labels of "
                + "the training cutoff " + lastTrain + " run to " + labelsEnd.minusDays(1) + ": leave at least the "
                + "label's " + length + " between the last training cutoff and the first test cutoff"
                + latest.map(c -> " (end train by " + c + ", or start test later)").orElse(""));
    }

    private static String range(SplitSpec.Part part) {
        if (part.from().isEmpty() && part.to().isEmpty()) {
            return "";
        }
        return " (" + part.from().map(Object::toString).orElse("the first cutoff") + " to "
                + part.to().map(Object::toString).orElse("the last cutoff") + ")";
    }

    // ----------------------------------------------------------------------------------------- training

    private List<LocalDate> trainingCutoffs() {
        if (recipe.split().isPresent()) {
            SplitSpec.Part train = recipe.split().get().parts().stream()
                    .filter(p -> p.name().text().equals("train")).findFirst().orElseThrow();
            return plan.cutoffs().stream().filter(train::holds).toList();
        }
        if (plan.label().isPresent()) {
            return plan.cutoffs().stream().filter(plan.label().get()::complete).toList();
        }
        return plan.cutoffs();
    }

    private String trainingRule() {
        if (recipe.split().isPresent()) {
            SplitSpec.Part train = recipe.split().get().parts().stream()
                    .filter(p -> p.name().text().equals("train")).findFirst().orElseThrow();
            return "the cutoffs of the split's train part" + range(train);
        }
        if (plan.label().isPresent()) {
            return "every cutoff whose label horizon is wholly observed";
        }
        return "every cutoff";
    }

    private int indexOf(String column) {
        for (int i = 0; i < plan.columns().size(); i++) {
            if (plan.columns().get(i).name().equals(column)) {
                return i;
            }
        }
        return -1;
    }
}
