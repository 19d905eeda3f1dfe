package dev.quern.plan;

import dev.quern.recipe.Span;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import dev.quern.expr.CheckedExpression;

/**
 * All measures over all windows of one path: a single scan of the path's rows in the longest window
 * serves every column of the block. Only rows that meet {@code filter} count.
 */
public record Block(String name, EventPath path, Optional<CheckedExpression> filter, List<Aggregate> aggregates) {
    public Block {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(path, "path");
        Objects.requireNonNull(filter, "filter");
        aggregates = List.copyOf(aggregates);
        if (aggregates.isEmpty()) {
            throw new IllegalArgumentException("a block needs at least one aggregate");
        }
    }

    /** The distinct windows of the block, shortest first. */
    public List<Span> windows() {
        return aggregates.stream().map(Aggregate::window)
                .collect(java.util.stream.Collectors.toMap(Span::label, w -> w, (a, b) -> a,
                        java.util.LinkedHashMap::new))
                .values().stream().sorted(Comparator.comparing(w -> w.before(Boundary.REFERENCE),
                        Comparator.reverseOrder())).toList();
    }

    /** The window that reaches furthest back: the scan reads rows of this window only. */
    public Span longestWindow() {
        List<Span> w = windows();
        return w.get(w.size() - 1);
    }
}
