package dev.quern.recipe;

import dev.quern.Diagnostics;
import dev.quern.Position;
import java.util.Optional;
import java.util.regex.Pattern;

/**
 * The rule for names of tables, columns and output columns: plain identifiers only. Later stages quote
 * names for the engine, but a name that is plain to begin with cannot smuggle SQL through a quote.
 */
final class Names {

    private static final Pattern PLAIN = Pattern.compile("[A-Za-z_][A-Za-z0-9_]*");

    /** The placeholder a measure's own name may hold, replaced by the window label. */
    static final String WINDOW = "{window}";

    private Names() {
    }

    static boolean isPlain(String text) {
        return PLAIN.matcher(text).matches();
    }

    /**
     * The name, when {@code text} is plain; otherwise an error at {@code at}. {@code role} says what the name
     * is for: "table", "column", "output".
     */
    static Optional<Name> plain(String text, Position at, String role, Diagnostics diagnostics) {
        if (isPlain(text)) {
            return Optional.of(new Name(text, at));
        }
        diagnostics.error(at, notPlain(text, role));
        return Optional.empty();
    }

    /** An output name that may hold {@code {window}}: {@code station_visits_{window}}. */
    static Optional<Name> output(String text, Position at, Diagnostics diagnostics) {
        if (isPlain(text.replace(WINDOW, "w"))) {
            return Optional.of(new Name(text, at));
        }
        diagnostics.error(at, notPlain(text, "output") + "; {window} stands for the window");
        return Optional.empty();
    }

    static String notPlain(String text, String role) {
        return quote(text) + " is not a plain " + role + " name: use letters, digits and _, not starting with a digit";
    }

    /** A value for a message: quoted, shortened when long, with line breaks and tabs shown. */
    static String quote(String text) {
        String shown = text.replace("\n", "\\n").replace("\t", "\\t");
        if (shown.length() > 60) {
            shown = shown.substring(0, 57) + "...";
        }
        return "'" + shown + "'";
    }
}
