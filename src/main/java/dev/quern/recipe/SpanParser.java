package dev.quern.recipe;

import dev.quern.Diagnostics;
import dev.quern.Position;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/** Reads a span: a whole number and a unit, {@code 30d}, {@code 12w}, {@code 6m}, {@code 1y}. */
final class SpanParser {

    private static final Pattern SPAN = Pattern.compile("([0-9]+)([dwmy])");

    /** Longer than any history a database keeps (about 270 years in days); guards the int arithmetic. */
    static final int LONGEST = 100_000;

    private SpanParser() {
    }

    /** The span, or an error at {@code at} saying how to write one. Zero is accepted: callers decide. */
    static Optional<Span> parse(String text, Position at, Diagnostics diagnostics) {
        Matcher m = SPAN.matcher(text);
        if (!m.matches()) {
            diagnostics.error(at, Names.quote(text)
                    + " is not a span: write a whole number and d, w, m or y, e.g. 30d");
            return Optional.empty();
        }
        String digits = m.group(1);
        long amount = digits.length() > 9 ? Long.MAX_VALUE : Long.parseLong(digits);
        if (amount > LONGEST) {
            diagnostics.error(at, Names.quote(text) + " is too long a span: keep the number at most " + LONGEST);
            return Optional.empty();
        }
        return Optional.of(new Span((int) amount, WindowUnit.ofSuffix(m.group(2).charAt(0)), at));
    }
}
