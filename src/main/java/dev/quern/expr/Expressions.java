package dev.quern.expr;

import dev.quern.Diagnostics;
import dev.quern.Position;
import java.util.Optional;

/**
 * The entry to the expression language: parse the text, then check it against the names of the place it
 * is written in. Mistakes go to the caller's {@link Diagnostics}, each at its recipe position with a caret
 * line under the offending token; an empty result means at least one was reported.
 */
public final class Expressions {

    private Expressions() {
    }

    /**
     * Parses {@code text}, whose first character is at {@code start} in the recipe. Reports the first
     * lexical or syntax error: after one, what follows is seldom read the way the author meant.
     */
    public static Optional<ParsedExpression> parse(String text, Position start, Diagnostics out) {
        SourceText source = new SourceText(text, start);
        try {
            return Optional.of(new ParsedExpression(source, Parser.parse(text)));
        } catch (SyntaxError e) {
            out.error(source.positionAt(e.offset()), source.pointAt(e.offset(), e.getMessage()));
            return Optional.empty();
        }
    }

    /** Resolves names and checks types, reporting every mistake found. */
    public static Optional<CheckedExpression> check(ParsedExpression parsed, Scope scope, Expect expect,
                                                    Diagnostics out) {
        TypeChecker checker = new TypeChecker(parsed.source(), scope, out);
        return checker.check(parsed.root(), expect)
                .map(root -> new CheckedExpression(parsed, root, checker.columns(), checker.usesCutoff()));
    }

    /** Parse, then check: the usual path for a filter, a rule or a derived column. */
    public static Optional<CheckedExpression> compile(String text, Position start, Scope scope, Expect expect,
                                                      Diagnostics out) {
        return parse(text, start, out).flatMap(parsed -> check(parsed, scope, expect, out));
    }
}
