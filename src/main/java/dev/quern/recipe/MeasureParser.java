package dev.quern.recipe;

import dev.quern.Diagnostics;
import dev.quern.Suggestions;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads a measure written as text, {@code count} or {@code sum(distance_km)}, and the label value, which
 * has the same form ({@code exists}, {@code count}, {@code sum(amount)}).
 */
final class MeasureParser {

    /** A word, optionally followed by a parenthesised argument; spaces allowed around the argument. */
    private static final Pattern CALL = Pattern.compile("([A-Za-z_][A-Za-z0-9_]*)\\s*(?:\\((.*)\\))?");

    /** Names other tools use for our measures, so that the hint is right where the spelling is far off. */
    private static final Map<String, String> OTHER_NAMES = Map.of(
            "avg", "mean", "average", "mean", "std", "stddev", "stdev", "stddev", "sd", "stddev",
            "count_distinct", "distinct", "nunique", "distinct", "total", "sum", "n", "count");

    private MeasureParser() {
    }

    /** A parsed call: the word, its argument (absent when no parentheses) and the argument's offset. */
    private record Call(String word, Optional<String> argument, int argumentOffset) {
    }

    static Optional<MeasureSpec> parse(String text, Locator at, Optional<Name> name, Diagnostics diagnostics) {
        Optional<Call> call = call(text, at, diagnostics, "a measure",
                "write a measure such as count, or a measure and a column such as sum(distance_km)");
        if (call.isEmpty()) {
            return Optional.empty();
        }
        String word = call.get().word();
        Optional<MeasureKind> kind = MeasureKind.ofSpelling(word);
        if (kind.isEmpty()) {
            diagnostics.error(at.at(0), "unknown measure " + Names.quote(word) + hint(word)
                    + "; measures are " + String.join(", ", MeasureKind.spellings()));
            return Optional.empty();
        }
        return column("measure", kind.get().spelling(), kind.get().takesColumn(), call.get(), at, diagnostics)
                .map(column -> new MeasureSpec(kind.get(), column, name, at.at(0)));
    }

    /** The kind and column of a label value. */
    record LabelValue(LabelSpec.Kind kind, Optional<Name> column) {
    }

    static Optional<LabelValue> label(String text, Locator at, Diagnostics diagnostics) {
        String spellings = "write exists, count or sum(column)";
        Optional<Call> call = call(text, at, diagnostics, "a label value", spellings);
        if (call.isEmpty()) {
            return Optional.empty();
        }
        String word = call.get().word();
        for (LabelSpec.Kind kind : LabelSpec.Kind.values()) {
            if (kind.spelling().equals(word)) {
                return column("label value", word, kind == LabelSpec.Kind.SUM, call.get(), at, diagnostics)
                        .map(column -> new LabelValue(kind, column));
            }
        }
        List<String> known = List.of("exists", "count", "sum");
        diagnostics.error(at.at(0), "unknown label value " + Names.quote(word)
                + Suggestions.hint(word, known) + ": " + spellings);
        return Optional.empty();
    }

    private static Optional<Call> call(String text, Locator at, Diagnostics diagnostics, String what,
                                       String howToWrite) {
        Matcher m = CALL.matcher(text);
        if (!m.matches()) {
            diagnostics.error(at.at(0), Names.quote(text) + " is not " + what + ": " + howToWrite);
            return Optional.empty();
        }
        if (m.group(2) == null) {
            return Optional.of(new Call(m.group(1), Optional.empty(), 0));
        }
        String inside = m.group(2);
        int lead = inside.length() - inside.stripLeading().length();
        return Optional.of(new Call(m.group(1), Optional.of(inside.strip()), m.start(2) + lead));
    }

    /**
     * The column of a call, checked against whether the word takes one: the outer optional is empty on an
     * error, the inner one when there is rightly no column.
     */
    private static Optional<Optional<Name>> column(String noun, String word, boolean takesColumn, Call call,
                                                   Locator at, Diagnostics diagnostics) {
        Optional<String> argument = call.argument().filter(a -> !a.isEmpty());
        if (!takesColumn) {
            if (call.argument().isPresent()) {
                diagnostics.error(at.at(call.argumentOffset()), noun + " " + Names.quote(word)
                        + " takes no column: write " + word);
                return Optional.empty();
            }
            return Optional.of(Optional.empty());
        }
        if (argument.isEmpty()) {
            diagnostics.error(at.at(0), noun + " " + Names.quote(word) + " needs a column: write " + word + "(column)");
            return Optional.empty();
        }
        return Names.plain(argument.get(), at.at(call.argumentOffset()), "column", diagnostics).map(Optional::of);
    }

    private static String hint(String word) {
        String other = OTHER_NAMES.get(word.toLowerCase(java.util.Locale.ROOT));
        return other != null ? " (did you mean " + other + "?)" : Suggestions.hint(word, MeasureKind.spellings());
    }
}
