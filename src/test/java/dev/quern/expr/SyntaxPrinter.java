package dev.quern.expr;

import java.util.Locale;
import java.util.stream.Collectors;

/** Writes a syntax tree fully parenthesised, so that tests can read off how the parser grouped it. */
final class SyntaxPrinter {

    private SyntaxPrinter() {
    }

    static String print(Syntax node) {
        if (node instanceof Syntax.NumberLiteral n) {
            return String.valueOf(n.value());
        }
        if (node instanceof Syntax.TextLiteral t) {
            return "'" + t.value().replace("'", "''") + "'";
        }
        if (node instanceof Syntax.BooleanLiteral b) {
            return String.valueOf(b.value());
        }
        if (node instanceof Syntax.NullLiteral) {
            return "null";
        }
        if (node instanceof Syntax.DateLiteral d) {
            return "date " + d.value();
        }
        if (node instanceof Syntax.TimestampLiteral t) {
            return "timestamp " + t.value();
        }
        if (node instanceof Syntax.Name n) {
            return n.written();
        }
        if (node instanceof Syntax.Group g) {
            return print(g.inner());
        }
        if (node instanceof Syntax.Negate n) {
            return "(-" + print(n.operand()) + ")";
        }
        if (node instanceof Syntax.Not n) {
            return "(not " + print(n.operand()) + ")";
        }
        if (node instanceof Syntax.Binary b) {
            return "(" + print(b.left()) + " " + b.symbol().toLowerCase(Locale.ROOT) + " " + print(b.right()) + ")";
        }
        if (node instanceof Syntax.Between b) {
            return "(" + print(b.value()) + (b.negated() ? " not" : "") + " between " + print(b.low()) + " and "
                    + print(b.high()) + ")";
        }
        if (node instanceof Syntax.In in) {
            return "(" + print(in.value()) + (in.negated() ? " not" : "") + " in ("
                    + in.items().stream().map(SyntaxPrinter::print).collect(Collectors.joining(", ")) + "))";
        }
        if (node instanceof Syntax.IsNull i) {
            return "(" + print(i.value()) + (i.negated() ? " is not null)" : " is null)");
        }
        if (node instanceof Syntax.Call c) {
            return c.function() + "(" + c.arguments().stream().map(SyntaxPrinter::print)
                    .collect(Collectors.joining(", ")) + ")";
        }
        throw new IllegalArgumentException(node.toString());
    }
}
