package dev.quern.encode;

import dev.quern.Position;
import dev.quern.plan.LabelPlan;
import dev.quern.plan.OutputColumn;
import dev.quern.plan.Role;
import dev.quern.recipe.SplitSpec;
import dev.quern.schema.ValueType;
import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;

/**
 * The data dictionary's entries for the encoded matrix: raw columns as the plan described them, the split
 * column, and for each encoded column its source column, its level or bin and the values fitted for it.
 * Long tables of fitted values (every level's share or target mean) are summarised; fitted.json holds all.
 */
final class EncodedColumns {

    /** How many levels a summary names before saying how many more there are. */
    private static final int SHOWN = 5;

    private EncodedColumns() {
    }

    static List<OutputColumn> of(EncodePlan plan, Fitted fitted) {
        List<OutputColumn> out = new ArrayList<>();
        for (OutputColumn column : plan.plan().columns()) {
            Optional<ColumnEncoding> encoding = plan.columns().stream()
                    .filter(c -> c.source().name().equals(column.name())).findFirst();
            if (encoding.isPresent()) {
                out.addAll(encoded(plan, encoding.get(), fitted.column(column.name()).orElseThrow(), fitted));
            } else {
                out.add(column);
            }
            if (column.role() == Role.CUTOFF) {
                plan.split().ifPresent(s -> out.add(split(s)));
            }
        }
        return out;
    }

    private static OutputColumn split(SplitSpec split) {
        String parts = split.parts().stream().map(p -> p.name().text() + " " + range(p))
                .collect(Collectors.joining(", "));
        return new OutputColumn(EncodePlan.SPLIT_COLUMN, Role.SPLIT, ValueType.TEXT,
                "The part of the time split the row's cutoff is in: " + parts + ". Encodings are fitted on train"
                        + " rows only.", List.of(), Optional.empty(), Optional.empty(),
                "empty when the cutoff is in no part", split.position());
    }

    private static String range(SplitSpec.Part p) {
        return "(" + p.from().map(Object::toString).orElse("first cutoff") + " to "
                + p.to().map(Object::toString).orElse("last cutoff") + ")";
    }

