package dev.quern.encode;

import dev.quern.plan.OutputColumn;
import dev.quern.plan.Role;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;

/**
 * Names the columns encodings add, once, when they are fitted; a scoring run takes the names from the
 * fitted file and never renames. A chain of log1p, standardise and impute keeps its column's name (the
 * value is the same quantity, rescaled); the others say what they are: {@code plan_commuter},
 * {@code plan_other}, {@code plan_missing}, {@code fee_missing}, {@code zone_frequency},
 * {@code zone_target_mean}, {@code fee_bin}. A level becomes lower-case letters, digits and _. A name
 * already taken gets {@code _2}, {@code _3}, ...
 */
final class Naming {

    private final Set<String> taken = new HashSet<>();

    private Naming() {
    }

    /** The fitted columns with every output named, in the plan's order. */
    static List<FittedColumn> name(EncodePlan plan, List<List<FittedStep>> unnamed) {
        Naming names = new Naming();
        List<Integer> encoded = plan.columns().stream().map(ColumnEncoding::index).toList();
        List<OutputColumn> raw = plan.plan().columns();
        for (int i = 0; i < raw.size(); i++) {
            if (!encoded.contains(i)) {
                names.taken.add(raw.get(i).name());
            }
        }
        plan.split().ifPresent(s -> names.taken.add(EncodePlan.SPLIT_COLUMN));
        for (ColumnEncoding c : plan.columns()) {
            if (keepsName(c)) {
                names.taken.add(c.source().name());
            }
        }
        List<FittedColumn> out = new ArrayList<>();
        for (int i = 0; i < plan.columns().size(); i++) {
            out.add(names.column(plan.columns().get(i), unnamed.get(i)));
        }
        return out;
    }

    /** The encoded matrix's header: raw columns with each encoded one replaced by its outputs. */
    static List<String> header(EncodePlan plan, List<FittedColumn> fitted) {
        List<String> header = new ArrayList<>();
        List<OutputColumn> raw = plan.plan().columns();
        for (int i = 0; i < raw.size(); i++) {
            OutputColumn column = raw.get(i);
            Optional<FittedColumn> f = fitted.stream().filter(c -> c.source().equals(column.name())).findFirst();
            if (f.isPresent()) {
                header.addAll(f.get().outputs());
            } else {
                header.add(column.name());
            }
            if (column.role() == Role.CUTOFF && plan.split().isPresent()) {
                header.add(EncodePlan.SPLIT_COLUMN);
            }
        }
        return header;
    }

    private static boolean keepsName(ColumnEncoding c) {
        Step last = c.last();
        return !(last instanceof Step.OneHot || last instanceof Step.Frequency || last instanceof Step.TargetMean
                || last instanceof Step.Bins);
    }

    private FittedColumn column(ColumnEncoding encoding, List<FittedStep> steps) {
        String source = encoding.source().name();
        List<FittedStep> named = new ArrayList<>();
        for (FittedStep step : steps) {
            if (step instanceof FittedStep.Missing) {
                named.add(new FittedStep.Missing(claim(source + "_missing")));
            } else if (step instanceof FittedStep.OneHot h) {
                String other = claim(source + "_other");
                String missing = claim(source + "_missing");
                List<FittedStep.Level> levels = new ArrayList<>();
                for (FittedStep.Level l : h.levels()) {
                    levels.add(new FittedStep.Level(l.level(), l.rows(), claim(source + "_" + slug(l.level()))));
                }
                named.add(new FittedStep.OneHot(h.top(), h.rows(), levels, h.otherRows(), other, h.emptyRows(),
                        missing));
            } else {
                named.add(step);
            }
        }
        Step last = encoding.last();
        Optional<String> output;
        if (last instanceof Step.OneHot) {
            output = Optional.empty();
        } else if (last instanceof Step.Frequency) {
            output = Optional.of(claim(source + "_frequency"));
        } else if (last instanceof Step.TargetMean) {
            output = Optional.of(claim(source + "_target_mean"));
        } else if (last instanceof Step.Bins) {
            output = Optional.of(claim(source + "_bin"));
        } else {
            output = Optional.of(source);
        }
        return new FittedColumn(source, named, output);
    }

    private String claim(String wanted) {
        String name = wanted;
        for (int n = 2; !taken.add(name); n++) {
            name = wanted + "_" + n;
        }
        return name;
    }

    /** A level as part of a column name: lower-case letters and digits, other runs as one _. */
    static String slug(String level) {
        StringBuilder out = new StringBuilder();
        for (char c : level.toLowerCase(Locale.ROOT).toCharArray()) {
            if (c >= 'a' && c <= 'z' || c >= '0' && c <= '9') {
                out.append(c);
            } else if (out.length() > 0 && out.charAt(out.length() - 1) != '_') {
                out.append('_');
            }
        }
        while (out.length() > 0 && out.charAt(out.length() - 1) == '_') {
            out.setLength(out.length() - 1);
        }
        if (out.length() > 40) {
            out.setLength(40);
        }
        return out.length() == 0 ? "level" : out.toString();
    }
}
