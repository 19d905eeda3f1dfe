package dev.quern.encode;

import dev.quern.plan.Plan;
import dev.quern.recipe.SplitSpec;
import java.time.LocalDate;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What the encode stage will do to the raw matrix of {@code plan}: the encoded columns in raw-matrix order,
 * the time split if the recipe has one, and the cutoffs whose rows encodings are fitted on.
 * {@code trainingRule} says in words how those cutoffs were chosen.
 */
public record EncodePlan(Plan plan, List<ColumnEncoding> columns, Optional<SplitSpec> split,
                         List<LocalDate> trainingCutoffs, String trainingRule) {

    /** The name of the column that says which part of the split a row is in. */
    public static final String SPLIT_COLUMN = "split";

    public EncodePlan {
        Objects.requireNonNull(plan, "plan");
        columns = List.copyOf(columns);
        Objects.requireNonNull(split, "split");
        trainingCutoffs = List.copyOf(trainingCutoffs);
        Objects.requireNonNull(trainingRule, "trainingRule");
    }

    /** True when there is nothing to encode and no split: the raw matrix is the matrix. */
    public boolean isEmpty() {
        return columns.isEmpty() && split.isEmpty();
    }

    /** The part of the split {@code cutoff} belongs to, or empty when it is in none. */
    public Optional<String> partOf(LocalDate cutoff) {
        return split.flatMap(s -> s.parts().stream().filter(p -> p.holds(cutoff)).findFirst())
                .map(p -> p.name().text());
    }
}