    private static List<OutputColumn> encoded(EncodePlan plan, ColumnEncoding encoding, FittedColumn fitted,
                                              Fitted all) {
        OutputColumn source = encoding.source();
        String from = " Source column " + source.name() + ": " + source.meaning();
        List<OutputColumn> out = new ArrayList<>();
        List<String> before = new ArrayList<>();
        for (int i = 0; i < fitted.steps().size(); i++) {
            FittedStep step = fitted.steps().get(i);
            Position at = encoding.steps().get(i).position();
            if (step instanceof FittedStep.Missing m) {
                out.add(column(source, m.column(), ValueType.INTEGER, "1 when " + source.name() + " is empty, else 0"
                        + " (missing indicator" + (before.isEmpty() ? "" : ", after " + String.join(", ", before))
                        + ")." + from, "never empty", at));
            } else if (step instanceof FittedStep.OneHot h) {
                for (int l = 0; l < h.levels().size(); l++) {
                    FittedStep.Level level = h.levels().get(l);
                    out.add(column(source, level.column(), ValueType.INTEGER, "1 when " + source.name() + " is '"
                            + level.level() + "', else 0: one-hot level " + (l + 1) + " of " + h.levels().size()
                            + ", held by " + level.rows() + " of the " + h.rows() + " training rows ("
                            + percent(level.rows(), h.rows()) + ")." + from, "never empty", at));
                }
                out.add(column(source, h.otherColumn(), ValueType.INTEGER, "1 when " + source.name() + " holds a "
                        + "value without a column of its own (beyond the top " + h.top() + " training levels, or not"
                        + " seen in training), else 0; " + h.otherRows() + " of the " + h.rows() + " training rows ("
                        + percent(h.otherRows(), h.rows()) + ")." + from, "never empty", at));
                out.add(column(source, h.missingColumn(), ValueType.INTEGER, "1 when " + source.name() + " is empty,"
                        + " else 0; " + h.emptyRows() + " of the " + h.rows() + " training rows ("
                        + percent(h.emptyRows(), h.rows()) + ")." + from, "never empty", at));
            } else if (step instanceof FittedStep.Frequency f) {
                String levels = f.levels().stream().limit(SHOWN).map(s -> "'" + s.level() + "' " + num(s.share()))
                        .collect(Collectors.joining(", "));
                out.add(column(source, fitted.output().orElseThrow(), ValueType.DECIMAL, "Share of the " + f.rows()
                        + " training rows whose " + source.name() + " holds the row's value: " + levels
                        + more(f.levels().size()) + "; empty " + num(f.empty().share())
                        + "; a value not seen in training gives 0." + from, "never empty", at));
            } else if (step instanceof FittedStep.TargetMean t) {
                String label = plan.plan().label().map(LabelPlan::column).orElse("the label");
                String levels = t.levels().stream().limit(SHOWN).map(l -> "'" + l.level() + "' " + num(l.value())
                        + " (n " + l.rows() + ")").collect(Collectors.joining(", "));
                out.add(column(source, fitted.output().orElseThrow(), ValueType.DECIMAL, "Smoothed mean of " + label
                        + " over training rows with the row's " + source.name() + ": the m-estimate (n * mean + m *"
                        + " prior) / (n + m) with m = " + num(t.m()) + " (Cestnik 1990). At training cutoffs it is"
                        + " fitted out of time, on training rows whose label horizon had ended by the row's cutoff,"
                        + " so a row never sees its own label; at other cutoffs it is the frozen fit on all "
                        + t.labelledRows() + " labelled training rows: prior " + num(t.prior()) + ", " + levels
                        + more(t.levels().size()) + "; a value not seen in training gives the prior." + from,
                        "empty at a training cutoff when no training label was known by then", at));
            } else if (step instanceof FittedStep.Bins b) {
                String edges = b.edges().stream().map(EncodedColumns::num).collect(Collectors.joining(", "));
                out.add(column(source, fitted.output().orElseThrow(), ValueType.INTEGER, "Quantile bin (1 to "
                        + (b.edges().size() + 1) + ") of " + source.name() + (before.isEmpty() ? ""
                        : " after " + String.join(", ", before)) + ": bin j holds values above edge j-1 and up to"
                        + " edge j; edges " + (edges.isEmpty() ? "none (one value only)" : edges) + ", the "
                        + b.count() + "-quantiles of " + b.rows() + " training values (Hyndman and Fan type 7)"
                        + (b.edges().size() + 1 < b.count() ? "; equal quantiles merged" : "") + "." + from,
                        "empty when the value is empty", at));
            }
            before.add(describe(step));
        }
        fitted.output().filter(o -> o.equals(source.name())).ifPresent(o -> {
            if (!encoding.numeric()) {
                out.add(source);
                return;
            }
            // A source that is 0 rather than empty ("0 when the window has no rows") is never empty.
            List<String> empty = new ArrayList<>();
            if (source.whenEmpty().startsWith("empty")) {
                empty.add(source.whenEmpty());
            }
            for (FittedStep step : fitted.steps()) {
                if (step instanceof FittedStep.Impute) {
                    empty.clear();
                } else if (step instanceof FittedStep.Log1p) {
                    empty.add("empty when the value is -1 or less before log1p");
                }
            }
            out.add(column(source, o, Chain.outputType(encoding), source.name() + " after "
                    + String.join(", then ", before.stream().filter(s -> !s.startsWith("missing")).toList()) + "."
                    + from, empty.isEmpty() ? "never empty" : String.join("; ", empty),
                    encoding.position()));
        });
        return out;
    }

    private static String describe(FittedStep step) {
        if (step instanceof FittedStep.Impute i) {
            return i.with().equals("constant") ? "empty values filled with " + num(i.value())
                    : "empty values filled with the training " + i.with() + " " + num(i.value()) + " (of " + i.rows()
                    + " values)";
        }
        if (step instanceof FittedStep.Log1p) {
            return "ln(1 + x)";
        }
        if (step instanceof FittedStep.Standardise s) {
            return s.scale() == s.sd() ? "standardised with the training mean " + num(s.mean())
                    + " and sample standard deviation " + num(s.sd()) + " (of " + s.rows() + " values)"
                    : "shifted by the training mean " + num(s.mean()) + " (of " + s.rows() + " values; the standard "
                    + "deviation is " + (Double.isNaN(s.sd()) ? "undefined" : "0") + ", so values are not divided)";
        }
        return "missing indicator";
    }

    private static OutputColumn column(OutputColumn source, String name, ValueType type, String meaning,
                                       String whenEmpty, Position at) {
        return new OutputColumn(name, Role.FEATURE, type, meaning, source.sources(), source.window(), source.filter(),
                whenEmpty, at);
    }

    private static String more(int levels) {
        return levels > SHOWN ? " and " + (levels - SHOWN) + " more levels in fitted.json" : "";
    }

    private static String percent(long n, long of) {
        return of == 0 ? "0%" : String.format(Locale.ROOT, "%.2f%%", 100.0 * n / of);
    }

    /** Six significant digits, as the dictionary's statistics. */
    static String num(double v) {
        if (Double.isNaN(v)) {
            return "none";
        }
        if (v == 0.0) {
            return "0";
        }
        return new BigDecimal(v).round(new MathContext(6)).stripTrailingZeros().toPlainString();
    }
}
