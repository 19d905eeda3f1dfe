package dev.quern.encode;

import dev.quern.plan.OutputColumn;
import dev.quern.run.ValueFormat;
import dev.quern.schema.ValueType;
import java.time.LocalDate;
import java.util.HashMap;
import java.util.Map;

/** One encoded column's fitted chain, applied to a raw value: writes each of its output cells in order. */
final class Chain {

    /** Receives each output cell: the value (null when empty) and its text. */
    interface Sink {
        void put(Object value, String text);
    }

    private final ColumnEncoding encoding;
    private final FittedColumn fitted;
    private final TargetStatistics outOfTime;
    private final ValueType outputType;
    private final Map<String, Integer> levelIndex = new HashMap<>();
    private final Map<String, Double> values = new HashMap<>();
    private int levels;
    private double unseen;
    private double emptyValue;
    private double[] edges = new double[0];

    /** {@code outOfTime} is null when the fit is frozen (read from a file) or the column has no target mean. */
    Chain(ColumnEncoding encoding, FittedColumn fitted, TargetStatistics outOfTime) {
        this.encoding = encoding;
        this.fitted = fitted;
        this.outOfTime = outOfTime;
        this.outputType = outputType(encoding);
        FittedStep first = fitted.steps().get(0);
        if (first instanceof FittedStep.OneHot h) {
            for (FittedStep.Level l : h.levels()) {
                levelIndex.put(l.level(), levels++);
            }
        } else if (first instanceof FittedStep.Frequency f) {
            f.levels().forEach(s -> values.put(s.level(), s.share()));
            unseen = 0.0;
            emptyValue = f.empty().share();
        } else if (first instanceof FittedStep.TargetMean t) {
            t.levels().forEach(l -> values.put(l.level(), l.value()));
            unseen = t.prior();
            emptyValue = t.empty().value();
        }
        FittedStep last = fitted.steps().get(fitted.steps().size() - 1);
        if (last instanceof FittedStep.Bins b) {
            edges = b.edges().stream().mapToDouble(Double::doubleValue).toArray();
        }
    }

    /** The type of the column a chain ends in (one-hot's level columns are integers). */
    static ValueType outputType(ColumnEncoding encoding) {
        Step last = encoding.last();
        if (last instanceof Step.OneHot || last instanceof Step.Bins) {
            return ValueType.INTEGER;
        }
        if (last instanceof Step.Frequency || last instanceof Step.TargetMean) {
            return ValueType.DECIMAL;
        }
        if (!encoding.numeric()) {
            return encoding.source().type();
        }
        boolean integral = encoding.source().type() == ValueType.INTEGER && encoding.steps().stream().allMatch(s ->
                s instanceof Step.Missing || s instanceof Step.Impute i && i.method() == Step.Impute.Method.CONSTANT
                        && i.constant() == Math.rint(i.constant()));
        return integral ? ValueType.INTEGER : ValueType.DECIMAL;
    }

    /** A numeric step (not bins) applied to a value; null stands for an empty value. */
    static Double apply(FittedStep step, Double v) {
        if (step instanceof FittedStep.Impute i) {
            return v == null ? i.value() : v;
        }
        if (step instanceof FittedStep.Log1p) {
            // ln(1 + x) is defined only above -1: the dictionary says such values become empty.
            return v == null || v <= -1.0 ? null : Math.log1p(v);
        }
        if (step instanceof FittedStep.Standardise s) {
            return v == null ? null : (v - s.mean()) / s.scale();
        }
        if (step instanceof FittedStep.Missing) {
            return v;
        }
        throw new IllegalArgumentException("not a numeric step: " + step);
    }

    /**
     * Writes the cells of one row. {@code training} says the row is at a training cutoff of this build's own
     * fit: its target mean is then the out-of-time one.
     */
    void emit(String raw, LocalDate cutoff, boolean training, Sink sink) {
        FittedStep first = fitted.steps().get(0);
        if (first instanceof FittedStep.OneHot) {
            int hit = raw.isEmpty() ? levels + 1 : levelIndex.getOrDefault(raw, levels);
            for (int i = 0; i < levels + 2; i++) {
                flag(i == hit, sink);
            }
        } else if (first instanceof FittedStep.Frequency) {
            decimal(raw.isEmpty() ? emptyValue : values.getOrDefault(raw, unseen), sink);
        } else if (first instanceof FittedStep.TargetMean) {
            Double v;
            if (outOfTime != null && training) {
                v = outOfTime.outOfTime(cutoff, raw);
            } else {
                v = raw.isEmpty() ? emptyValue : values.getOrDefault(raw, unseen);
            }
            decimal(v, sink);
        } else if (!encoding.numeric()) {
            // Only missing indicators: the value itself goes on as it was written.
            for (int i = 0; i < fitted.steps().size(); i++) {
                flag(raw.isEmpty(), sink);
            }
            sink.put(raw.isEmpty() ? null : raw, raw);
        } else {
            Double v = Fitter.number(raw, encoding.source(), cutoff);
            for (FittedStep step : fitted.steps()) {
                if (step instanceof FittedStep.Missing) {
                    flag(v == null, sink);
                } else if (step instanceof FittedStep.Bins) {
                    v = v == null ? null : (double) Quantiles.bin(edges, v);
                } else {
                    v = apply(step, v);
                }
            }
            if (v == null) {
                sink.put(null, "");
            } else {
                sink.put(v, ValueFormat.format(v, outputType));
            }
        }
    }

    OutputColumn source() {
        return encoding.source();
    }

    private static void flag(boolean on, Sink sink) {
        sink.put(on ? 1 : 0, on ? "1" : "0");
    }

    private static void decimal(Double v, Sink sink) {
        if (v == null || v.isNaN()) {
            sink.put(null, "");
        } else {
            sink.put(v, ValueFormat.format(v, ValueType.DECIMAL));
        }
    }
}
