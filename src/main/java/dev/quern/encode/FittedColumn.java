package dev.quern.encode;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One encoded column as fitted: the raw column it reads, its fitted steps in order, and the name of the
 * column its chain ends in ({@code output}; none after one-hot, whose columns are its levels').
 */
public record FittedColumn(String source, List<FittedStep> steps, Optional<String> output) {
    public FittedColumn {
        Objects.requireNonNull(source, "source");
        steps = List.copyOf(steps);
        Objects.requireNonNull(output, "output");
    }

    /** Every column this one becomes, in matrix order. */
    public List<String> outputs() {
        List<String> out = new ArrayList<>();
        for (FittedStep step : steps) {
            if (step instanceof FittedStep.Missing m) {
                out.add(m.column());
            } else if (step instanceof FittedStep.OneHot h) {
                h.levels().forEach(l -> out.add(l.column()));
                out.add(h.otherColumn());
                out.add(h.missingColumn());
            }
        }
        output.ifPresent(out::add);
        return out;
    }
}
