package dev.quern.encode;

import java.time.LocalDate;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Everything a build fitted, frozen: the recipe it belongs to (name and SHA-256 of its text), the training
 * cutoffs and rows it was fitted on, each encoded column's fitted steps, and the matrix header it gives.
 * A scoring run reads it back and applies it unchanged.
 */
public record Fitted(String recipeName, String recipeSha256, String quernVersion, Optional<String> label,
                     List<LocalDate> trainingCutoffs, long trainingRows, List<FittedColumn> columns,
                     List<String> header) {
    public Fitted {
        Objects.requireNonNull(recipeName, "recipeName");
        Objects.requireNonNull(recipeSha256, "recipeSha256");
        Objects.requireNonNull(quernVersion, "quernVersion");
        Objects.requireNonNull(label, "label");
        trainingCutoffs = List.copyOf(trainingCutoffs);
        columns = List.copyOf(columns);
        header = List.copyOf(header);
    }

    public Optional<FittedColumn> column(String source) {
        return columns.stream().filter(c -> c.source().equals(source)).findFirst();
    }
}
